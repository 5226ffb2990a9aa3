/**
 * Item 6 of issue 15 for the load, line and part conditions: the hover, the code lens, the
 * report tables and the JSON name each corner's line, ambient and load, and say what the load
 * is made of. Fixture: the universal-input adapter example (a scenario of our own).
 */
import { describe, expect, it } from 'vitest';
import { hoverInFile } from '../../server/src/editor/stress-hover';
import { codeLensesOf } from '../../server/src/editor/code-lens';
import { toJsonReport } from '../../server/src/cli/report-json';
import { renderAnnotatedText } from '../../server/src/report/report-text-annotated';
import { cornerConditionTable } from '../../server/src/report/figure-tables';
import { analyseExample } from '../report/fixtures';
import { analyseText } from '../rules/check';

const file = analyseExample('universal-adapter-90-264v.cir');

describe('conditions in the editor and the reports', () => {
  it('hover: the load and what it is made of, and the conditions of each worst corner', () => {
    const at = file.text.indexOf('D1 l1');
    const hover = hoverInFile(file, at)!;
    const text = typeof hover === 'string' ? hover : (hover as { markdown: string }).markdown;
    expect(text).toContain('Load: 300 mW…18 W constant power (\\*@ load) + RBLEED (470 kΩ) across the output');
    expect(text).toContain('corners over 90–264 V · 50/60 Hz · load 300 mW–18 W · part spread');
    expect(text).toContain('high-line hot light-load: 264 V 50 Hz · 55 °C · load 300 mW · largest C, nominal ESR, lowest VF');
  });

  it('code lens: the span solved, after the usual figures', () => {
    const [summary] = codeLensesOf(file);
    expect(summary!.title).toMatch(/^diode bridge · η [\d.]+ % · ripple [\d.]+ V p-p · PF 0\.\d+ · .* · 90–264 V · 50\/60 Hz · load 300 mW–18 W · part spread$/);
  });

  it('code lens: unchanged for a single line, load and nominal parts', () => {
    const plain = analyseText(`plain bridge (our own)
*@ mains 230V 50Hz
*@ load 20W
VAC L N SIN(0 325 50)
RS L A 10
D1 A P DR
D2 N P DR
D3 0 A DR
D4 0 N DR
CB P 0 47u
.model DR D(IS=5n N=1.8 RS=0.05)
.end
`);
    const title = codeLensesOf(plain)[0]!.title;
    expect(title).toMatch(/^diode bridge · η [\d.]+ % · ripple [\d.]+ V p-p · PF 0\.\d+/);
    expect(title).not.toMatch(/part spread| V · |load /);
  });

  it('report: a corner table with line, ambient, load and parts per corner, and the load composition', () => {
    const table = cornerConditionTable(file.rectifiers[0]!);
    expect(table.rows.map((r) => r.label)).toEqual(['Line', 'Ambient', 'Load', 'Parts']);
    const last = table.corners.length - 1;
    expect(table.corners[last]).toBe('high-line hot light-load');
    expect(table.rows.map((r) => r.cells[last])).toEqual(['264 V 50 Hz', '55 °C', '300 mW + RBLEED', 'C max · ESR nom · VF low']);
    const text = renderAnnotatedText(file, 'examples/universal-adapter-90-264v.cir');
    expect(text).toContain('load: 300 mW…18 W constant power (*@ load) + RBLEED (470 kΩ) across the output');
    expect(text).toMatch(/^Corners +low nom full/m);
  });

  it('JSON: each corner names its line, frequency, ambient, load and part vertex; the rectifier its load', () => {
    const json = toJsonReport({ files: new Map([[file.uri, file]]), unreadable: [] });
    const r = json.files[0]!.rectifiers[0]!;
    expect(r.load).toEqual({ full: { kind: 'power', w: 18, vminV: 80 }, light: { kind: 'power', w: 0.3, vminV: 80 }, fromDirective: true, fixed: { ohm: 470e3, elements: ['RBLEED'] } });
    const light = r.corners.find((c) => c.name === 'high-line hot light-load')!;
    expect(light).toMatchObject({ lineVrms: expect.closeTo(264, 9), freqHz: 50, ambientC: 55, loadLevel: 'light', load: { kind: 'power', w: 0.3 }, parts: { capacitance: 'max', esr: 'nominal', vf: 'low' } });
    expect(r.worstCorner.vOutMaxV).toBe('high-line hot light-load');
  });
});
