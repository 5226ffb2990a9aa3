/**
 * Hover, in-process: `hoverInFile` (editor/stress-hover.ts) on an analysed fixture and `hoverAt`
 * (editor/hover.ts) on a bare parse, at the `$0` cursor. The fixtures are netlists of our own
 * invention.
 */
import { describe, expect, it } from 'vitest';
import { parseNetlist } from '../../grammar/src/index';
import { hoverAt } from '../../server/src/editor/hover';
import { hoverInFile } from '../../server/src/editor/stress-hover';
import { formatPercent, formatSi } from '../../server/src/presentation/format';
import { readCursor } from '../helpers/cursor';
import { analyseAt, textOf } from './check';

/** Our 230 V 50 Hz capacitor-input bridge (tests/rules/fixtures.ts), written out with a cursor. */
const bridgeWith = (cursorLine: string) => `230 V bridge (our own)
*@ mains 230V 50Hz
*@ load 20W
*@ rate DR vrrm=600V ifav=1A ifsm=60A tjmax=150C rthja=80
*@ rate CB vrated=450V iripple=1A
VAC L N SIN(0 325 50)
RS L A 10
${cursorLine}
D2 N P DR
D3 0 A DR
D4 0 N DR
CB P 0 47u
.model DR D(IS=5n N=1.8 RS=0.05)
.end
`;

/** The hover at the cursor of an analysed fixture, with the text its span covers. */
function hoverOf(fixture: string) {
  const { file, text, offset } = analyseAt(fixture);
  const found = hoverInFile(file, offset);
  return { file, text, found, under: found ? textOf(text, found.span) : undefined };
}

describe('hover on a rectifier device', () => {
  it('describes the card and gives the stress table, each worst value with its corner, and the mains caution', () => {
    const { file, found, under } = hoverOf(bridgeWith('D$01 A P DR'));
    expect(under).toBe('D1');
    const markdown = found!.markdown;
    expect(markdown).toContain('**D1** — diode, anode `A` → cathode `P`, model `DR`');
    expect(markdown).toContain('**diode bridge** (D1, D2, D3, D4)');
    expect(markdown).toContain('**D1** (diode `DR`) — from the first AC line to DC+');
    // The table repeats the device's own worst figures; "used" is worst/rating, worked out here.
    const figures = file.rectifiers[0]!.devices[0]!.figures;
    const worst = figures.worst!;
    const piv = worst.pivV!;
    const nominalPivV = figures.corners.find((c) => c.corner === 'nominal-line nominal')!.figures!.pivV;
    expect(markdown).toContain(`| PIV | ${formatSi(nominalPivV, 'V')} | ${formatSi(piv.value, 'V')} | ${piv.corner} | VRRM 600 V | ${formatPercent(piv.value / 600)} |`);
    expect(markdown).toContain(`| ${formatPercent(worst.iavgA!.value / 1)} |`);
    // Bridge PIV ≈ Vm less the drops (REFERENCES.md §1, "Vm − VD with real diodes"): within 3 % below the
    // high-line crest 230·1.1·√2 = 357.8 V (D), at the high-line corner.
    expect(piv.corner).toMatch(/^high-line/);
    expect(piv.value).toBeLessThan(230 * 1.1 * Math.SQRT2);
    expect(piv.value).toBeGreaterThan(230 * 1.1 * Math.SQRT2 * 0.97);
    expect(markdown).toContain('Ratings from VRRM: rate directive for model DR');
    // Above the 50 V a.c. extra-low-voltage band (IEC 61140, REFERENCES.md §6): the caution is shown.
    expect(markdown).toContain('⚠ Mains-connected circuits can kill.');
  });

  it('answers with the cursor just after the name (the end of a name counts)', () => {
    expect(hoverOf(bridgeWith('D1$0 A P DR')).under).toBe('D1');
  });

  it('has no caution for an extra-low-voltage bridge (12 V rms ≤ 50 V, IEC 61140)', () => {
    const { found, under } = hoverOf(`12 V bridge (our own)
*@ rate DG vrrm=100V ifav=1A ifsm=30A tjmax=150C rthja=80
V1 a b SIN(0 17 50)
D1 a p DG
D$02 b p DG
D3 n a DG
D4 n b DG
C1 p n 2200u
R1 p n 24
.model DG D(IS=2.5n N=1.75 RS=0.04)
`);
    expect(under).toBe('D2');
    expect(found!.markdown).toContain('| PIV |');
    expect(found!.markdown).not.toContain('⚠');
  });

  const activeBridge = (cursorAt: string) => `active bridge (our own, tests/rules/fixtures.ts)
*@ rate NM vds=11.7V id=5A tjmax=150C
V1 ac1 ac2 SIN(0 8.5 50)
XC ac1 ac2 g1 g2 g3 g4 SYNCDRV
M1 out g1 ac1 ac1 NM
M2 out g2 ac2 ac2 NM
M3 ac1 g3 0 0 NM
M4 ac2 g4 0 0 NM
C1 out 0 2200u
RL out 0 24
.subckt SYNCDRV a b g1 g2 g3 g4
.ends SYNCDRV
.model NM NMOS(rdson=0.02)
`.replace(cursorAt.replace('$0', ''), () => cursorAt);

  it('on a MOSFET of an active bridge, rates its blocking voltage against VDS', () => {
    const { file, found, under } = hoverOf(activeBridge('M$03 ac1 g3 0 0 NM'));
    expect(under).toBe('M3');
    expect(found!.markdown).toContain('**M3** — MOSFET, drain `ac1` gate `g3` source `0`, model `NM`');
    // The blocking voltage is about the high-line crest 8.5·1.1 = 9.35 V (D); the solver gives 9.34 V (tests/rules/other-rules.test.ts).
    const piv = file.rectifiers[0]!.devices.find((d) => d.ref.name === 'M3')!.figures.worst!.pivV!;
    expect(piv.value).toBeCloseTo(8.5 * 1.1, 1);
    expect(found!.markdown).toMatch(new RegExp(`\\| PIV \\| [\\d.]+ V \\| ${formatSi(piv.value, 'V')} \\| ${piv.corner} \\| VDS 11\\.7 V \\| ${formatPercent(piv.value / 11.7)} \\|`));
    expect(found!.markdown).toContain('ID 5 A');
  });

  it('FIXME: with no resistance in the switch-on path, the summary shows an inrush set by the integrator, not by the circuit', () => {
    // Expected: no inrush figure, with a note that nothing in the netlist limits it, or one bounded by the path's
    // resistance. Actual: the body diodes (no RS) take the switch-on current and the peak comes out near 7e8 A
    // ("inrush 729 MA"); a diode bridge with RS=0 and no source resistance gives about 1.6e9 A.
    const { file, found } = hoverOf(activeBridge('M$01 out g1 ac1 ac1 NM'));
    expect(file.rectifiers[0]!.solution.worst.inrushPeakA!.value).toBeGreaterThan(1e6);
    expect(found!.markdown).toMatch(/inrush [\d.]+ [MG]A/);
  });

  it('on the X card of a packaged bridge, gives a section for every device inside', () => {
    const { found, under } = hoverOf(`packaged bridge (our own)
*@ mains 230V 50Hz
*@ load 20W
.subckt BR4 ac1 ac2 p n
D1 ac1 p DR
D2 ac2 p DR
D3 n ac1 DR
D4 n ac2 DR
.ends BR4
VAC L N SIN(0 325 50)
RS L A 10
X$0B A N P 0 BR4
CB P 0 47u
.model DR D(IS=5n N=1.8 RS=0.05)
`);
    expect(under).toBe('XB');
    expect(found!.markdown).toContain('**XB** — instance of `BR4`');
    expect(found!.markdown.match(/\| PIV \|/g)).toHaveLength(4);
    expect(found!.markdown).toContain('VRRM not rated');
  });
});

describe('hover on names', () => {
  it('on a node lists the cards it connects, once each', () => {
    const { found, under } = hoverOf(bridgeWith('D1 $0A P DR'));
    expect(under).toBe('A');
    // A joins RS, D1 and D3 in the fixture.
    expect(found!.markdown).toBe('**node A** — 3 connections: RS, D1, D3');
  });

  it('on ground says so', () => {
    const { found } = hoverOf(bridgeWith('D1 A P DR').replace('D3 0 A DR', 'D3 $00 A DR'));
    expect(found!.markdown).toBe('**node 0** (ground) — 3 connections: D3, D4, CB');
  });

  it('on a model use shows its type, parameters and users', () => {
    const { found, under } = hoverOf(bridgeWith('D1 A P D$0R'));
    expect(under).toBe('DR');
    expect(found!.markdown).toBe('**model DR** (D)\n\n`IS=5n` `N=1.8` `RS=0.05`\n\nUsed by D1, D2, D3, D4.');
  });

  it('on a model the file does not define says it may come from an include', () => {
    const { found } = hoverOf('t\nD1 a b D$0X\n');
    expect(found!.markdown).toBe('**model DX**\n\nNot defined in this file (it may come from an include).\n\nUsed by D1.');
  });

  it('escapes Markdown in netlist names', () => {
    const { found } = hoverOf('t\nR1 v_o$0ut 0 1k\nR2 v_out 0 2k\n');
    expect(found!.markdown).toBe('**node v\\_out** — 2 connections: R1, R2');
  });

  it('is empty on a comment and past the end of the cards', () => {
    expect(hoverOf('t\n* a comm$0ent\nR1 a 0 1k\n').found).toBeUndefined();
    expect(hoverOf('t\nR1 a 0 1k\n\n$0').found).toBeUndefined();
  });
});

describe('hover on a bare parse (no analysis)', () => {
  it('describes a passive card and a source by their own words', () => {
    const { text, offset } = readCursor('t\nR$02 out 0 4k7\nV1 out 0 SIN(0 10 50)\n');
    const netlist = parseNetlist(text);
    expect(hoverAt(netlist, offset)?.markdown).toBe('**R2** — resistor 4k7 between `out` and `0`');
    expect(hoverAt(netlist, text.indexOf('V1'))?.markdown).toBe('**V1** — voltage source SIN(0 10 50)');
  });
});
