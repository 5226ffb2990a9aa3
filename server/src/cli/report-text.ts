/**
 * Compiler-style text: `file:line:col: severity code: message`, then a one-line summary. Messages
 * quote netlist text, which may hold control characters: they are written as escapes (`\x1B`),
 * so the netlist cannot drive the terminal.
 */
import { entryWriter } from './check-writers';
import type { JsonReport } from './report-json';

/** The whole report at once; `check` writes the same text entry by entry (`check-writers.ts`). */
export function toTextReport(report: JsonReport): string {
  let text = '';
  const writer = entryWriter('text', (t) => void (text += t));
  for (const file of report.files) writer.entry(file);
  writer.end();
  return text;
}
