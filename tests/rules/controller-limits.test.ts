/**
 * The controller's limits (issue 19 item 3): `vmax` against the input crest
 * (`controller-overvoltage`), and the quiescent current `iq=I@V,I@V` drawn from the output and
 * counted as loss in the efficiency.
 */
import { describe, expect, it } from 'vitest';
import { parseDirective } from '../../grammar/src/index';
import { controllerSupplyOf, quiescentCurrentA } from '../../server/src/equivalent/index';
import { compareTopologies } from '../../server/src/compare/index';
import { memoisedSolver } from '../../server/src/solve/index';
import { BENCH_12V, analyseText, withLoad } from '../compare/bench-12v';

const withController = (rate: string) => BENCH_12V.replace(/^\*@ rate XCTL .*$/m, `*@ rate XCTL ${rate}`);
const overvoltage = (text: string) => analyseText(text).findings.filter((f) => f.code === 'controller-overvoltage');

describe('controller-overvoltage', () => {
  // Crest at high line: the SIN amplitude 16.97 V is 12.0 V rms; +10 % default tolerance gives
  // 13.2 V rms, √2 × 13.2 = 18.67 V (D).
  it('errs when the high-line crest exceeds the controller\'s vmax, on the controller\'s card', () => {
    const text = withController('vmin=8V vmax=18V iq=0.5mA@8V,1.5mA@60V');
    const found = overvoltage(text);
    expect(found).toHaveLength(1);
    expect(found[0]!.severity).toBe('error');
    expect(text.slice(found[0]!.span.start, found[0]!.span.end)).toBe('XCTL');
    expect(found[0]!.message).toMatch(/input crest 18\.7 V at high-line [a-z -]+ exceeds the controller XCTL's rated vmax 18 V/);
  });

  it('fails the comparison\'s rows that keep that controller, under the same code', () => {
    const file = analyseText(withController('vmin=8V vmax=18V'));
    const rows = compareTopologies(file.rectifiers[0]!, file.policy, memoisedSolver(new Map())).rows;
    for (const id of ['as-drawn', 'synchronous']) {
      const row = rows.find((r) => r.id === id)!;
      expect(row.verdict?.status, id).toBe('fail');
      expect(row.verdict?.failures.map((f) => f.code)).toContain('controller-overvoltage');
    }
    expect(rows.find((r) => r.id === 'hybrid')!.verdict?.failures.map((f) => f.code)).not.toContain('controller-overvoltage');
  });

  it('is silent just inside (vmax 19 V above the 18.67 V crest) and without a vmax', () => {
    expect(overvoltage(withController('vmin=8V vmax=19V'))).toEqual([]);
    expect(overvoltage(withController('vmin=8V'))).toEqual([]);
  });
});

describe('the quiescent current', () => {
  it('reads two points amps@volts and refuses other shapes', () => {
    const ok = parseDirective('*@ rate XCTL vmin=8V vmax=60V iq=40uA@8V,300uA@60V', 0);
    expect(ok.diagnostics).toEqual([]);
    const entries = ok.directive?.keyword === 'rate' ? ok.directive.entries : [];
    expect(entries.find((e) => e.key === 'iq')?.points).toEqual([{ vV: 8, iA: 40e-6 }, { vV: 60, iA: 300e-6 }]);
    expect(entries.find((e) => e.key === 'vmax')?.value).toBe(60);
    for (const bad of ['iq=40uA@8V', 'iq=40uA@8V,300uA@8V', 'iq=40uA@8V,300uA@60V,1mA@90V']) {
      expect(parseDirective(`*@ rate XCTL ${bad}`, 0).diagnostics.map((d) => d.message)).toEqual(['iq takes one current, or two currents at two different supply voltages, e.g. iq=40uA@8V,300uA@60V']);
    }
    // Volts and amps swapped: each half is named.
    expect(parseDirective('*@ rate XCTL iq=8V@40uA,60V@300uA', 0).diagnostics.map((d) => d.message)).toEqual(["expected a current such as 1A, got '8V'", "expected a voltage such as 230V, got '40uA'"]);
    expect(parseDirective('*@ rate XCTL vmax=0V', 0).diagnostics.map((d) => d.code)).toEqual(['directive-error']);
  });

  it('is the straight line through the two points', () => {
    // Slope (300 − 40) µA / (60 − 8) V = 5 µA/V, so 200 kΩ; intercept 40 µA − 8 V × 5 µA/V = 0 (D).
    const line = controllerSupplyOf({ kind: 'controller', iqPoints: { value: [{ vV: 8, iA: 40e-6 }, { vV: 60, iA: 300e-6 }], origin: { kind: 'default', note: '' } as never } })!;
    expect(line.iA).toBeCloseTo(0, 15);
    expect(line.ohm).toBeCloseTo(200e3, 6);
    expect(quiescentCurrentA(line, 24)).toBeCloseTo(120e-6, 12);
    // One current: a constant.
    expect(controllerSupplyOf({ kind: 'controller', iqA: { value: 1e-3, origin: { kind: 'default', note: '' } as never } })).toEqual({ iA: 1e-3 });
  });

  // The source at 12 V and at 30 V rms: the output settles near each crest, so the controller
  // runs at two supply voltages; its loss is I·V with I read off the rated line at that V (D).
  for (const [label, amplitude] of [['12 V', '16.97'], ['30 V', '42.43']] as const) {
    it(`is counted as loss at ${label}: I·V by hand from the rated line at the solved output`, () => {
      const text = withLoad(BENCH_12V, '20mA').replace('SIN(0 16.97 50)', `SIN(0 ${amplitude} 50)`).replace('vds=40V', 'vds=100V').replace('vrated=35V', 'vrated=63V');
      const file = analyseText(text);
      const corner = file.rectifiers[0]!.solution.corners.find((c) => c.name === 'nominal-line nominal')!;
      const v = corner.vOutAvgV!;
      const iq = 0.5e-3 + ((1.5e-3 - 0.5e-3) / (60 - 8)) * (v - 8);
      // Ripple at 20 mA into 4700 µF is about 40 mV p-p: the mean of Iq(v)·v and Iq(v̄)·v̄ agree to 1e-5.
      expect(corner.controllerLossW! / (iq * v)).toBeCloseTo(1, 5);
      // The load's own power is 20 mA × v̄ (a current load, D); the efficiency counts the controller as loss.
      expect(corner.outputPowerW! / (0.02 * v)).toBeCloseTo(1, 9);
      const devices = corner.devices.reduce((s, d) => s + d.lossW!, 0);
      expect(corner.rectifierLossW).toBeCloseTo(devices + corner.controllerLossW!, 12);
      expect(corner.efficiency).toBeCloseTo(corner.outputPowerW! / (corner.outputPowerW! + devices + corner.controllerLossW!), 12);
    });
  }
});
