/** The JSON report of `check --format json` (DESIGN.md §8): stable names, SI units in the names, 1-based lines. */
import type { FileAnalysis, Snapshot } from '../analysis/analyze';
import { LineIndex } from '../analysis/line-index';

export interface JsonDiagnostic {
  line: number;
  column: number;
  endLine: number;
  endColumn: number;
  severity: string;
  code: string;
  message: string;
}

export interface JsonFile {
  path: string;
  rectifiers: unknown[];
  diagnostics: JsonDiagnostic[];
}

export interface JsonReport {
  version: 1;
  files: JsonFile[];
}

export function toJsonReport(snapshot: Snapshot): JsonReport {
  return { version: 1, files: [...snapshot.files.values()].map(toJsonFile) };
}

function toJsonFile(file: FileAnalysis): JsonFile {
  const lines = new LineIndex(file.text);
  const diagnostics = file.findings
    .filter((f) => f.uri === file.uri)
    .map((f) => {
      const start = lines.positionAt(f.span.start);
      const end = lines.positionAt(f.span.end);
      return {
        line: start.line + 1, column: start.character + 1, endLine: end.line + 1, endColumn: end.character + 1,
        severity: f.severity, code: f.code, message: f.message,
      };
    });
  return { path: file.uri, rectifiers: [], diagnostics };
}
