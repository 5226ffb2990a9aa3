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

/**
 * The cache is bounded by the numbers its solutions hold, not by their count: a solution with
 * waveforms is a hundred times one without, and a count limit let a long session keep hundreds of
 * megabytes. About 4 million numbers (some 32 MB of doubles) keep every rectifier of a large file
 * and its fix trials; beyond it the least recently used entries are dropped.
 */
export const CACHE_NUMBER_BUDGET = 4_000_000;

/** Weights counted once per solution: trimming sums them on every store. */
const weights = new WeakMap<RectifierSolution, number>();

/** Numbers a solution holds, counted roughly: its corners' figures and every waveform sample. */
export function solutionWeight(solution: RectifierSolution): number {
  const known = weights.get(solution);
  if (known !== undefined) return known;
  let weight = 64;
  for (const corner of solution.corners) {
    weight += 64 + 16 * corner.devices.length;
    for (const w of [corner.waveform, corner.inrushWaveform]) {
      if (w) weight += w.tS.length * (4 + w.deviceA.length);
    }
  }
  weights.set(solution, weight);
  return weight;
}

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
    cache.set(key, solution);
    trimToBudget(cache);
    return solution;
  };
}

/** Drops the least recently used solutions until the cache fits its budget (the newest always stays). */
function trimToBudget(cache: SolutionCache): void {
  let total = 0;
  for (const s of cache.values()) total += solutionWeight(s);
  for (const [key, s] of cache) {
    if (total <= CACHE_NUMBER_BUDGET || cache.size === 1) return;
    total -= solutionWeight(s);
    cache.delete(key);
  }
}
