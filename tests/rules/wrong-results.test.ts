/**
 * Inputs that gave wrong figures with nothing said (issue 13, item 5): each now ends in a finding
 * with its code, severity and the number at fault, never a throw. Fixtures are our own 230 V
 * bridge (tests/limits/check.ts); numbers are derived in the test or read from the solution.
 */
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { displayNumber } from '../../grammar/src/index';
import { analyseText, bridge, DIODE_MODEL, expectNoNonFinite, findingsOf } from '../limits/check';
import { run } from '../report/fixtures';

const MAINS = '*@ mains 230V 50Hz';
const withBridge = (body: string, head = MAINS) => `wrong results\n${head}\n${body}\n${DIODE_MODEL}\n`;

/** The one finding of `code`, with its severity and the text under its span. */
function only(text: string, code: string, files: Record<string, string> = {}) {
  const file = analyseText(text, {}, files);
  const found = findingsOf(file, code);
  expect(found, file.findings.map((f) => `${f.code}: ${f.message}`).join('\n')).toHaveLength(1);
  const finding = file.findings.find((f) => f.code === code)!;
  return { file, finding, text: found[0]!.text };
}

describe('*@ mains', () => {
  it('0 Hz is a directive error on the word, and the figures come from the source\'s own 50 Hz', () => {
    const { file, finding, text } = only(withBridge(bridge(1), '*@ mains 230V 0Hz'), 'directive-error');
    expect([finding.severity, text]).toEqual(['error', '0Hz']);
    expect(finding.message).toContain("a mains frequency must be above zero, got '0Hz'");
    expect(file.rectifiers[0]!.circuit.source.freqHz).toBe(50);
    expect(file.rectifiers[0]!.solution.worst.vOutAvgV?.value).toBeGreaterThan(0);
    expectNoNonFinite(file);
  });

  it('0 V and a negative voltage are refused the same way', () => {
    for (const volts of ['0V', '-230V']) {
      const { finding, text } = only(withBridge(bridge(1), `*@ mains ${volts} 50Hz`), 'directive-error');
      expect([finding.severity, text, finding.message]).toEqual(['error', volts, `a mains voltage must be above zero, got '${volts}'; it is ignored`]);
    }
  });

  it('tol=-100% puts low line at 0 V: refused, the default ±10 % corners are used', () => {
    const { file, finding, text } = only(withBridge(bridge(1), '*@ mains 230V 50Hz tol=-100%'), 'directive-error');
    expect([finding.severity, text]).toEqual(['error', '-100%']);
    // Analytic: 230 V × (1 − 100 %) = 0 V.
    expect(finding.message).toContain('tol=-100% puts low line at 0 V (230 V × (1 − 100 %))');
    expect(file.rectifiers[0]!.corners.map((c) => c.lineScale)).toContain(0.9);
  });

  it('tol=-150%,+10% puts low line at −115 V: refused', () => {
    const { finding } = only(withBridge(bridge(1), '*@ mains 230V 50Hz tol=-150%,+10%'), 'directive-error');
    // Analytic: 230 V × (1 − 150 %) = −115 V.
    expect([finding.severity, finding.message]).toEqual(['error', expect.stringContaining('puts low line at -115 V (230 V × (1 − 150 %))')]);
  });

  it('is silent just inside: tol=-99% (low line 2.3 V) is a tolerance, if an odd one', () => {
    const file = analyseText(withBridge(bridge(1), '*@ mains 230V 50Hz tol=-99%'));
    expect(findingsOf(file, 'directive-error')).toEqual([]);
    expect(Math.min(...file.rectifiers[0]!.corners.map((c) => c.lineScale))).toBeCloseTo(0.01, 12);
  });
});

describe('*@ load', () => {
  it('-10W is a directive error naming the power, not a silent "no load"', () => {
    const { finding, text } = only(withBridge(bridge(1, '100u', ''), `${MAINS}\n*@ load -10W`), 'directive-error');
    expect([finding.severity, text]).toEqual(['error', '-10W']);
    expect(finding.message).toBe('a load of -10 W would feed power into the output; a load draws 0 W or more; the load is ignored');
  });

  it('a negative current, a 0 Ω and a negative resistance are refused; 0 W is an explicit no load', () => {
    const message = (load: string) => only(withBridge(bridge(1, '100u', ''), `${MAINS}\n*@ load ${load}`), 'directive-error').finding.message;
    expect(message('-0.5A')).toContain('a load of -0.5 A would feed current into the output');
    expect(message('0ohm')).toContain('a load of 0 Ω is a short across the output');
    expect(message('-33ohm')).toContain('a load of -33 Ω is not a passive part');
    expect(findingsOf(analyseText(withBridge(bridge(1, '100u', ''), `${MAINS}\n*@ load 0W`)), 'directive-error')).toEqual([]);
  });
});

describe('bypassed-device: a resistor across a bridge diode', () => {
  const across = (ohm: string) => only(withBridge(`${bridge(1)}\nRB a1 p1 ${ohm}`), 'bypassed-device');

  it('1 mΩ shorts the diode: an error with the reverse current at its PIV (Ohm\'s law, PIV/R)', () => {
    const { file, finding, text } = across('1m');
    const piv = file.rectifiers[0]!.solution.devices[0]!.pivV!;
    expect([finding.severity, text]).toEqual(['error', 'RB']);
    expect(finding.message).toContain(`RB (0.001 Ω) is across D11 of the diode bridge`);
    expect(finding.message).toContain(`at D11's PIV of ${displayNumber(piv.value)} V (${piv.corner}) it passes ${displayNumber(piv.value / 0.001)} A in reverse`);
    expect(finding.message).toContain('the rectifier could not be analysed as drawn');
    expect(finding.related?.[0]?.message).toBe('D11 is the device it bypasses');
  });

  it('0 Ω across a diode is a short outright', () => {
    expect(across('0').finding).toMatchObject({ severity: 'error', message: expect.stringContaining('at 0 Ω it shorts D11') });
  });

  it('10 kΩ passes a share of the diode current the figures leave out: a warning with the share', () => {
    const { file, finding } = across('10k');
    const d = file.rectifiers[0]!.solution.devices[0]!;
    // PIV/R against the diode's average current: about 357 V / 10 kΩ = 35.7 mA of some 0.1 A.
    const share = d.pivV!.value / 10e3 / d.iavgA!.value;
    expect(share).toBeGreaterThan(0.01);
    expect(finding.severity).toBe('warning');
    expect(finding.message).toContain(`${Math.round(share * 100)} % of its average current of ${displayNumber(d.iavgA!.value)} A`);
  });

  it('10 MΩ (under 1 % of the diode current) is an info note that says the effect is negligible', () => {
    const { finding } = across('10MEG');
    expect(finding).toMatchObject({ severity: 'info', message: expect.stringContaining('under 1 % of its average current') });
  });
});

describe('shorted-source', () => {
  it('a 0 Ω load is a short across the output, not "no load found"', () => {
    const { file, finding, text } = only(withBridge(bridge(1, '100u', '0')), 'shorted-source');
    expect([finding.severity, text]).toEqual(['error', 'RL1']);
    expect(finding.message).toContain('RL1 is 0 Ω across the output p1/0 of the diode bridge: it shorts the output');
    expectNoNonFinite(file);
  });

  it('a source with both terminals on one node is shorted', () => {
    const { finding, text } = only(withBridge(`${bridge(1)}\nV9 q q 5`), 'shorted-source');
    expect([finding.severity, text, finding.message]).toEqual(['warning', 'V9', 'V9 has both terminals on node q: the source is shorted and drives nothing']);
    expect(only('shorted\nV1 a a 5\nR1 a 0 1k\n', 'shorted-source').finding.message).toBe('V1 has both terminals on node a: the source is shorted and drives nothing');
  });

  it('is silent for a 1 mΩ load (a finite load the solver takes as it is)', () => {
    expect(findingsOf(analyseText(withBridge(bridge(1, '100u', '1m'))), 'shorted-source')).toEqual([]);
  });
});

describe('duplicate-name', () => {
  it('a second R1 card gets a finding naming the line of the first', () => {
    const text = withBridge(`${bridge(1)}\nRL1 p1 0 2k`);
    const { finding, text: under } = only(text, 'duplicate-name');
    const firstLine = text.split('\n').findIndex((l) => l.startsWith('RL1 ')) + 1;
    expect([finding.severity, under]).toEqual(['warning', 'RL1']);
    expect(finding.message).toBe(`RL1 is already defined on line ${firstLine}: a simulator may refuse the file or keep only one of them; this analysis keeps both`);
    expect(finding.span.start).toBeGreaterThan(text.indexOf('RL1 p1 0 1k'));
  });

  it('compares names without case, and not the copies two instances make of one subcircuit', () => {
    expect(only('t\nR1 a 0 1k\nr1 a 0 2k\n', 'duplicate-name').finding.message).toContain('r1 is already defined on line 2');
    const twice = 't\n.subckt S p n\nR1 p n 1k\n.ends\nX1 a 0 S\nX2 b 0 S\n';
    expect(findingsOf(analyseText(twice), 'duplicate-name')).toEqual([]);
  });
});

describe('include-error: errors in included files reach the root', () => {
  const sub = 'file:///work/limits/sub.cir';

  it('a cycle closed one file down (root → sub → root) is an error on the root\'s include card', () => {
    const { finding, text } = only('root\n.include "sub.cir"\nR1 a 0 1k\n', 'include-error', { [sub]: '.include "root.cir"\nR2 a 0 1k\n' });
    expect([finding.severity, text]).toEqual(['error', '"sub.cir"']);
    expect(finding.message).toMatch(/^'sub\.cir' leads to an error, so part of the circuit was not analysed as written; the first, in file:\/\/\/work\/limits\/sub\.cir line 1: include-cycle: /);
  });

  it('a truncated included file (cut inside a card) is an error on the root, with the line in the included file', () => {
    const { finding } = only('root\n.include "sub.cir"\nV1 a 0 5\n', 'include-error', { [sub]: 'R9 a 0 1k\nD1 a' });
    expect(finding.severity).toBe('error');
    expect(finding.message).toContain('sub.cir line 2: syntax-error');
  });

  it('makes `rectilens check` fail (exit 1) where it passed before, for a cycle and for a truncated include', () => {
    const dir = mkdtempSync(join(tmpdir(), 'rectilens-include-'));
    writeFileSync(join(dir, 'a.cir'), 'top\n.include "b.cir"\nV1 a 0 5\nR1 a 0 1k\n');
    writeFileSync(join(dir, 'b.cir'), '.include "a.cir"\nR2 a 0 1k\n');
    writeFileSync(join(dir, 't.cir'), 'top\n.include "half.cir"\nV1 a 0 5\n');
    writeFileSync(join(dir, 'half.cir'), 'R9 a 0 1k\nD1 a');
    for (const root of ['a.cir', 't.cir']) {
      const result = run(['check', join(dir, root)]);
      expect(result.code, result.stdout).toBe(1);
      expect(result.stdout).toMatch(/:2:\d+: error include-error: /);
    }
  });

  it('is silent for a clean include', () => {
    expect(findingsOf(analyseText('root\n.include "sub.cir"\nR1 a 0 1k\n', {}, { [sub]: 'R2 a 0 1k\n' }), 'include-error')).toEqual([]);
  });
});
