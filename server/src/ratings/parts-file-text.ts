/**
 * A parts file from its text: a leading byte-order mark is accepted and skipped, an empty file,
 * a JSON syntax error or a version other than the supported one makes the whole file unusable,
 * and every problem carries the span of the text it is about, so it can be shown on the file.
 */
import type { Span } from '../../../grammar/src/index';
import { scanJson, spanAt } from './json-spans';
import { PARTS_FILE_VERSION, type PartsFile } from './parts-file-format';
import { validatePartsFile, type PartsFileProblem } from './parts-file-validate';

export interface LocatedPartsFileProblem extends PartsFileProblem {
  /** Offsets in the text as given (a byte-order mark included). */
  span: Span;
}

export interface PartsFileReading {
  /** The usable part of the file; absent when nothing in it can be trusted. */
  file?: PartsFile;
  problems: LocatedPartsFileProblem[];
}

const BOM = '\uFEFF';
const UNUSED = 'none of its ratings are used';

/** Reads a parts file's text into entries and located problems. */
export function readPartsFileText(text: string, uri: string): PartsFileReading {
  const shift = text.startsWith(BOM) ? BOM.length : 0;
  const body = text.slice(shift);
  const at = (span: Span): Span => ({ start: span.start + shift, end: span.end + shift });
  if (body.trim() === '') return unusable({ start: 0, end: text.length }, `the parts file is empty; ${UNUSED}`);
  const scan = scanJson(body);
  if (scan.error) {
    const { offset, message } = scan.error;
    return unusable(at({ start: offset, end: Math.min(offset + 1, body.length) }), `the parts file is not valid JSON: ${message}; ${UNUSED}`);
  }
  let data: unknown;
  try {
    data = JSON.parse(body);
  } catch (error) {
    // The scanner accepted it, so this does not happen; if it ever does, it is still a finding.
    return unusable({ start: 0, end: 0 }, `the parts file is not valid JSON (${error instanceof Error ? error.message : String(error)}); ${UNUSED}`);
  }
  const { file, problems } = validatePartsFile(data, uri);
  const located = problems.map((p) => ({ ...p, span: at(spanAt(scan, p.pointer)) }));
  // The document's shape, its version or its list of parts: nothing in the file can be read as meant.
  const fatal = problems.find((p) => p.severity === 'error' && ['', '/version', '/parts'].includes(p.pointer));
  if (fatal) {
    const version = (data as { version?: unknown } | null)?.version;
    const supported = `this Rectilens reads version ${PARTS_FILE_VERSION}`;
    const why = fatal.pointer !== '/version' ? fatal.message
      : version === undefined ? `the parts file states no "version" (${supported})`
      : `version ${JSON.stringify(version)} is not supported (${supported})`;
    return { problems: located.map((p) => (p === located[problems.indexOf(fatal)] ? { ...p, message: `${why}; ${UNUSED}` } : p)) };
  }
  return { file, problems: located.map((p) => (p.severity === 'error' ? { ...p, message: `${p.message}; left out of the ratings` } : p)) };
}

function unusable(span: Span, message: string): PartsFileReading {
  return { problems: [{ pointer: '', severity: 'error', span, message }] };
}
