/**
 * Re-parsing after an edit: the cards before and after the changed lines are taken from the
 * previous parse (those after it shifted by the change in length) and only the changed lines,
 * widened to whole cards, are lexed and parsed again. The result equals a full parse of the new
 * text; where that cannot be guaranteed cheaply (the title line, text after `.end`), it is one.
 */
import type { Card, Netlist, Span, SyntaxDiagnostic } from './syntax-tree';

/** Diagnostics that the post-passes over the whole card list produce; never reused. */
export const WHOLE_FILE_CODES: ReadonlySet<string> = new Set(['unclosed-block', 'unmatched-end', 'after-end']);

export interface ReparsePlan {
  /** The changed region of the new text: [start, end), both at line starts (or the text's end). */
  start: number;
  end: number;
  /** New length minus old length. */
  delta: number;
  prefix: { cards: Card[]; comments: Span[]; diagnostics: SyntaxDiagnostic[] };
  suffix: { cards: Card[]; comments: Span[]; diagnostics: SyntaxDiagnostic[] };
}

/** What can be kept from `old` for `text`, or undefined when a full parse is the safe choice. */
export function planReparse(old: Netlist, text: string): ReparsePlan | undefined {
  if (old.diagnostics.some((d) => d.code === 'after-end')) return undefined;
  const oldText = old.text;
  const delta = text.length - oldText.length;
  let prefixLength = 0;
  const limit = Math.min(oldText.length, text.length);
  while (prefixLength < limit && oldText.charCodeAt(prefixLength) === text.charCodeAt(prefixLength)) prefixLength++;
  let suffixLength = 0;
  while (suffixLength < limit - prefixLength && oldText.charCodeAt(oldText.length - 1 - suffixLength) === text.charCodeAt(text.length - 1 - suffixLength)) suffixLength++;
  if (old.title && prefixLength <= old.title.span.end + 1) return undefined;
  const items = [...old.cards.filter((c) => c.kind !== 'title').map((c) => c.span), ...old.comments];
  let start = lineStartAt(text, prefixLength);
  let end = lineEndAfter(text, text.length - suffixLength);
  for (let moved = true; moved; ) {
    moved = false;
    while (start > 0 && isContinuation(text, start)) { start = lineStartAt(text, start - 1); moved = true; }
    while (end < text.length && isContinuation(text, end)) { end = nextLineStart(text, end); moved = true; }
    for (const span of items) {
      if (span.start < start && span.end > start) { start = lineStartAt(text, span.start); moved = true; }
      const oldEnd = end - delta;
      if (span.start < oldEnd && span.end > oldEnd) { end = lineEndAfter(text, span.end + delta); moved = true; }
    }
  }
  if (old.title && start <= old.title.span.end) return undefined;
  const oldEnd = end - delta;
  const before = (s: Span) => s.end <= start;
  const after = (s: Span) => s.start >= oldEnd;
  const kept = (d: SyntaxDiagnostic) => !WHOLE_FILE_CODES.has(d.code);
  const body = old.cards.filter((c) => c.kind !== 'title');
  return {
    start, end, delta,
    prefix: {
      cards: body.filter((c) => before(c.span)),
      comments: old.comments.filter(before),
      diagnostics: old.diagnostics.filter((d) => kept(d) && before(d.span)),
    },
    suffix: {
      cards: body.filter((c) => after(c.span)).map((c) => shifted(c, delta)),
      comments: old.comments.filter(after).map((s) => shifted(s, delta)),
      diagnostics: old.diagnostics.filter((d) => kept(d) && after(d.span)).map((d) => shifted(d, delta)),
    },
  };
}

function isLineBreak(code: number): boolean {
  return code === 10 || code === 13;
}

/** The start of the line that holds `offset`. */
function lineStartAt(text: string, offset: number): number {
  let at = Math.min(offset, text.length);
  // Between the two characters of a CRLF the offset still belongs to the line before.
  if (at > 0 && text.charCodeAt(at - 1) === 13 && text.charCodeAt(at) === 10) at--;
  while (at > 0 && !isLineBreak(text.charCodeAt(at - 1))) at--;
  return at;
}

/** `offset` itself when it starts a line, else the start of the next line (or the text's end). */
function lineEndAfter(text: string, offset: number): number {
  if (offset > 0 && offset <= text.length && isLineBreak(text.charCodeAt(offset - 1)) && !(text.charCodeAt(offset - 1) === 13 && text.charCodeAt(offset) === 10)) return offset;
  let at = offset;
  while (at < text.length && !isLineBreak(text.charCodeAt(at))) at++;
  if (at < text.length) at += text.charCodeAt(at) === 13 && text.charCodeAt(at + 1) === 10 ? 2 : 1;
  return at;
}

/** The start of the line after the one that begins at or holds `offset`. */
function nextLineStart(text: string, offset: number): number {
  let at = offset;
  while (at < text.length && !isLineBreak(text.charCodeAt(at))) at++;
  if (at < text.length) at += text.charCodeAt(at) === 13 && text.charCodeAt(at + 1) === 10 ? 2 : 1;
  return at;
}

/** Whether the line starting at `offset` continues the card above (`+` after optional blanks). */
function isContinuation(text: string, offset: number): boolean {
  let at = offset;
  while (at < text.length && (text.charCodeAt(at) === 32 || text.charCodeAt(at) === 9)) at++;
  return text.charCodeAt(at) === 43;
}

/** A copy with every offset (`start`/`end` numbers, in spans and expressions) moved by `delta`. */
export function shifted<T>(value: T, delta: number): T {
  if (delta === 0) return value;
  if (Array.isArray(value)) return value.map((v) => shifted(v, delta)) as T;
  if (value === null || typeof value !== 'object') return value;
  const out: Record<string, unknown> = {};
  for (const [k, v] of Object.entries(value as Record<string, unknown>)) {
    out[k] = (k === 'start' || k === 'end') && typeof v === 'number' ? v + delta : shifted(v, delta);
  }
  return out as T;
}
