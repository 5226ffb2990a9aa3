/**
 * Item 1 of issue 15, the bleeder: a resistor across the output draws beside the `*@ load`
 * directive, it does not replace it. Checked against an independent integration of the same
 * circuit by the registry library `odex` (Hairer & Wanner's ODEX) run to steady state.
 */
import { describe, expect, it } from 'vitest';
import { analyseText } from '../rules/check';
import { bisect } from '../solve/fixtures';
import { loadOdex, type OdexSolver } from '../solve/odex-loader';
import { periodicOrbit } from './fixtures';

// Our own scenario: a 12 V transformer secondary (drawn as its EMF), 0.5 Ω winding, a bridge,
// 2200 µF, an 8 W converter and a 4k7 bleeder across the capacitor. The nominal ambient is the
// diodes' TNOM (27 °C), so their IS is the card's at the nominal corner.
const netlist = (load: string, bleeder: boolean) => `12 V bridge with a bleeder (scenario of our own)
*@ load ${load}
*@ ambient 27C..50C
V1 L N SIN(0 16.97 50)
RS L A 0.5
D1 A P DB
D2 N P DB
D3 0 A DB
D4 0 N DB
C1 P 0 2200u
${bleeder ? 'RB P 0 4k7' : ''}
.model DB D(IS=5n N=1.8)
.end
`;

const D = { isA: 5e-9, n: 1.8 };
const VT_27C = (1.380649e-23 * 300.15) / 1.602176634e-19; // kT/q at TNOM, SI-exact constants
const vDiode = (i: number) => D.n * VT_27C * Math.log1p(i / D.isA); // SPICE diode law, RS = 0

/** Brute force: C·dv/dt = i(e, v) − P/v − v/R, i from |e| = Rs·i + 2·Vd(i) + v; per-diode currents over a settled period. */
function bruteForce(Solver: new (n: number) => OdexSolver, k: { vm: number; f: number; rs: number; c: number; pW: number; rOhm: number }) {
  const w = 2 * Math.PI * k.f;
  const T = 1 / k.f;
  const current = (t: number, v: number) => {
    const e = Math.abs(k.vm * Math.sin(w * t));
    return e <= v ? 0 : bisect((i) => k.rs * i + 2 * vDiode(i) + v - e, 0, (e - v) / k.rs, 80);
  };
  const rhs = (t: number, y: number[]) => [(current(t, y[0]!) - k.pW / y[0]! - y[0]! / k.rOhm) / k.c];
  const { solver: s, t0, v0 } = periodicOrbit(Solver, rhs, k.vm, T);
  const samples: number[] = [];
  s.solve(rhs, t0, [v0], t0 + T, s.grid(T / 40000, (t, y) => { samples.push(Math.sin(w * t) > 0 ? current(t, y[0]!) : 0); }));
  samples.pop();
  const mean = (f: (i: number) => number) => samples.reduce((a, i) => a + f(i), 0) / samples.length;
  return { ipkA: Math.max(...samples), iavgA: mean((i) => i), irmsA: Math.sqrt(mean((i) => i * i)) };
}

describe('a bleeder across the output adds to the directive load', () => {
  it('is carried beside the 8 W load in the equivalent circuit', () => {
    const r = analyseText(netlist('8W', true)).rectifiers[0]!;
    expect(r.circuit.load).toEqual({ kind: 'power', w: 8 });
    expect(r.circuit.fixedLoad).toEqual({ ohm: 4700 });
    expect(r.rectifier.surroundings.load.elements).toEqual(['RB']);
  });

  it('gives the device currents of 8 W plus the bleeder, against odex within 1 %', async () => {
    const r = analyseText(netlist('8W', true)).rectifiers[0]!;
    const corner = r.solution.corners.find((c) => c.name === 'nominal-line nominal')!;
    const ref = bruteForce(await loadOdex(), { vm: 16.97, f: 50, rs: 0.5, c: 2200e-6, pW: 8, rOhm: 4700 });
    const d = corner.devices[0]!; // upper-a conducts in the positive half-cycle, as sampled above
    const rel = (a: number | undefined, b: number) => Math.abs(a! / b - 1);
    expect(rel(d.iavgA, ref.iavgA)).toBeLessThan(0.01);
    expect(rel(d.irmsA, ref.irmsA)).toBeLessThan(0.01);
    expect(rel(d.ipkA, ref.ipkA)).toBeLessThan(0.01);
    // Charge balance (exact in steady state): two diodes per half-cycle share the output current
    // P/v + v/R, so each carries half of its average; the bug solved for the bleeder alone (≈ 1.6 mA).
    const vAvg = corner.vOutAvgV!;
    expect(d.iavgA!).toBeGreaterThan(0.5 * (8 / vAvg) * 0.95);
    expect(d.iavgA!).toBeGreaterThan(100 * 0.5 * (vAvg / 4700));
  });

  it('counts the bleeder in the hold-up time', () => {
    const r = analyseText(netlist('8W vmin=10V', true)).rectifiers[0]!;
    const corner = r.solution.corners.find((c) => c.name === 'low-line nominal')!;
    // Analytic, derived here: C·v·dv/dt = −(P + v²/R) gives d(v²)/dt = −(2/RC)·(v² + P·R), so
    // t = (R·C/2)·ln((v0² + P·R)/(vmin² + P·R)) from v0 (the steady-state minimum) down to vmin.
    const R = 4700, C = 2200e-6, P = 8, v0 = corner.vOutMinV!;
    const exact = ((R * C) / 2) * Math.log((v0 ** 2 + P * R) / (10 ** 2 + P * R));
    expect(Math.abs(corner.holdUpS! / exact - 1)).toBeLessThan(1e-6);
    // Without the bleeder the energy balance C·(v0² − vmin²)/(2P) would be longer.
    expect(corner.holdUpS!).toBeLessThan((C * (v0 ** 2 - 10 ** 2)) / (2 * P));
  });

  it('draws more than the load alone by the bleeder current', () => {
    const alone = analyseText(netlist('8W', false)).rectifiers[0]!.solution.corners.find((c) => c.name === 'nominal-line nominal')!;
    const both = analyseText(netlist('8W', true)).rectifiers[0]!.solution.corners.find((c) => c.name === 'nominal-line nominal')!;
    // Output power: the load's 8 W plus the bleeder's ⟨v²⟩/R (energy balance over the period).
    const bleederW = both.vOutRmsV! ** 2 / 4700;
    expect(both.outputPowerW!).toBeCloseTo(8 + bleederW, 6);
    expect(alone.outputPowerW!).toBeCloseTo(8, 6);
  });
});
