import { describe, expect, it } from 'vitest';
import { E6, E12, E24, E_SERIES_SOURCE, nextPreferredValue } from '../../server/src/ratings/index';

// IEC 60063:2015, "Preferred number series for resistors and capacitors". The tables in the code
// are written from memory; these tests check them against the rule the standard's series follow.
const round2 = (x: number): number => Number(x.toPrecision(2));

/**
 * The E24 values that differ from 10^(i/24) rounded to two significant figures: the historical
 * values the standard keeps (2.7 … 4.7 and 8.2 where the formula gives 2.6 … 4.6 and 8.3).
 * From memory; the test below would fail if any other value broke the rule.
 */
const E24_EXCEPTIONS = new Map<number, number>([
  [10, 2.7], [11, 3.0], [12, 3.3], [13, 3.6], [14, 3.9], [15, 4.3], [16, 4.7], [22, 8.2],
]);

describe('IEC 60063 E-series tables', () => {
  it('cites the standard', () => {
    expect(E_SERIES_SOURCE).toBe('IEC 60063:2015, Preferred number series for resistors and capacitors');
  });

  it('E24 is 10^(i/24) to two significant figures but for the standard\'s known exceptions', () => {
    expect(E24).toHaveLength(24);
    E24.forEach((value, i) => expect(value, `E24[${i}]`).toBe(E24_EXCEPTIONS.get(i) ?? round2(10 ** (i / 24))));
  });

  it('E12 is every second E24 value and E6 every second E12 value', () => {
    // The series are nested: E(n) is every second term of E(2n) (IEC 60063 structure, D from the ratios).
    expect(E12).toEqual(E24.filter((_, i) => i % 2 === 0));
    expect(E6).toEqual(E12.filter((_, i) => i % 2 === 0));
  });

  it('E12 approximates 10^(i/12): two-figure rounding except the inherited E24 values', () => {
    E12.forEach((value, i) => {
      const ideal = 10 ** (i / 12);
      const exception = E24_EXCEPTIONS.get(2 * i);
      expect(value, `E12[${i}]`).toBe(exception ?? round2(ideal));
      // Every value stays within 5 % of the geometric ideal (the largest gap is 3.3 vs 3.16, D).
      expect(Math.abs(value / ideal - 1)).toBeLessThan(0.05);
    });
  });

  it('spot values from the E12 colour-code chart (from memory)', () => {
    expect(E12).toEqual([1.0, 1.2, 1.5, 1.8, 2.2, 2.7, 3.3, 3.9, 4.7, 5.6, 6.8, 8.2]);
    expect(E6).toEqual([1.0, 1.5, 2.2, 3.3, 4.7, 6.8]);
  });
});

describe('nextPreferredValue', () => {
  it('rounds up across decades and keeps values already on the series', () => {
    expect(nextPreferredValue(10.5, 'E12', 'up')).toBe(12);
    expect(nextPreferredValue(9.5, 'E12', 'up')).toBe(10);
    expect(nextPreferredValue(470, 'E12', 'up')).toBe(470);
    expect(nextPreferredValue(4.7e3 * (1 + 1e-12), 'E12', 'up')).toBe(4700);
    expect(nextPreferredValue(0.05, 'E24', 'up')).toBe(0.051);
  });

  it('rounds down and to the nearest on a log scale', () => {
    expect(nextPreferredValue(0.35, 'E12', 'down')).toBe(0.33);
    expect(nextPreferredValue(1, 'E6', 'down')).toBe(1);
    expect(nextPreferredValue(0.99, 'E6', 'down')).toBe(0.68);
    // ln(5.6/5) = 0.113 > ln(5/4.7) = 0.062, so 4.7 is nearer (D).
    expect(nextPreferredValue(5, 'E12', 'nearest')).toBe(4.7);
    expect(nextPreferredValue(5.3, 'E12', 'nearest')).toBe(5.6);
  });

  it('sizes an inrush resistor: 253 V·√2 crest into 30 A needs 11.9 Ω → 12 Ω E12', () => {
    // R ≥ Vpk / IFSM with an empty capacitor (D); 30 A is an example figure, not a part's rating.
    const rMinOhm = (253 * Math.SQRT2) / 30;
    expect(rMinOhm).toBeCloseTo(11.93, 2);
    expect(nextPreferredValue(rMinOhm, 'E12', 'up')).toBe(12);
    expect(nextPreferredValue(rMinOhm, 'E6', 'up')).toBe(15);
  });

  it('refuses values that are not positive finite numbers', () => {
    for (const bad of [0, -1, Number.NaN, Number.POSITIVE_INFINITY]) expect(nextPreferredValue(bad, 'E12', 'up')).toBeUndefined();
  });
});
