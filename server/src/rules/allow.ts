/**
 * `*@ allow CODE …`: the designer accepts a finding. The directive covers the next card of its
 * file that is not a comment (directives are comments), or the whole file when it sits in the
 * file's leading block of directives, before any other card. A finding is accepted when its own
 * place, or one of its related places (the inner card of a device inside a subcircuit), lies in a
 * covered card.
 */
import type { Card, Netlist, Span } from '../../../grammar/src/index';
import type { PlacedDirective } from '../circuit/index';
import type { Finding } from '../analysis/findings';

/** One region an allow directive covers. */
export interface AllowedRegion {
  uri: string;
  /** Undefined: the whole file. */
  span?: Span;
  /** Lowercase codes. */
  codes: string[];
}

/** The regions every allow directive covers. */
export function allowedRegions(directives: readonly PlacedDirective[], parsed: ReadonlyMap<string, Netlist>): AllowedRegion[] {
  const regions: AllowedRegion[] = [];
  for (const placed of directives) {
    const d = placed.directive;
    if (d.keyword !== 'allow' || d.codes.length === 0) continue;
    const codes = d.codes.map((c) => c.text.toLowerCase());
    const cards = parsed.get(placed.uri)?.cards ?? [];
    const leading = cards.filter((c) => c.span.start < d.span.start).every((c) => c.kind === 'directive' || c.kind === 'title');
    if (leading) {
      regions.push({ uri: placed.uri, codes });
      continue;
    }
    const next = nextCard(cards, d.span.end);
    if (next) regions.push({ uri: placed.uri, span: next.span, codes });
  }
  return regions;
}

/** Drops the findings an allow directive accepts. */
export function filterAllowed<F extends Pick<Finding, 'uri' | 'span' | 'code' | 'related'>>(
  findings: readonly F[], directives: readonly PlacedDirective[], parsed: ReadonlyMap<string, Netlist>,
): F[] {
  const regions = allowedRegions(directives, parsed);
  if (regions.length === 0) return [...findings];
  return findings.filter((f) => !regions.some((r) => covers(r, f)));
}

function covers(region: AllowedRegion, finding: Pick<Finding, 'uri' | 'span' | 'code' | 'related'>): boolean {
  if (!region.codes.includes(finding.code.toLowerCase())) return false;
  const places = [{ uri: finding.uri, span: finding.span }, ...(finding.related ?? [])];
  return places.some((p) => p.uri === region.uri && (!region.span || (p.span.start >= region.span.start && p.span.end <= region.span.end)));
}

function nextCard(cards: readonly Card[], after: number): Card | undefined {
  return cards.find((c) => c.span.start >= after && c.kind !== 'directive' && c.kind !== 'title');
}
