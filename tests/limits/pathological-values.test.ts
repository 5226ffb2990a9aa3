/**
 * One test per pathological value: each gives a finding that names it, and no hint, lens,
 * message or reported figure says NaN or Infinity. Fixtures are our own bridge on 230 V mains.
 */
import { describe, expect, it } from 'vitest';
import { solverFindings } from '../../server/src/analysis/limits';
import type { RectifierAnalysis } from '../../server/src/analysis/rectifier-analysis';
import { dropNonFiniteFigures, NON_FINITE_NOTE } from '../../server/src/solve/finite-figures';
import type { CornerSolution } from '../../server/src/solve/index';
import { analyseText, bridge, DIODE_MODEL, expectNoNonFinite, findingsOf } from './check';

const withBridge = (body: string, extra = '') => `patho\n*@ mains 230V 50Hz\n${extra}${body}\n${DIODE_MODEL}\n`;

describe('pathological values: a finding each, never NaN', () => {
  it('1e400 (beyond the double range) is a bad value', () => {
    const file = analyseText(withBridge(bridge(1, '1e400')));
    expect(findingsOf(file, 'bad-value')).toMatchObject([{ text: '1e400' }]);
    expectNoNonFinite(file);
  });

  it('a 0 F capacitor', () => {
    const file = analyseText(withBridge(bridge(1, '0')));
    expect(findingsOf(file, 'implausible-value')).toMatchObject([{ text: 'C1', message: expect.stringContaining('capacitance of 0 F') }]);
    expectNoNonFinite(file);
  });

  it('a negative resistance', () => {
    const file = analyseText(withBridge(bridge(1, '100u', '-1k')));
    expect(findingsOf(file, 'implausible-value')).toMatchObject([{ text: 'RL1', message: expect.stringContaining('negative resistance') }]);
    expectNoNonFinite(file);
  });

  it('a source shorted by 0 Ω across the bridge input', () => {
    const file = analyseText(withBridge(`${bridge(1)}\nRS a1 b1 0`));
    expect(findingsOf(file, 'shorted-source')).toMatchObject([{ text: 'RS', message: 'RS is 0 Ω across V1: it shorts the source' }]);
    expectNoNonFinite(file);
  });

  it('a 0 V source across the bridge input', () => {
    for (const source of ['V1 a1 b1 SIN(0 0 50)', 'V1 a1 b1 0']) {
      const file = analyseText(withBridge(bridge(1).replace('V1 a1 b1 SIN(0 325 50)', source)));
      expect(findingsOf(file, 'shorted-source'), source).toMatchObject([{ text: 'V1', message: expect.stringContaining('0 V source across') }]);
      expectNoNonFinite(file);
    }
  });

  it('a capacitor with no discharge path (no load)', () => {
    const file = analyseText(withBridge(bridge(1, '100u', '')));
    expect(findingsOf(file, 'assumed-condition').map((f) => f.message)).toEqual(expect.arrayContaining([expect.stringContaining('no load found')]));
    expect(file.rectifiers[0]!.solution.worst.efficiency).toBeUndefined(); // omitted: no output power
    expectNoNonFinite(file);
  });

  it('a SIN of 0 Hz (frequency taken as missing; the assumption is a finding)', () => {
    const file = analyseText(`zero hz\n${bridge(1).replace('SIN(0 325 50)', 'SIN(0 325 0)')}\n${DIODE_MODEL}\n`);
    expect(findingsOf(file, 'assumed-condition').map((f) => f.message)).toEqual(expect.arrayContaining([expect.stringContaining('no frequency; assuming 50 Hz')]));
    expectNoNonFinite(file);
  });

  it('a SIN with a negative amplitude', () => {
    const file = analyseText(withBridge(bridge(1).replace('SIN(0 325 50)', 'SIN(0 -325 50)')));
    expect(findingsOf(file, 'implausible-value')).toMatchObject([{ message: expect.stringContaining('negative SIN amplitude (-325 V)') }]);
    expectNoNonFinite(file);
  });

  it('a rating of zero is refused (found by fuzzing: it gave "Infinity %")', () => {
    const file = analyseText(withBridge(bridge(1), '*@ rate C1 vrated=0V iripple=0A\n'));
    expect(findingsOf(file, 'directive-error').map((f) => f.text)).toEqual(['vrated=0V', 'iripple=0A']);
    expectNoNonFinite(file);
  });

  it('an ambient below absolute zero is refused (found by fuzzing: it gave NaN figures)', () => {
    const file = analyseText(withBridge(bridge(1), '*@ ambient -300C..9999C\n'));
    expect(findingsOf(file, 'directive-error')).toMatchObject([{ text: '-300C..9999C', message: expect.stringContaining('absolute zero') }]);
    expectNoNonFinite(file);
  });

  it('a figure that is not finite is dropped from the solution, noted, and reported as figure-omitted', () => {
    const corner = { name: 'nominal', lineScale: 1, lineVrms: 230, ambientC: 25, rippleVpp: Number.NaN, harmonicsA: [1, Infinity], vOutAvgV: 300,
      devices: [{ name: 'D1', pivV: -Infinity, lossW: 1, thermalRunaway: false }], converged: true, shootingIterations: 3, thermalIterations: 0, notes: [] } as CornerSolution;
    dropNonFiniteFigures(corner);
    expect(corner).not.toHaveProperty('rippleVpp');
    expect(corner).not.toHaveProperty('harmonicsA');
    expect(corner.devices[0]).toEqual({ name: 'D1', lossW: 1, thermalRunaway: false });
    expect(corner.notes).toEqual([`${NON_FINITE_NOTE}: rippleVpp, harmonicsA, D1.pivV`]);
    const analysis = { rectifier: { anchor: { uri: 'u', span: { start: 1, end: 2 } } }, solution: { corners: [corner], notes: corner.notes } } as unknown as RectifierAnalysis;
    expect(solverFindings([analysis])).toMatchObject([{ code: 'figure-omitted', span: { start: 1, end: 2 }, message: expect.stringContaining('rippleVpp') }]);
  });
});
