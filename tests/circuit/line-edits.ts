/** Line edits for the elaboration property tests: a line's text replaced, a line added or taken out (never the title or the last line). */
export interface LineEdit {
  line: number;
  kind: string;
  text: string;
}

export function applied(text: string, e: LineEdit): string {
  const lines = text.split('\n');
  const at = 1 + (e.line % Math.max(1, lines.length - 2));
  if (e.kind === 'replace') lines[at] = e.text;
  else if (e.kind === 'insert') lines.splice(at, 0, e.text);
  else lines.splice(at, 1);
  return lines.join('\n');
}
