/**
 * The solution cache is bounded by what it holds, not by how many entries: a long editing session
 * must not keep hundreds of megabytes of waveforms. Derived in the test: each solve with N-point
 * waveforms holds at least N numbers per waveform array; enough distinct solves must push the
 * oldest out while the newest and the entries in use stay.
 */
import { describe, expect, it } from 'vitest';
import { CACHE_NUMBER_BUDGET, memoisedSolver, solutionWeight, type SolutionCache } from '../../server/src/solve/solver-memo';
import { AT_25C, bridgeDevices, circuit } from './fixtures';

const bridge = (ohm: number) => circuit('diode-bridge', { vrms: 230, rOhm: 1 }, bridgeDevices(), [[100e-6, 0]], { kind: 'resistance', ohm });

describe('the memoised solver', () => {
  it('answers a repeated solve from the cache, the same object', () => {
    const cache: SolutionCache = new Map();
    const solve = memoisedSolver(cache);
    const first = solve(bridge(1000), [AT_25C], { inrush: false });
    expect(solve(bridge(1000), [AT_25C], { inrush: false })).toBe(first);
    expect(cache.size).toBe(1);
  });

  it('counts waveform samples in a solution\'s weight', () => {
    const solve = memoisedSolver(new Map());
    const light = solve(bridge(1000), [AT_25C], { inrush: false, waveformPoints: 0 });
    const heavy = solve(bridge(1000), [AT_25C], { inrush: false, waveformPoints: 2000 });
    // 2000 samples × (time, source V, output V, source A, four devices) = 16,000 numbers at least.
    expect(solutionWeight(heavy) - solutionWeight(light)).toBeGreaterThanOrEqual(2000 * 8);
  });

  it('drops the least recently used solutions once the budget is spent, keeping the newest', () => {
    const cache: SolutionCache = new Map();
    const solve = memoisedSolver(cache);
    const points = 50_000; // 50,000 × 8 = 400,000 numbers per solution: the budget holds about ten
    const kept = solve(bridge(500), [AT_25C], { inrush: false, waveformPoints: points });
    const perSolution = solutionWeight(kept);
    const fits = Math.floor(CACHE_NUMBER_BUDGET / perSolution);
    expect(fits).toBeGreaterThan(2);
    for (let k = 0; k < fits + 3; k++) {
      solve(bridge(600 + k), [AT_25C], { inrush: false, waveformPoints: points });
      solve(bridge(500), [AT_25C], { inrush: false, waveformPoints: points }); // in use: refreshed
    }
    let total = 0;
    for (const s of cache.values()) total += solutionWeight(s);
    expect(total).toBeLessThanOrEqual(CACHE_NUMBER_BUDGET);
    expect(cache.size).toBe(fits);
    expect(solve(bridge(500), [AT_25C], { inrush: false, waveformPoints: points })).toBe(kept);
    // The first of the others went out; the last stayed.
    expect([...cache.values()].includes(solve(bridge(600 + fits + 2), [AT_25C], { inrush: false, waveformPoints: points }))).toBe(true);
    const before = cache.size;
    solve(bridge(600), [AT_25C], { inrush: false, waveformPoints: points });
    expect(cache.size).toBe(before); // re-solved and stored again, something older dropped
  });
});
