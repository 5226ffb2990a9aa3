/**
 * Expected findings written inside a fixture, so the fixture stays a valid netlist:
 *
 *     R2 out 0 4k7
 *     *        ^^^ warning value-notation: RKM
 *
 * A comment line made of `*`, blanks and carets, then `severity code: message fragment`, points
 * at the columns of the nearest line above it that is not itself an annotation. Carets that
 * touch the `*` start in column 0, the `*` standing for the first caret, so that a card's name
 * can be underlined whole:
 *
 *     D1 A P DR
 *     *^ warning piv-margin: of VRRM 440 V
 */
export interface ExpectedFinding {
  start: number;
  end: number;
  severity: string;
  code: string;
  fragment: string;
}

const ANNOTATION = /^\*(\s*)(\^+)\s+(error|warning|info|hint)\s+([a-z-]+)(?::\s*(.*))?$/;

export function readAnnotations(text: string): ExpectedFinding[] {
  const lines = text.split('\n');
  const lineStarts: number[] = [];
  let offset = 0;
  for (const line of lines) {
    lineStarts.push(offset);
    offset += line.length + 1;
  }
  const found: ExpectedFinding[] = [];
  let target = -1;
  lines.forEach((line, index) => {
    const match = ANNOTATION.exec(line);
    if (!match) {
      target = index;
      return;
    }
    // `*^^` underlines columns 0–2: with no blank between them, the `*` is a caret too.
    const touching = match[1]!.length === 0;
    const column = touching ? 0 : 1 + match[1]!.length;
    const start = lineStarts[target]! + column;
    const width = match[2]!.length + (touching ? 1 : 0);
    found.push({ start, end: start + width, severity: match[3]!, code: match[4]!, fragment: (match[5] ?? '').trim() });
  });
  return found;
}

/** Whether a span (offsets) lies on an annotation line, so it can be ignored when comparing. */
export function isAnnotationLine(text: string, at: number): boolean {
  const start = text.lastIndexOf('\n', at - 1) + 1;
  const end = text.indexOf('\n', at);
  return ANNOTATION.test(text.slice(start, end < 0 ? undefined : end));
}

/** The text with its annotation lines taken out: the same netlist expecting no findings. */
export function withoutAnnotations(text: string): string {
  return text.split('\n').filter((line) => !ANNOTATION.test(line)).join('\n');
}
