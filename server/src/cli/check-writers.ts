/**
 * The report of `check` written entry by entry, in each format, byte for byte what the whole
 * report's renderers (`report-text.ts`, `report-ci.ts`, `JSON.stringify`, `report-sarif.ts`) write:
 * text, workflow annotations and JSON go out as each entry arrives; SARIF lists the rules of every
 * result before the results, so it keeps the compact entries (findings only) until the end.
 */
import { escapeControlChars } from '../../../grammar/src/index';
import { toCiAnnotations } from './report-ci';
import type { JsonFile } from './report-json';
import { toSarif } from './report-sarif';

export type CheckFormat = 'text' | 'json' | 'sarif' | 'ci';

export interface EntryWriter {
  entry(file: JsonFile): void;
  end(): void;
}

export interface SarifContext {
  toolVersion: string;
  toUri: (path: string) => string;
  baseUri: string;
}

export function entryWriter(format: CheckFormat, write: (text: string) => void, sarif: SarifContext = { toolVersion: '', toUri: (p) => p, baseUri: '' }): EntryWriter {
  switch (format) {
    case 'json':
      return jsonWriter(write);
    case 'sarif':
      return sarifWriter(write, sarif);
    case 'ci':
      return { entry: (file) => write(toCiAnnotations({ version: 1, files: [file] })), end: () => {} };
    default:
      return textWriter(write);
  }
}

/** `JSON.stringify(report, null, 2)`, one file at a time: each entry is its own stringify, indented two levels. */
function jsonWriter(write: (text: string) => void): EntryWriter {
  let count = 0;
  write('{\n  "version": 1,\n  "files": [');
  return {
    entry: (file) => write(`${count++ === 0 ? '\n' : ',\n'}    ${JSON.stringify(file, null, 2).replace(/\n/g, '\n    ')}`),
    end: () => write(count ? '\n  ]\n}\n' : ']\n}\n'),
  };
}

function sarifWriter(write: (text: string) => void, context: SarifContext): EntryWriter {
  const files: JsonFile[] = [];
  return {
    entry: (file) => void files.push({ path: file.path, rectifiers: [], diagnostics: file.diagnostics }),
    end: () => write(JSON.stringify(toSarif({ version: 1, files }, context.toolVersion, context.toUri, context.baseUri), null, 2) + '\n'),
  };
}

function textWriter(write: (text: string) => void): EntryWriter {
  const counts: Record<string, number> = { error: 0, warning: 0, info: 0, hint: 0 };
  let files = 0;
  return {
    entry: (file) => {
      files++;
      const lines = file.diagnostics.map((d) => {
        counts[d.severity] = (counts[d.severity] ?? 0) + 1;
        return `${file.path}:${d.line}:${d.column}: ${d.severity} ${d.code}: ${d.message}\n`;
      });
      if (lines.length) write(escapeControlChars(lines.join('')));
    },
    end: () => write(escapeControlChars(
      `${files} file${files === 1 ? '' : 's'} checked: ${counts.error} error(s), ${counts.warning} warning(s), ${counts.info} info, ${counts.hint} hint(s)\n`,
    )),
  };
}
