/**
 * No silent pass (issue 16, item 4): a mistyped subcircuit or model name, an AC source with diodes
 * that form no recognised rectifier, and a rectifier the solver cannot solve each give a finding
 * (an error where nothing was checked), and the did-you-mean fix restores the analysis. Fixtures
 * are scenarios of our own invention.
 */
import { describe, expect, it } from 'vitest';
import { unsolvedRectifierFindings } from '../../server/src/analysis/unsolved-rectifier';
import { analyseText, applyFix, errorsOf, findingsOf, fixTitled } from './check';
import { bridge } from './fixtures';

/** The 230 V bridge of the rule fixtures, packaged in a four-pin subcircuit BRIDGE. */
function packaged(subcktOnCard: string): string {
  return [
    'packaged 230 V bridge',
    '*@ mains 230V 50Hz',
    '*@ load 20W',
    '*@ rate DR vrrm=600V ifav=1A ifsm=60A tjmax=150C rthja=80',
    '*@ rate CB vrated=450V iripple=1A',
    'VAC L N SIN(0 325 50)',
    'RS L A 10',
    `XBR A N P 0 ${subcktOnCard}`,
    'CB P 0 47u',
    '.subckt BRIDGE ac1 ac2 pos neg',
    'D1 ac1 pos DR',
    'D2 ac2 pos DR',
    'D3 neg ac1 DR',
    'D4 neg ac2 DR',
    '.ends BRIDGE',
    '.model DR D(IS=5n N=1.8 RS=0.05)',
    '.end',
    '',
  ].join('\n');
}

/** Every corner solved: each has an output figure. */
function solvedEverywhere(file: ReturnType<typeof analyseText>): boolean {
  return file.rectifiers.length > 0 && file.rectifiers.every((r) => r.solution.corners.every((c) => c.vOutAvgV !== undefined));
}

describe('a mistyped subcircuit name in a bridge instance', () => {
  const good = packaged('BRIDGE');
  const typo = packaged('BRIDGX');

  it('is an error with a preferred fix naming the intended subcircuit, and nothing is recognised meanwhile', () => {
    const file = analyseText(typo);
    const [finding] = findingsOf(file, 'unknown-subckt');
    expect(finding).toMatchObject({ severity: 'error' });
    expect(finding!.message).toContain("did you mean 'BRIDGE'?");
    expect(finding!.message).toContain('nothing inside it is analysed');
    expect(file.rectifiers).toEqual([]);
    const fix = fixTitled(finding, "Change 'BRIDGX' to 'BRIDGE'");
    expect(fix.preferred).toBe(true);
  });

  it('once fixed, the bridge is recognised and solved and the finding is gone', () => {
    const fixed = applyFix(typo, fixTitled(findingsOf(analyseText(typo), 'unknown-subckt')[0], 'Change '));
    expect(fixed).toBe(good);
    const file = analyseText(fixed);
    expect(findingsOf(file, 'unknown-subckt')).toEqual([]);
    expect(file.rectifiers.map((r) => r.rectifier.kind)).toEqual(['diode-bridge']);
    expect(solvedEverywhere(file)).toBe(true);
    expect(errorsOf(file)).toEqual([]);
  });
});

describe('a mistyped model name on a bridge diode', () => {
  const good = bridge();
  // D2 names RD (two letters swapped) where the file defines DR.
  const typo = good.replace('D2 N P DR', 'D2 N P RD');

  it('is an error with a did-you-mean fix; missing-rating offers the rename, never invented ratings for RD', () => {
    const file = analyseText(typo);
    const [unknown] = findingsOf(file, 'unknown-model');
    expect(unknown).toMatchObject({ severity: 'error' });
    expect(unknown!.message).toContain("did you mean 'DR'?");
    expect(fixTitled(unknown, "Change 'RD' to 'DR'").preferred).toBe(true);
    // The device lost its ratings with its model: missing-rating says so and its only fix is the rename.
    const missing = findingsOf(file, 'missing-rating').find((f) => f.message.startsWith('D2'));
    expect(missing!.message).toContain("its model 'RD' is not defined");
    expect(missing!.fixes!.map((f) => f.title)).toEqual(["Change 'RD' to 'DR'"]);
    expect(missing!.fixes!.some((f) => f.edits.some((e) => e.newText.includes('*@ rate')))).toBe(false);
  });

  it('once fixed, the bridge is solved with D2 rated again and both findings are gone', () => {
    const fixed = applyFix(typo, fixTitled(findingsOf(analyseText(typo), 'unknown-model')[0], 'Change '));
    expect(fixed).toBe(good);
    const file = analyseText(fixed);
    expect(findingsOf(file, 'unknown-model')).toEqual([]);
    expect(findingsOf(file, 'missing-rating')).toEqual([]);
    expect(solvedEverywhere(file)).toBe(true);
    const d2 = file.rectifiers[0]!.devices.find((d) => d.ref.name === 'D2')!;
    expect(d2.ratings.ratings.kind === 'diode' && d2.ratings.ratings.vrrmV?.value).toBe(600);
  });

  it('with no defined model near the name, missing-rating keeps its template (not preferred)', () => {
    const far = good.replace('D2 N P DR', 'D2 N P QQQQQ');
    const file = analyseText(far);
    expect(findingsOf(file, 'unknown-model')[0]!.fixes).toBeUndefined();
    const missing = findingsOf(file, 'missing-rating').find((f) => f.message.startsWith('D2'));
    const template = fixTitled(missing, 'Insert a rate line for D2');
    expect(template.preferred).toBeUndefined();
  });
});

describe('an AC source and diodes in no recognised rectifier', () => {
  // A two-diode clamp behind a resistor: diodes and a SIN source, but nothing that rectifies into a filter.
  const clamp = 'clamp\nV1 a 0 SIN(0 10 50)\nR1 a b 1k\nD1 b 0 DC\nD2 0 b DC\n.model DC D\n.end\n';

  it('is a no-rectifier error on the first device, naming the devices and the source', () => {
    const file = analyseText(clamp);
    expect(file.rectifiers).toEqual([]);
    const found = findingsOf(file, 'no-rectifier');
    expect(found).toHaveLength(1);
    expect(found[0]).toMatchObject({ severity: 'error' });
    expect(clamp.slice(found[0]!.span.start, found[0]!.span.end)).toBe('D1');
    expect(found[0]!.message).toContain('(D1, D2) although V1 is an AC source: nothing in this file was checked');
  });

  it('a wrong node name in one bridge card that leaves nothing recognisable is caught the same way', () => {
    // Every diode's cathode on a node of its own: no pattern fits.
    const broken = bridge().replace('D1 A P DR', 'D1 A P1 DR').replace('D2 N P DR', 'D2 N P2 DR').replace('D3 0 A DR', 'D3 0 A3 DR').replace('D4 0 N DR', 'D4 0 N4 DR');
    const file = analyseText(broken);
    expect(file.rectifiers).toEqual([]);
    expect(findingsOf(file, 'no-rectifier')).toHaveLength(1);
  });

  it('is not raised when a rectifier is recognised, without an AC source, or when allowed', () => {
    expect(findingsOf(analyseText(bridge()), 'no-rectifier')).toEqual([]);
    expect(findingsOf(analyseText(clamp.replace('SIN(0 10 50)', 'DC 5')), 'no-rectifier')).toEqual([]);
    // An allow line in the leading block covers the whole file (findings/allow.ts).
    expect(findingsOf(analyseText(clamp.replace('clamp\n', 'clamp\n*@ allow no-rectifier\n')), 'no-rectifier')).toEqual([]);
  });
});

describe('a recognised rectifier the solver cannot solve', () => {
  // A 0.5 A constant-current load and no filter capacitor: the solver cannot build the network.
  const text = bridge({ cap: '', load: '0.5A' }).replace('CB P 0 47u\n', '');

  it('is an unsolved-rectifier error quoting the solver\'s reason, not only a note', () => {
    const file = analyseText(text);
    expect(file.rectifiers).toHaveLength(1);
    const found = findingsOf(file, 'unsolved-rectifier');
    expect(found).toHaveLength(1);
    expect(found[0]).toMatchObject({ severity: 'error' });
    expect(found[0]!.message).toContain('could not be solved at any corner (no filter capacitor and no load resistance');
    expect(found[0]!.message).toContain('none of its parts was checked');
  });

  it('is a warning naming the corners when only some were solved', () => {
    const analysis = analyseText(bridge()).rectifiers[0]!;
    const corners = analysis.solution.corners.map((c, k) => (k === 0 ? { ...c, vOutAvgV: undefined, notes: ['source frequency is not positive'] } : c));
    const [finding] = unsolvedRectifierFindings({ ...analysis, solution: { ...analysis.solution, corners } });
    expect(finding).toMatchObject({ severity: 'warning', code: 'unsolved-rectifier' });
    expect(finding!.message).toContain(`could not be solved at ${corners[0]!.name} (source frequency is not positive): its worst case is taken over the other corners only`);
  });

  it('is silent for a rectifier solved at every corner', () => {
    const file = analyseText(bridge());
    expect(solvedEverywhere(file)).toBe(true);
    expect(findingsOf(file, 'unsolved-rectifier')).toEqual([]);
  });
});
