/**
 * The quick fixes of several findings without repeats: the four diodes of a packaged bridge each
 * offer the same part swap, which is one edit and one choice, and the preferred one at most once.
 */
import type { Fix } from './finding';

export interface DistinctFix {
  fix: Fix;
  /** The findings (by their index in the caller's list) that offered it. */
  offeredBy: number[];
}

/** `fixesOf[i]` are the fixes of finding `findings[i]`; fixes with the same edits are merged, in first-offered order. */
export function distinctFixes(findings: readonly number[], fixesOf: readonly (readonly Fix[] | undefined)[]): DistinctFix[] {
  const byEdits = new Map<string, DistinctFix>();
  findings.forEach((finding, i) => {
    for (const fix of fixesOf[i] ?? []) {
      const key = JSON.stringify(fix.edits.map((e) => [e.uri, e.span.start, e.span.end, e.newText]));
      const known = byEdits.get(key);
      if (known) {
        if (!known.offeredBy.includes(finding)) known.offeredBy.push(finding);
        if (fix.preferred && !known.fix.preferred) known.fix = { ...known.fix, preferred: true };
      } else byEdits.set(key, { fix, offeredBy: [finding] });
    }
  });
  return [...byEdits.values()];
}
