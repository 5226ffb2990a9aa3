/**
 * The inner solves of the overlap solver, which carry its speed: one diode behind a line's
 * impedance (overlap-phase.ts), checked against its own defining equation and the implicit
 * derivative; the bridge's joint Newton on (star point, DC current) against the nested bracketed
 * searches it falls back on (overlap-bridge.ts), over seeded random stages; and the work it takes
 * on the 480 V drive, counted in evaluations (never timed).
 */
import { describe, expect, it } from 'vitest';
import type { DiodeAtTemp } from '../../server/src/solve/diode-model';
import type { DiodeParams, Load } from '../../server/src/solve/equivalent-circuit';
import { DiodeBehindZ } from '../../server/src/solve/overlap-phase';
import { OverlapBridge } from '../../server/src/solve/overlap-bridge';
import { overlapSystemOf } from '../../server/src/solve/overlap-corner';
import { findOverlapSteadyState } from '../../server/src/solve/overlap-shooting';
import { circuit } from './fixtures';

/** A small seeded generator (xorshift32) so every run draws the same cases. */
function random(seed: number): () => number {
  let x = seed >>> 0 || 1;
  return () => {
    x ^= x << 13; x >>>= 0; x ^= x >>> 17; x ^= x << 5; x >>>= 0;
    return x / 4294967296;
  };
}
const logUniform = (r: () => number, lo: number, hi: number) => lo * (hi / lo) ** r();

// Our own diodes: a rectifier law (N = 1.8), one with RS, a near-ideal one (N = 0.001).
const DIODES: DiodeAtTemp[] = [
  { isA: 1e-8, nVtV: 1.8 * 0.025693, rsOhm: 0 },
  { isA: 1e-8, nVtV: 1.8 * 0.025693, rsOhm: 0.01 },
  { isA: 1e-12, nVtV: 0.001 * 0.025693, rsOhm: 0 },
];

describe('one diode behind the line impedance', () => {
  for (const [k, dev] of DIODES.entries()) {
    it(`diode ${k}: Z·d + N·Vt·ln(1 + d/IS) + RS·d = w to 1e-12 of w, warm-started through jumps and drifts`, () => {
      const r = random(17 + k);
      const solver = new DiodeBehindZ();
      let w = 10;
      let worst = 0;
      for (let n = 0; n < 20000; n++) {
        const pick = r();
        // Mostly slow drifts (a stage after a stage), with jumps across twelve decades and into blocking.
        w = pick < 0.05 ? (r() - 0.2) * 1000 : pick < 0.1 ? logUniform(r, 1e-9, 1e5) : w * (1 + (r() - 0.5) * 0.05);
        const Z = pick < 0.5 ? logUniform(r, 1e-3, 1e8) : 3;
        const d = solver.solve(dev, Z, w);
        if (!(w > 0)) { expect(d).toBe(0); continue; }
        // The defining equation (overlap-phase.ts header), evaluated independently of the solver.
        const residual = Math.abs((Z + dev.rsOhm) * d + dev.nVtV * Math.log1p(d / dev.isA) - w) / w;
        worst = Math.max(worst, residual);
      }
      expect(worst).toBeLessThan(1e-12);
    });
  }
  it('the slope is dd/dw of the solution (central difference, derived: 1/(Z + RS + N·Vt/(d + IS)))', () => {
    const dev = DIODES[1]!;
    for (const [Z, w] of [[0.1, 50], [150, 600], [1e4, 0.5], [1e7, 300]] as const) {
      const s = new DiodeBehindZ();
      s.solve(dev, Z, w);
      const h = 1e-6 * w;
      const fd = (new DiodeBehindZ().solve(dev, Z, w + h) - new DiodeBehindZ().solve(dev, Z, w - h)) / (2 * h);
      expect(Math.abs(s.slope / fd - 1), `Z ${Z}, w ${w}`).toBeLessThan(1e-5);
    }
  });
});

const DBR: DiodeParams = { isA: 10e-9, n: 1.8, rsOhm: 0.01, egEv: 1.11, xti: 3, tnomC: 25 };
const ROLES = ['upper-a', 'upper-b', 'upper-c', 'lower-a', 'lower-b', 'lower-c'] as const;

function systemOf(caps: [number, number][], load: Load, lH = 1.2e-3) {
  const devices = ROLES.map((role, j) => ({ kind: 'diode' as const, name: `D${j + 1}`, role, params: DBR }));
  const c = circuit('three-phase-bridge', { vrms: 480 / Math.sqrt(3), freqHz: 60, rOhm: 0.01, lH }, devices, caps, load);
  const sys = overlapSystemOf(c, 1, devices.map(() => 25), []);
  if (!sys) throw new Error('no overlap system');
  return sys;
}

describe('the bridge at one stage: joint Newton against the nested searches', () => {
  const loads: [string, [number, number][], Load][] = [
    ['capacitor and resistor', [[500e-6, 0.1]], { kind: 'resistance', ohm: 40 }],
    ['capacitor and power load', [[500e-6, 0.1]], { kind: 'power', w: 8000, vminV: 400 }],
    ['bare resistor', [], { kind: 'resistance', ohm: 30 }],
  ];
  for (const [label, caps, load] of loads) {
    it(`${label}: the same star point, bus voltage and diode currents to 1e-9, with Σ i = 0 and the port law holding`, () => {
      const sys = systemOf(caps, load);
      const make = (limit?: number) => new OverlapBridge(sys.net.load, sys.hasCap, sys.net.devices, sys.upper, sys.lower, limit);
      const joint = make();
      const nested = make(0);
      const r = random(5);
      const port = sys.net.ports[0]!;
      let t = 0;
      let phase = 0;
      for (let n = 0; n < 3000; n++) {
        // A stage's inputs: three EMFs (balanced plus the companions' λ·r), Z = L/dh + R, the capacitor's source.
        const jump = r() < 0.05;
        const dh = jump ? logUniform(r, 1e-8, 1e-3) : 8e-6;
        phase = jump ? r() * 2 * Math.PI : phase + 0.01;
        t += dh;
        const Z = sys.lH / dh + sys.rOhm;
        const A = sys.hasCap ? (jump ? r() * 700 : 620 + 10 * Math.sin(3 * phase)) : 0;
        const K = sys.hasCap ? dh / port.cF + port.esrOhm : sys.net.load.rOhm;
        const ep = [0, 1, 2].map((x) => 391.9 * Math.sin(phase - (2 * Math.PI * x) / 3) + (jump ? (r() - 0.5) * 4000 : 0));
        for (const b of [joint, nested]) { b.Z = Z; b.ep.set(ep); }
        joint.solve(A, K, t);
        nested.solve(A, K, t);
        const spread = Math.max(...joint.ep) - Math.min(...joint.ep);
        const iScale = spread / Z + 1e-300;
        expect(Math.abs(joint.s - nested.s), `s at case ${n}`).toBeLessThanOrEqual(1e-9 * spread);
        expect(Math.abs(joint.u - nested.u), `u at case ${n}`).toBeLessThanOrEqual(1e-9 * Math.max(spread, A));
        let sum = 0, idc = 0;
        for (let x = 0; x < 3; x++) {
          expect(Math.abs(joint.up[x]!.d - nested.up[x]!.d)).toBeLessThanOrEqual(1e-9 * iScale);
          expect(Math.abs(joint.low[x]!.d - nested.low[x]!.d)).toBeLessThanOrEqual(1e-9 * iScale);
          sum += joint.up[x]!.d - joint.low[x]!.d; idc += joint.up[x]!.d;
        }
        // Kirchhoff at the star point, and the port: u + K·g(u) = A + K·i_dc (bare: u = R·i_dc).
        expect(Math.abs(sum)).toBeLessThanOrEqual(1e-9 * iScale);
        const portResidual = sys.hasCap ? joint.u + K * joint.port.g - (A + K * idc) : joint.u - K * idc;
        if (joint.u > 0) expect(Math.abs(portResidual), `port at case ${n}`).toBeLessThanOrEqual(1e-9 * Math.max(spread, A));
      }
      // The comparison means something only if the joint Newton did the work and the nested did all of it.
      expect(joint.fallbacks).toBeLessThan(30);
      expect(nested.fallbacks).toBeGreaterThan(2000);
    });
  }
});

describe('work on the 480 V drive with 1.2 mH reactors', () => {
  it('no stage needs the nested searches, and the bridge takes under three evaluations per step', () => {
    // Our own drive (as in three-phase-overlap.test.ts): 500 µF, 40 Ω, 60 Hz.
    const sys = systemOf([[500e-6, 0]], { kind: 'resistance', ohm: 40 });
    const ss = findOverlapSteadyState(sys);
    expect(ss.converged).toBe(true);
    expect(ss.fallbacks).toBe(0);
    // Two stages a step; the joint Newton with its predictor measures about 1.2 evaluations a
    // stage, where the nested searches alone took about 22 (bounds of our own, counted work).
    expect(ss.evaluations).toBeLessThan(3 * ss.steps);
  });
});
