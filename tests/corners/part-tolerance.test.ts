/**
 * Item 3 of issue 15, tolerance and ageing of parts: the capacitance spread (`tol=`, `life=`),
 * the rated ESR reaching the solver with its end-of-life rise (`esr=`, `esrlife=`), and the
 * corners' part vertices (solve/corners.ts).
 */
import { describe, expect, it } from 'vitest';
import { analyseText } from '../rules/check';
import { parseDirective } from '../../grammar/src/directives';
import { bisect } from '../solve/fixtures';
import { loadOdex, type OdexSolver } from '../solve/odex-loader';
import { offlineBridge, periodicOrbit } from './fixtures';
import { DEFAULT_ESR_LIFE_FACTOR } from '../../server/src/equivalent/part-spreads';

const D = { isA: 5e-9, n: 1.8 };
const VT_27C = (1.380649e-23 * 300.15) / 1.602176634e-19; // kT/q at TNOM, SI-exact constants
const vDiode = (i: number) => D.n * VT_27C * Math.log1p(i / D.isA); // SPICE diode law, RS = 0

// Our own scenario: a 230 V bridge, 4.7 Ω, 100 µF ±20 %, a 30 W converter working down to 200 V;
// the nominal ambient is the diodes' TNOM (27 °C), so IS is the card's at the nominal corners.
const bridge = (cap: string, rate: string) => offlineBridge('230 V bridge with a toleranced capacitor (scenario of our own)',
  '*@ mains 230V 50Hz tol=-10%,+10%\n*@ load 30W vmin=200V\n*@ ambient 27C..50C', cap, rate);

/** Brute force: C·dv/dt = i(e, v) − P/v, i from |e| = Rs·i + 2·Vd(i) + v, to steady state; ripple and minimum. */
function bruteForce(Solver: new (n: number) => OdexSolver, k: { vm: number; f: number; rs: number; c: number; pW: number }) {
  const w = 2 * Math.PI * k.f;
  const T = 1 / k.f;
  const current = (t: number, v: number) => {
    const e = Math.abs(k.vm * Math.sin(w * t));
    return e <= v ? 0 : bisect((i) => k.rs * i + 2 * vDiode(i) + v - e, 0, (e - v) / k.rs, 80);
  };
  const rhs = (t: number, y: number[]) => [(current(t, y[0]!) - k.pW / y[0]!) / k.c];
  const { solver: s, t0, v0 } = periodicOrbit(Solver, rhs, k.vm, T);
  const vs: number[] = [];
  s.solve(rhs, t0, [v0], t0 + T, s.grid(T / 40000, (_t, y) => { vs.push(y[0]!); }));
  return { rippleVpp: Math.max(...vs) - Math.min(...vs), vMinV: Math.min(...vs) };
}

describe('capacitance tolerance and loss over life', () => {
  it('reads tol= and life= and combines them: the smallest capacitance is nominal × 0.8 × 0.8', () => {
    const { directive, diagnostics } = parseDirective('*@ rate C1 tol=-20%,+20% life=-20% esr=0.4ohm esrlife=3', 0);
    expect(diagnostics).toEqual([]);
    expect(directive).toMatchObject({ entries: [
      { key: 'tol', range: [-0.2, 0.2] }, { key: 'life', value: -0.2 }, { key: 'esr', value: 0.4 }, { key: 'esrlife', value: 3 },
    ] });
    expect(parseDirective('*@ rate C1 tol=20%', 0).directive).toMatchObject({ entries: [{ key: 'tol', range: [-0.2, 0.2] }] });
    expect(parseDirective('*@ rate C1 life=+10%', 0).diagnostics).toHaveLength(1);
    expect(parseDirective('*@ rate C1 esrlife=0.5', 0).diagnostics).toHaveLength(1);
    const r = analyseText(bridge('C1 P 0 100u', '*@ rate C1 tol=-20%,+20% life=-20%')).rectifiers[0]!;
    expect(r.circuit.capacitors[0]).toMatchObject({ cF: 100e-6, cMinF: expect.closeTo(100e-6 * 0.8 * 0.8, 18), cMaxF: expect.closeTo(120e-6, 18) });
  });

  it('gives ripple and hold-up at −20 % capacitance matching odex within 1 %', async () => {
    const r = analyseText(bridge('C1 P 0 100u', '*@ rate C1 tol=-20%,+20%')).rectifiers[0]!;
    const worstRipple = r.solution.worst.rippleVpp!;
    const worstHold = r.solution.worst.holdUpS!;
    expect(worstRipple.corner).toBe('low-line nominal');
    expect(worstHold.corner).toBe('low-line nominal');
    const corner = r.solution.corners.find((c) => c.name === 'low-line nominal')!;
    expect(corner.parts).toEqual({ capacitance: 'min', esr: 'aged', vf: 'high' });
    const ref = bruteForce(await loadOdex(), { vm: Math.SQRT2 * 230 * 0.9, f: 50, rs: 4.7, c: 80e-6, pW: 30 });
    expect(Math.abs(worstRipple.value / ref.rippleVpp - 1)).toBeLessThan(0.01);
    // Hold-up of the reference: the energy balance C·(v0² − vmin²)/(2P) from its own minimum.
    const refHold = (80e-6 * (ref.vMinV ** 2 - 200 ** 2)) / (2 * 30);
    expect(Math.abs(worstHold.value / refHold - 1)).toBeLessThan(0.01);
    // The nominal part would have hidden it: more than 10 % less ripple at the nominal 100 µF (ripple ∝ 1/C).
    const nominal = analyseText(bridge('C1 P 0 100u', '')).rectifiers[0]!.solution.worst.rippleVpp!.value;
    expect(nominal).toBeLessThan(0.9 * worstRipple.value);
  });
});

describe('ESR from the rating', () => {
  const figures = (cap: string, rate: string) => analyseText(bridge(cap, rate)).rectifiers[0]!.solution.corners
    .map((c) => ({ name: c.name, ripple: c.rippleVpp, ipk: c.devices[0]!.ipkA }));

  it('moves ripple and peak current exactly as the same resistor in series does', () => {
    const rated = figures('C1 P 0 100u', '*@ rate C1 esr=0.5ohm esrlife=1');
    const drawn = figures('RE P X 0.5\nC1 X 0 100u', '');
    expect(rated).toEqual(drawn);
    // And it does move them: without ESR the peak current is higher (the ESR limits the charging pulse).
    const none = figures('C1 P 0 100u', '');
    expect(none[0]!.ipk!).toBeGreaterThan(rated[0]!.ipk! * 1.001);
  });

  it('rises by the end-of-life factor at the ripple corner, again exactly as a resistor would', () => {
    expect(DEFAULT_ESR_LIFE_FACTOR).toBe(2);
    const rated = figures('C1 P 0 100u', '*@ rate C1 esr=0.5ohm');
    const aged = figures(`RE P X ${0.5 * DEFAULT_ESR_LIFE_FACTOR}\nC1 X 0 100u`, '');
    const drawn = figures('RE P X 0.5\nC1 X 0 100u', '');
    const at = (fs: typeof rated, name: string) => fs.find((f) => f.name === name)!;
    expect({ ...at(rated, 'low-line nominal'), name: '' }).toEqual({ ...at(aged, 'low-line nominal'), name: '' });
    expect(at(rated, 'high-line hot')).toEqual(at(drawn, 'high-line hot'));
    expect(at(rated, 'nominal-line nominal')).toEqual(at(drawn, 'nominal-line nominal'));
  });
});

describe('forward-voltage spread', () => {
  it('shifts the forward drop by the spread at the vertices that take it', () => {
    const base = analyseText(bridge('C1 P 0 100u', '')).rectifiers[0]!;
    const spread = analyseText(bridge('C1 P 0 100u', '*@ rate DR vfspread=-0.05V,+0.1V')).rectifiers[0]!;
    expect(spread.circuit.devices[0]).toMatchObject({ vfSpreadV: [-0.05, 0.1] });
    const at = (r: typeof base, name: string) => r.solution.corners.find((c) => c.name === name)!;
    // High line takes the low end (−50 mV per diode, two in the path): the output rises by about
    // 0.1 V; low line the high end: it falls by about 0.2 V. Bounds by hand at ±30 % of those,
    // as the source resistance and the ripple shift the operating point a little.
    const up = at(spread, 'high-line hot').vOutMaxV! - at(base, 'high-line hot').vOutMaxV!;
    const down = at(base, 'low-line hot').vOutMaxV! - at(spread, 'low-line hot').vOutMaxV!;
    expect(up).toBeGreaterThan(0.07); expect(up).toBeLessThan(0.13);
    expect(down).toBeGreaterThan(0.14); expect(down).toBeLessThan(0.26);
  });
});
