/**
 * Every quick fix, applied to the text and re-analysed: the rule it answers passes and no new
 * error appears. The fixtures are of our own invention.
 */
import { describe, expect, it } from 'vitest';
import { E12 } from '../../server/src/ratings/index';
import { analyseText, applyFix, errorsOf, findingsOf, fixTitled } from './check';
import { bridge } from './fixtures';

/** Re-analyses the fixed text; the code must be gone and the errors no more than before (minus the answered ones). */
function expectAnswered(before: string, after: string, code: string): void {
  const old = analyseText(before);
  const fixed = analyseText(after);
  expect(findingsOf(fixed, code), findingsOf(fixed, code).map((f) => f.message).join('\n')).toEqual([]);
  const oldErrors = new Set(errorsOf(old).map((e) => e.split(':')[0]));
  for (const e of errorsOf(fixed)) expect(oldErrors.has(e.split(':')[0]!), `new error ${e}`).toBe(true);
}

describe('part swap (piv-margin)', () => {
  // A 230 V 50 Hz bridge of 400 V-class parts (1N4004, JEDEC ladder: 400 V, REFERENCES.md §7, C). At +10 % line
  // the PIV is about 230·1.1·√2 = 358 V (D), 89 % of 400 V, above the default 80 % (IPC-9592B, from memory).
  const text = bridge({ diode: '', rs: '22' }).replace(/ DR$/gm, ' 1N4004').replace('.model DR D(IS=5n N=1.8 RS=0.05)', '.model 1N4004 D(IS=5n N=1.8 RS=0.05)');

  it('flags piv-margin with default derating and offers a part of 600 V or more', () => {
    const file = analyseText(text);
    const found = findingsOf(file, 'piv-margin');
    expect(found).toHaveLength(4);
    expect(found[0]!.severity).toBe('warning');
    expect(found[0]!.message).toMatch(/is 8\d % of VRRM 400 V \(1N4004, built-in catalog\); policy allows 80 % \(default: IPC-9592B/);
    const fix = fixTitled(found[0], 'Use ');
    const vrrmV = Number(/\((\d+) V,/.exec(fix.title)![1]);
    expect(vrrmV).toBeGreaterThanOrEqual(600);
    // The lowest-rated passing part: the 1 A series' 600 V member (1N4005), the next rung up the ladder.
    expect(fix.title).toBe('Use 1N4005 (600 V, 1 A) for D1, D2, D3, D4');
    const fixed = applyFix(text, fix);
    expect(fixed).toMatch(/^\.model 1N4005 D\(IS=/m);
    expectAnswered(text, fixed, 'piv-margin');
    expect(findingsOf(analyseText(fixed), 'mixed-bridge')).toEqual([]);
  });

  it('never offers a silicon Schottky for a mains reverse voltage', () => {
    const found = findingsOf(analyseText(text), 'piv-margin');
    expect(found[0]!.fixes!.some((f) => /1N58/.test(f.title))).toBe(false);
  });

  it('offers a Schottky where the reverse voltage is low enough, and the swap passes', () => {
    const low = 't\n*@ rate DL vrrm=10V ifav=1A ifsm=30A tjmax=125C\nV1 s b SIN(0 12 50)\nRS s a 2\nD1 a p DL\nD2 b p DL\nD3 0 a DL\nD4 0 b DL\nC1 p 0 1000u\nRL p 0 100\n.model DL D(IS=5n N=1.8 RS=0.05)\n.end\n';
    const found = findingsOf(analyseText(low), 'piv-margin');
    const fix = fixTitled(found[0], 'Use ');
    // PIV ≈ 13.2 V (12·1.1, D) needs VRRM ≥ 16.5 V at 80 %; 2 Ω keeps the inrush near 13.2/2 = 6.6 A (D), inside a 1 A
    // part's surge rating: the 20 V Schottky 1N5817 is the lowest-rated 1 A part.
    expect(fix.title).toContain('1N5817');
    expectAnswered(low, applyFix(low, fix), 'piv-margin');
  });
});

describe('raise the capacitor voltage class (cap-voltage)', () => {
  it('moves CB from 400 V to the 450 V class, which holds 353 V within 80 % (353/0.8 = 441 V)', () => {
    const text = bridge({ cap: 'vrated=400V iripple=1A' });
    const fix = fixTitled(findingsOf(analyseText(text), 'cap-voltage')[0], 'Raise CB to the 450 V class');
    const fixed = applyFix(text, fix);
    expect(fixed).toContain('*@ rate CB vrated=450V iripple=1A');
    expectAnswered(text, fixed, 'cap-voltage');
  });
});

describe('capacitor bank (cap-ripple)', () => {
  it('makes CB a bank whose per-part ripple fits the rating', () => {
    const text = bridge({ cap: 'vrated=450V iripple=0.1A esr=2ohm' });
    const finding = findingsOf(analyseText(text), 'cap-ripple')[0];
    const fix = fixTitled(finding, 'Make CB a bank of ');
    const n = Number(/bank of (\d+)/.exec(fix.title)![1]);
    // 0.187 A on one part against 0.1 A: at least ⌈1.87⌉ = 2 parts, more because the total ripple grows with C.
    expect(n).toBeGreaterThanOrEqual(2);
    const fixed = applyFix(text, fix);
    expect(fixed).toContain(`CB P 0 ${Number((47 * n).toPrecision(3))}u`);
    expect(fixed).toContain(`iripple=${Number((0.1 * n).toPrecision(3))}A`);
    expectAnswered(text, fixed, 'cap-ripple');
  });

  it('scales an expression value', () => {
    const text = bridge({ cap: 'vrated=450V iripple=0.1A', capValue: '{cbulk}', head: '.param cbulk=47u' });
    const fixed = applyFix(text, fixTitled(findingsOf(analyseText(text), 'cap-ripple')[0], 'Make CB'));
    expect(fixed).toMatch(/CB P 0 \{\d+\*\(cbulk\)\}/);
    expectAnswered(text, fixed, 'cap-ripple');
  });
});

describe('series inrush resistor (surge-rating)', () => {
  it('inserts the smallest E12 value (IEC 60063) that keeps the surge within IFSM, keeping the netlist valid', () => {
    const text = bridge({ rs: '1', diode: 'vrrm=600V ifav=1A ifsm=30A tjmax=150C rthja=80' });
    const found = findingsOf(analyseText(text), 'surge-rating');
    expect(found.length).toBeGreaterThan(0);
    const fix = fixTitled(found[0], 'Insert RINRUSH');
    const ohm = Number(/RINRUSH ([\d.]+) Ω/.exec(fix.title)![1]);
    // An E12 value of IEC 60063 (the decade table times a power of ten).
    expect(E12.some((m) => [0.1, 1, 10, 100].some((p) => Math.abs(m * p - ohm) < 1e-9))).toBe(true);
    // Analytic bound (D): the peak cannot exceed Vm/(R_total) and is held to IFSM, so R_total ≥ Vm/30 less the
    // diode drops' share: about 12 Ω in all.
    expect(ohm + 1).toBeGreaterThan(((230 * 1.1 * Math.SQRT2) / 30) * 0.8);
    const fixed = applyFix(text, fix);
    expect(fixed).toContain('VAC L_rin N SIN(0 325 50)');
    expect(fixed).toMatch(/^RINRUSH L_rin L \S+$/m);
    expectAnswered(text, fixed, 'surge-rating');
    // The next lower E12 value would not do: the choice is the smallest.
    const i = E12.findIndex((m) => [0.1, 1, 10, 100].some((p) => Math.abs(m * p - ohm) < 1e-9));
    const lower = i > 0 ? ohm * (E12[i - 1]! / E12[i]!) : ohm * (8.2 / 10);
    const tooSmall = fixed.replace(/^(RINRUSH L_rin L )\S+$/m, `$1${Number(lower.toPrecision(2))}`);
    expect(findingsOf(analyseText(tooSmall), 'surge-rating').length).toBeGreaterThan(0);
  });
});

describe('rate template (missing-rating)', () => {
  it('inserts a rate line with the minimum values the design needs, which then passes every rule', () => {
    const text = bridge({ diode: '', cap: '' });
    const file = analyseText(text);
    const diodeFix = fixTitled(findingsOf(file, 'missing-rating').find((f) => f.message.startsWith('D1')), 'Insert a rate line for DR');
    const capFix = fixTitled(findingsOf(file, 'missing-rating').find((f) => f.message.includes('CB')), 'Insert a rate line for CB');
    // PIV ≈ 354 V / 0.8 = 442 V → 450 V rounded up to two digits (D).
    expect(diodeFix.title).toContain('vrrm=450V');
    const fixed = applyFix(applyFix(text, diodeFix), capFix);
    // The largest RθJA that keeps the junction within the policy, proven by a re-solve (issue 16, item 7).
    expect(fixed).toMatch(/^\*@ rate DR vrrm=450V ifav=\S+ ifsm=\S+ tjmax=150C rthja=\d+$/m);
    expectAnswered(text, fixed, 'missing-rating');
    const after = analyseText(fixed);
    for (const code of ['piv-margin', 'current-rating', 'surge-rating', 'cap-voltage', 'cap-ripple']) expect(findingsOf(after, code)).toEqual([]);
  });
});

describe('reversed device (recognition) through the whole pipeline', () => {
  it('swapping the terminals gives a bridge with no error', () => {
    const good = bridge();
    const text = good.replace('D3 0 A DR', 'D3 A 0 DR');
    const found = findingsOf(analyseText(text), 'reversed-device');
    expect(found).toHaveLength(1);
    const fixed = applyFix(text, found[0]!.fixes![0]!);
    expect(fixed).toBe(good);
    expectAnswered(text, fixed, 'reversed-device');
    expect(analyseText(fixed).rectifiers.map((r) => r.rectifier.kind)).toEqual(['diode-bridge']);
  });
});

describe('fixes that need trial solves are computed when asked for', () => {
  it('does not run a fix trial until the finding\'s fixes are read, then keeps them', async () => {
    const { withLazyFixes } = await import('../../server/src/findings/index');
    let computed = 0;
    const finding = withLazyFixes(
      { uri: 'file:///x.cir', span: { start: 0, end: 1 }, severity: 'warning', code: 'piv-margin', message: 'm' },
      () => {
        computed++;
        return [{ title: 'Use a part that passes', edits: [] }, undefined];
      },
    );
    expect(computed).toBe(0);
    expect(finding.fixes!.map((f) => f.title)).toEqual(['Use a part that passes']);
    expect(finding.fixes).toHaveLength(1);
    expect(computed).toBe(1);
  });
});
