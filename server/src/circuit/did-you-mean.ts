/**
 * "Did you mean": the names in scope closest to a name that is not defined, by edit distance
 * (insertions, deletions, substitutions and swaps of two neighbouring letters, each 1),
 * case-insensitive as netlist names are. Pure and bounded: names far longer than the wanted one
 * are skipped by their length alone, and at most `MAX_CANDIDATES` names are compared.
 */
import type { Fix, Place } from '../findings/index';

/** Most renames offered for one name; a tie beyond it is not a suggestion worth reading. */
const MAX_OFFERED = 3;

/**
 * The suggestion for a name written at `place` that is not defined: a clause for the message
 * (`; did you mean 'BRIDGE'?`, empty when nothing is near) and one rename fix per nearest name,
 * preferred when it is the only one.
 */
export function didYouMean(written: string, candidates: Iterable<string>, place: Place): { clause: string; fixes: Fix[] } {
  const names = closestNames(written, candidates);
  if (names.length === 0 || names.length > MAX_OFFERED) return { clause: '', fixes: [] };
  const fixes = names.map((name): Fix => ({
    title: `Change '${written}' to '${name}'`,
    edits: [{ uri: place.uri, span: place.span, newText: name }],
    ...(names.length === 1 ? { preferred: true } : {}),
  }));
  return { clause: `; did you mean ${names.map((n) => `'${n}'`).join(' or ')}?`, fixes };
}

/** Most names compared for one suggestion; a scope with more is cut (work is counted, never timed). */
export const MAX_CANDIDATES = 10_000;

/** Longest name a suggestion is sought for; longer ones are not typed by hand. */
const MAX_NAME_LENGTH = 64;

/**
 * The largest distance still read as a typo: 1 for names of up to three letters, 2 up to eight,
 * 3 beyond (our own choice: one slip per three or four letters, so `DR` never becomes `D1N4007`).
 */
export function typoDistance(length: number): number {
  return length <= 3 ? 1 : length <= 8 ? 2 : 3;
}

/**
 * The candidates nearest to `wanted` within the typo distance, as written, each once, in the
 * order given; empty when none is near. Candidates equal to `wanted` (ignoring case) are left out.
 */
export function closestNames(wanted: string, candidates: Iterable<string>): string[] {
  const target = wanted.toLowerCase();
  if (target.length === 0 || target.length > MAX_NAME_LENGTH) return [];
  let best = typoDistance(target.length);
  let found: string[] = [];
  const seen = new Set<string>();
  let looked = 0;
  for (const name of candidates) {
    if (++looked > MAX_CANDIDATES) break;
    const lower = name.toLowerCase();
    if (lower === target || seen.has(lower) || Math.abs(lower.length - target.length) > best) continue;
    seen.add(lower);
    const d = editDistance(target, lower, best);
    if (d < best) {
      best = d;
      found = [name];
    } else if (d === best) found.push(name);
  }
  return found;
}

/**
 * Optimal-string-alignment distance between two strings, or `limit + 1` as soon as it must
 * exceed `limit` (every cell of a row above the limit).
 */
export function editDistance(a: string, b: string, limit = Infinity): number {
  let before = new Array<number>(b.length + 1).fill(0);
  let previous = Array.from({ length: b.length + 1 }, (_, j) => j);
  for (let i = 1; i <= a.length; i++) {
    const row = new Array<number>(b.length + 1).fill(0);
    row[0] = i;
    let smallest = row[0];
    for (let j = 1; j <= b.length; j++) {
      const cost = a[i - 1] === b[j - 1] ? 0 : 1;
      let d = Math.min(previous[j]! + 1, row[j - 1]! + 1, previous[j - 1]! + cost);
      if (i > 1 && j > 1 && a[i - 1] === b[j - 2] && a[i - 2] === b[j - 1]) d = Math.min(d, before[j - 2]! + 1);
      row[j] = d;
      smallest = Math.min(smallest, d);
    }
    if (smallest > limit) return limit + 1;
    before = previous;
    previous = row;
  }
  return previous[b.length]!;
}
