/**
 * Item 2 of issue 15, universal input: `*@ mains 100V..240V 50Hz,60Hz tol=-10%,+10%` solves
 * low line at 100 V − 10 % = 90 V and the lowest frequency, high line at 240 V + 10 % = 264 V.
 */
import { describe, expect, it } from 'vitest';
import { analyseText } from '../rules/check';
import { offlineBridge } from './fixtures';
import { parseDirective } from '../../grammar/src/directives';

// Our own scenario: a universal-input adapter front end, bridge straight off the line, 47 µF
// with a ±20 % tolerance, a 20 W converter that works down to 80 V.
const adapter = (mains: string) => offlineBridge('universal-input front end (scenario of our own)',
  `*@ mains ${mains}\n*@ load 20W vmin=80V`, 'C1 P 0 47u', '*@ rate C1 tol=-20%,+20%');

describe('universal input', () => {
  it('reads a voltage range and several frequencies', () => {
    const { directive, diagnostics } = parseDirective('*@ mains 100V..240V 50Hz,60Hz tol=-10%,+10%', 0);
    expect(diagnostics).toEqual([]);
    expect(directive).toMatchObject({ vrms: 240, vrmsRange: [100, 240], freqHz: 50, freqsHz: [50, 60], tolLow: -0.1, tolHigh: 0.1 });
    expect(parseDirective('*@ mains 240V..100V', 0).diagnostics[0]!.message).toContain('lowest..highest');
  });

  it('takes the PIV from 264 V and the hold-up from 90 V', () => {
    const r = analyseText(adapter('100V..240V 50Hz,60Hz tol=-10%,+10%')).rectifiers[0]!;
    const byName = new Map(r.solution.corners.map((c) => [c.name, c]));
    const piv = r.solution.devices[0]!.pivV!;
    const pivCorner = byName.get(piv.corner)!;
    expect(pivCorner.lineVrms).toBeCloseTo(240 * 1.1, 9); // 264 V
    // Hand formula: the blocking diode sees the crest √2·264 V less the conducting diode's drop
    // and the source resistance's drop near the crest (a few volts, under 1 % of 373 V).
    expect(Math.abs(piv.value / (Math.SQRT2 * 264) - 1)).toBeLessThan(0.01);
    const hold = r.solution.worst.holdUpS!;
    const holdCorner = byName.get(hold.corner)!;
    expect(holdCorner.lineVrms).toBeCloseTo(100 * 0.9, 9); // 90 V
    expect(holdCorner.freqHz).toBe(50); // the lowest frequency: the longest gap between charging pulses
    // Hand formula, energy balance of a constant-power load: C·(v0² − vmin²)/(2P), with C the
    // smallest capacitance (47 µF − 20 %) and v0 the corner's own output minimum.
    const cMin = 47e-6 * 0.8;
    expect(hold.value).toBeCloseTo((cMin * (holdCorner.vOutMinV! ** 2 - 80 ** 2)) / (2 * 20), 12);
  });

  it('solves its low line exactly as a 100 V design does, and its high line as a 240 V one', () => {
    const wide = analyseText(adapter('100V..240V 50Hz,60Hz tol=-10%,+10%')).rectifiers[0]!.solution;
    const low = analyseText(adapter('100V 50Hz tol=-10%,+10%')).rectifiers[0]!.solution;
    const high = analyseText(adapter('240V 60Hz tol=-10%,+10%')).rectifiers[0]!.solution;
    const at = (s: typeof wide, name: string) => s.corners.find((c) => c.name === name)!;
    // Same line voltage, frequency, ambient and part vertex: the same solve, to the last digit.
    expect(at(wide, 'low-line nominal').holdUpS).toBe(at(low, 'low-line nominal').holdUpS);
    expect(at(wide, 'low-line nominal').rippleVpp).toBe(at(low, 'low-line nominal').rippleVpp);
    expect(at(wide, 'high-line nominal').devices[0]!.pivV).toBe(at(high, 'high-line nominal').devices[0]!.pivV);
  });

  it('keeps a single voltage and frequency as before: no frequency overrides', () => {
    const r = analyseText(adapter('230V 50Hz')).rectifiers[0]!;
    expect(r.corners.every((c) => c.freqHz === undefined)).toBe(true);
    expect(r.solution.corners.map((c) => c.lineVrms)).toEqual([207, 207, 230, 230, 253, 253].map((v) => expect.closeTo(v, 9)));
  });
});
