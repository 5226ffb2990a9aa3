/**
 * `surge-rating` over the inrush check's cases: the hot restart of an NTC limiter, both switch-on
 * polarities, and the two comparisons (peak against IFSM, I²t against IFSM²·t_rated/2) with the
 * binding one named. Netlists of our own invention: 230 V 50 Hz bridges into a bulk capacitor.
 */
import { describe, expect, it } from 'vitest';
import { analyseText, applyFix, checkAnnotated, findingsOf, fixTitled } from './check';

const CREST_HIGH_V = 230 * 1.1 * Math.SQRT2; // 357.8 V at +10 % line (D)

interface Bench {
  head?: string[];
  series: string[];
  cap: string;
  models: Record<string, string>;
  /** Model of each diode D1…D4. */
  diodes?: [string, string, string, string];
  notes?: Record<string, string>;
}

function bench(o: Bench): string {
  const [m1, m2, m3, m4] = o.diodes ?? ['DR', 'DR', 'DR', 'DR'];
  const card = (line: string) => (o.notes?.[line.split(' ')[0]!] ? `${line}\n${o.notes[line.split(' ')[0]!]}` : line);
  return [
    'bridge for the inrush tests', '*@ mains 230V 50Hz', '*@ load 60W', ...(o.head ?? []),
    ...Object.entries(o.models).map(([name, rate]) => `*@ rate ${name} vrrm=600V ifav=3A ${rate} tjmax=150C rthja=40`),
    'VAC L N SIN(0 325 50)', ...o.series,
    card(`D1 A P ${m1}`), card(`D2 N P ${m2}`), card(`D3 0 A ${m3}`), card(`D4 0 N ${m4}`), `CB P 0 ${o.cap}`,
    ...Object.keys(o.models).map((name) => `.model ${name} D(IS=5n N=1.8 RS=0.02)`), '.end', '',
  ].join('\n');
}

const all = (note: string) => ({ D1: note, D2: note, D3: note, D4: note });

describe('NTC limiter: hot restart', () => {
  const ntc = (head: string[], notes?: Record<string, string>) =>
    bench({ head, series: ['RNTC L A 10'], cap: '470u', models: { DR: 'ifsm=60A' }, notes });

  it('passes from cold (10 Ω: about 35 A), trips on the hot restart (1 Ω: about 340 A)', () => {
    checkAnnotated(ntc([]), ['surge-rating']);
    const hot = checkAnnotated(ntc(['*@ rate RNTC hot=1ohm'], all('*^ error surge-rating: hot restart at the')), ['surge-rating']);
    expect(findingsOf(hot, 'surge-rating')[0]!.message).toContain('(RNTC still hot, capacitor empty)');
    const r = hot.rectifiers[0]!;
    // The steady state runs with the NTC hot; the inrush limiter keeps both values.
    expect(r.circuit.source.seriesROhm).toBe(1);
    expect(r.circuit.inrushLimiter).toEqual({ names: ['RNTC'], coldROhm: 10, hotROhm: 1 });
    // Hand estimate: peak ≈ (Vcrest − 2·VF)/(R + 2·RS), the capacitor at 0 V at the step (no series
    // inductance). VF of this model at ~340 A and 50 °C ≈ 1.8·27.8 mV·ln(340/5n) ≈ 1.25 V (SPICE3
    // diode equation, D). Cold: 355.3/10.04 = 35.4 A; hot: 355.3/1.04 = 341.6 A.
    const peak = r.solution.worst.inrushPeakA!.value;
    expect(peak / ((CREST_HIGH_V - 2 * 1.25) / 1.04)).toBeCloseTo(1, 2);
    const cold = analyseText(ntc([])).rectifiers[0]!.solution.worst.inrushPeakA!.value;
    expect(cold / ((CREST_HIGH_V - 2 * 1.25) / 10.04)).toBeCloseTo(1, 2);
    // The restart's peak is the cold one times (R_cold + other)/(R_hot + other) = 10.04/1.04 = 9.65 (D).
    expect(peak / cold).toBeCloseTo(10.04 / 1.04, 1);
  });

  it('the inrush-resistor fix sizes a fixed resistor for the hot restart', () => {
    const text = ntc(['*@ rate RNTC hot=1ohm']);
    const fix = fixTitled(findingsOf(analyseText(text), 'surge-rating')[0], 'Insert RINRUSH');
    const ohm = Number(/RINRUSH ([\d.]+) Ω/.exec(fix.title)![1]);
    // The restart's peak ≈ 355.3 V/(1.04 Ω + R) must fall to IFSM 60 A: R ≥ 4.9 Ω (D), so the E12 rung is at least 5.6 Ω.
    expect(ohm).toBeGreaterThanOrEqual(5.6);
    expect(findingsOf(analyseText(applyFix(text, fix)), 'surge-rating')).toEqual([]);
  });
});

describe('both switch-on polarities', () => {
  it('judges D2 and D3 by the negative crest, where their own pair takes the surge', () => {
    // D2/D3 of a weaker model (IFSM 30 A) than D1/D4 (60 A); the surge is about 35 A through each pair.
    const file = checkAnnotated(bench({
      series: ['RS L A 10'], cap: '470u', models: { DR: 'ifsm=60A', DW: 'ifsm=30A' }, diodes: ['DR', 'DW', 'DW', 'DR'],
      notes: { D2: '*^ warning surge-rating: switch-on at the negative crest: peak', D3: '*^ warning surge-rating: switch-on at the negative crest' },
    }), ['surge-rating']);
    expect(findingsOf(file, 'surge-rating')[0]!.message).toContain('the peak binds: 18 % above IFSM');
  });
});

describe('peak and I²t', () => {
  // 10 Ω into 470 µF: the current steps to ~35.4 A and decays with τ ≈ 4.7 ms — a short pulse, so the peak binds.
  it('names the peak when it uses more of its rating, in A and A²s', () => {
    const file = checkAnnotated(bench({ series: ['RS L A 10'], cap: '470u', models: { DR: 'ifsm=34A' }, notes: all('*^ warning surge-rating: the peak binds: 4 % above IFSM (the I²t is') }), ['surge-rating']);
    const message = findingsOf(file, 'surge-rating')[0]!.message;
    expect(message).toContain('against the rated 4.8 A²s (IFSM²·8.3 ms/2)'); // 34²·0.0083/2 = 4.80 A²s (REFERENCES.md §5, D)
    expect(message).not.toMatch(/mA²s|µA²s/);
  });

  // A 30 mH choke: the current rises and falls as a near half-sine of Vm/(ωL) ≈ 38 A over the whole
  // half-cycle (D), a long pulse whose I²t binds before its peak does.
  const choke = (ifsm: string, notes?: Record<string, string>) => bench({ series: ['LS L M 30m', 'RS M A 0.5'], cap: '4700u', models: { DR: `ifsm=${ifsm}` }, notes });

  it('names the I²t when it binds: an error, as the energy exceeds the rating', () => {
    const file = checkAnnotated(choke('35A', all('*^ error surge-rating: the I²t binds: 7 % above its rating (the peak is 98 % of IFSM)')), ['surge-rating']);
    const m = /peak ([\d.]+) A against IFSM 35 A \(8\.3 ms\), I²t ([\d.]+) A²s against the rated ([\d.]+) A²s/.exec(findingsOf(file, 'surge-rating')[0]!.message)!;
    const [peakA, i2t, rated] = [Number(m[1]), Number(m[2]), Number(m[3])];
    expect(rated).toBeCloseTo((35 * 35 * 0.0083) / 2, 2); // 5.08 A²s (REFERENCES.md §5, D)
    // Binding by hand: the half-sine peak of the same I²t over 8.3 ms, √(2·I²t/t), exceeds the peak.
    expect(Math.sqrt((2 * i2t) / 0.0083)).toBeGreaterThan(peakA);
    // The pulse is bounded by a rectangle of its peak over the 10 ms window (D), and the peak by Vm/(ωL).
    expect(i2t).toBeLessThan(peakA * peakA * 0.01);
    expect(peakA).toBeLessThan(CREST_HIGH_V / (2 * Math.PI * 50 * 0.03));
  });

  it('is silent when both are inside (IFSM 40 A: the I²t 82 %, the peak 86 %)', () => {
    checkAnnotated(choke('40A'), ['surge-rating']);
  });
});
