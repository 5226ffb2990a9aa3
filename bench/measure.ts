/** Timing helpers for the benchmarks: medians of repeated runs, high-resolution clock. */
export interface BenchFigure {
  name: string;
  value: number;
  unit: string;
  target?: string;
  met?: boolean;
  note?: string;
}

/** Median wall time in milliseconds of `runs` calls. */
export function median(runs: number, work: () => unknown): number {
  const times: number[] = [];
  for (let i = 0; i < runs; i++) {
    const start = process.hrtime.bigint();
    work();
    times.push(Number(process.hrtime.bigint() - start) / 1e6);
  }
  return percentile(times, 50);
}

export function percentile(values: readonly number[], p: number): number {
  const sorted = [...values].sort((a, b) => a - b);
  const rank = Math.min(sorted.length - 1, Math.max(0, Math.ceil((p / 100) * sorted.length) - 1));
  return sorted[rank]!;
}
