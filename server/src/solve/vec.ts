/**
 * Small dense vectors as plain arrays. The solver's vectors hold one to nine numbers and are
 * created per solve; plain arrays are far cheaper to create and collect than typed arrays, whose
 * off-heap backing stores made allocation dominate a sub-millisecond solve.
 */

/** An array of n zeros. */
export function zeros(n: number): number[] {
  const a = new Array<number>(n);
  for (let k = 0; k < n; k++) a[k] = 0;
  return a;
}

/** Copies src into dst element by element (same length). */
export function copyInto(dst: number[], src: readonly number[]): void {
  for (let k = 0; k < src.length; k++) dst[k] = src[k]!;
}
