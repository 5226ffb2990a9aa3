/**
 * The solver behind a memo: solutions keyed by the exact JSON of their inputs, in a cache the
 * adapter owns. The analysis, the rules and their fixes all solve through it, so an edit that
 * leaves a rectifier's inputs alone re-solves nothing — neither the rectifier nor its fix trials.
 */
import type { Corner, EquivalentCircuit } from './equivalent-circuit';
import type { RectifierSolution } from './solution';
import { solveRectifier, type SolveOptions } from './solve-rectifier';

export type SolveFn = (circuit: EquivalentCircuit, corners: Corner[], options?: SolveOptions) => RectifierSolution;

/** Cache of solutions by the JSON of their inputs; the adapter decides its lifetime. */
export type SolutionCache = Map<string, RectifierSolution>;

/** Largest cache the analysis fills; beyond it the oldest entries are dropped. */
const CACHE_LIMIT = 4000;

export function memoisedSolver(cache: SolutionCache | undefined): SolveFn {
  if (!cache) return solveRectifier;
  return (circuit, corners, options) => {
    const key = JSON.stringify([circuit, corners, options ?? null]);
    const hit = cache.get(key);
    if (hit) {
      // Refresh its place so the entries in use survive the trimming.
      cache.delete(key);
      cache.set(key, hit);
      return hit;
    }
    const solution = solveRectifier(circuit, corners, options);
    if (cache.size >= CACHE_LIMIT) cache.delete(cache.keys().next().value!);
    cache.set(key, solution);
    return solution;
  };
}
