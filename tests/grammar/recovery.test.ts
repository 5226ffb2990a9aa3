import { describe, expect, it } from 'vitest';
import { parseNetlist } from '../../grammar/src/index';
import { isAnnotationLine, readAnnotations } from '../helpers/annotations';

/** Parses a fixture and compares its findings with the caret annotations written in it. */
function checkFindings(fixture: string): void {
  const netlist = parseNetlist(fixture);
  const actual = netlist.diagnostics
    .filter((d) => !isAnnotationLine(fixture, d.span.start))
    .map((d) => ({ start: d.span.start, end: d.span.end, severity: d.severity, code: d.code, message: d.message }));
  const expected = readAnnotations(fixture);
  expect(actual.map(({ message: _m, ...rest }) => rest)).toEqual(expected.map(({ fragment: _f, ...rest }) => rest));
  expected.forEach((e, i) => expect(actual[i]!.message).toContain(e.fragment));
}

describe('error recovery', () => {
  it('one broken card in the middle costs one diagnostic on exactly the broken token', () => {
    checkFindings(`recovery
R1 a b 10
R2 a b 10 )
*         ^ error syntax-error: unexpected ')'
R3 b 0 30
`);
    const n = parseNetlist('t\nR1 a b 10\nR2 a b 10 )\nR3 b 0 30\n');
    expect(n.cards.filter((c) => c.kind === 'passive').map((c) => c.kind === 'passive' && c.name.text)).toEqual(['R1', 'R2', 'R3']);
  });

  it('an unclosed parenthesis is reported where the card ends, and the next card still parses', () => {
    checkFindings(`t
V1 a 0 SIN(0 325 50
*                ^^ error syntax-error: card ends too early
R1 a 0 1k
`);
  });

  it('an unclosed brace is reported on the brace', () => {
    checkFindings(`t
R1 a 0 {2*3
*      ^^^^ error syntax-error: unclosed '{'
R2 a 0 1
`);
  });

  it('a bad expression is reported on the offending character', () => {
    checkFindings(`t
R1 a 0 {2*#}
*         ^ error syntax-error: unexpected '#'
R2 a 0 {sqrt(2, 3)}
*       ^^^^ error syntax-error: takes 1 argument
`);
  });

  it('missing parts of an element are reported with the card syntax', () => {
    checkFindings(`t
D4 0 ac2
*    ^^^ error syntax-error: Dname anode cathode model
M1 d g s NCH
*        ^^^ error syntax-error: drain, gate, source, bulk
`);
  });

  it('RKM values get a warning that names the value assumed', () => {
    checkFindings(`t
R2 out 0 4k7
*        ^^^ warning value-notation: read as 4700
`);
  });

  it('a card that starts with a stray symbol is reported and skipped', () => {
    checkFindings(`t
  = R1 a b 1
* ^ error syntax-error: a card starts with
R2 a b 1
`);
  });

  it('never throws on any prefix of a fixture (truncated at every line and every character)', () => {
    const fixture = `Truncation fixture
*@ mains 230V 50Hz tol=-15%,+10%
*@ rate DMAIN vrrm=600V ifsm=30A@10ms vf=0.93V@1A,0.78V@0.1A
.param r0=50 rl={2*r0}
V1 ac1 ac2 SIN(0 325 50)
.subckt BR a b p n
D1 a p DMAIN
D2 b p DMAIN
D3 n a DMAIN
D4 n b DMAIN
.ends BR
X1 ac1 ac2 out 0 BR
C1 out 0 100u
+ ic=0
R1 out 0 {rl}
.model DMAIN D(IS=1n N=1.8 RS=0.05)
.end
`;
    for (let cut = 0; cut <= fixture.length; cut++) {
      const netlist = parseNetlist(fixture.slice(0, cut));
      for (const d of netlist.diagnostics) {
        expect(d.span.start).toBeGreaterThanOrEqual(0);
        expect(d.span.end).toBeLessThanOrEqual(cut);
      }
    }
  });
});
