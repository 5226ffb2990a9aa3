/**
 * Code actions, in-process: the quick fixes of the findings in the editor's range, as the language
 * server gathers them (lsp/editor-features.ts: `findingsInRange` of findings/finding.ts, then each
 * finding's fixes). The range is the `$0` cursor, or `$0`…`$1` for a selection. A fix is applied
 * and the text re-analysed to see it answer its finding. The fixtures are netlists of our own invention.
 */
import { describe, expect, it } from 'vitest';
import { findingsInRange, type Fix } from '../../server/src/findings/index';
import { applyEdits } from '../../server/src/rules/fixes/text-edits';
import { analyseAt, analyseFile, URI, type AtCursor } from './check';

/** The fixes offered for the cursor or selection, each with the code of the finding it answers. */
function actionsAt(at: AtCursor): { code: string; fix: Fix }[] {
  const start = Math.min(at.offset, at.second ?? at.offset);
  const end = Math.max(at.offset, at.second ?? at.offset);
  return findingsInRange(at.file.findings, at.file.uri, start, end)
    .flatMap((index) => (at.file.findings[index]!.fixes ?? []).map((fix) => ({ code: at.file.findings[index]!.code, fix })));
}

/** A 230 V bridge of our own (tests/rules/fixtures.ts), with the lines to mark written in. */
const bridge = (lines: { diode?: string; d3?: string; cb?: string; capRate?: string }) => `230 V bridge (our own)
*@ mains 230V 50Hz
*@ load 20W
*@ rate DR ${lines.diode ?? 'vrrm=600V ifav=1A ifsm=60A tjmax=150C rthja=80'}
*@ rate CB ${lines.capRate ?? 'vrated=450V iripple=1A'}
VAC L N SIN(0 325 50)
RS L A 10
D1 A P DR
D2 N P DR
${lines.d3 ?? 'D3 0 A DR'}
D4 0 N DR
${lines.cb ?? 'CB P 0 47u'}
.model DR D(IS=5n N=1.8 RS=0.05)
.end
`;

describe('code actions', () => {
  it('on a reversed diode offers to reverse it, and the fix gives the bridge as intended', () => {
    const at = analyseAt(bridge({ d3: 'D$03 A 0 DR' }));
    const actions = actionsAt(at);
    expect(actions.map((a) => [a.code, a.fix.title])).toEqual([['reversed-device', 'Reverse D3 (swap A and 0)']]);
    const fixed = applyEdits(at.text, actions[0]!.fix.edits);
    expect(fixed).toBe(bridge({}));
    const after = analyseFile(fixed);
    expect(after.findings.filter((f) => f.code === 'reversed-device')).toEqual([]);
    expect(after.rectifiers.map((r) => r.rectifier.kind)).toEqual(['diode-bridge']);
  });

  it('on an over-stressed capacitor offers the next voltage class, which answers the finding', () => {
    // 353 V peak against 400 V is 88 %, above the default 80 % (tests/rules/other-rules.test.ts); 450 V holds it.
    const at = analyseAt(bridge({ capRate: 'vrated=400V iripple=1A', cb: 'C$0B P 0 47u' }));
    const actions = actionsAt(at).filter((a) => a.code === 'cap-voltage');
    expect(actions.map((a) => a.fix.title)).toEqual([expect.stringMatching(/^Raise CB to the 450 V class/)]);
    expect(actions[0]!.fix.edits.every((e) => e.uri === URI)).toBe(true);
    const fixed = applyEdits(at.text, actions[0]!.fix.edits);
    expect(fixed).toContain('*@ rate CB vrated=450V iripple=1A');
    expect(analyseFile(fixed).findings.filter((f) => f.code === 'cap-voltage')).toEqual([]);
  });

  it('over a selection offers the fixes of every finding it touches, and only those', () => {
    // VRRM 440 V: PIV ≈ 354 V is 80 % of it, past the default 80 % (tests/rules/stress-rules.test.ts), on all four diodes.
    const stressed = { diode: 'vrrm=440V ifav=1A ifsm=60A tjmax=150C rthja=80', capRate: 'vrated=400V iripple=1A' };
    const wide = analyseAt(bridge({ ...stressed, d3: '$0D3 0 A DR', cb: 'CB$1 P 0 47u' }));
    const found = actionsAt(wide);
    // D3, D4 and CB lie in the selection; D1 and D2 (piv-margin too) do not.
    expect(found.filter((a) => a.code === 'piv-margin').map((a) => a.fix.title)).toEqual([expect.stringMatching(/ for D1, D2, D3, D4$/), expect.stringMatching(/ for D1, D2, D3, D4$/)]);
    expect(found.filter((a) => a.code === 'cap-voltage').map((a) => a.fix.title)).toEqual([expect.stringMatching(/^Raise CB to the 450 V class/)]);
    const narrow = analyseAt(bridge({ ...stressed, d3: '$0D3 0 A DR$1' }));
    expect(actionsAt(narrow).map((a) => a.code)).toEqual(['piv-margin']);
  });

  it('offers nothing where no finding is, or for a finding without a fix', () => {
    expect(actionsAt(analyseAt(bridge({}).replace('D2 N P DR', 'D2 N P D$0R')))).toEqual([]);
    // The mains caution (hazardous-voltage) sits on VAC and has no fix.
    const onSource = analyseAt(bridge({}).replace('VAC L N', 'V$0AC L N'));
    expect(onSource.file.findings.some((f) => f.code === 'hazardous-voltage')).toBe(true);
    expect(actionsAt(onSource)).toEqual([]);
  });

  it('does not offer a fix for a finding in another file', () => {
    const lib = 'file:///w/lib.cir';
    const at = analyseAt('t\n.include "lib.cir"\nR1 a 0 1k$0\n', { extra: { [lib]: 'D1 a b\n' } });
    expect(at.file.findings.some((f) => f.uri === lib)).toBe(true);
    // The included file's syntax error spans offsets 0… of lib.cir; the root's own range must not pick it up.
    expect(findingsInRange(at.file.findings, URI, 0, at.text.length).every((i) => at.file.findings[i]!.uri === URI)).toBe(true);
  });
});
