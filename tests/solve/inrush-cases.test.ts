/**
 * The inrush check's cases (solve/inrush-cases.ts): both switch-on polarities, and with an NTC
 * limiter a cold start and a hot restart. Every circuit has no series inductance and near-ideal
 * diodes (N = 0.001: a drop of about a millivolt at hundreds of amperes), so at switch-on with the
 * capacitor empty the current steps at once to Vcrest/(R_series + the two conducting diodes' RS)
 * and then falls as the capacitor charges (D: Ohm's law with the capacitor at 0 V; no capacitance
 * enters the peak, so no "large capacitor" approximation is needed).
 */
import { describe, expect, it } from 'vitest';
import { solveCorner } from '../../server/src/solve/solve-rectifier';
import { buildNetwork, setDeviceTemperatures } from '../../server/src/solve/network';
import { simulateInrush } from '../../server/src/solve/inrush';
import { inrushCasesOf } from '../../server/src/solve/inrush-cases';
import type { EquivalentCircuit } from '../../server/src/solve/equivalent-circuit';
import { AT_25C, IDEAL_DIODE, bridgeDevices, circuit, diode } from './fixtures';

const VM = 230 * Math.SQRT2; // 325.27 V crest (D)

/** A 230 V bridge into 4.7 mF: D1/D4 (the positive crest's pair) with RS 0.05 Ω, D2/D3 with RS 0.5 Ω. */
function unevenBridge(rOhm: number): EquivalentCircuit {
  const devices = bridgeDevices().map((d, k) => ({ ...d, params: { ...IDEAL_DIODE, rsOhm: k === 0 || k === 3 ? 0.05 : 0.5 } }));
  return circuit('diode-bridge', { vrms: 230, rOhm }, devices, [[4.7e-3, 0]], { kind: 'resistance', ohm: 1e3 });
}

describe('both switch-on polarities', () => {
  it('each pair of a bridge takes the surge of its own crest; the worse is the rectifier’s', () => {
    const s = solveCorner(unevenBridge(1), AT_25C, { waveformPoints: 0 });
    const byName = Object.fromEntries(s.devices.map((d) => [d.name, d]));
    const positive = VM / (1 + 2 * 0.05); // 295.7 A (D, see the file comment)
    const negative = VM / (1 + 2 * 0.5); // 162.6 A (D)
    expect(byName.D1!.inrushPeakA! / positive).toBeCloseTo(1, 2);
    expect(byName.D4!.inrushPeakA! / positive).toBeCloseTo(1, 2);
    expect(byName.D2!.inrushPeakA! / negative).toBeCloseTo(1, 2);
    expect(byName.D3!.inrushPeakA! / negative).toBeCloseTo(1, 2);
    expect(byName.D1!.inrushCase).toBe('switch-on at the positive crest');
    expect(byName.D2!.inrushCase).toBe('switch-on at the negative crest');
    expect(s.inrushPeakA! / positive).toBeCloseTo(1, 2);
    expect(s.inrushCase).toBe('switch-on at the positive crest');
  });

  it('one polarity alone understates the other pair’s surge', () => {
    const c = unevenBridge(1);
    const net = buildNetwork(c, 1, c.devices.map(() => 25), [])!;
    setDeviceTemperatures(net, c.devices.map(() => 25));
    const positiveOnly = simulateInrush(net, 1e-5, 'positive');
    // In the positive crest's window D2 (index 1) conducts only after the zero crossing, into a
    // capacitor already part-charged (τ = 1.1 Ω · 4.7 mF = 5.2 ms), so it sees about half of its own
    // 162.6 A surge at the negative crest.
    expect(positiveOnly.devicePeakA[1]!).toBeLessThan(0.6 * (VM / 2));
    expect(positiveOnly.devicePeakA[1]!).toBeGreaterThan(0);
  });

  it('a symmetric bridge takes the negative crest as the positive one mirrored, equal to integrating it', () => {
    // All four diodes alike: the negative crest drives the same loop through the other pair, so the
    // solver swaps the halves instead of integrating again (symmetry, D). Checked against the integration.
    const c = circuit('diode-bridge', { vrms: 230, rOhm: 1 }, bridgeDevices({ ...IDEAL_DIODE, rsOhm: 0.05 }), [[4.7e-3, 0]], { kind: 'resistance', ohm: 1e3 });
    const s = solveCorner(c, AT_25C, { waveformPoints: 0 });
    const net = buildNetwork(c, 1, c.devices.map(() => 25), [])!;
    setDeviceTemperatures(net, c.devices.map(() => 25));
    const negative = simulateInrush(net, 1e-5, 'negative');
    s.devices.forEach((d, k) => {
      if (d.inrushCase !== 'switch-on at the negative crest') return;
      expect(d.inrushPeakA! / negative.devicePeakA[k]!).toBeCloseTo(1, 4);
      expect(d.inrushI2tA2s! / negative.i2tA2s[k]!).toBeCloseTo(1, 3);
    });
    expect(s.devices.filter((d) => d.inrushCase === 'switch-on at the negative crest').map((d) => d.name)).toEqual(['D2', 'D3']);
  });

  it('a half-wave rectifier charges on one polarity only, so it runs one case', () => {
    const c = circuit('half-wave', { vrms: 230, rOhm: 1 }, [diode('D1', 'series')], [[1e-3, 0]], { kind: 'resistance', ohm: 1e3 });
    expect(inrushCasesOf(c).map((k) => k.polarity)).toEqual(['positive']);
  });
});

describe('NTC hot restart', () => {
  // An NTC of 10 Ω cold and 1 Ω hot plus 0.1 Ω of wiring; the circuit carries the hot value (steady state).
  const withNtc = (): EquivalentCircuit => ({
    ...circuit('diode-bridge', { vrms: 230, rOhm: 1.1 }, bridgeDevices(), [[470e-6, 0]], { kind: 'resistance', ohm: 1e3 }),
    inrushLimiter: { names: ['RNTC'], coldROhm: 10, hotROhm: 1 },
  });

  it('runs a cold start with the cold value and a hot restart with the hot one', () => {
    expect(inrushCasesOf(withNtc()).map((k) => [k.start, k.seriesROhm, k.polarity])).toEqual([
      ['cold start', 10.1, 'positive'], ['cold start', 10.1, 'negative'], ['hot restart', 1.1, 'positive'], ['hot restart', 1.1, 'negative'],
    ]);
  });

  it('the hot restart peaks at Vcrest/(R_hot + the other series R), about nine times the cold start', () => {
    const s = solveCorner(withNtc(), AT_25C, { waveformPoints: 0 });
    expect(s.inrushPeakA! / (VM / 1.1)).toBeCloseTo(1, 2); // 295.7 A (D)
    expect(s.inrushCase).toBe('hot restart at the positive crest');
    // The cold start alone: the same circuit without the limiter, at its cold resistance.
    const cold = solveCorner({ ...withNtc(), inrushLimiter: undefined, source: { ...withNtc().source, seriesROhm: 10.1 } }, AT_25C, { waveformPoints: 0 });
    expect(cold.inrushPeakA! / (VM / 10.1)).toBeCloseTo(1, 2); // 32.2 A (D)
    expect(s.inrushPeakA! / cold.inrushPeakA!).toBeCloseTo(10.1 / 1.1, 1); // 9.18 (D)
  });
});
