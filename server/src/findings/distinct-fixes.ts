/**
 * The quick fixes of several findings without repeats: the four diodes of a packaged bridge each
 * offer the same part swap, which is one edit and one choice, and the preferred one at most once.
 */
import type { Fix } from './finding';

export interface DistinctFix<T = Fix> {
  fix: T;
  /** The findings (by their index in the caller's list) that offered it. */
  offeredBy: number[];
}

/**
 * `fixesOf[i]` are the fixes (or offers) of finding `findings[i]`; those with the same key (for
 * finished fixes `editsKey`, their edits) are merged, in first-offered order. Each finding keeps at most one
 * preferred fix, its first: an editor applies the preferred fix of a diagnostic without asking.
 */
export function distinctFixes<T extends { preferred?: boolean }>(
  findings: readonly number[], fixesOf: readonly (readonly T[] | undefined)[], keyOf: (fix: T) => string,
): DistinctFix<T>[] {
  const byKey = new Map<string, DistinctFix<T>>();
  findings.forEach((finding, i) => {
    for (const fix of fixesOf[i] ?? []) {
      const key = keyOf(fix);
      const known = byKey.get(key);
      if (known) {
        if (!known.offeredBy.includes(finding)) known.offeredBy.push(finding);
        if (fix.preferred && !known.fix.preferred) known.fix = { ...known.fix, preferred: true };
      } else byKey.set(key, { fix, offeredBy: [finding] });
    }
  });
  return onePreferredPerFinding([...byKey.values()]);
}

function onePreferredPerFinding<T extends { preferred?: boolean }>(fixes: DistinctFix<T>[]): DistinctFix<T>[] {
  const served = new Set<number>();
  return fixes.map((d) => {
    if (!d.fix.preferred) return d;
    const clash = d.offeredBy.some((f) => served.has(f));
    d.offeredBy.forEach((f) => served.add(f));
    return clash ? { ...d, fix: { ...d.fix, preferred: false } } : d;
  });
}
