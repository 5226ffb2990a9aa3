/**
 * A single-phase bridge with a DC choke between it and the filter capacitor ("choke input"), in
 * continuous and discontinuous conduction: against an independent integration of the same circuit
 * with the registry library `odex` (Hairer & Wanner's ODEX), run period after period to steady
 * state, and against the textbook critical-inductance condition.
 */
import { describe, expect, it } from 'vitest';
import { solveCorner } from '../../server/src/solve/solve-rectifier';
import type { DiodeParams, EquivalentCircuit } from '../../server/src/solve/equivalent-circuit';
import { AT_25C, bisect, bridgeDevices, circuit } from './fixtures';
import { loadOdex, type OdexSolver } from './odex-loader';
import { runPiecewise, type PiecewiseSystem } from './piecewise-reference';

/** Our own example diode (no datasheet): IS and N written out, RS = 0, TNOM 25 °C. */
const DIODE: DiodeParams = { isA: 5e-9, n: 1.9, rsOhm: 0, egEv: 1.11, xti: 3, tnomC: 25 };
const VT_25C = (1.380649e-23 * 298.15) / 1.602176634e-19; // kT/q, SI-exact constants
const vDiode = (i: number) => DIODE.n * VT_25C * Math.log1p(Math.max(i, 0) / DIODE.isA); // SPICE diode law, RS = 0

interface Case { vrms: number; f: number; rs: number; lH: number; rL: number; c: number; rl: number }

function chokeCircuit(k: Case, params: DiodeParams = DIODE): EquivalentCircuit {
  const c = circuit('diode-bridge', { vrms: k.vrms, freqHz: k.f, rOhm: k.rs }, bridgeDevices(params), [[k.c, 0]], { kind: 'resistance', ohm: k.rl });
  return { ...c, choke: { names: ['L1'], lH: k.lH, rOhm: k.rL } };
}

/**
 * The bridge as the four diodes it is. With choke current iL and line current is, pair 1 (upper-a,
 * lower-b) carries i1 = (iL + is)/2 and pair 2 i2 = (iL − is)/2 (KCL at the four nodes, equal
 * diodes). KVL: the AC terminals differ by e − Rs·is = vBus + 2·vD(i1) = −vBus − 2·vD(i2).
 * One pair alone (is = ±iL) while its sum holds; near a zero crossing both pairs conduct, with is
 * from e − Rs·is = vD(i1) − vD(i2) (monotone, bisection) and vBus = −vD(i1) − vD(i2).
 */
function bridge(e: number, iL: number, rs: number): { is: number; vBus: number } {
  const g = (is: number) => e - rs * is - vDiode((iL + is) / 2) + vDiode((iL - is) / 2);
  if (g(iL) >= 0) return { is: iL, vBus: e - rs * iL - 2 * vDiode(iL) };
  if (g(-iL) <= 0) return { is: -iL, vBus: -e - rs * iL - 2 * vDiode(iL) };
  const is = bisect(g, -iL, iL, 100);
  return { is, vBus: -vDiode((iL + is) / 2) - vDiode((iL - is) / 2) };
}

/**
 * Brute force. States y = [iL, vC]. Conducting: L·diL/dt = vBus − RL·iL − vC; blocked (iL = 0)
 * until |e| exceeds vC; always C·dvC/dt = iL − vC/R. Each mode is integrated as a smooth ODE and
 * the turn-on and turn-off instants are located as events (piecewise-reference.ts).
 */
function bruteForce(Solver: new (n: number) => OdexSolver, k: Case) {
  const w = 2 * Math.PI * k.f;
  const vm = k.vrms * Math.SQRT2;
  const T = 1 / k.f;
  const ON = 1;
  const sys: PiecewiseSystem = {
    n: 2,
    rhs: (mode, t, y) => {
      const iL = Math.max(y[0]!, 0);
      const dI = mode === ON ? (bridge(vm * Math.sin(w * t), iL, k.rs).vBus - k.rL * iL - y[1]!) / k.lH : 0;
      return [dI, (iL - y[1]! / k.rl) / k.c];
    },
    guard: (mode, t, y) => (mode === ON ? y[0]! : y[1]! - Math.abs(vm * Math.sin(w * t))),
    settle: (t, y) => (y[0]! > 0 || Math.abs(vm * Math.sin(w * t)) > y[1]! ? { mode: ON, y: [Math.max(y[0]!, 0), y[1]!] } : { mode: 0, y: [0, y[1]!] }),
  };
  let y = [0, 0];
  let t0 = 0;
  for (let p = 0; p < 3000; p++) {
    const y1 = runPiecewise(Solver, sys, t0, t0 + T, y, 1e-10, T / 2000).y;
    t0 += T;
    const done = Math.abs(y1[1]! - y[1]!) <= 1e-8 * vm && Math.abs(y1[0]! - y[0]!) <= 1e-8 * (vm / k.rl);
    y = y1;
    if (done) break;
  }
  const samples: { v: number; iL: number; is: number; e: number }[] = [];
  runPiecewise(Solver, sys, t0, t0 + T, y, 1e-10, T / 2000, {
    dt: T / 20000,
    at: (t, yy, mode) => {
      const e = vm * Math.sin(w * t);
      const iL = mode === ON ? Math.max(yy[0]!, 0) : 0;
      samples.push({ v: yy[1]!, iL, is: iL > 0 ? bridge(e, iL, k.rs).is : 0, e });
    },
  });
  const mean = (f: (x: (typeof samples)[number]) => number) => samples.reduce((a, x) => a + f(x), 0) / samples.length;
  const vs = samples.map((x) => x.v);
  const isRms = Math.sqrt(mean((x) => x.is * x.is));
  return {
    vOutAvgV: mean((x) => x.v),
    rippleVpp: Math.max(...vs) - Math.min(...vs),
    capIrmsA: Math.sqrt(mean((x) => (x.iL - x.v / k.rl) ** 2)),
    sourceIrmsA: isRms,
    powerFactor: mean((x) => x.e * x.is) / (k.vrms * isRms),
    iLminA: Math.min(...samples.map((x) => x.iL)),
  };
}

/** The choke current over the solved period: the two upper devices' currents (D1 upper-a, D3 upper-b). */
function chokeCurrent(s: ReturnType<typeof solveCorner>): number[] {
  const w = s.waveform!;
  return w.deviceA[0]!.map((a, k) => a + w.deviceA[2]![k]!);
}

// Critical inductance of a full-wave rectifier with a choke-input (L-section) filter: the choke
// current stays continuous while L ≥ Lc = R/(3ω), ω the line's angular frequency — from the
// second harmonic of the full-wave voltage, (4Vm/3π)/(2ωL) peak, against the DC current 2Vm/(πR):
// J. Millman & C. C. Halkias, Integrated Electronics (McGraw-Hill, 1972), §18-… "L-section
// filter" (section number from memory). The same derivation gives Vdc = 2Vm/π in continuous conduction.
const criticalL = (rl: number, f: number) => rl / (3 * 2 * Math.PI * f);

describe('single-phase bridge with a DC choke, against odex run to steady state', () => {
  const base = { vrms: 12, f: 50, rs: 0.5, rL: 0.3, c: 2200e-6, rl: 24 };
  const lc = criticalL(base.rl, base.f); // 25.5 mH
  const cases: [string, Case, boolean][] = [
    ['continuous conduction, L = 4·Lc', { ...base, lH: 4 * lc }, true],
    ['discontinuous conduction, L = Lc/5', { ...base, lH: lc / 5 }, false],
  ];
  for (const [label, k, continuous] of cases) {
    it(`${label}: DC average, ripple, capacitor RMS, source RMS and power factor within 1 %`, async () => {
      const ref = bruteForce(await loadOdex(), k);
      const s = solveCorner(chokeCircuit(k), AT_25C, { waveformPoints: 400, inrush: false });
      expect(s.converged).toBe(true);
      const rel = (a: number | undefined, b: number) => Math.abs(a! / b - 1);
      expect(rel(s.vOutAvgV, ref.vOutAvgV), `${s.vOutAvgV} vs ${ref.vOutAvgV}`).toBeLessThan(0.01);
      expect(rel(s.rippleVpp, ref.rippleVpp), `${s.rippleVpp} vs ${ref.rippleVpp}`).toBeLessThan(0.01);
      expect(rel(s.capRippleIrmsA, ref.capIrmsA), `${s.capRippleIrmsA} vs ${ref.capIrmsA}`).toBeLessThan(0.01);
      expect(rel(s.sourceIrmsA, ref.sourceIrmsA), `${s.sourceIrmsA} vs ${ref.sourceIrmsA}`).toBeLessThan(0.01);
      expect(rel(s.powerFactor, ref.powerFactor), `${s.powerFactor} vs ${ref.powerFactor}`).toBeLessThan(0.01);
      // The regime itself, in the reference and in ours.
      const iMin = Math.min(...chokeCurrent(s));
      if (continuous) { expect(ref.iLminA).toBeGreaterThan(0.05); expect(iMin).toBeGreaterThan(0.05); }
      else { expect(ref.iLminA).toBe(0); expect(iMin).toBeLessThan(1e-6); }
    }, 120_000);
  }
});

describe('the critical inductance Lc = R/(3ω) (Millman & Halkias, L-section filter)', () => {
  // Near-ideal diodes, a stiff source and a large capacitor: the textbook's assumptions.
  const ideal: DiodeParams = { isA: 1e-12, n: 0.001, rsOhm: 0, egEv: 1.11, xti: 3, tnomC: 25 };
  const base = { vrms: 100, f: 50, rs: 0.01, rL: 0, c: 20000e-6, rl: 100 };
  const lc = criticalL(base.rl, base.f);
  const minCurrent = (lH: number) => {
    const s = solveCorner(chokeCircuit({ ...base, lH }, ideal), AT_25C, { waveformPoints: 1000, inrush: false });
    return { s, iMin: Math.min(...chokeCurrent(s)) };
  };
  it('above Lc (1.3·Lc) the choke current never falls to zero, and Vdc = 2Vm/π within 1 %', () => {
    const { s, iMin } = minCurrent(1.3 * lc);
    expect(iMin).toBeGreaterThan(0);
    const vdc = (2 * Math.SQRT2 * base.vrms) / Math.PI; // textbook, continuous conduction
    expect(Math.abs(s.vOutAvgV! / vdc - 1)).toBeLessThan(0.01);
  });
  it('below Lc (0.7·Lc) it falls to zero for part of each half-period', () => {
    expect(minCurrent(0.7 * lc).iMin).toBeLessThan(1e-6);
  });
});

describe('three-phase bridge with a DC choke (continuous conduction)', () => {
  it('gives the six-pulse average Vdo = (3√2/π)·V_LL within 1 %, the choke current never zero', () => {
    // Mohan, Undeland & Robbins, Power Electronics (3rd ed., Wiley 2003), ch. 5, three-phase
    // full-bridge rectifier with a stiff DC current: Vdo = 1.35·V_LL (section from memory).
    // Near-ideal diodes, a stiff source, a large choke and capacitor.
    const ideal: DiodeParams = { isA: 1e-12, n: 0.001, rsOhm: 0, egEv: 1.11, xti: 3, tnomC: 25 };
    const roles = ['upper-a', 'upper-b', 'upper-c', 'lower-a', 'lower-b', 'lower-c'] as const;
    const devices = roles.map((role, k) => ({ kind: 'diode' as const, name: `D${k + 1}`, role, params: ideal }));
    const c = circuit('three-phase-bridge', { vrms: 230, freqHz: 50, rOhm: 0.01 }, devices, [[4700e-6, 0]], { kind: 'resistance', ohm: 50 });
    const s = solveCorner({ ...c, choke: { names: ['L1'], lH: 0.05, rOhm: 0 } }, AT_25C, { waveformPoints: 600, inrush: false });
    expect(s.converged).toBe(true);
    const vdo = ((3 * Math.SQRT2) / Math.PI) * 230 * Math.sqrt(3);
    expect(Math.abs(s.vOutAvgV! / vdo - 1)).toBeLessThan(0.01);
    const w = s.waveform!;
    const iChoke = w.deviceA[0]!.map((a, k) => a + w.deviceA[1]![k]! + w.deviceA[2]![k]!);
    expect(Math.min(...iChoke)).toBeGreaterThan(0);
  });
});
