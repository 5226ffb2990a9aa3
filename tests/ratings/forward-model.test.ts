import { describe, expect, it } from 'vitest';
import { fitForwardModel, forwardVoltageV, thermalVoltageV } from '../../server/src/ratings/index';

describe('fitForwardModel', () => {
  it('recovers IS = 1e-14, N = 1 from the SPICE3 points of REFERENCES.md §8', () => {
    // IS 1e-14 A, N 1 at 300.15 K: 1 mA → 0.65512 V, 1 A → 0.83379 V (REFERENCES.md §8, C/D).
    expect(thermalVoltageV(27)).toBeCloseTo(0.025865, 6);
    const m = fitForwardModel([{ vV: 0.65512, iA: 1e-3 }, { vV: 0.83379, iA: 1 }], 'silicon', 'test', 27)!;
    expect(m.n).toBeCloseTo(1, 3);
    expect(m.isA / 1e-14).toBeCloseTo(1, 1);
    expect(m.rsOhm).toBe(0);
    expect(m.tnomC).toBe(27);
  });

  it('recovers a known IS, N, RS from three exact points', () => {
    // Points generated from the diode equation in the test (D), then fitted back.
    const truth = { isA: 2e-9, n: 1.8, rsOhm: 0.05 };
    const vt = (1.380649e-23 * 298.15) / 1.602176634e-19;
    const point = (iA: number) => ({ iA, vV: truth.n * vt * Math.log(1 + iA / truth.isA) + truth.rsOhm * iA });
    const m = fitForwardModel([point(0.01), point(0.3), point(2)], 'silicon', 'test')!;
    expect(m.n).toBeCloseTo(1.8, 6);
    expect(m.rsOhm).toBeCloseTo(0.05, 6);
    expect(m.isA / 2e-9).toBeCloseTo(1, 4);
    expect(forwardVoltageV(m, 1)).toBeCloseTo(point(1).vV, 6);
  });

  it('fits more than three points by least squares', () => {
    const m = fitForwardModel([{ vV: 0.6, iA: 0.01 }, { vV: 0.7, iA: 0.1 }, { vV: 0.82, iA: 1 }, { vV: 0.95, iA: 3 }], 'silicon', 'test')!;
    for (const [iA, vV] of [[0.01, 0.6], [0.1, 0.7], [1, 0.82], [3, 0.95]] as const) expect(Math.abs(forwardVoltageV(m, iA) - vV)).toBeLessThan(0.01);
  });

  it('refuses points that are not a forward diode', () => {
    expect(fitForwardModel([{ vV: 0.9, iA: 1 }, { vV: 0.9, iA: 1 }], 'silicon', 'x')).toBeUndefined();
    expect(fitForwardModel([{ vV: 0.9, iA: 0.1 }, { vV: 0.7, iA: 1 }], 'silicon', 'x')).toBeUndefined();
    expect(fitForwardModel([{ vV: 0.9, iA: 1 }], 'silicon', 'x')).toBeUndefined();
    // Concave points would need a negative RS.
    expect(fitForwardModel([{ vV: 0.5, iA: 0.01 }, { vV: 0.8, iA: 0.1 }, { vV: 0.85, iA: 1 }], 'silicon', 'x')).toBeUndefined();
  });
});
