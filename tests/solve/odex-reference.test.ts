import { describe, expect, it } from 'vitest';
import { solveCorner } from '../../server/src/solve/solve-rectifier';
import { AT_25C, bridgeDevices, circuit } from './fixtures';
import { SPICE_DIODE, bridgeCurrentA, meanOf, sampledFigures, spiceDiodeV, type PeriodSample } from './spice-diode-reference';
import { loadOdex, type OdexSolver } from './odex-loader';

// Independent reference: the registry library `odex` (Hairer & Wanner's ODEX extrapolation
// integrator) integrates the same circuit by brute force from an empty capacitor until the period
// repeats. With source resistance and no inductance the state is the capacitor voltage alone and
// the bridge current is an algebraic function of it: a smooth non-stiff ODE, fit for ODEX.

interface Case { vrms: number; f: number; rs: number; c: number; rl: number }

function bruteForce(Solver: new (n: number) => OdexSolver, k: Case) {
  const w = 2 * Math.PI * k.f;
  const vm = k.vrms * Math.SQRT2;
  const T = 1 / k.f;
  const solver = new Solver(1);
  solver.absoluteTolerance = 1e-10;
  solver.relativeTolerance = 1e-10;
  solver.maxSteps = 1e6;
  const rhs = (t: number, y: number[]) => [(bridgeCurrentA(Math.abs(vm * Math.sin(w * t)), y[0]!, k.rs) - y[0]! / k.rl) / k.c];
  // Settle: integrate whole periods until the start-of-period voltage repeats to 1e-9 relative.
  let v0 = 0;
  let t0 = 0;
  for (let p = 0; p < 400; p++) {
    const v1 = solver.solve(rhs, t0, [v0], t0 + T).y[0]!;
    t0 += T;
    const done = Math.abs(v1 - v0) <= 1e-9 * vm;
    v0 = v1;
    if (done) break;
  }
  // Sample the settled period densely.
  const samples: PeriodSample[] = [];
  solver.denseOutput = true;
  solver.solve(rhs, t0, [v0], t0 + T, solver.grid(T / 40000, (t, y) => {
    samples.push({ v: y[0]!, i: bridgeCurrentA(Math.abs(vm * Math.sin(w * t)), y[0]!, k.rs) * (Math.sin(w * t) > 0 ? 1 : 0) });
  }));
  samples.pop(); // the grid includes both ends of the period; keep one
  return { ...sampledFigures(samples), lossW: meanOf(samples, (s) => spiceDiodeV(s.i) * s.i) };
}

describe('real diodes with source resistance, against odex run to steady state', () => {
  const cases: [string, Case][] = [
    ['12 V 50 Hz, 0.5 Ω, 2200 µF, 24 Ω', { vrms: 12, f: 50, rs: 0.5, c: 2200e-6, rl: 24 }],
    ['230 V 50 Hz, 1 Ω, 100 µF, 1 kΩ', { vrms: 230, f: 50, rs: 1, c: 100e-6, rl: 1000 }],
  ];
  for (const [label, k] of cases) {
    it(`${label}: ripple, peak, average and RMS current, loss within 1 %`, async () => {
      const ref = bruteForce(await loadOdex(), k);
      const s = solveCorner(
        circuit('diode-bridge', { vrms: k.vrms, freqHz: k.f, rOhm: k.rs }, bridgeDevices(SPICE_DIODE), [[k.c, 0]], { kind: 'resistance', ohm: k.rl }),
        AT_25C, { waveformPoints: 0, inrush: false },
      );
      const d = s.devices[0]!; // upper-a: conducts in the positive half-cycle, as sampled above
      const rel = (a: number | undefined, b: number) => Math.abs(a! / b - 1);
      expect(rel(s.rippleVpp, ref.rippleVpp)).toBeLessThan(0.01);
      expect(rel(d.ipkA, ref.ipkA)).toBeLessThan(0.01);
      expect(rel(d.iavgA, ref.iavgA)).toBeLessThan(0.01);
      expect(rel(d.irmsA, ref.irmsA)).toBeLessThan(0.01);
      expect(rel(d.lossW, ref.lossW)).toBeLessThan(0.01);
    });
  }
});
