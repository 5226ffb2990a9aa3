/**
 * The topology comparison (server/src/compare/) picks its catalog parts under the file's own
 * policy and solves its variants through the solver it is given, so the memoised solver serves
 * a repeated comparison from the cache.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { analyze, type FileAnalysis } from '../../server/src/analysis/analyze';
import { memoisedSolver, type SolutionCache, type SolveFn } from '../../server/src/solve/index';
import { compareTopologies } from '../../server/src/compare/index';
import { EXAMPLES_DIR } from './fixtures';

const LED = readFileSync(join(EXAMPLES_DIR, 'led-driver-230v.cir'), 'utf8');

function analyseText(text: string): FileAnalysis {
  return analyze({ roots: ['file:///c.cir'], readText: () => text }).files.get('file:///c.cir')!;
}

const silicon = (file: FileAnalysis, solve: SolveFn = memoisedSolver(undefined)) =>
  compareTopologies(file.rectifiers[0]!, file.policy, solve).rows.find((r) => r.id === 'silicon')!;

describe('the comparison under the file\'s policy', () => {
  // PIV ≈ 230·1.1·√2 = 358 V (D). At the default 80 % it needs VRRM ≥ 447 V: the 600 V step 1N4005;
  // under the file's `*@ derate vr=50%` it needs ≥ 716 V: the 800 V step 1N4006 (JEDEC ladder, REFERENCES.md §7, C).
  it('takes the VRRM step the file\'s own derating asks for', () => {
    expect(silicon(analyseText(LED)).construction).toBe('4 × 1N4005-class silicon (1 A)');
    const strict = analyseText(LED.replace('*@ mains', '*@ derate vr=50%\n*@ mains'));
    expect(strict.policy.vr.value).toBe(0.5);
    expect(silicon(strict).construction).toBe('4 × 1N4006-class silicon (1 A)');
  });

  it('solves the variants through the solver it is given, once', () => {
    const cache: SolutionCache = new Map();
    const memo = memoisedSolver(cache);
    let solves = 0;
    const counting: SolveFn = (circuit, corners, options) => { solves++; return memo(circuit, corners, options); };
    const file = analyseText(LED);
    const first = compareTopologies(file.rectifiers[0]!, file.policy, counting);
    const applicable = first.rows.filter((r) => r.id !== 'as-drawn' && r.applicable).length;
    expect(solves).toBe(applicable);
    expect(cache.size).toBe(applicable);
    const again = compareTopologies(file.rectifiers[0]!, file.policy, counting);
    expect(cache.size).toBe(applicable);
    expect(again).toEqual(first);
  });
});
