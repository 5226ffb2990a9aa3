/**
 * One test per hard limit (server/src/analysis/limits.ts lists them): passing the limit gives a
 * clear finding that names it, and the analysis returns what fits instead of failing. Limits are
 * lowered through `AnalysisInput.limits` so the fixtures stay small.
 */
import { describe, expect, it } from 'vitest';
import { MAX_EXPRESSION_DEPTH } from '../../grammar/src/index';
import { MAX_INCLUDE_DEPTH } from '../../server/src/circuit/index';
import { DEFAULT_LIMITS } from '../../server/src/analysis/limits';
import { solverPeriods } from '../../server/src/equivalent/index';
import { analyseText, bridge, DIODE_MODEL, expectNoNonFinite, findingsOf, ROOT } from './check';

const names = (file: ReturnType<typeof analyseText>) => file.flat.elements.map((e) => e.name);

describe('hard limits', () => {
  it('file size: the text past the limit is cut at a line start, with a finding on the last line read', () => {
    const text = ['big', 'R1 a 0 1', 'R2 a 0 2', 'R3 a 0 3', 'R4 a 0 4'].join('\n') + '\n';
    const file = analyseText(text, { limits: { maxFileChars: 24 } });
    expect(names(file)).toEqual(['R1', 'R2']);
    expect(findingsOf(file, 'limit-exceeded')).toMatchObject([{ text: 'R2 a 0 2', message: expect.stringContaining('limit: file size') }]);
  });

  it('card count: the cards past the limit are not read', () => {
    const text = ['cards', ...Array.from({ length: 10 }, (_, k) => `R${k} a 0 1`)].join('\n');
    // The title line is a card too, so four cards are the title and R0–R2.
    const file = analyseText(text, { limits: { maxCards: 4 } });
    expect(names(file)).toEqual(['R0', 'R1', 'R2']);
    expect(findingsOf(file, 'limit-exceeded')).toMatchObject([{ text: 'R2 a 0 1', message: expect.stringContaining('more than 4 cards (limit: cards per file)') }]);
  });

  it('hierarchy depth: nesting past the limit is not expanded', () => {
    const lines = ['deep'];
    for (let k = 0; k < 10; k++) lines.push(`.subckt s${k} a`, 'R1 a 0 1', `X1 a s${k + 1}`, '.ends');
    lines.push('.subckt s10 a', '.ends', 'X0 top s0');
    const file = analyseText(lines.join('\n'), { limits: { maxHierarchyDepth: 3 } });
    expect(findingsOf(file, 'subckt-depth').map((f) => f.message)).toEqual([expect.stringContaining('deeper than 3 levels')]);
    expect(file.flat.elements).toHaveLength(3);
    expect(DEFAULT_LIMITS.maxHierarchyDepth).toBe(64);
  });

  it('flattened size: a doubling hierarchy stops at the element limit', () => {
    const lines = ['wide'];
    for (let k = 0; k < 20; k++) lines.push(`.subckt w${k} a`, `X1 a w${k + 1}`, `X2 a w${k + 1}`, '.ends');
    lines.push('.subckt w20 a', 'R1 a 0 1', '.ends', 'X0 top w0');
    const file = analyseText(lines.join('\n'), { limits: { maxElements: 100 } });
    expect(findingsOf(file, 'circuit-too-large').map((f) => f.message)).toEqual([expect.stringContaining('passes 100 elements')]);
  });

  it('include depth: a chain of includes longer than the limit stops with a finding', () => {
    const files: Record<string, string> = {};
    for (let k = 0; k < MAX_INCLUDE_DEPTH + 5; k++) files[`file:///work/limits/i${k}.cir`] = `R${k} a 0 1\n.include "i${k + 1}.cir"\n`;
    const file = analyseText('chain\n.include "i0.cir"\n', {}, files);
    expect(findingsOf(file, 'include-depth').map((f) => f.message)).toEqual([expect.stringContaining(`deeper than ${MAX_INCLUDE_DEPTH} files`)]);
    expect(file.flat.elements.length).toBeLessThanOrEqual(MAX_INCLUDE_DEPTH);
  });

  it('expression depth: an expression nested past the limit is an error on its card, not a stack overflow', () => {
    const depth = MAX_EXPRESSION_DEPTH + 50;
    const text = `expr\nR1 a 0 {${'('.repeat(depth)}1${')'.repeat(depth)}}\nR2 a 0 {${'-'.repeat(5_000)}1}\n`;
    const file = analyseText(text);
    const messages = file.findings.filter((f) => f.severity === 'error').map((f) => f.message);
    expect(messages).toEqual(expect.arrayContaining([expect.stringContaining(`nested deeper than ${MAX_EXPRESSION_DEPTH} levels`)]));
    expect(file.flat.elements.find((e) => e.name === 'R1')).toMatchObject({ value: undefined });
  });

  it('solver iterations: a steady state not reached within the cap is a finding, and figures stay finite', () => {
    const file = analyseText(`it\n${bridge(1)}\n${DIODE_MODEL}\n`, { limits: { solverIterations: 0 } });
    expect(file.rectifiers).toHaveLength(1);
    expect(findingsOf(file, 'limit-exceeded')).toMatchObject([{ text: 'D11', message: expect.stringContaining("solver's iteration and step limits") }]);
    expectNoNonFinite(file);
    // With the default cap the same bridge settles and nothing is reported.
    expect(findingsOf(analyseText(`it\n${bridge(1)}\n${DIODE_MODEL}\n`), 'limit-exceeded')).toEqual([]);
  });

  it('rectifiers solved per analysis: the ones past the limit are recognised, not solved, and named', () => {
    const file = analyseText(`two\n${bridge(1)}\n${bridge(2)}\n${DIODE_MODEL}\n`, { limits: { maxRectifiers: 1 } });
    expect(file.rectifiers.map((r) => r.rectifier.devices[0]!.name)).toEqual(['D11']);
    expect(findingsOf(file, 'limit-exceeded')).toMatchObject([{ text: 'D21', message: expect.stringContaining('more than 1 rectifiers (limit: rectifiers solved per analysis); 1 rectifier was recognised but not solved') }]);
  });

  it('solver work: counted in periods between rectifiers; a partial result and a finding, the same with a warm cache', () => {
    const text = `slow\n${bridge(1)}\n${bridge(2)}\n${bridge(3)}\n${DIODE_MODEL}\n`;
    const full = analyseText(text);
    const periods = full.rectifiers.map((r) => solverPeriods(r.solution));
    // A budget that the first rectifier spends: the other two are recognised, named, not solved.
    const maxSolverPeriods = periods[0]!;
    const file = analyseText(text, { limits: { maxSolverPeriods } });
    expect(file.rectifiers).toHaveLength(1);
    expect(findingsOf(file, 'limit-exceeded')).toMatchObject([{ text: 'D21', message: expect.stringContaining(`the solver used its budget of ${maxSolverPeriods} periods (limit: solver work per analysis); 2 rectifiers were recognised but not solved`) }]);
    // Cached solutions count the same work, so the cut does not move when the adapter's cache is warm.
    const solutionCache = new Map();
    analyseText(text, { solutionCache });
    expect(analyseText(text, { solutionCache, limits: { maxSolverPeriods } }).findings).toEqual(file.findings);
    // One period more than the first rectifier spent lets the second one start.
    expect(analyseText(text, { limits: { maxSolverPeriods: maxSolverPeriods + 1 } }).rectifiers).toHaveLength(2);
  });

  it('the limit findings lie inside the analysed text', () => {
    const text = `x\n${'R1 a 0 1\n'.repeat(50)}`;
    const file = analyseText(text, { limits: { maxFileChars: 100, maxCards: 5 } });
    for (const f of file.findings.filter((x) => x.uri === ROOT)) expect(f.span.end).toBeLessThanOrEqual(file.text.length);
    expect(file.findings.some((f) => f.code === 'limit-exceeded')).toBe(true);
  });
});
