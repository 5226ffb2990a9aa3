/**
 * What elaboration keeps of its work for the next elaboration, keyed by the cards it came from. The
 * language server's re-parse moves the cards an edit did not touch into the new tree (the same
 * objects, offsets moved in place), so work that is a function of such cards alone stands: the
 * global parameters' values, a function of the `.param` definitions alone (names and expressions),
 * kept when resolving them said nothing. A card that changed is a new object and misses. What is
 * kept equals a fresh build, so an elaboration's result does not depend on it
 * (tests/analysis/incremental.test.ts).
 *
 * Keeping every top-level card's flat element this way was tried and dropped: about 12 % of the
 * elaboration at 50,000 lines, for some 250 MB more resident memory after 20 edits at 100,000.
 */
import type { FindingSet } from '../findings/index';
import { resolvePlaced, type PlacedParam } from './scope';

const keptGlobals = new WeakMap<PlacedParam['param'], { placed: readonly PlacedParam[]; values: Map<string, number> }>();

/** The global parameters' values: those of the last resolution of the very same definitions, else resolved (and kept when that said nothing). */
export function globalParamValues(placed: readonly PlacedParam[], sink: FindingSet): Map<string, number> {
  const first = placed[0]?.param;
  const was = first && keptGlobals.get(first);
  if (was && samePlaced(was.placed, placed)) return was.values;
  const offered = sink.offered;
  const values = resolvePlaced(placed, () => undefined, sink);
  if (first && sink.offered === offered) keptGlobals.set(first, { placed, values });
  return values;
}

function samePlaced(a: readonly PlacedParam[], b: readonly PlacedParam[]): boolean {
  if (a.length !== b.length) return false;
  for (let i = 0; i < a.length; i++) if (a[i]!.param !== b[i]!.param || a[i]!.uri !== b[i]!.uri) return false;
  return true;
}
