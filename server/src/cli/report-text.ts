/**
 * Compiler-style text: `file:line:col: severity code: message`, then a one-line summary. Messages
 * quote netlist text, which may hold control characters: they are written as escapes (`\x1B`),
 * so the netlist cannot drive the terminal.
 */
import { escapeControlChars } from '../../../grammar/src/index';
import type { JsonReport } from './report-json';

export function toTextReport(report: JsonReport): string {
  const lines: string[] = [];
  const counts = { error: 0, warning: 0, info: 0, hint: 0 } as Record<string, number>;
  for (const file of report.files) {
    for (const d of file.diagnostics) {
      lines.push(`${file.path}:${d.line}:${d.column}: ${d.severity} ${d.code}: ${d.message}`);
      counts[d.severity] = (counts[d.severity] ?? 0) + 1;
    }
  }
  const files = report.files.length;
  lines.push(
    `${files} file${files === 1 ? '' : 's'} checked: ${counts.error} error(s), ${counts.warning} warning(s), ${counts.info} info, ${counts.hint} hint(s)`,
  );
  return escapeControlChars(lines.join('\n') + '\n');
}
