/**
 * Transformers from K coupling, checked against the coupled-inductor equations (derived here):
 *   v1 = L1·di1/dt + M·di2/dt,  v2 = M·di1/dt + L2·di2/dt,  M = k·√(L1·L2).
 * Open secondary (i2 = 0): v2/v1 = M/L1. With v1 held by an ideal source, eliminating di1/dt gives
 *   v2 = (M/L1)·v1 + (L2 − M²/L1)·di2/dt,
 * so the secondary's Thevenin EMF is (M/L1)·v1 and its series (leakage) inductance is L2 − M²/L1.
 * For k = 1 the ratio is √(L2/L1) = N2/N1, the ideal transformer (inductance ∝ turns²).
 */
import { describe, expect, it } from 'vitest';
import { recognize } from './check';

const L1 = 1.0;
const L2 = 0.01;
const K = 0.98;
const M = K * Math.sqrt(L1 * L2);
const RATIO = M / L1; // derived above
const LEAK = L2 - (M * M) / L1; // derived above

const DIODES = 'D1 s1 out DM\nD2 s2 out DM\nD3 0 s1 DM\nD4 0 s2 DM\n.model DM D';

function transformerBridge(extra = '') {
  const text = `* transformer\n${extra}\nV1 line 0 SIN(0 325.27 50)\nRP line p1 2\nLP p1 0 ${L1}\nLS w1 s2 ${L2}\nRS w1 s1 0.3\nK1 LP LS ${K}\nC1 out 0 1000u\nRL out 0 50\n${DIODES}\n.end\n`;
  const { result } = recognize(text);
  expect(result.rectifiers).toHaveLength(1);
  return { rectifier: result.rectifiers[0]!, diagnostics: result.diagnostics };
}

describe('transformer from K coupling', () => {
  it('finds the turns ratio √(L2/L1), the voltage ratio M/L1 and the leakage L2 − M²/L1 = (1 − k²)·L2', () => {
    const t = transformerBridge().rectifier.surroundings.source.transformer!;
    expect(t).toMatchObject({ coupling: 'K1', primary: 'LP', secondary: 'LS', k: K });
    expect(t.turnsRatio).toBeCloseTo(Math.sqrt(L2 / L1), 12);
    expect(t.voltageRatio).toBeCloseTo(RATIO, 12);
    expect(t.leakageH).toBeCloseTo(LEAK, 15);
    expect(t.leakageH).toBeCloseTo((1 - K * K) * L2, 15);
  });
  it('refers the source through the transformer: EMF, leakage, and primary R times the ratio squared', () => {
    const { rectifier, diagnostics } = transformerBridge();
    const s = rectifier.surroundings.source;
    expect(s.vrms).toBeCloseTo((325.27 / Math.SQRT2) * RATIO, 9);
    expect(s.mainsVrms).toBeCloseTo(325.27 / Math.SQRT2, 9);
    expect(s.turnsRatio).toBeCloseTo(RATIO, 12);
    expect(s.seriesLH).toBeCloseTo(LEAK, 15);
    // A primary resistance R seen from the secondary through an ideal ratio n is n²·R (power conserved).
    expect(s.seriesROhm).toBeCloseTo(0.3 + 2 * RATIO * RATIO, 12);
    expect(diagnostics).toEqual([]);
  });
  it('takes the line voltage from the mains directive on the primary side', () => {
    const s = transformerBridge('*@ mains 120V 60Hz').rectifier.surroundings.source;
    expect(s.vrms).toBeCloseTo(120 * RATIO, 9);
    expect(s.mainsVrms).toBeCloseTo(120, 9);
    expect(s.freqHz).toBe(60);
  });
  it('approaches the ideal transformer as k → 1', () => {
    const text = `* ideal\nV1 p 0 SIN(0 100 50)\nLP p 0 4\nLS s1 s2 1\nK1 LP LS 1\n${DIODES}\nRL out 0 10\n.end\n`;
    const s = recognize(text).result.rectifiers[0]!.surroundings.source;
    expect(s.vrms).toBeCloseTo((100 / Math.SQRT2) * 0.5, 9); // N2/N1 = √(1/4)
    expect(s.seriesLH).toBe(0);
  });
  it('assumes nominal mains on a primary that nothing drives, and says so', () => {
    const text = `* undriven\nLP p 0 1\nLS s1 s2 0.01\nK1 LP LS 1\n${DIODES}\nC1 out 0 100u\nRL out 0 10\n.end\n`;
    const { rectifiers, diagnostics } = recognize(text).result;
    expect(rectifiers[0]!.surroundings.source.vrms).toBeCloseTo(230 * 0.1, 9);
    expect(diagnostics.map((d) => d.message)).toEqual(['no source drives LP; assuming 230 V 50 Hz mains on it (IEC 60038 nominal)']);
  });
  it('gives a centre-tapped rectifier the voltage of each half-winding', () => {
    const text = `* ct\nV1 line 0 SIN(0 325.27 50)\nLP line 0 1\nLS1 a 0 2.5m\nLS2 0 b 2.5m\nK1 LP LS1 LS2 1\nD1 a out DM\nD2 b out DM\nC1 out 0 1000u\nRL out 0 10\n.model DM D\n.end\n`;
    const r = recognize(text).result.rectifiers[0]!;
    expect(r.kind).toBe('centre-tap');
    expect(r.surroundings.source.vrms).toBeCloseTo((325.27 / Math.SQRT2) * Math.sqrt(2.5e-3 / 1), 9);
  });
});
