/**
 * Item 6 of issue 15 for the inrush cases and the capacitor stress: the hover, the code lens, the
 * report tables and the JSON show the hot restart of an NTC limiter, each device's switch-on
 * polarity, which surge comparison binds, and the capacitor's ripple loss, core temperature and
 * life estimate. Fixture: a 230 V bridge with an NTC and a rated bulk capacitor (our own scenario).
 */
import { describe, expect, it } from 'vitest';
import { hoverInFile } from '../../server/src/editor/stress-hover';
import { codeLensesOf } from '../../server/src/editor/code-lens';
import { toJsonReport } from '../../server/src/cli/report-json';
import { deviceFigureTables, rectifierFigureTable } from '../../server/src/report/figure-tables';
import { capacitorFigureTables } from '../../server/src/report/capacitor-tables';
import { renderAnnotatedText } from '../../server/src/report/report-text-annotated';
import { analyseText } from '../rules/check';

const file = analyseText(`NTC-limited bridge (our own scenario)
*@ mains 230V 50Hz
*@ load 60W
*@ derate life=100000h
*@ rate RNTC hot=1ohm
*@ rate DR vrrm=600V ifav=3A ifsm=60A tjmax=150C rthja=40
*@ rate CB vrated=450V iripple=1.2A esr=0.3ohm endurance=5000h@105C
VAC L N SIN(0 325 50)
RNTC L A 10
D1 A P DR
D2 N P DR
D3 0 A DR
D4 0 N DR
CB P 0 470u
.model DR D(IS=5n N=1.8 RS=0.02)
.end
`);
const markdown = (offset: number) => {
  const h = hoverInFile(file, offset)!;
  return typeof h === 'string' ? h : (h as { markdown: string }).markdown;
};

describe('inrush cases and capacitor stress in the editor and the reports', () => {
  it('hover on a diode: its own surge case and which comparison binds, in A and A²s', () => {
    const text = markdown(file.text.indexOf('D2 N P'));
    // Peak ≈ (Vcrest − 2·VF)/(R_hot + 2·RS + ESR) = (357.8 − 2.5)/(1 + 0.04 + 0.3) = 265 A (D; VF as in
    // tests/rules/inrush-surge.test.ts): the capacitor's rated ESR is in the loop too.
    expect(text).toContain('inrush 265 A (hot restart at the positive crest)');
    expect(text).toMatch(/\*\*Surge:\*\* surge at high-line hot, hot restart at the negative crest \(RNTC still hot, capacitor empty\): peak 265 A against IFSM 60 A \(8\.3 ms\), I²t [\d.]+ A²s/);
    expect(text).toContain('the peak binds: 4.4 times IFSM'); // 265/60 (D)
    expect(text).not.toMatch(/mA²s/);
  });

  it('hover on the capacitor: ripple, loss, core and life with their corners', () => {
    const text = markdown(file.text.indexOf('CB P 0'));
    expect(text).toMatch(/Ripple loss I²·ESR: [\d.]+ mW at low-line hot \(ESR 300 mΩ, from its rating\)/);
    expect(text).toMatch(/Core temperature: \d+ °C at low-line hot \(core = ambient \+ 5 K × \(I\/I_rated\)²/);
    expect(text).toMatch(/Life estimate: \d+ h at low-line hot, from 5000 h at 105 °C doubling per 10 °C cooler/);
  });

  it('code lens: the inrush names the hot restart, and the shortest capacitor life', () => {
    expect(codeLensesOf(file)[0]!.title).toMatch(/ · inrush 265 A \(hot restart\) · CB life \d+ h/);
  });

  it('report tables: the inrush case per corner, each device’s surge with its rating, the capacitor table', () => {
    const r = file.rectifiers[0]!;
    const caseRow = rectifierFigureTable(r).rows.find((row) => row.label === 'Inrush case of the peak')!;
    expect(caseRow.cells.every((c) => c.startsWith('hot restart at the'))).toBe(true);
    expect(rectifierFigureTable(r).rows.find((row) => row.label.startsWith('Inrush I²t'))!.cells[0]).toMatch(/^[\d.]+ A²s$/);
    const tables = deviceFigureTables(r);
    // D1/D4 take the positive crest's surge, D2/D3 the negative's: two tables.
    expect(tables.map((t) => t.title)).toEqual(['D1, D4 (DR)', 'D2, D3 (DR)']);
    const i2t = tables[0]!.rows.find((row) => row.label === 'Inrush I²t, first half-cycle')!;
    expect(i2t.rating).toBe('14.9 A²s (IFSM²·t/2)'); // 60²·0.0083/2 = 14.94 A²s (REFERENCES.md §5, D)
    const [cap] = capacitorFigureTables(r);
    expect(cap!.title).toBe('CB (filter capacitor)');
    expect(cap!.rows.map((row) => row.label)).toEqual(['Ripple current, RMS', 'Ripple loss (ESR 300 mΩ, rating)', 'Core temperature', 'Life estimate (10 °C rule)']);
    expect(cap!.rows[3]!.rating).toBe('5000 h at 105 °C');
    expect(renderAnnotatedText(file, 't.cir')).toContain('CB (filter capacitor)');
  });

  it('JSON: the limiter, each corner’s inrush case, each device’s own surge, the capacitor’s stress', () => {
    const r = toJsonReport({ files: new Map([[file.uri, file]]), unreadable: [] }).files[0]!.rectifiers[0]!;
    expect(r.inrushLimiter).toEqual({ names: ['RNTC'], coldROhm: 10, hotROhm: 1 });
    const hot = r.corners.find((c) => c.name === 'high-line hot')!;
    expect(hot.inrushCase).toBe('hot restart at the positive crest');
    expect(hot.devices.find((d) => d.name === 'D2')).toMatchObject({ inrushCase: 'hot restart at the negative crest', inrushPeakA: expect.closeTo(265, 0) });
    const cap = r.capacitors[0]!;
    expect(cap).toMatchObject({ name: 'CB', esrOhm: 0.3, coreRiseModel: 'rated-ripple', worstCorner: { lifeH: 'low-line hot' } });
    const at = cap.corners.find((c) => c.name === 'low-line hot')!;
    expect(at.lossW).toBeCloseTo(at.irmsA ** 2 * 0.3, 12); // I²·ESR (D)
    expect(cap.worst.lifeH).toBeCloseTo(5000 * 2 ** ((105 - at.coreC) / 10), 6); // REFERENCES.md §4 (C)
  });
});
