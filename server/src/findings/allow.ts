/**
 * `*@ allow CODE …`: the designer accepts a finding. The directive covers the next card of its
 * file that is not a comment (directives are comments), or the whole file when it sits in the
 * file's leading block of directives, before any other card. A finding is accepted when its own
 * place, or one of its related places (the inner card of a device inside a subcircuit), lies in a
 * covered card.
 */
import type { Card, Directive, Netlist, Span } from '../../../grammar/src/index';
import type { Finding } from './finding';

/** A directive and the file it sits in (the flat circuit's placed directives have this shape). */
export interface DirectiveInFile {
  uri: string;
  directive: Directive;
}

/** One region an allow directive covers. */
export interface AllowedRegion {
  uri: string;
  /** Undefined: the whole file. */
  span?: Span;
  /** Lowercase codes. */
  codes: string[];
}

/** The regions every allow directive covers. */
export function allowedRegions(directives: readonly DirectiveInFile[], parsed: ReadonlyMap<string, Netlist>): AllowedRegion[] {
  const regions: AllowedRegion[] = [];
  const layouts = new Map<string, CardLayout>();
  for (const placed of directives) {
    const d = placed.directive;
    if (d.keyword !== 'allow' || d.codes.length === 0) continue;
    const codes = d.codes.map((c) => c.text.toLowerCase());
    let layout = layouts.get(placed.uri);
    if (!layout) layouts.set(placed.uri, (layout = cardLayout(parsed.get(placed.uri)?.cards ?? [])));
    if (d.span.start <= layout.leadingEnd) {
      regions.push({ uri: placed.uri, codes });
      continue;
    }
    const next = layout.nextAfter(d.span.end);
    if (next) regions.push({ uri: placed.uri, span: next.span, codes });
  }
  return regions;
}

/**
 * The designer's allowances of one analysis: whether an allow directive accepts a finding. The
 * regions are indexed by file and code, and the covered cards of one file do not overlap, so each
 * place is one binary search: twenty thousand allow lines cost no more than their own count.
 */
export function allowance(directives: readonly DirectiveInFile[], parsed: ReadonlyMap<string, Netlist>): (finding: AllowableFinding) => boolean {
  const regions = allowedRegions(directives, parsed);
  if (regions.length === 0) return () => false;
  const index = indexRegions(regions);
  return (f) => {
    const code = f.code.toLowerCase();
    const places = [{ uri: f.uri, span: f.span }, ...(f.related ?? [])];
    return places.some((p) => index.covers(p.uri, code, p.span));
  };
}

type AllowableFinding = Pick<Finding, 'uri' | 'span' | 'code' | 'related'>;

/** The findings an allow directive does not accept. */
export function filterAllowed<F extends AllowableFinding>(
  findings: readonly F[], directives: readonly DirectiveInFile[], parsed: ReadonlyMap<string, Netlist>,
): F[] {
  const allowed = allowance(directives, parsed);
  return findings.filter((f) => !allowed(f));
}

/** Where a file's leading block of directives ends, and the next card after an offset that is not a comment. */
interface CardLayout {
  /** Directives starting at or before this offset sit in the leading block (no other card before them). */
  leadingEnd: number;
  nextAfter(offset: number): Card | undefined;
}

function cardLayout(cards: readonly Card[]): CardLayout {
  const isComment = (c: Card) => c.kind === 'directive' || c.kind === 'title';
  const firstOther = cards.find((c) => !isComment(c));
  // For each card index, the first card at or after it that is not a directive or the title.
  const nextOther: (Card | undefined)[] = new Array(cards.length + 1);
  for (let i = cards.length - 1; i >= 0; i--) nextOther[i] = isComment(cards[i]!) ? nextOther[i + 1] : cards[i];
  return {
    leadingEnd: firstOther ? firstOther.span.start : Infinity,
    nextAfter: (offset) => nextOther[firstIndexAtOrAfter(cards.length, (i) => cards[i]!.span.start, offset)],
  };
}

/** Regions by file and code: whole-file ones as a set, card ones as start-sorted spans. */
function indexRegions(regions: readonly AllowedRegion[]) {
  const wholeFile = new Set<string>();
  const spans = new Map<string, Span[]>();
  for (const r of regions) {
    for (const code of r.codes) {
      const id = `${r.uri}\u0000${code}`;
      if (!r.span) wholeFile.add(id);
      else {
        const list = spans.get(id);
        if (list) list.push(r.span);
        else spans.set(id, [r.span]);
      }
    }
  }
  for (const list of spans.values()) list.sort((a, b) => a.start - b.start);
  return {
    covers(uri: string, code: string, span: Span): boolean {
      const id = `${uri}\u0000${code}`;
      if (wholeFile.has(id)) return true;
      const list = spans.get(id);
      if (!list) return false;
      // Cards do not overlap: only the last covered card starting at or before the place can hold it.
      const k = firstIndexAtOrAfter(list.length, (i) => list[i]!.start, span.start + 1) - 1;
      const card = list[k];
      return card !== undefined && card.start <= span.start && span.end <= card.end;
    },
  };
}

/** The first index in [0, length) whose key is at least `value` (keys ascending), or `length`. */
function firstIndexAtOrAfter(length: number, keyAt: (i: number) => number, value: number): number {
  let lo = 0;
  let hi = length;
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if (keyAt(mid) < value) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}
