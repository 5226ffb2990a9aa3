/**
 * An independent reference for the three-phase bridge with line inductance: the same circuit
 * written out as conduction modes and integrated by the registry library `odex` (Hairer &
 * Wanner's ODEX) through piecewise-reference.ts, mode changes located as events. Nothing here
 * imports the solver under test.
 *
 * The circuit: EMFs e_x = Vm·sin(ωt − 2πx/3) in star (floating star point s), each behind R and
 * L, into six diodes and a capacitor C with a resistive load R_load (no ESR). A phase conducts
 * through its upper diode (i_x > 0, terminal at u + vD(i_x)), its lower one (i_x < 0, terminal at
 * −vD(−i_x)) or not at all (i_x = 0, terminal e_x + s inside [0, u]); blocked diodes are open.
 * KVL per conducting line: L·di_x/dt = e_x + s − R·i_x − v_x, with s from Σ di_x/dt = 0 over the
 * conducting lines; C·du/dt = Σ_{i_x>0} i_x − u/R_load. States y = (i_a, i_b, u), i_c = −i_a − i_b.
 */
import type { OdexSolver } from './odex-loader';
import { runPiecewise, type PiecewiseSystem } from './piecewise-reference';

export interface DriveSpec {
  vllRms: number;
  fHz: number;
  lH: number;
  rOhm: number;
  cF: number;
  rLoadOhm: number;
  /** SPICE diode law at the test temperature: IS, N·Vt. */
  isA: number;
  nVtV: number;
}

/** Current below which a phase is taken as open at an event, and the voltage margin of a turn-on. */
const I_EPS = 1e-9;
const V_EPS = 1e-2;

export function threePhaseSystem(k: DriveSpec): PiecewiseSystem & { emf: (x: number, t: number) => number } {
  const vm = (k.vllRms * Math.SQRT2) / Math.sqrt(3);
  const w = 2 * Math.PI * k.fHz;
  const emf = (x: number, t: number) => vm * Math.sin(w * t - (2 * Math.PI * x) / 3);
  const vD = (i: number) => k.nVtV * Math.log1p(i / k.isA);
  const signs = (mode: number) => [0, 1, 2].map((x) => (Math.floor(mode / 3 ** x) % 3) - 1);
  const encode = (sg: number[]) => sg.reduce((m, s, x) => m + (s + 1) * 3 ** x, 0);
  const currents = (y: number[]) => [y[0]!, y[1]!, -y[0]! - y[1]!];
  const terminal = (sg: number, i: number, u: number) => (sg > 0 ? u + vD(Math.max(i, 0)) : -vD(Math.max(-i, 0)));
  /** Star point from the conducting lines (undefined with fewer than two). */
  const star = (sg: number[], t: number, y: number[]) => {
    const i = currents(y);
    const on = [0, 1, 2].filter((x) => sg[x] !== 0);
    if (on.length < 2) return undefined;
    return on.reduce((s, x) => s + terminal(sg[x]!, i[x]!, y[2]!) + k.rOhm * i[x]! - emf(x, t), 0) / on.length;
  };
  return {
    n: 3,
    emf,
    rhs: (mode, t, y) => {
      const sg = signs(mode);
      const i = currents(y);
      const s = star(sg, t, y);
      const di = [0, 1, 2].map((x) => (sg[x] === 0 || s === undefined ? 0 : (emf(x, t) + s - k.rOhm * i[x]! - terminal(sg[x]!, i[x]!, y[2]!)) / k.lH));
      const idc = [0, 1, 2].reduce((a, x) => a + (sg[x]! > 0 ? Math.max(i[x]!, 0) : 0), 0);
      return [di[0]!, di[1]!, (idc - y[2]! / k.rLoadOhm) / k.cF];
    },
    guard: (mode, t, y) => {
      const sg = signs(mode);
      const i = currents(y);
      const u = y[2]!;
      const s = star(sg, t, y);
      if (s === undefined) {
        const e = [0, 1, 2].map((x) => emf(x, t));
        return u - (Math.max(...e) - Math.min(...e)) + V_EPS;
      }
      let g = Infinity;
      for (let x = 0; x < 3; x++) {
        if (sg[x] !== 0) g = Math.min(g, sg[x]! * i[x]! + I_EPS);
        else { const v = emf(x, t) + s; g = Math.min(g, u - v + V_EPS, v + V_EPS); }
      }
      return g;
    },
    settle: (t, y0) => {
      const y = y0.slice();
      let i = currents(y);
      const sg = i.map((ix) => (Math.abs(ix) <= 2 * I_EPS ? 0 : Math.sign(ix)));
      // Zeroed lines keep Σ i = 0: with two left they carry equal and opposite currents.
      const on = [0, 1, 2].filter((x) => sg[x] !== 0);
      if (on.length === 2) { const m = 0.5 * (i[on[0]!]! - i[on[1]!]!); i[on[0]!] = m; i[on[1]!] = -m; }
      if (on.length < 2) { i = [0, 0, 0]; sg.fill(0); }
      i = i.map((ix, x) => (sg[x] === 0 ? 0 : ix));
      y[0] = i[0]!; y[1] = i[1]!;
      const u = y[2]!;
      if (on.length < 2) {
        const e = [0, 1, 2].map((x) => emf(x, t));
        if (Math.max(...e) - Math.min(...e) > u + 0.5 * V_EPS) { sg[e.indexOf(Math.max(...e))] = 1; sg[e.indexOf(Math.min(...e))] = -1; }
      } else {
        const s = star(sg, t, y)!;
        for (let x = 0; x < 3; x++) {
          if (sg[x] !== 0) continue;
          const v = emf(x, t) + s;
          if (v > u + 0.5 * V_EPS) sg[x] = 1; else if (v < -0.5 * V_EPS) sg[x] = -1;
        }
      }
      return { mode: encode(sg), y };
    },
  };
}

export interface DriveFigures {
  vOutAvgV: number;
  rippleVpp: number;
  capIrmsA: number;
  sourceIrmsA: number;
  powerFactor: number;
  diodePeakA: number;
  periods: number;
}

/** Period after period from empty to steady state (state change per period below 1e-8 of its scale), then one sampled period. */
export function steadyDrive(Solver: new (n: number) => OdexSolver, k: DriveSpec): DriveFigures {
  const sys = threePhaseSystem(k);
  const T = 1 / k.fHz;
  const vScale = k.vllRms * Math.SQRT2;
  const iScale = vScale / k.rLoadOhm;
  let y = [0, 0, 0];
  let t0 = 0;
  let periods = 0;
  for (; periods < 400; periods++) {
    const y1 = runPiecewise(Solver, sys, t0, t0 + T, y, 1e-10, T / 2000).y;
    t0 += T;
    const done = Math.abs(y1[2]! - y[2]!) <= 1e-8 * vScale && Math.abs(y1[0]! - y[0]!) <= 1e-8 * iScale && Math.abs(y1[1]! - y[1]!) <= 1e-8 * iScale;
    y = y1;
    if (done) break;
  }
  const rows: { u: number; i: number[]; p: number }[] = [];
  runPiecewise(Solver, sys, t0, t0 + T, y, 1e-10, T / 2000, {
    dt: T / 20000,
    at: (t, yy, mode) => {
      const sg = [0, 1, 2].map((x) => (Math.floor(mode / 3 ** x) % 3) - 1);
      const i = [yy[0]!, yy[1]!, -yy[0]! - yy[1]!].map((ix, x) => (sg[x] === 0 ? 0 : ix));
      rows.push({ u: yy[2]!, i, p: i.reduce((a, ix, x) => a + sys.emf(x, t) * ix, 0) });
    },
  });
  const mean = (f: (r: (typeof rows)[number]) => number) => rows.reduce((a, r) => a + f(r), 0) / rows.length;
  const us = rows.map((r) => r.u);
  const iaRms = Math.sqrt(mean((r) => r.i[0]! ** 2));
  return {
    vOutAvgV: mean((r) => r.u), rippleVpp: Math.max(...us) - Math.min(...us),
    capIrmsA: Math.sqrt(mean((r) => (r.i.reduce((a, ix) => a + Math.max(ix, 0), 0) - r.u / k.rLoadOhm) ** 2)),
    sourceIrmsA: iaRms, powerFactor: mean((r) => r.p) / (3 * (k.vllRms / Math.sqrt(3)) * iaRms),
    diodePeakA: Math.max(...rows.map((r) => Math.max(...r.i.map(Math.abs)))), periods,
  };
}

/** Largest line current in the half-cycle after closing at tOn with everything empty. */
export function inrushPeak(Solver: new (n: number) => OdexSolver, k: DriveSpec, tOn: number): number {
  const sys = threePhaseSystem(k);
  const T = 1 / k.fHz;
  let peak = 0;
  runPiecewise(Solver, sys, tOn, tOn + T / 2, [0, 0, 0], 1e-10, T / 4000, {
    dt: T / 40000,
    at: (_t, yy) => { peak = Math.max(peak, Math.abs(yy[0]!), Math.abs(yy[1]!), Math.abs(yy[0]! + yy[1]!)); },
  });
  return peak;
}
