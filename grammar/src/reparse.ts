/**
 * Re-parsing after an edit: the cards before and after the changed lines are taken from the
 * previous parse (those after it shifted by the change in length) and only the changed lines,
 * widened to whole cards, are scanned and parsed again. The result equals a full parse of the new
 * text; where that cannot be guaranteed cheaply (the title line, text after `.end`), it is one.
 *
 * The cards after the edit carry offsets of the old text. By default they are copied with their
 * offsets shifted, so the previous tree stays valid for whoever still holds it; a caller that drops
 * the previous tree may let them be moved instead (`consumePrevious`): the same objects, their
 * offsets updated in place, no allocation — and unchanged cards keep their identity.
 */
import { marksOf } from './card-marks';
import type { Card, Netlist, Span, SyntaxDiagnostic } from './syntax-tree';

/** Diagnostics that the post-passes over the whole card list produce; never reused. */
export const WHOLE_FILE_CODES: ReadonlySet<string> = new Set(['unclosed-block', 'unmatched-end', 'after-end', 'subckt-depth']);

export interface ReparsePlan {
  /** The changed region of the new text: [start, end), both at line starts (or the text's end). */
  start: number;
  end: number;
  /** New length minus old length. */
  delta: number;
  prefix: KeptRegion;
  suffix: KeptRegion;
}

export interface KeptRegion {
  cards: Card[];
  comments: Span[];
  diagnostics: SyntaxDiagnostic[];
  /** Indices into `cards` of the cards that shape the file (card-marks.ts). */
  marks: readonly number[];
  /** The cards' offset lists, where the previous tree had them (`carryOffsetLists`). */
  offsets?: readonly (Offsets | undefined)[];
}

/**
 * What can be kept from `old` for `text`, or undefined when a full parse is the safe choice.
 * Finding the changed lines costs a comparison of the texts (block by block) and binary searches
 * over the cards; what is kept after the change is shifted by `delta` (`moved` says how).
 */
export function planReparse(old: Netlist, text: string, moved: 'copy' | 'move' = 'copy'): ReparsePlan | undefined {
  if (old.diagnostics.some((d) => d.code === 'after-end')) return undefined;
  const oldText = old.text;
  const delta = text.length - oldText.length;
  const prefixLength = commonPrefix(oldText, text);
  const suffixLength = commonSuffix(oldText, text, Math.min(oldText.length, text.length) - prefixLength);
  if (old.title && prefixLength <= old.title.span.end + 1) return undefined;
  const body = old.title ? old.cards.slice(1) : old.cards;
  let start = lineStartAt(text, prefixLength);
  let end = lineEndAfter(text, text.length - suffixLength);
  for (let widened = true; widened; ) {
    widened = false;
    while (start > 0 && isContinuation(text, start)) { start = lineStartAt(text, start - 1); widened = true; }
    while (end < text.length && isContinuation(text, end)) { end = nextLineStart(text, end); widened = true; }
    // A card or comment that straddles either end of the region is parsed again whole.
    for (const spans of [body, old.comments]) {
      const across = straddling(spans, start);
      if (across) { start = lineStartAt(text, across.start); widened = true; }
      const overEnd = straddling(spans, end - delta);
      if (overEnd) { end = lineEndAfter(text, overEnd.end + delta); widened = true; }
    }
  }
  if (old.title && start <= old.title.span.end) return undefined;
  const oldEnd = end - delta;
  const kept = (d: SyntaxDiagnostic) => !WHOLE_FILE_CODES.has(d.code);
  const firstAfter = firstStartingAt(body, oldEnd);
  const commentsAfter = firstStartingAt(old.comments, oldEnd);
  const marks = marksOf(old);
  const prefixCount = firstEndingAfter(body, start);
  // The prefix's cards are the same objects in both trees, so their lists hold in the new one either way.
  const lists = offsetListsByTree.get(old);
  const prefix = {
    cards: body.slice(0, prefixCount),
    marks: marks.filter((m) => m < prefixCount),
    comments: old.comments.slice(0, firstEndingAfter(old.comments, start)),
    diagnostics: old.diagnostics.filter((d) => kept(d) && d.span.end <= start),
    offsets: lists?.slice(0, prefixCount),
  };
  // Diagnostics are copied before any card moves: a diagnostic may hold the very span of a node.
  const diagnostics = old.diagnostics.filter((d) => kept(d) && d.span.start >= oldEnd).map((d) => shifted(d, delta));
  const cards = body.slice(firstAfter);
  const comments = old.comments.slice(commentsAfter);
  const suffix = moved === 'move'
    ? { cards, comments: movedSpans(comments, delta), offsets: moveCards(cards, delta, lists, firstAfter) }
    : { cards: shiftAll(cards, delta), comments: shiftAll(comments, delta) };
  return { start, end, delta, prefix, suffix: { ...suffix, diagnostics, marks: marks.filter((m) => m >= firstAfter).map((m) => m - firstAfter) } };
}

/** Items in text order that never overlap one another, each with a span (or a span itself). */
type Spanned = { span: Span } | Span;
const spanOf = (item: Spanned): Span => ('span' in item ? item.span : item);

/** The item that starts before `offset` and ends after it, if any (binary search). */
function straddling(items: readonly Spanned[], offset: number): Span | undefined {
  const index = firstStartingAt(items, offset) - 1;
  const span = index >= 0 ? spanOf(items[index]!) : undefined;
  return span && span.start < offset && span.end > offset ? span : undefined;
}

/** The index of the first item that starts at or after `offset`. */
function firstStartingAt(items: readonly Spanned[], offset: number): number {
  let low = 0;
  let high = items.length;
  while (low < high) {
    const mid = (low + high) >>> 1;
    if (spanOf(items[mid]!).start < offset) low = mid + 1;
    else high = mid;
  }
  return low;
}

/** The index of the first item that ends after `offset` (items end in order too, never overlapping). */
function firstEndingAfter(items: readonly Spanned[], offset: number): number {
  let low = 0;
  let high = items.length;
  while (low < high) {
    const mid = (low + high) >>> 1;
    if (spanOf(items[mid]!).end <= offset) low = mid + 1;
    else high = mid;
  }
  return low;
}

/** How far two texts agree from the start, compared a block at a time (a block compare is a memcmp). */
function commonPrefix(a: string, b: string): number {
  const limit = Math.min(a.length, b.length);
  let at = 0;
  while (at + BLOCK <= limit && a.slice(at, at + BLOCK) === b.slice(at, at + BLOCK)) at += BLOCK;
  while (at < limit && a.charCodeAt(at) === b.charCodeAt(at)) at++;
  return at;
}

/** How far two texts agree from the end, at most `limit` characters. */
function commonSuffix(a: string, b: string, limit: number): number {
  let length = 0;
  while (length + BLOCK <= limit && a.slice(a.length - length - BLOCK, a.length - length) === b.slice(b.length - length - BLOCK, b.length - length)) length += BLOCK;
  while (length < limit && a.charCodeAt(a.length - 1 - length) === b.charCodeAt(b.length - 1 - length)) length++;
  return length;
}
const BLOCK = 4096;

/** The items as shifted copies (the same list when nothing moves). */
function shiftAll<T>(items: T[], delta: number): T[] {
  if (delta === 0) return items;
  for (let i = 0; i < items.length; i++) items[i] = shifted(items[i]!, delta);
  return items;
}

/** Comments are bare spans: nothing to find, nothing worth listing. */
function movedSpans(spans: Span[], delta: number): Span[] {
  for (let i = 0; i < spans.length; i++) {
    spans[i]!.start += delta;
    spans[i]!.end += delta;
  }
  return spans;
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
  if (delta === 0 || value === null || typeof value !== 'object') return value;
  if (Array.isArray(value)) return (value.length === 0 ? value : value.map((v) => shifted(v, delta))) as T;
  // A spread copy keeps the original's layout (one hidden class per node kind), unlike building a new object key by key.
  const out = { ...value } as Record<string, unknown>;
  for (const key in out) {
    const field = out[key];
    if (typeof field === 'number') {
      if (key === 'start' || key === 'end') out[key] = field + delta;
    } else if (field !== null && typeof field === 'object') out[key] = shifted(field, delta);
  }
  return out as T;
}

/**
 * The cards with their offsets moved in place: no copy, so each card keeps its identity (what
 * re-uses work per card needs) and the old tree that held it no longer describes the old text.
 * A card's offsets are found once and listed: a card after an edit moves again with every later
 * edit above it, and walking it each time was the largest cost of a re-parse. Returns the lists,
 * which go with the cards into the new tree. `lists` are the old tree's, by index into its body
 * (`from` is where `cards` start there).
 */
function moveCards(cards: readonly Card[], delta: number, lists: readonly (Offsets | undefined)[] | undefined, from: number): (Offsets | undefined)[] | undefined {
  if (delta === 0) return lists?.slice(from, from + cards.length);
  const moved: Offsets[] = new Array(cards.length);
  for (let i = 0; i < cards.length; i++) {
    const found = lists?.[from + i] ?? collectedOffsets(cards[i]!);
    moved[i] = found;
    // Named stores: a store through a key read from a list was five times slower on these holders.
    const both = Array.isArray(found) ? found : found.both;
    for (let k = 0; k < both.length; k++) {
      const holder = both[k]!;
      holder.start += delta;
      holder.end += delta;
    }
    if (!Array.isArray(found)) {
      for (const s of found.starts) s.start += delta;
      for (const e of found.ends) e.end += delta;
    }
  }
  return moved;
}

/**
 * Lists the offsets of up to `count` cards of a tree from card `from` on, as a move does first
 * for each card it moves; returns where to go on, or −1 once every card is listed. For idle time
 * after a parse: the first edit that moves the cards then moves their lists instead of walking them.
 */
export function listOffsetsAhead(netlist: Netlist, from: number, count: number): number {
  const cards = netlist.cards;
  const skip = netlist.title ? 1 : 0;
  let lists = offsetListsByTree.get(netlist);
  if (!lists) offsetListsByTree.set(netlist, (lists = new Array(cards.length - skip).fill(undefined)));
  const end = Math.min(cards.length, from + count);
  for (let i = Math.max(from, skip); i < end; i++) lists[i - skip] ??= collectedOffsets(cards[i]!);
  return end >= cards.length ? -1 : end;
}

/**
 * Joins the offset lists of the regions a tree was assembled from (in text order, as its cards),
 * for its first `count` cards: the cards a re-parse moved or kept take their lists with them.
 */
export function carryOffsetLists(netlist: Netlist, regions: readonly { cards: readonly Card[]; offsets?: readonly (Offsets | undefined)[] }[], count: number): void {
  if (regions.every((r) => r.offsets === undefined)) return;
  // Joined whole (a copy of each list) rather than entry by entry: at 50,000 cards a push each was 3 ms an edit.
  const parts = regions.map(({ cards, offsets }) => (offsets?.length === cards.length ? offsets : Array.from(cards, (_, i) => offsets?.[i])));
  const lists = ([] as (Offsets | undefined)[]).concat(...parts);
  if (lists.length > count) lists.length = count;
  offsetListsByTree.set(netlist, lists);
}

/**
 * Every holder of offsets in a node, in the order a walk meets them (an object met twice, twice).
 * Nearly every holder has both a start and an end (spans, expressions), so a node's offsets are
 * usually one array of those holders; only a node with a holder of one of them alone keeps the
 * three lists. Two lists and their holder object per card came to 440 bytes a card, 63 MB in the
 * two threads of the language server at 100,000 lines; one array is half that.
 */
export type Offsets = Span[] | OffsetHolders;

/**
 * Each tree's lists by index into its cards without the title (as card marks are), beside the tree
 * rather than by card: a look-up per card in a table keyed by 50,000 objects cost as much as the
 * move itself.
 */
const offsetListsByTree = new WeakMap<Netlist, (Offsets | undefined)[]>();

function collectedOffsets(node: object): Offsets {
  const holders: OffsetHolders = { both: [], starts: [], ends: [] };
  collectOffsets(node, holders);
  return holders.starts.length === 0 && holders.ends.length === 0 ? holders.both : holders;
}

interface OffsetHolders {
  both: Span[];
  starts: { start: number }[];
  ends: { end: number }[];
}

function collectOffsets(value: object, into: OffsetHolders): void {
  if (Array.isArray(value)) {
    for (const item of value) if (item !== null && typeof item === 'object') collectOffsets(item, into);
    return;
  }
  const fields = value as Record<string, unknown>;
  const start = typeof fields.start === 'number';
  const end = typeof fields.end === 'number';
  if (start && end) into.both.push(fields as unknown as Span);
  else if (start) into.starts.push(fields as { start: number });
  else if (end) into.ends.push(fields as { end: number });
  for (const key in fields) {
    const field = fields[key];
    if (field !== null && typeof field === 'object') collectOffsets(field, into);
  }
}
