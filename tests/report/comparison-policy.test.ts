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

describe('every row judged under the file\'s policy', () => {
  const VALVE = readFileSync(join(EXAMPLES_DIR, 'irrigation-valve-24vac.cir'), 'utf8');
  const STRESS_CODES = ['piv-margin', 'mosfet-vds', 'current-rating', 'surge-rating', 'junction-temp', 'thermal-runaway'];

  it('fails the Schottky bridge of the 24 VAC valve on piv-margin, with its figure and limit', () => {
    const file = analyseText(VALVE);
    const rows = compareTopologies(file.rectifiers[0]!, file.policy, memoisedSolver(undefined)).rows;
    const schottky = rows.find((r) => r.id === 'schottky')!;
    // Crest 24 V·1.1·√2 = 37.3 V less a silicon drop (D) gives about 35 V of reverse voltage against
    // a 40 V Schottky class held to 80 % (the policy's default, common practice): 32 V.
    expect(schottky.verdict?.status).toBe('fail');
    expect(schottky.verdict?.failures.map((f) => [f.code, f.devices.length])).toEqual([['piv-margin', 4]]);
    expect(schottky.verdict?.failures[0]!.text).toMatch(/^reverse voltage 3[45]\.\d V against a limit of 32 V \(rating 40 V\)$/);
    // The as-drawn row agrees with `check`: its parts pass, and the file has no stress finding.
    expect(rows[0]!.verdict?.status).toBe('pass');
    expect(file.findings.filter((f) => STRESS_CODES.includes(f.code))).toEqual([]);
    // Generic MOSFETs are not passed: the row says what a part there would need.
    const sync = rows.find((r) => r.id === 'synchronous')!;
    expect(sync.verdict?.status).toBe('unjudged');
    expect(sync.verdict?.unrated[0]!.needs).toMatch(/^VDS ≥ [\d.]+ V, ID ≥ [\d.]+ A$/);
  });

  it.each([['the 24 VAC valve', 'irrigation-valve-24vac.cir', 'DRECT'], ['the 230 V LED driver', 'led-driver-230v.cir', 'DGEN']])(
    'proposes for %s only diode bridges that pass check once applied', (_name, example, model) => {
      const text = readFileSync(join(EXAMPLES_DIR, example), 'utf8');
      const file = analyseText(text);
      const rows = compareTopologies(file.rectifiers[0]!, file.policy, memoisedSolver(undefined)).rows;
      const proposed = rows.filter((r) => (r.id === 'silicon' || r.id === 'schottky') && r.verdict?.status === 'pass');
      expect(proposed.length).toBeGreaterThan(0);
      for (const row of proposed) {
        const part = /^4 × (\S+)-class/.exec(row.construction)![1]!;
        const rthja = /rthja=(\d+)/.exec(text)![1]!;
        // Applied: every diode card names the catalog part, whose ratings the catalog gives; the file's thermal path stays.
        const applied = text
          .split('\n')
          .filter((line) => !line.startsWith(`*@ rate ${model} `) && !line.startsWith(`.model ${model} `))
          .map((line) => (/^D\d /.test(line) ? line.replace(new RegExp(` ${model}$`), ` ${part}`) : line))
          .join('\n')
          .replace('.end', `*@ rate ${part} rthja=${rthja}\n.model ${part} D\n.end`);
        const after = analyseText(applied);
        expect(after.rectifiers[0]!.devices.map((d) => d.model?.name.toUpperCase())).toEqual(Array(4).fill(part.toUpperCase()));
        expect(after.rectifiers[0]!.devices[0]!.ratings.ratings.rthjaKPerW?.value).toBe(Number(rthja));
        const findings = after.findings.filter((f) => STRESS_CODES.includes(f.code) && f.severity !== 'info');
        expect(findings.map((f) => `${f.code}: ${f.message}`)).toEqual([]);
      }
    },
  );
});
