/**
 * Benchmark: one periodic steady state of a capacitor-input bridge (230 V 50 Hz, 100 µF, about
 * 100 W, 1 Ω source) by our shooting solver, against the registry ODE integrator `odex` run period
 * by period to steady state at a tolerance matched to the same accuracy (0.1 % on ripple and
 * peak current, both measured against a tight reference), side by side in one run.
 * Run alone: `npx tsx bench/solve-bench.ts`.
 */
import { buildNetwork } from '../server/src/solve/network';
import { findSteadyState } from '../server/src/solve/shooting';
import { computePeriodFigures } from '../server/src/solve/figures';
import { lambertWOfExp, thermalVoltageV } from '../server/src/solve/diode-model';
import type { DiodeParams, EquivalentCircuit } from '../server/src/solve/equivalent-circuit';

export interface BenchRow {
  name: string;
  value: number;
  unit: string;
  target?: string;
}

const DIODE: DiodeParams = { isA: 5e-9, n: 1.9, rsOhm: 0, egEv: 1.11, xti: 3, tnomC: 25 };
const P = { vrms: 230, f: 50, rs: 1, c: 100e-6, rl: 1000 };
const CIRCUIT: EquivalentCircuit = {
  kind: 'diode-bridge',
  source: { vrms: P.vrms, freqHz: P.f, seriesROhm: P.rs, seriesLH: 0, mainsVrms: 230, turnsRatio: 1 },
  devices: (['upper-a', 'lower-a', 'upper-b', 'lower-b'] as const).map((role, k) => ({ kind: 'diode' as const, name: `D${k + 1}`, role, params: DIODE })),
  capacitors: [{ name: 'C1', cF: P.c, esrOhm: 0 }],
  load: { kind: 'resistance', ohm: P.rl },
};

interface Figures { rippleVpp: number; ipkA: number }

/** Our solver: network, shooting, recorded period, figures. */
function solveOurs(relTol?: number, recordStepFraction?: number): Figures {
  const net = buildNetwork(CIRCUIT, 1, [25, 25, 25, 25], [])!;
  const ss = findSteadyState(net, { relTol, recordStepFraction });
  const f = computePeriodFigures(ss.record);
  return { rippleVpp: f.rippleVpp, ipkA: f.devices[0]!.ipkA };
}

type Solver = {
  absoluteTolerance: number; relativeTolerance: number; maxSteps: number; denseOutput: boolean;
  solve(f: (x: number, y: number[]) => number[], x: number, y0: number[], xEnd: number, out?: unknown): { y: number[] };
  grid(dt: number, out: (x: number, y: number[]) => void): unknown;
};

async function loadOdex(): Promise<new (n: number) => Solver> {
  // Non-literal specifier: the package ships TypeScript source that does not pass our strict checks.
  const name = 'odex';
  const mod = (await import(name)) as { Solver?: new (n: number) => Solver; default?: { Solver: new (n: number) => Solver } };
  return mod.Solver ?? mod.default!.Solver;
}

/** The same circuit as an ODE in the capacitor voltage, integrated by odex to steady state. */
function solveOdex(Ctor: new (n: number) => Solver, tol: number): Figures {
  const w = 2 * Math.PI * P.f;
  const vm = P.vrms * Math.SQRT2;
  const T = 1 / P.f;
  const nvt2 = 2 * DIODE.n * thermalVoltageV(25); // two diodes in series
  // Rs·i + 2·N·Vt·ln(1 + i/IS) = |e| − v, solved exactly: i + IS = (2NVt/Rs)·W((Rs·IS/2NVt)·e^((D + Rs·IS)/2NVt)).
  const current = (t: number, v: number) => {
    const d = Math.abs(vm * Math.sin(w * t)) - v;
    if (d <= 0) return 0;
    const lnZ = Math.log((P.rs * DIODE.isA) / nvt2) + (d + P.rs * DIODE.isA) / nvt2;
    return (nvt2 / P.rs) * lambertWOfExp(lnZ) - DIODE.isA;
  };
  const rhs = (t: number, y: number[]) => [(current(t, y[0]!) - y[0]! / P.rl) / P.c];
  const s = new Ctor(1);
  s.absoluteTolerance = tol * vm;
  s.relativeTolerance = tol;
  s.maxSteps = 1e6;
  let v0 = 0;
  let t0 = 0;
  for (let p = 0; p < 200; p++) {
    const v1 = s.solve(rhs, t0, [v0], t0 + T).y[0]!;
    t0 += T;
    const done = Math.abs(v1 - v0) <= tol * vm;
    v0 = v1;
    if (done) break;
  }
  let vMin = Infinity, vMax = -Infinity, iPk = 0;
  s.denseOutput = true;
  s.solve(rhs, t0, [v0], t0 + T, s.grid(T / 4000, (t, y) => {
    vMin = Math.min(vMin, y[0]!); vMax = Math.max(vMax, y[0]!); iPk = Math.max(iPk, current(t, y[0]!));
  }));
  s.denseOutput = false;
  return { rippleVpp: vMax - vMin, ipkA: iPk };
}

function medianMs(run: () => void, repeats: number): number {
  const times: number[] = [];
  for (let k = 0; k < repeats; k++) {
    const t0 = performance.now();
    run();
    times.push(performance.now() - t0);
  }
  times.sort((a, b) => a - b);
  return times[Math.floor(times.length / 2)]!;
}

const relErr = (a: Figures, ref: Figures) => Math.max(Math.abs(a.rippleVpp / ref.rippleVpp - 1), Math.abs(a.ipkA / ref.ipkA - 1));

/** Runs the benchmark and returns its rows. */
export async function runSolveBench(): Promise<BenchRow[]> {
  const Odex = await loadOdex();
  const ref = solveOurs(1e-9, 1 / 20000);
  const ours = solveOurs();
  // Matched tolerance: the loosest odex setting that meets the same 0.1 % on ripple and peak.
  let tol = 1e-3;
  let odex = solveOdex(Odex, tol);
  while (relErr(odex, ref) > 1e-3 && tol > 1e-12) { tol /= 10; odex = solveOdex(Odex, tol); }
  for (let k = 0; k < 20; k++) solveOurs(); // warm-up
  const oursMs = medianMs(() => solveOurs(), 201);
  const odexMs = medianMs(() => solveOdex(Odex, tol), 7);
  return [
    { name: 'steady state, shooting (median)', value: oursMs, unit: 'ms', target: '≤ 1 ms' },
    { name: 'steady state, odex to steady state (median)', value: odexMs, unit: 'ms' },
    { name: 'speed ratio odex/shooting', value: odexMs / oursMs, unit: '×', target: '≥ 50×' },
    { name: 'shooting: worst error on ripple/peak current', value: 100 * relErr(ours, ref), unit: '%', target: '≤ 0.1 %' },
    { name: 'odex: worst error on ripple/peak current', value: 100 * relErr(odex, ref), unit: '%', target: '≤ 0.1 %' },
    { name: 'odex tolerance (rel) used', value: tol, unit: '' },
  ];
}

if (process.argv[1] && /solve-bench\.ts$/.test(process.argv[1])) {
  void runSolveBench().then((rows) => {
    for (const r of rows) console.log(`${r.name.padEnd(48)} ${r.value.toPrecision(4).padStart(10)} ${r.unit.padEnd(3)} ${r.target ?? ''}`);
  });
}
