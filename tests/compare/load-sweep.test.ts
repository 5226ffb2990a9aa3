/**
 * The load sweep (server/src/compare/load-sweep.ts) on the 12 V bench supply of our own: the
 * efficiency ordering of the constructions at heavy load, the synchronous bridge's controller
 * making it the worst at a few mA, the crossovers, and every point equal to a single analysis
 * of the file at that load.
 */
import { describe, expect, it } from 'vitest';
import { memoisedSolver, type SolveFn } from '../../server/src/solve/index';
import { compareTopologies, sweepFiguresOf, sweepLoad, type LoadSweep } from '../../server/src/compare/index';
import { refinementOrder } from '../../server/src/compare/load-sweep';
import { crossoverSentence } from '../../server/src/report/sweep-svg';
import { BENCH_12V, analyseText, withLoad } from './bench-12v';

const file = analyseText(BENCH_12V);
const sweep: LoadSweep = sweepLoad(file.rectifiers[0]!, file.policy, memoisedSolver(new Map()));
const eff = (k: number, id: 'silicon' | 'hybrid' | 'synchronous' | 'schottky') => sweep.points[k]!.figures[id]!.efficiency!;

describe('the 12 V bench supply across its load range', () => {
  it('sweeps the file\'s range 5 mA..1.5 A in 20 log-spaced points with every construction', () => {
    expect(sweep.applicable).toBe(true);
    expect(sweep.quantity).toBe('current');
    expect(sweep.logScale).toBe(true);
    expect(sweep.points).toHaveLength(20);
    // Ends of the directive's range; log spacing: each step the same ratio, (1.5/0.005)^(1/19) (D).
    expect(sweep.points[0]!.amount).toBeCloseTo(0.005, 12);
    expect(sweep.points[19]!.amount).toBeCloseTo(1.5, 12);
    const ratio = (1.5 / 0.005) ** (1 / 19);
    for (let k = 1; k < 20; k++) expect(sweep.points[k]!.amount / sweep.points[k - 1]!.amount).toBeCloseTo(ratio, 9);
    expect(sweep.series.map((s) => s.id)).toEqual(['as-drawn', 'silicon', 'schottky', 'hybrid', 'synchronous']);
  });

  it('orders silicon < hybrid < synchronous above a few hundred mA (the bench ordering, common practice)', () => {
    const heavy = sweep.points.map((p, k) => k).filter((k) => sweep.points[k]!.amount >= 0.3);
    expect(heavy.length).toBeGreaterThanOrEqual(5);
    for (const k of heavy) {
      expect(eff(k, 'silicon')).toBeLessThan(eff(k, 'hybrid'));
      expect(eff(k, 'hybrid')).toBeLessThan(eff(k, 'synchronous'));
    }
  });

  it('makes the synchronous bridge the worst at 5 mA through its controller\'s quiescent draw', () => {
    const ids = ['silicon', 'schottky', 'hybrid', 'synchronous'] as const;
    const worst = ids.reduce((a, b) => (eff(0, a) <= eff(0, b) ? a : b));
    expect(worst).toBe('synchronous');
    // By hand at the corner where it is worst (the single analysis at 5 mA is the sweep point,
    // checked below): the controller draws Iq(V), the line through 0.5 mA@8 V and 1.5 mA@60 V,
    // at the output voltage V; the load takes 5 mA·V; the four channels lose their own share (D).
    const single = analyseText(withLoad(BENCH_12V, '5mA'));
    const corners = single.rectifiers[0]!.solution.corners;
    const c = corners.find((x) => x.name === single.rectifiers[0]!.solution.worst.efficiency!.corner)!;
    const v = c.vOutAvgV!;
    const iq = 0.5e-3 + ((1.5e-3 - 0.5e-3) / (60 - 8)) * (v - 8);
    // Ripple at 5 mA into 4700 µF is about 17 mV: Iq(v̄)·v̄ and the mean of Iq(v)·v agree to 1e-5.
    expect(c.controllerLossW! / (iq * v)).toBeCloseTo(1, 5);
    const channels = c.devices.reduce((sum, d) => sum + d.lossW!, 0);
    expect(c.efficiency!).toBeCloseTo((0.005 * v) / (0.005 * v + iq * v + channels), 5);
    // The controller's draw, not the channels, is what makes it the worst.
    expect(iq * v).toBeGreaterThan(5 * channels);
    expect(eff(0, 'synchronous')).toBe(c.efficiency);
  });

  it('states the crossovers where the synchronous bridge overtakes the others, between neighbouring points', () => {
    const sync = sweep.crossovers.filter((c) => c.above === 'synchronous');
    expect(sync.map((c) => c.below).sort()).toEqual(['hybrid', 'schottky', 'silicon']);
    for (const c of sync) {
      const k = sweep.points.findIndex((p) => p.amount > c.amount);
      // The interpolated load lies between the two points where the sign of the difference changes.
      expect(k).toBeGreaterThan(0);
      expect(eff(k - 1, 'synchronous') - eff(k - 1, c.below as 'silicon')).toBeLessThan(0);
      expect(eff(k, 'synchronous') - eff(k, c.below as 'silicon')).toBeGreaterThan(0);
    }
    const sentence = crossoverSentence(sweep);
    expect(sentence).toMatch(/Synchronous bridge overtakes Silicon bridge above \d/);
    console.log(`12 V bench supply: ${sentence}`);
  });
});

describe('each sweep point is a single analysis at that load', () => {
  const picks = [0, 9, 19];
  for (const k of picks) {
    it(`point ${k}: the bridge as drawn equals an analysis of the file with that single load`, () => {
      const amount = sweep.points[k]!.amount;
      const single = analyseText(withLoad(BENCH_12V, `${amount.toPrecision(17)}A`));
      // An independent analysis (its own solver, inrush and waveforms included): the same
      // worst-case figures to the last bit, because it is the same solve of the same corners.
      expect(sweep.points[k]!.figures['as-drawn']).toEqual(sweepFiguresOf(single.rectifiers[0]!.solution));
    });
  }

  it('the constructions equal the comparison of a single-load file where the comparison picks the same parts', () => {
    // 0.1 A..0.5 A: the 1 A catalog classes fit every load, so the comparison at each single load
    // builds the very constructions the sweep holds fixed.
    const ranged = analyseText(withLoad(BENCH_12V, '0.1A..0.5A'));
    const solve: SolveFn = memoisedSolver(new Map());
    const s = sweepLoad(ranged.rectifiers[0]!, ranged.policy, solve, 7);
    const parts = compareTopologies(ranged.rectifiers[0]!, ranged.policy, solve).rows.map((r) => r.construction);
    for (const k of [0, 3, 6]) {
      const single = analyseText(withLoad(BENCH_12V, `${s.points[k]!.amount.toPrecision(17)}A`));
      const rows = compareTopologies(single.rectifiers[0]!, single.policy, memoisedSolver(undefined)).rows;
      expect(rows.map((r) => r.construction)).toEqual(parts);
      for (const row of rows.filter((r) => r.applicable)) {
        const point = s.points[k]!.figures[row.id]!;
        expect(point.efficiency).toBe(row.efficiency!.value);
        expect(point.rectifierLossW).toBe(row.rectifierLossW!.value);
        expect(point.hottestTjC).toBe(row.hottestTjC!.value);
      }
    }
  });
});

describe('the sweep counts its work', () => {
  it('solves every construction once per point through the solver it is given, and a repeat from its cache', () => {
    let solves = 0;
    const cache = new Map();
    const memo = memoisedSolver(cache);
    const counting: SolveFn = (c, corners, o) => { solves++; return memo(c, corners, o); };
    const s = sweepLoad(file.rectifiers[0]!, file.policy, counting, 6);
    expect(solves).toBe(6 * s.series.length);
    const filled = cache.size;
    expect(filled).toBeGreaterThan(0);
    expect(filled).toBeLessThanOrEqual(6 * s.series.length);
    expect(sweepLoad(file.rectifiers[0]!, file.policy, counting, 6)).toEqual(s);
    expect(cache.size).toBe(filled);
  });

  it('takes fewer points when the corners would exceed its corner-solve budget', () => {
    // 6 corners × 5 constructions = 30 solves a point; 800 allow 26 points, so 40 asked give 26 (D).
    const s = sweepLoad(file.rectifiers[0]!, file.policy, memoisedSolver(new Map()), 40);
    expect(s.points).toHaveLength(Math.floor(800 / (6 * 5)));
    expect(s.limited).toMatch(/26 points instead of 40/);
  });
});

describe('the order the points are solved in', () => {
  it('takes the ends, then halves the widest gaps, each index once', () => {
    expect(refinementOrder(5)).toEqual([0, 4, 2, 1, 3]);
    const order = refinementOrder(20);
    expect([...order].sort((a, b) => a - b)).toEqual(Array.from({ length: 20 }, (_, k) => k));
    // After the ends and three halvings (7 points) no gap is wider than a quarter of the range.
    const first = [...order.slice(0, 7)].sort((a, b) => a - b);
    for (let k = 1; k < first.length; k++) expect(first[k]! - first[k - 1]!).toBeLessThanOrEqual(19 / 4 + 1);
  });
});
