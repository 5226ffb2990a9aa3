import { describe, expect, it } from 'vitest';
import { solveCorner, solveRectifier } from '../../server/src/solve/solve-rectifier';
import { defaultCorners } from '../../server/src/solve/corners';
import { AT_25C, bridgeDevices, circuit, exactIdealBridge } from './fixtures';

const opts = { waveformPoints: 0, inrush: false };

/** Every number anywhere in a result is finite (DESIGN.md §8 JSON; never NaN). */
function expectAllFinite(x: unknown, path = 'result'): void {
  if (typeof x === 'number') expect(Number.isFinite(x), path).toBe(true);
  else if (Array.isArray(x)) x.forEach((v, k) => expectAllFinite(v, `${path}[${k}]`));
  else if (x && typeof x === 'object') for (const [k, v] of Object.entries(x)) expectAllFinite(v, `${path}.${k}`);
}

describe('periodic steady state by shooting', () => {
  it('a slow RC (τ = 1000 periods) converges in a few shooting iterations and matches the exact solution', () => {
    // 12 V, 0.1 F, 200 Ω: τ = 20 s at 50 Hz. Ideal diodes; reference derived in fixtures.ts.
    const s = solveCorner(circuit('diode-bridge', { vrms: 12 }, bridgeDevices(), [[0.1, 0]], { kind: 'resistance', ohm: 200 }), AT_25C, opts);
    expect(s.converged).toBe(true);
    expect(s.shootingIterations).toBeLessThanOrEqual(8);
    const ex = exactIdealBridge(12 * Math.SQRT2, 50, 200, 0.1);
    expect(Math.abs(s.rippleVpp! / ex.rippleVpp - 1)).toBeLessThan(0.01);
    expect(Math.abs(s.vOutAvgV! / ex.vDc - 1)).toBeLessThan(0.01);
  });

  it('series inductance: an RL load behind a bridge draws a sinusoid, Ipk = Vm/|Z|, PF = R/|Z| (derived)', () => {
    // Near-ideal diodes: the current never stops, so the source sees R + jωL.
    const r = 10.5, l = 50e-3, vm = 100 * Math.SQRT2;
    const s = solveCorner(circuit('diode-bridge', { vrms: 100, rOhm: 0.5, lH: l }, bridgeDevices(), [], { kind: 'resistance', ohm: 10 }), AT_25C, opts);
    const z = Math.hypot(r, 2 * Math.PI * 50 * l);
    expect(Math.abs(s.devices[0]!.ipkA! / (vm / z) - 1)).toBeLessThan(0.005);
    expect(Math.abs(s.powerFactor! / (r / z) - 1)).toBeLessThan(0.005);
    expectAllFinite(s);
  });

  it('capacitor and constant-power load: output power P and hold-up C(v0² − vmin²)/2P (energy balance)', () => {
    const c = 470e-6;
    const s = solveCorner(circuit('diode-bridge', { vrms: 230, rOhm: 2 }, bridgeDevices(), [[c, 0.1]], { kind: 'power', w: 60, vminV: 200 }), AT_25C, opts);
    expect(Math.abs(s.outputPowerW! / 60 - 1)).toBeLessThan(0.01);
    expect(s.holdUpS!).toBeCloseTo((c * (s.vOutMinV! ** 2 - 200 ** 2)) / (2 * 60), 9);
  });
});

describe('degenerate circuits are handled without NaN', () => {
  it('no load: the capacitor sits at the source peak with no ripple', () => {
    const s = solveCorner(circuit('diode-bridge', { vrms: 100 }, bridgeDevices(), [[1e-3, 0]], { kind: 'none' }), AT_25C, { waveformPoints: 50 });
    expect(Math.abs(s.vOutAvgV! / (100 * Math.SQRT2) - 1)).toBeLessThan(0.005);
    expect(s.rippleVpp!).toBeLessThan(1e-3);
    expect(s.efficiency).toBeUndefined();
    expect(s.notes.some((n) => n.includes('efficiency'))).toBe(true);
    expectAllFinite(s);
  });

  it('shorted source: no figures, a note saying why', () => {
    const s = solveCorner(circuit('diode-bridge', { vrms: 0 }, bridgeDevices(), [[1e-3, 0]], { kind: 'resistance', ohm: 10 }), AT_25C, opts);
    expect(s.vOutAvgV).toBeUndefined();
    expect(s.notes.join(' ')).toMatch(/source voltage is zero/);
    expectAllFinite(s);
  });

  it('zero capacitance is ignored with a note; a resistive load is then solved without filter (2Vm/π, Rashid ch. 3)', () => {
    const s = solveCorner(circuit('diode-bridge', { vrms: 100 }, bridgeDevices(), [[0, 0]], { kind: 'resistance', ohm: 100 }), AT_25C, opts);
    expect(s.notes.join(' ')).toMatch(/no positive capacitance/);
    expect(Math.abs(s.vOutAvgV! / ((2 * 100 * Math.SQRT2) / Math.PI) - 1)).toBeLessThan(0.005);
  });

  it('a constant-current load without capacitor cannot be solved and says so', () => {
    const s = solveCorner(circuit('diode-bridge', { vrms: 100 }, bridgeDevices(), [], { kind: 'current', a: 1 }), AT_25C, opts);
    expect(s.vOutAvgV).toBeUndefined();
    expect(s.notes.join(' ')).toMatch(/cannot be solved without a capacitor/);
  });
});

describe('corners', () => {
  it('default corners: line −10 %/nominal/+10 % × 25 °C/50 °C with lowercase names', () => {
    const cs = defaultCorners();
    expect(cs.map((c) => c.name)).toEqual([
      'low-line nominal', 'low-line hot', 'nominal-line nominal', 'nominal-line hot', 'high-line nominal', 'high-line hot',
    ]);
    expect(cs.map((c) => c.lineScale)).toEqual([0.9, 0.9, 1, 1, 1.1, 1.1]);
    expect(cs.map((c) => c.ambientC)).toEqual([25, 50, 25, 50, 25, 50]);
  });

  it('worst values come from the expected corners: PIV and inrush at high line, output average at low line', () => {
    const silicon = { isA: 5e-9, n: 1.9, rsOhm: 0.02, egEv: 1.11, xti: 3, tnomC: 25 };
    const sol = solveRectifier(circuit('diode-bridge', { vrms: 230, rOhm: 1 }, bridgeDevices(silicon, 60), [[100e-6, 0.2]], { kind: 'power', w: 80, vminV: 150 }), defaultCorners(), { waveformPoints: 20 });
    expect(sol.devices[0]!.pivV!.corner).toMatch(/^high-line/);
    expect(sol.worst.inrushPeakA!.corner).toMatch(/^high-line/);
    expect(sol.worst.vOutAvgV!.corner).toMatch(/^low-line/);
    expect(sol.devices[0]!.tjC!.corner).toMatch(/hot$/);
    // The worst is the extreme over corners, by definition.
    expect(sol.devices[0]!.pivV!.value).toBe(Math.max(...sol.corners.map((c) => c.devices[0]!.pivV!)));
    expectAllFinite(sol);
  });
});
