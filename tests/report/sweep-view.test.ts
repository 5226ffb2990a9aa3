/**
 * The load sweep and the cost against energy in the comparison view, the HTML report's
 * comparison section, the terminal and `compare --format json` (issue 19 items 1, 2 and 5).
 */
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { runCommandLine } from '../../server/src/cli/main';
import { renderComparisonSection, renderComparisonView } from '../../server/src/report/view-content';
import { renderView } from '../../server/src/lsp/views';
import { memoisedSolver } from '../../server/src/solve/index';
import { BENCH_12V, analyseText } from '../compare/bench-12v';

const SERIES = ['as-drawn', 'silicon', 'schottky', 'hybrid', 'synchronous'];
const CHARTS = ['sweep-efficiency', 'sweep-loss', 'sweep-tj', 'sweep-vout', 'sweep-ripple'];

function run(argv: string[]) {
  let stdout = '';
  let stderr = '';
  const code = runCommandLine(argv, { stdout: (t) => (stdout += t), stderr: (t) => (stderr += t), stderrIsTty: false });
  return { code, stdout, stderr };
}

describe('the comparison view', () => {
  const body = renderComparisonView(analyseText(BENCH_12V), undefined, memoisedSolver(new Map())).body;

  it('draws one sweep chart per figure with every construction as a series and the file\'s load marked', () => {
    for (const chart of CHARTS) {
      const svg = new RegExp(`<svg[^>]*data-chart="${chart}"[\\s\\S]*?</svg>`).exec(body)?.[0];
      expect(svg, chart).toBeDefined();
      expect([...svg!.matchAll(/<path class="sw-trace" data-series="([a-z-]+)"/g)].map((m) => m[1])).toEqual(SERIES);
      // The file's load is the full end of its range, 1.5 A.
      expect(svg).toContain('data-file-load="1.5 A"');
      // Every coordinate is a finite number.
      expect(svg).not.toMatch(/NaN|Infinity/);
    }
    expect(body).toMatch(/Synchronous bridge overtakes Silicon bridge above [\d.]+ mA/);
    // The editor's view runs in the analysis worker with a budget counted in solver periods: it
    // takes its 12 points, or says where the budget stopped it.
    const charted = /data-series="as-drawn"[^>]*d="([^"]*)"/.exec(body)?.[1] ?? '';
    const said = /The sweep took (\d+) points instead of 12: the solver&#39;s periods reached the sweep&#39;s limit of 2000/.exec(body);
    if (!said) expect(charted.split(/[ML]/).filter((p) => p.trim()).length).toBe(12);
  });

  it('says so when the solver budget stops the sweep early', () => {
    const solve = memoisedSolver(new Map());
    const file = analyseText(BENCH_12V);
    const html = renderComparisonSection(file.rectifiers[0]!, file.policy, solve, undefined, { points: 12, maxPeriods: 200 });
    const said = /The sweep took (\d+) points instead of 12: the solver&#39;s periods reached the sweep&#39;s limit of 200\b/.exec(html);
    expect(said).not.toBeNull();
    expect(Number(said![1])).toBeLessThan(12);
  });

  it('shows the cost against energy with "no price" for the catalog constructions', () => {
    const table = /<table class="rl-table rl-energy-table">[\s\S]*?<\/table>/.exec(body)![0];
    expect(table).toMatch(/<tr data-energy="silicon"><th scope="row">Silicon bridge<\/th><td>no price<\/td>/);
    // As drawn: 4 MOSFETs at 0.30 and the controller at 0.80 (the file's prices).
    expect(table).toMatch(/<tr data-energy="as-drawn"><th scope="row">As drawn<\/th><td>2\.00<\/td>/);
  });
});

describe('rectilens compare with the sweep', () => {
  const dir = mkdtempSync(join(tmpdir(), 'rectilens-sweep-'));
  const path = join(dir, 'bench.cir');
  writeFileSync(path, BENCH_12V);

  it('prints the sweep table, the crossovers and the cost against energy', () => {
    const result = run(['compare', path]);
    expect(result.code).toBe(0);
    const lines = result.stdout.split('\n');
    expect(lines).toContain('Across the load range (worst corner at each load):');
    expect(lines.find((l) => l.startsWith('load '))).toMatch(/^load +As drawn +Silicon bridge +Schottky bridge +Hybrid bridge +Synchronous bridge$/);
    expect(lines.find((l) => l.startsWith('5 mA '))).toMatch(/^5 mA +[\d.]+ % [\d.]+ mW 40 °C/);
    expect(lines.find((l) => l.startsWith('1.5 A *'))).toBeDefined();
    expect(result.stdout).toMatch(/Crossovers in efficiency \(from light to heavy load\): .*Synchronous bridge overtakes Silicon bridge above [\d.]+ mA/);
    expect(lines).toContain('Cost against energy:');
  });

  it('--format json gives each bridge a sweep: its points with the load and every construction\'s figures', () => {
    const json = JSON.parse(run(['compare', path, '--format', 'json']).stdout);
    const sweep = json.rectifiers[0].sweep;
    expect(sweep.quantity).toBe('current');
    expect(sweep.fileLoad).toBe(1.5);
    expect(sweep.points).toHaveLength(20);
    for (const p of sweep.points) {
      expect(p.loadA).toBeGreaterThan(0);
      expect(Object.keys(p.constructions)).toEqual(SERIES);
      expect(p.constructions.synchronous.efficiency).toBeGreaterThan(0.8);
    }
    expect(sweep.crossovers.some((c: { above: string; below: string; loadA: number }) => c.above === 'synchronous' && c.below === 'silicon' && c.loadA > 0.005 && c.loadA < 0.1)).toBe(true);
    expect(json.rectifiers[0].energy.rows.find((r: { id: string }) => r.id === 'silicon').cost).toBeUndefined();
  });
});

describe('the report the editor\'s command writes', () => {
  it('is the whole HTML page of the open file, the sweep charts and the energy table in it', () => {
    const file = analyseText(BENCH_12V);
    const page = renderView(file, { kind: 'report', uri: file.uri }, memoisedSolver(new Map()))!;
    expect(page.title).toBe('Rectilens report: bench.cir');
    expect(page.body.startsWith('<!DOCTYPE html>')).toBe(true);
    for (const chart of CHARTS) expect(page.body).toContain(`data-chart="${chart}"`);
    expect(page.body).toContain('rl-energy-table');
    // A file with no rectifier still has a report (it says so), unlike the views.
    const empty = analyseText('just a resistor\nR1 a 0 1k\n');
    expect(renderView(empty, { kind: 'report', uri: empty.uri }, memoisedSolver(undefined))!.body).toContain('No rectifier was recognised in this file.');
    expect(renderView(empty, { kind: 'comparison', uri: empty.uri }, memoisedSolver(undefined))).toBeNull();
  });
});
