/**
 * Item 1 of issue 15, the load range: a capacitor-input bridge at `*@ load 0.2W..12W` gains the
 * corner "high-line hot light-load", where the capacitor charges to the crest, and the
 * capacitor-voltage check runs there too.
 */
import { describe, expect, it } from 'vitest';
import { analyseText, findingsOf } from '../rules/check';
import { offlineBridge } from './fixtures';

/** Boltzmann constant over the elementary charge (SI-exact since 2019), for the hand formula's diode law. */
const K_OVER_Q = 1.380649e-23 / 1.602176634e-19;

/**
 * SPICE3 diode law V = N·Vt·ln(1 + I/IS(T)) with the SPICE3 temperature law
 * IS(T) = IS·exp{[EG/Vt(Tnom) − EG/Vt(T) + XTI·ln(T/Tnom)]/N} (Berkeley SPICE3 manual, diode model).
 */
function diodeDropV(iA: number, tC: number, p = { isA: 5e-9, n: 1.8, eg: 1.11, xti: 3, tnomC: 27 }): number {
  const t = tC + 273.15, tn = p.tnomC + 273.15;
  const vt = K_OVER_Q * t, vtn = K_OVER_Q * tn;
  const is = p.isA * Math.exp((p.eg / vtn - p.eg / vt + p.xti * Math.log(t / tn)) / p.n);
  return p.n * vt * Math.log1p(iA / is);
}

// Our own scenario: a 230 V offline bridge feeding a 12 W converter that idles at 0.2 W.
const offline = (load: string) => offlineBridge('230 V bridge, standby and full load (scenario of our own)',
  `*@ mains 230V 50Hz tol=-10%,+10%\n*@ load ${load}`, 'C1 P 0 22u', '*@ rate C1 vrated=400V\n*@ rate DR vrrm=600V');

describe('light-load corner', () => {
  it('reports the worst capacitor voltage at light load within 1 % of √2·Vrms·(1 + tol) minus two diode drops', () => {
    const file = analyseText(offline('0.2W..12W'));
    const r = file.rectifiers[0]!;
    expect(r.solution.corners.map((c) => c.name)).toContain('high-line hot light-load');
    const worst = r.solution.worst.vOutMaxV!;
    expect(worst.corner).toBe('high-line hot light-load');
    // Hand formula: the crest of 230 V + 10 % less two diode drops at the hot ambient (50 °C, no
    // RθJA: Tj = ambient), at the light load's average current 0.2 W / 357 V = 0.56 mA. The
    // charging pulses run above the average; at twenty times it the two drops grow by
    // 2·N·Vt·ln 20 ≈ 0.3 V, 0.1 % of the crest, well inside the 1 %.
    const crest = Math.SQRT2 * 230 * 1.1;
    const hand = crest - 2 * diodeDropV(0.2 / crest, 50);
    expect(Math.abs(worst.value / hand - 1)).toBeLessThan(0.01);
    // And the light end is what sets it: the full-load corners at the same line sit lower (source drop, ripple).
    const full = r.solution.corners.find((c) => c.name === 'high-line hot full-load')!;
    expect(full.vOutMaxV!).toBeLessThan(worst.value);
  });

  it('solves the light end with the light load and the full end with the full load', () => {
    const r = analyseText(offline('0.2W..12W')).rectifiers[0]!;
    const light = r.solution.corners.find((c) => c.loadLevel === 'light')!;
    const full = r.solution.corners.find((c) => c.name === 'high-line hot full-load')!;
    // Energy balance: the output power the solver integrates is the directive's, at each end.
    expect(light.outputPowerW!).toBeCloseTo(0.2, 6);
    expect(full.outputPowerW!).toBeCloseTo(12, 6);
    expect(light.load).toEqual({ kind: 'power', w: 0.2 });
  });

  it('keeps the six corners and their names for a single load', () => {
    const r = analyseText(offline('12W')).rectifiers[0]!;
    expect(r.solution.corners.map((c) => c.name)).toEqual([
      'low-line nominal', 'low-line hot', 'nominal-line nominal', 'nominal-line hot', 'high-line nominal', 'high-line hot',
    ]);
  });

  // Our own scenario after the issue's: a 12 V secondary with a 16 V reservoir capacitor, 150 mA
  // in use and 5 mA in standby. At full load the source resistance and the ripple keep the
  // capacitor below its rating; in standby it charges to the crest of 13.2 V (12 V + 10 %) less
  // two diode drops, about 17.4 V, above its 16 V.
  const board = (load: string) => `12 V board with a 16 V capacitor (scenario of our own)
*@ load ${load}
*@ derate cap=100%
V1 L N SIN(0 16.97 50)
RS L A 2.2
D1 A P DB
D2 N P DB
D3 0 A DB
D4 0 N DB
C1 P 0 1000u
*@ rate C1 vrated=16V
*@ rate DB vrrm=100V
.model DB D(IS=5n N=1.8)
.end
`;

  it('flags a capacitor that passes at full load but not at light load', () => {
    expect(findingsOf(analyseText(board('150mA')), 'cap-voltage')).toEqual([]);
    const ranged = analyseText(board('5mA..150mA'));
    const found = findingsOf(ranged, 'cap-voltage');
    expect(found).toHaveLength(1);
    expect(found[0]!.severity).toBe('error');
    expect(found[0]!.message).toContain('high-line hot light-load');
    // Bounds by hand: above the 16 V rating, and below the crest of 13.2 V less two drops at the
    // average standby current (5 mA, 50 °C) — the charging pulses carry more than the average,
    // so the real drops (diodes and 2.2 Ω) are larger.
    const peak = ranged.rectifiers[0]!.solution.worst.vOutMaxV!.value;
    expect(peak).toBeGreaterThan(16);
    expect(peak).toBeLessThan(Math.SQRT2 * 12 * 1.1 - 2 * diodeDropV(5e-3, 50));
  });
});
