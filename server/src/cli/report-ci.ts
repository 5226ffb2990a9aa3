/**
 * Findings as CI annotations: one workflow command per finding (`::error file=…,line=…,col=…,
 * title=…::message`), the syntax GitHub Actions defines and several CI runners read, so a finding
 * shows on the line of the change under review. Values are escaped as that syntax asks (`%`, CR,
 * LF, and in properties `:` and `,`).
 */
import type { JsonReport } from './report-json';

const COMMAND: Readonly<Record<string, string>> = { error: 'error', warning: 'warning', info: 'notice', hint: 'notice' };

export function toCiAnnotations(report: JsonReport): string {
  const lines: string[] = [];
  for (const file of report.files) {
    for (const d of file.diagnostics) {
      const props = [`file=${property(file.path)}`, `line=${d.line}`, `col=${d.column}`, `endLine=${d.endLine}`, `endColumn=${d.endColumn}`, `title=${property(`rectilens ${d.code}`)}`];
      lines.push(`::${COMMAND[d.severity] ?? 'notice'} ${props.join(',')}::${data(d.message)}`);
    }
  }
  return lines.length ? `${lines.join('\n')}\n` : '';
}

function data(text: string): string {
  return text.replace(/%/g, '%25').replace(/\r/g, '%0D').replace(/\n/g, '%0A');
}

function property(text: string): string {
  return data(text).replace(/:/g, '%3A').replace(/,/g, '%2C');
}
