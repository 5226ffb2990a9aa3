/**
 * The mains current of a transformer-fed rectifier is the primary current: the secondary current
 * referred through the turns ratio plus the magnetising current. Checked against an independent
 * integration of the coupled-winding equations themselves, v = L·di/dt with the full 3×3
 * inductance matrix of a centre-tapped transformer (no cantilever model, no referral):
 * the registry library `odex` (Hairer & Wanner's ODEX) run period after period to steady state.
 */
import { describe, expect, it } from 'vitest';
import { analyseText } from '../rules/check';
import { loadOdex, type OdexSolver } from './odex-loader';
import { runPiecewise, type PiecewiseSystem } from './piecewise-reference';

// Our own scenario: a 230 V 50 Hz primary (10 H, 5 Ω), two 15 V half-windings (0.2 Ω each),
// one K card coupling all three at 0.998, two diodes, 2200 µF and 20 Ω. The ambient is the
// diodes' TNOM (27 °C) so IS is the card's.
const VP = 325.27;
const F = 50;
const L1 = 10;
const L2 = L1 * (15 / 230) ** 2;
const K = 0.998;
const RP = 5;
const RW = 0.2;
const C = 2200e-6;
const RL = 20;
const netlist = `Centre-tapped transformer rectifier (scenario of our own)
*@ ambient 27C
VP line 0 SIN(0 ${VP} ${F})
RP line pri ${RP}
LP pri 0 ${L1}
LS1 top ct ${L2}
LS2 ct bot ${L2}
K1 LP LS1 LS2 ${K}
RW1 top t1 ${RW}
RW2 bot b1 ${RW}
D1 t1 out DT
D2 b1 out DT
C1 out ct ${C}
RLOAD out ct ${RL}
.model DT D(IS=2n N=1.6)
.end
`;

const VT_27C = (1.380649e-23 * 300.15) / 1.602176634e-19; // kT/q at TNOM, SI-exact constants
const vDiode = (i: number) => 1.6 * VT_27C * Math.log1p(Math.max(i, 0) / 2e-9); // SPICE diode law, RS = 0

/** Solves the n×n system a·x = b (Gaussian elimination; n ≤ 3 here). */
function solveLinear(a: number[][], b: number[]): number[] {
  const n = b.length;
  const m = a.map((row, i) => [...row, b[i]!]);
  for (let c = 0; c < n; c++) {
    let p = c;
    for (let r = c + 1; r < n; r++) if (Math.abs(m[r]![c]!) > Math.abs(m[p]![c]!)) p = r;
    [m[c], m[p]] = [m[p]!, m[c]!];
    for (let r = c + 1; r < n; r++) {
      const f = m[r]![c]! / m[c]![c]!;
      for (let j = c; j <= n; j++) m[r]![j] = m[r]![j]! - f * m[c]![j]!;
    }
  }
  const x = new Array<number>(n).fill(0);
  for (let r = n - 1; r >= 0; r--) {
    let s = m[r]![n]!;
    for (let j = r + 1; j < n; j++) s -= m[r]![j]! * x[j]!;
    x[r] = s / m[r]![r]!;
  }
  return x;
}

/**
 * Brute force. States y = [iLP (pri → 0), iD1, iD2, vC]. SPICE's dot convention puts each
 * inductor's dot on its first node: iLS1 (top → ct) = −iD1, iLS2 (ct → bot) = +iD2. Winding
 * voltages: vLP = e − RP·iLP; a conducting half gives vLS1 = vC + RW·iD1 + vD, vLS2 = −(vC + RW·iD2 + vD).
 * A blocked half keeps its current at zero and its voltage follows from the coupling (its row of
 * L·di/dt); its diode turns on when its voltage (vLS1 − vC, or −vLS2 − vC) would be positive.
 * Mode bit j set: half j conducts. Each mode is a smooth ODE; the edges are events
 * (piecewise-reference.ts).
 */
function bruteForce(Solver: new (n: number) => OdexSolver) {
  const w = 2 * Math.PI * F;
  const T = 1 / F;
  const m = K * Math.sqrt(L1 * L2);
  const L = [[L1, m, m], [m, L2, K * L2], [m, K * L2, L2]];
  const sign = [1, -1, 1]; // winding current per state current
  const on = (mode: number, j: number) => (mode & (1 << j)) !== 0;
  /** Winding current derivatives in a mode, and each blocked diode's forward voltage. */
  const solveMode = (mode: number, t: number, y: number[]) => {
    const e = VP * Math.sin(w * t);
    const iD = [Math.max(y[1]!, 0), Math.max(y[2]!, 0)];
    const v = [e - RP * y[0]!, y[3]! + RW * iD[0]! + vDiode(iD[0]!), -(y[3]! + RW * iD[1]! + vDiode(iD[1]!))];
    const free = [0, ...[1, 2].filter((r) => on(mode, r - 1))];
    const x = solveLinear(free.map((r) => free.map((c) => L[r]![c]!)), free.map((r) => v[r]!));
    const di = [0, 0, 0];
    free.forEach((r, k) => { di[r] = x[k]!; });
    const vWinding = [1, 2].map((r) => L[r]!.reduce((s, l, c) => s + l * di[c]!, 0));
    const forward = [vWinding[0]! - y[3]!, -vWinding[1]! - y[3]!];
    return { di, iD, forward };
  };
  const sys: PiecewiseSystem = {
    n: 4,
    rhs: (mode, t, y) => {
      const { di, iD } = solveMode(mode, t, y);
      return [di[0]!, on(mode, 0) ? sign[1]! * di[1]! : 0, on(mode, 1) ? sign[2]! * di[2]! : 0, (iD[0]! + iD[1]! - y[3]! / RL) / C];
    },
    guard: (mode, t, y) => {
      const { forward } = solveMode(mode, t, y);
      // A conducting diode ends when its current falls below −0.1 µA (ODEX's noise about zero
      // current, far below the amperes here); settle then clamps it to zero.
      return Math.min(...[0, 1].map((j) => (on(mode, j) ? y[1 + j]! + 1e-7 : -forward[j]!)));
    },
    // The consistent mode: every conducting diode's current positive or rising from zero, every
    // blocked diode's voltage not positive (tried in the order: as the currents say, then the rest).
    settle: (t, y) => {
      const fromCurrents = (y[1]! > 0 ? 1 : 0) | (y[2]! > 0 ? 2 : 0);
      for (const mode of [fromCurrents, 0, 1, 2, 3]) {
        const yy = [y[0]!, on(mode, 0) ? Math.max(y[1]!, 0) : 0, on(mode, 1) ? Math.max(y[2]!, 0) : 0, y[3]!];
        if ((!on(mode, 0) && y[1]! > 1e-9) || (!on(mode, 1) && y[2]! > 1e-9)) continue;
        const { di, forward } = solveMode(mode, t, yy);
        const ok = [0, 1].every((j) => (on(mode, j) ? yy[1 + j]! > 0 || sign[1 + j]! * di[1 + j]! >= 0 : forward[j]! <= 0));
        if (ok) return { mode, y: yy };
      }
      throw new Error('no consistent conduction mode');
    },
  };
  // Start at the magnetising current's own steady state (−Vp/ωL1 at t = 0), the capacitor charged
  // near its level (so no diode starts at nanoamperes), and run whole periods
  // until the capacitor voltage repeats.
  let y = [-VP / (w * L1), 0, 0, 20];
  let t0 = 0;
  for (let p = 0; p < 3000; p++) {
    const y1 = runPiecewise(Solver, sys, t0, t0 + T, y, 1e-8, T / 2000).y;
    t0 += T;
    const done = Math.abs(y1[3]! - y[3]!) <= 1e-8 * VP;
    y = y1;
    if (done) break;
  }
  const samples: { iP: number; e: number }[] = [];
  runPiecewise(Solver, sys, t0, t0 + T, y, 1e-9, T / 2000, { dt: T / 20000, at: (t, yy) => { samples.push({ iP: yy[0]!, e: VP * Math.sin(w * t) }); } });
  // The primary's own L1/RP mode (2 s) decays slowest and only shifts the primary current by a
  // constant; in steady state an inductor's average voltage is zero, so with a zero-mean source
  // the primary current has zero mean: the remaining offset is removed.
  const mean = (f: (x: { iP: number; e: number }) => number) => samples.reduce((a, x) => a + f(x), 0) / samples.length;
  const offset = mean((x) => x.iP);
  const irms = Math.sqrt(mean((x) => (x.iP - offset) ** 2));
  const p = mean((x) => x.e * (x.iP - offset));
  return { irmsA: irms, powerFactor: p / ((VP / Math.SQRT2) * irms), offsetA: offset };
}

describe('centre-tapped transformer rectifier: the mains current is the primary current', () => {
  it('mains RMS current and power factor within 1 % of odex on the coupled windings', async () => {
    const r = analyseText(netlist).rectifiers[0]!;
    expect(r.circuit.kind).toBe('centre-tap');
    // Cantilever model (transformer.ts): the magnetising inductance L1 referred by (M/L1)² is k²·L2.
    expect(r.circuit.source.magnetisingLH).toBeCloseTo(K * K * L2, 12);
    const corner = r.solution.corners.find((c) => c.name === 'nominal-line nominal')!;
    const ref = bruteForce(await loadOdex());
    const rel = (a: number | undefined, b: number) => Math.abs(a! / b - 1);
    expect(rel(corner.sourceIrmsA, ref.irmsA), `${corner.sourceIrmsA} vs ${ref.irmsA}`).toBeLessThan(0.01);
    expect(rel(corner.powerFactor, ref.powerFactor), `${corner.powerFactor} vs ${ref.powerFactor}`).toBeLessThan(0.01);
  }, 120_000);
});
