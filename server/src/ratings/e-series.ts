/**
 * Preferred values of IEC 60063:2015, "Preferred number series for resistors and capacitors":
 * the E6, E12 and E24 series, one decade each (1.0 … 9.1), and the search for the next preferred
 * value, used by the inrush-resistor fix.
 *
 * The tables are the standard's published values, written from memory (they are printed on every
 * resistor colour-code chart); the tests also check the derivable rule behind them.
 */

/** IEC 60063:2015 E6 (±20 %), from memory. */
export const E6: readonly number[] = [1.0, 1.5, 2.2, 3.3, 4.7, 6.8];

/** IEC 60063:2015 E12 (±10 %), from memory. */
export const E12: readonly number[] = [1.0, 1.2, 1.5, 1.8, 2.2, 2.7, 3.3, 3.9, 4.7, 5.6, 6.8, 8.2];

/** IEC 60063:2015 E24 (±5 %), from memory. */
export const E24: readonly number[] = [
  1.0, 1.1, 1.2, 1.3, 1.5, 1.6, 1.8, 2.0, 2.2, 2.4, 2.7, 3.0,
  3.3, 3.6, 3.9, 4.3, 4.7, 5.1, 5.6, 6.2, 6.8, 7.5, 8.2, 9.1,
];

export type ESeriesName = 'E6' | 'E12' | 'E24';

/** The decade table of a series. */
export const E_SERIES: Readonly<Record<ESeriesName, readonly number[]>> = { E6, E12, E24 };

/** The citation shown beside a value taken from these tables. */
export const E_SERIES_SOURCE = 'IEC 60063:2015, Preferred number series for resistors and capacitors';

export type RoundDirection = 'up' | 'down' | 'nearest';

/**
 * The preferred value of `series` next to `value`: the smallest one at or above it (`up`, for a
 * minimum resistance), the largest at or below it (`down`), or the nearest on a logarithmic scale
 * (`nearest`, ties going up). A value already on the series is returned as is. Undefined for a
 * value that is not a positive finite number.
 */
export function nextPreferredValue(value: number, series: ESeriesName, direction: RoundDirection): number | undefined {
  if (!(value > 0) || !Number.isFinite(value)) return undefined;
  const table = E_SERIES[series];
  const exponent = Math.floor(Math.log10(value));
  // Candidates from the decade below to the decade above cover every rounding edge (e.g. 9.5
  // rounds up to 10, the first value of the next decade).
  const candidates = [exponent - 1, exponent, exponent + 1].flatMap((e) => table.map((m) => scale(m, e)));
  const tol = value * 1e-9;
  if (direction === 'up') return candidates.find((c) => c >= value - tol);
  if (direction === 'down') return [...candidates].reverse().find((c) => c <= value + tol);
  const up = candidates.find((c) => c >= value - tol)!;
  const down = [...candidates].reverse().find((c) => c <= value + tol)!;
  return Math.log(up / value) <= Math.log(value / down) ? up : down;
}

/** m·10^e without the binary noise of a product such as 4.7·100 = 470.00000000000006. */
function scale(mantissa: number, exponent: number): number {
  return Number((mantissa * 10 ** exponent).toPrecision(3));
}
