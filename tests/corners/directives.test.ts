/** The directive forms of issue 15: load ranges, universal mains, part-spread rating keys. */
import { describe, expect, it } from 'vitest';
import { parseDirective } from '../../grammar/src/directives';
import { completeAt } from '../../server/src/editor/completion';
import { parseNetlist } from '../../grammar/src/index';

const parse = (line: string) => parseDirective(line, 0);

describe('load ranges', () => {
  it('reads a range of power, current or resistance, full end first whichever order it is written in', () => {
    expect(parse('*@ load 0.2W..12W vmin=80V').directive).toMatchObject({ load: { kind: 'power', w: 12 }, lightLoad: { kind: 'power', w: 0.2 }, vminV: 80 });
    expect(parse('*@ load 150mA..5mA').directive).toMatchObject({ load: { kind: 'current', a: 0.15 }, lightLoad: { kind: 'current', a: 0.005 } });
    // The full end of a resistance range is the smaller resistance (the larger current).
    expect(parse('*@ load 1kohm..33ohm').directive).toMatchObject({ load: { kind: 'resistance', ohm: 33 }, lightLoad: { kind: 'resistance', ohm: 1000 } });
    expect(parse('*@ load 12W').directive).not.toHaveProperty('lightLoad');
  });

  it('refuses mixed units, a third end and an end that feeds the output', () => {
    expect(parse('*@ load 0.2W..1A').diagnostics[0]!.message).toContain('one unit');
    expect(parse('*@ load 1W..2W..3W').diagnostics[0]!.message).toContain('two ends');
    const negative = parse('*@ load -1W..12W');
    expect(negative.diagnostics[0]!.message).toContain('feed power');
    expect(negative.directive).not.toHaveProperty('load');
  });
});

describe('universal mains', () => {
  it('reads the range and frequencies; a low tolerance is judged from the lowest voltage', () => {
    expect(parse('*@ mains 100V..240V 60Hz,50Hz').directive).toMatchObject({ vrms: 240, vrmsRange: [100, 240], freqHz: 60, freqsHz: [50, 60] });
    expect(parse('*@ mains 100V..240V tol=-120%').diagnostics[0]!.message).toContain('puts low line at -20 V (100 V');
    expect(parse('*@ mains 100V..0V').diagnostics.length).toBeGreaterThan(0);
  });
});

describe('part-spread rating keys', () => {
  it('reads vfspread as volts, low then high, and refuses a spread that does not straddle zero', () => {
    expect(parse('*@ rate D1 vfspread=-0.05V,+0.1V').directive).toMatchObject({ entries: [{ key: 'vfspread', range: [-0.05, 0.1] }] });
    expect(parse('*@ rate D1 vfspread=0.1V,0.2V').diagnostics[0]!.message).toContain('low,high around zero');
    expect(parse('*@ rate C1 tol=-120%,+20%').diagnostics[0]!.message).toContain('above −100 %');
  });

  it('offers them in completion with what they mean', () => {
    const text = '*@ rate C1 ';
    const items = completeAt(parseNetlist(text), text.length);
    for (const key of ['tol', 'life', 'esrlife', 'vfspread']) expect(items.find((i) => i.label === key)?.detail).toBeTruthy();
  });
});
