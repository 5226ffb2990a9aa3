/** The waveform and comparison views of every example: the series and variants they must carry. */
import { basename } from 'node:path';
import { describe, expect, it } from 'vitest';
import { parseNetlist } from '../../grammar/src/index';
import { analyze, type FileAnalysis } from '../../server/src/analysis/analyze';
import { memoisedSolver } from '../../server/src/solve/index';
import { compareTopologies as compareWith, type ComparisonRow } from '../../server/src/compare/index';
import { escapeMarkup, niceTicks } from '../../server/src/presentation/markup';
import { renderHtmlReport } from '../../server/src/report/report-html';
import { renderComparisonView, renderWaveformView } from '../../server/src/report/view-content';
import { analyseExample, examplePaths } from './fixtures';

const seriesIn = (html: string) => [...html.matchAll(/data-series="([^"]+)"/g)].map((m) => m[1]!);

describe('waveform view of every example', () => {
  for (const path of examplePaths()) {
    const name = basename(path);
    it(name, () => {
      const file = analyseExample(name);
      const view = renderWaveformView(file);
      expect(view.body).not.toMatch(/<script|<link|\ssrc=|url\(/i);
      const series = seriesIn(view.body);
      for (const analysis of file.rectifiers) {
        const devices = analysis.circuit.devices.map((d) => d.name);
        expect(series).toEqual(expect.arrayContaining([
          'source-voltage', 'output-voltage', 'source-current', ...devices.map((d) => `device-current:${d}`),
          'inrush-current', 'inrush-output-voltage', ...devices.map((d) => `inrush-device-current:${d}`),
        ]));
      }
      if (file.rectifiers.length === 0) expect(view.body).toContain('No rectifier was recognised');
    });
  }

  it('draws every trace with at least a hundred points and finite coordinates', () => {
    const body = renderWaveformView(analyseExample('led-driver-230v.cir')).body;
    const points = [...body.matchAll(/data-series="output-voltage"[^>]*\sd="([^"]+)"/g)][0]![1]!.split(' ');
    expect(points.length).toBeGreaterThanOrEqual(100);
    expect(points.every((p) => /^[ML]-?[\d.]+,-?[\d.]+$/.test(p))).toBe(true);
    // Device currents leave out their idle stretches: a path per conduction pulse.
    const d1 = [...body.matchAll(/data-series="device-current:D1"[^>]*\sd="([^"]+)"/g)][0]![1]!;
    expect(d1.match(/M/g)!.length).toBeGreaterThanOrEqual(1);
    expect(d1.split(' ').length).toBeLessThan(points.length);
  });

  it('names an unknown rectifier id rather than showing another', () => {
    const view = renderWaveformView(analyseExample('led-driver-230v.cir'), 'diode-bridge:nope');
    expect(view.body).toContain('No rectifier with id diode-bridge:nope');
    expect(seriesIn(view.body)).toEqual([]);
  });
});

describe('topology comparison', () => {
  // The first rectifier of an example compared under the example's own policy.
  const compareTopologies = (file: FileAnalysis) => compareWith(file.rectifiers[0]!, file.policy, memoisedSolver(undefined));
  const lossOf = (rows: ComparisonRow[], id: string) => rows.find((r) => r.id === id)!.rectifierLossW!.value;

  // Common practice: a diode drop loses more than a channel, so silicon > hybrid > synchronous.
  for (const name of ['led-driver-230v.cir', 'irrigation-valve-24vac.cir']) {
    it(`${name}: silicon loses most, hybrid less, synchronous least (common practice)`, () => {
      const { rows } = compareTopologies(analyseExample(name));
      expect(lossOf(rows, 'silicon')).toBeGreaterThan(lossOf(rows, 'hybrid'));
      expect(lossOf(rows, 'hybrid')).toBeGreaterThan(lossOf(rows, 'synchronous'));
      const efficiency = (id: string) => rows.find((r) => r.id === id)!.efficiency!.value;
      expect(efficiency('synchronous')).toBeGreaterThan(efficiency('silicon'));
    });
  }

  it('offers Schottky only within its reverse-voltage class', () => {
    const mains = compareTopologies(analyseExample('led-driver-230v.cir')).rows.find((r) => r.id === 'schottky')!;
    expect(mains.applicable).toBe(false);
    expect(mains.reason).toMatch(/beyond the silicon Schottky class \(up to 200 V/);
    const low = compareTopologies(analyseExample('irrigation-valve-24vac.cir')).rows.find((r) => r.id === 'schottky')!;
    expect(low.applicable).toBe(true);
    expect(lossOf([low], 'schottky')).toBeGreaterThan(0);
  });

  it('below the controller vmin the synchronous variant runs on body diodes, and says so', () => {
    const { rows } = compareTopologies(analyseExample('harvester-sync-bridge.cir'));
    const sync = rows.find((r) => r.id === 'synchronous')!;
    expect(sync.construction).toContain('vmin 3.3 V');
    expect(sync.assumptions.join(' ')).toMatch(/stays below the controller's 3\.3 V: the channels never turn on/);
    // With its channels off it is no better than the body diodes it is made of: the Schottky wins.
    expect(lossOf(rows, 'schottky')).toBeLessThan(lossOf(rows, 'synchronous'));
  });

  it('costs a variant only from the file\'s own cost ratings', () => {
    const { rows } = compareTopologies(analyseExample('led-driver-230v.cir'));
    expect(rows.find((r) => r.id === 'as-drawn')!.cost).toBeCloseTo(4 * 0.03, 10);
    expect(rows.find((r) => r.id === 'silicon')!.cost).toBeCloseTo(4 * 0.03, 10);
    expect(rows.find((r) => r.id === 'hybrid')!.cost).toBeUndefined();
  });

  it('renders bars and table rows with data-variant for every construction', () => {
    const body = renderComparisonView(analyseExample('led-driver-230v.cir')).body;
    for (const id of ['as-drawn', 'silicon', 'schottky', 'hybrid', 'synchronous']) {
      expect(body.match(new RegExp(`data-variant="${id}"`, 'g'))?.length, id).toBe(2);
    }
    expect(renderComparisonView(analyseExample('bench-supply-centre-tap.cir')).body).toContain('data-comparison="not-applicable"');
  });
});

describe('markup', () => {
  it('escapes netlist text everywhere it reaches the page', () => {
    const text = 'Evil <script>alert("x")</script> & co\n*@ mains 230V 50Hz\nV1 a b SIN(0 325 50)\nD1 a o DX\nD2 b o DX\nD3 0 a DX\nD4 0 b DX\nC1 o 0 10u\nR1 o 0 1k\n.model DX D\n.end\n';
    expect(parseNetlist(text).title?.text).toContain('<script>');
    const file = analyze({ roots: ['evil<x>.cir'], readText: () => text }).files.get('evil<x>.cir')!;
    const page = renderHtmlReport([{ file, displayPath: 'evil<x>.cir' }], { generator: 'test' });
    expect(page).not.toContain('<script>');
    expect(page).not.toContain('evil<x>');
    expect(page).toContain('Evil &lt;script&gt;alert(&quot;x&quot;)&lt;/script&gt; &amp; co');
    expect(escapeMarkup(`<a href='x'>&`)).toBe('&lt;a href=&#39;x&#39;&gt;&amp;');
  });

  it('chooses 1-2-5 axis steps that cover the data', () => {
    expect(niceTicks(-325, 358).ticks).toEqual([-400, -200, 0, 200, 400]);
    expect(niceTicks(0, 0.57).ticks).toEqual([0, 0.2, 0.4, 0.6]);
    expect(niceTicks(3, 3).ticks.length).toBeGreaterThan(1);
  });
});
