/**
 * Shared fuzzing settings. The seed is fixed so `npm test` is reproducible; `FUZZ_RUNS` multiplies
 * every suite's case count for the longer `npm run fuzz` (e.g. FUZZ_RUNS=20), and `FUZZ_SEED`
 * replays or varies a run.
 */
export const FUZZ_SEED = Number(process.env.FUZZ_SEED ?? 20_260_808);

const MULTIPLIER = Math.max(1, Number(process.env.FUZZ_RUNS ?? 1) || 1);

/** The case count of a suite: its default in `npm test`, scaled up for `npm run fuzz`. */
export function runs(defaultCount: number): number {
  return Math.round(defaultCount * MULTIPLIER);
}

/** Whether this is the long run (tests may then also raise their timeouts). */
export const LONG_RUN = MULTIPLIER > 1;

/** Per-test timeout for a suite of `count` cases at a generous per-case cost. */
export function timeoutFor(count: number, msPerCase: number): number {
  return Math.max(60_000, count * msPerCase);
}

/**
 * Wall-clock bound on one document through analysis and every feature. Generous on purpose:
 * it is a hang detector on a loaded 2-core machine, not a speed target (the benchmark has those);
 * the slowest generated document took 15–19 s on a slow day.
 */
export const MAX_MS_PER_DOCUMENT = 60_000;

/**
 * Options for every property run: stop at the first counterexample and report it as found.
 * Shrinking re-runs the whole pipeline hundreds of times, which on a loaded CI machine can
 * outlast the run itself; the seed and the reported case are enough to replay a failure.
 */
export const PROPERTY_OPTIONS = { endOnFailure: true } as const;
