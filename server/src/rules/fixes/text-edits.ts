/**
 * Small text helpers for quick fixes: inserting whole lines before or after a card without
 * breaking the netlist, in the file's own line ending, and finding a card by its span.
 */
import type { Card, Netlist, Span } from '../../../../grammar/src/index';
import type { TextEdit } from '../../findings/index';

let lastText: string | undefined;
let lastEol = '\n';

/**
 * The file's line ending: CRLF when it already uses one. Asked once per fix of an analysis, each
 * time of the same text, so the last answer is kept: a search of the whole text per fix cost
 * 0.8 ms an edit at 50,000 lines.
 */
export function eolOf(text: string): string {
  if (text !== lastText) {
    lastText = text;
    lastEol = text.includes('\r\n') ? '\r\n' : '\n';
  }
  return lastEol;
}

/** An edit that inserts `lines` as whole lines just above the line holding `offset`. */
export function insertLinesBefore(uri: string, text: string, offset: number, lines: readonly string[]): TextEdit {
  const start = text.lastIndexOf('\n', offset - 1) + 1;
  const eol = eolOf(text);
  return { uri, span: { start, end: start }, newText: lines.map((l) => l + eol).join('') };
}

/** An edit that inserts `lines` as whole lines just below the line (or continued card) ending at `offset`. */
export function insertLinesAfter(uri: string, text: string, offset: number, lines: readonly string[]): TextEdit {
  const eol = eolOf(text);
  // A span that already ends with its newline is found by starting one character back.
  const newline = text.indexOf('\n', Math.max(0, offset - 1));
  if (newline < 0) return { uri, span: { start: text.length, end: text.length }, newText: lines.map((l) => eol + l).join('') };
  const at = newline + 1;
  return { uri, span: { start: at, end: at }, newText: lines.map((l) => l + eol).join('') };
}

/** The card of a parsed file whose span is exactly `span` (an element origin's card). */
export function cardAt(netlist: Netlist | undefined, span: Span): Card | undefined {
  return netlist?.cards.find((c) => c.span.start === span.start && c.span.end === span.end)
    ?? netlist?.cards.find((c) => c.span.start <= span.start && c.span.end >= span.end && c.kind !== 'directive');
}

/** Applies edits to a text (for tests and checks): later edits first so offsets hold. */
export function applyEdits(text: string, edits: readonly Pick<TextEdit, 'span' | 'newText'>[]): string {
  const sorted = [...edits].sort((a, b) => b.span.start - a.span.start || b.span.end - a.span.end);
  let out = text;
  for (const e of sorted) out = out.slice(0, e.span.start) + e.newText + out.slice(e.span.end);
  return out;
}

/** A SPICE-style number: 3 significant digits with a scale suffix (22u, 4.7k, 1.5MEG). */
export function spiceNumber(value: number): string {
  const suffixes: [number, string][] = [[1e9, 'G'], [1e6, 'MEG'], [1e3, 'k'], [1, ''], [1e-3, 'm'], [1e-6, 'u'], [1e-9, 'n'], [1e-12, 'p']];
  const abs = Math.abs(value);
  for (const [scale, suffix] of suffixes) {
    if (abs >= scale * 0.9999999) return `${Number((value / scale).toPrecision(3))}${suffix}`;
  }
  return value.toExponential(3);
}
