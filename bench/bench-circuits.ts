/**
 * The solver benchmark's circuits (scenarios of our own), each twice: as the equivalent circuit
 * our solver takes, and as the plain ODE a general-purpose integrator takes — the same model
 * (SPICE diode law, RS = 0, two diodes in series while a bridge conducts), so the comparison is
 * of integration alone.
 *
 * - standard: a capacitor-input bridge, 230 V 50 Hz, 1 Ω, 100 µF, 1 kΩ (about 100 W);
 * - reservoir: a large reservoir behind a limiting resistance, 230 V, 47 Ω, 10 000 µF, 4.7 kΩ —
 *   the load's R·C is 47 s (2350 periods), and the period map's slowest mode at the orbit decays
 *   by e in 100 periods (the bench prints it, from the map's Jacobian);
 * - LC input: a choke-input filter, 230 V, 1 Ω, 10 H with 10 Ω, 1000 µF, 1 kΩ — far above the
 *   critical inductance R/(3ω) ≈ 1.06 H, so the choke current stays continuous, and the LC ring
 *   (about 1.6 Hz) decays by e in some 46 periods.
 */
import { lambertWOfExp, thermalVoltageV } from '../server/src/solve/diode-model';
import type { DiodeParams, EquivalentCircuit } from '../server/src/solve/equivalent-circuit';

const DIODE: DiodeParams = { isA: 5e-9, n: 1.9, rsOhm: 0, egEv: 1.11, xti: 3, tnomC: 25 };

export interface BenchCircuit {
  name: string;
  circuit: EquivalentCircuit;
  periodS: number;
  vmV: number;
  /** ODE states, ordered as our solver's: [v] for a capacitor input, [v, iL] with a choke. */
  n: number;
  rhs(t: number, y: number[]): number[];
  /** Device (= path) current at (t, y). */
  currentA(t: number, y: number[]): number;
  /** Output voltage at y. */
  vOutV(y: number[]): number;
}

interface Parts { vrms: number; f: number; rs: number; c: number; rl: number; choke?: { lH: number; rOhm: number } }

function equivalent(p: Parts): EquivalentCircuit {
  return {
    kind: 'diode-bridge',
    source: { vrms: p.vrms, freqHz: p.f, seriesROhm: p.rs, seriesLH: 0, mainsVrms: p.vrms, turnsRatio: 1 },
    devices: (['upper-a', 'lower-a', 'upper-b', 'lower-b'] as const).map((role, k) => ({ kind: 'diode' as const, name: `D${k + 1}`, role, params: DIODE })),
    capacitors: [{ name: 'C1', cF: p.c, esrOhm: 0 }],
    load: { kind: 'resistance', ohm: p.rl },
    ...(p.choke ? { choke: { names: ['L1'], lH: p.choke.lH, rOhm: p.choke.rOhm } } : {}),
  };
}

const NVT2 = 2 * DIODE.n * thermalVoltageV(DIODE.tnomC); // two diodes in series

/** Capacitor input: C·dv/dt = i − v/R, i from Rs·i + 2·N·Vt·ln(1 + i/IS) = |e| − v (Lambert W, exact). */
function capacitorInput(name: string, p: Parts): BenchCircuit {
  const w = 2 * Math.PI * p.f;
  const vm = p.vrms * Math.SQRT2;
  const current = (t: number, v: number) => {
    const d = Math.abs(vm * Math.sin(w * t)) - v;
    if (d <= 0) return 0;
    const lnZ = Math.log((p.rs * DIODE.isA) / NVT2) + (d + p.rs * DIODE.isA) / NVT2;
    return (NVT2 / p.rs) * lambertWOfExp(lnZ) - DIODE.isA;
  };
  return {
    name, circuit: equivalent(p), periodS: 1 / p.f, vmV: vm, n: 1,
    rhs: (t, y) => [(current(t, y[0]!) - y[0]! / p.rl) / p.c],
    currentA: (t, y) => current(t, y[0]!), vOutV: (y) => y[0]!,
  };
}

/**
 * Choke input: while a pair conducts (iL > 0, or |e| above v), L·diL/dt = |e| − (Rs + RL)·iL −
 * 2·N·Vt·ln(1 + iL/IS) − v; blocked, iL stays 0; always C·dv/dt = iL − v/R. The bridge hands the
 * choke current to the pair with the larger EMF at once, as our network does.
 */
function chokeInput(name: string, p: Parts & { choke: { lH: number; rOhm: number } }): BenchCircuit {
  const w = 2 * Math.PI * p.f;
  const vm = p.vrms * Math.SQRT2;
  const r = p.rs + p.choke.rOhm;
  return {
    name, circuit: equivalent(p), periodS: 1 / p.f, vmV: vm, n: 2,
    rhs: (t, y) => {
      const iL = Math.max(y[1]!, 0);
      const e = Math.abs(vm * Math.sin(w * t));
      const on = y[1]! > 0 || e > y[0]!;
      const di = on ? (e - r * iL - NVT2 * Math.log1p(iL / DIODE.isA) - y[0]!) / p.choke.lH : 0;
      return [(iL - y[0]! / p.rl) / p.c, di];
    },
    currentA: (_t, y) => Math.max(y[1]!, 0), vOutV: (y) => y[0]!,
  };
}

export const BENCH_CIRCUITS: readonly BenchCircuit[] = [
  capacitorInput('standard bridge', { vrms: 230, f: 50, rs: 1, c: 100e-6, rl: 1000 }),
  capacitorInput('reservoir', { vrms: 230, f: 50, rs: 47, c: 10000e-6, rl: 4700 }),
  chokeInput('LC input', { vrms: 230, f: 50, rs: 1, c: 1000e-6, rl: 1000, choke: { lH: 10, rOhm: 10 } }),
];
