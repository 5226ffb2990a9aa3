import { describe, expect, it } from 'vitest';
import { checkHarmonicLimits, classALimitA, classDLimitA } from '../../server/src/solve/iec61000-3-2';

// IEC 61000-3-2:2018 (edition 5.0), values as reproduced in REFERENCES.md §3.
describe('IEC 61000-3-2:2018 ed. 5.0 limits', () => {
  it('Class A, Table 1', () => {
    const odd: [number, number][] = [[3, 2.3], [5, 1.14], [7, 0.77], [9, 0.4], [11, 0.33], [13, 0.21]];
    const even: [number, number][] = [[2, 1.08], [4, 0.43], [6, 0.3]];
    for (const [n, a] of [...odd, ...even]) expect(classALimitA(n)).toBeCloseTo(a, 12);
    for (let n = 15; n <= 39; n += 2) expect(classALimitA(n)).toBeCloseTo((0.15 * 15) / n, 12); // 0.15·15/n
    for (let n = 8; n <= 40; n += 2) expect(classALimitA(n)).toBeCloseTo((0.23 * 8) / n, 12); // 0.23·8/n
    expect(classALimitA(1)).toBeUndefined();
    expect(classALimitA(41)).toBeUndefined();
  });

  it('Class D, Table 3: per-watt column capped by the absolute column', () => {
    const perW: [number, number][] = [[3, 3.4], [5, 1.9], [7, 1.0], [9, 0.5], [11, 0.35]];
    for (const [n, maPerW] of perW) expect(classDLimitA(n, 100)).toBeCloseTo((maPerW * 100) / 1000, 12);
    for (let n = 13; n <= 39; n += 2) expect(classDLimitA(n, 100)).toBeCloseTo((3.85 / n) * 0.1, 12);
    expect(classDLimitA(4, 100)).toBeUndefined(); // no even-order Class D limits
  });

  it('step checks: 200 W → 0.68/0.38/0.20 A; 600 W → 2.04/1.14/0.60 A; 500 W 3rd → 1.7 A (REFERENCES §3)', () => {
    expect(classDLimitA(3, 200)).toBeCloseTo(0.68, 12);
    expect(classDLimitA(5, 200)).toBeCloseTo(0.38, 12);
    expect(classDLimitA(7, 200)).toBeCloseTo(0.2, 12);
    expect(classDLimitA(3, 600)).toBeCloseTo(2.04, 12);
    expect(classDLimitA(5, 600)).toBeCloseTo(1.14, 12); // 1.9 mA/W × 600 W = 1.14 A = absolute cap
    expect(classDLimitA(7, 600)).toBeCloseTo(0.6, 12);
    expect(classDLimitA(3, 500)).toBeCloseTo(1.7, 12);
  });

  it('applicability: 220–240 V mains, above 75 W (clause 7), Class D up to 600 W', () => {
    const h = new Array(40).fill(0.005);
    expect(checkHarmonicLimits(h, 'A', 120, 60, 200).applicable).toBe(false);
    expect(checkHarmonicLimits(h, 'D', 230, 50, 70).applicable).toBe(false);
    expect(checkHarmonicLimits(h, 'D', 230, 50, 700).applicable).toBe(false);
    const ok = checkHarmonicLimits(h, 'D', 230, 50, 100);
    expect(ok.applicable && ok.pass).toBe(true);
    // The 230 V example of REFERENCES §2 (D): I3 = 0.420 A at 97.6 W fails Class D (limit 0.332 A).
    const fail = checkHarmonicLimits([0.4392, 0, 0.42], 'D', 230, 50, 97.58);
    expect(fail.pass).toBe(false);
    expect(fail.worstOrder).toBe(3);
    expect(fail.rows.find((r) => r.n === 3)!.limitA).toBeCloseTo(0.0034 * 97.58, 9);
  });
});
