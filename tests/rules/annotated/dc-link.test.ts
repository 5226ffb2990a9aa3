/**
 * `cap-voltage` on a series DC-link string and `unbalanced-string`, as annotated fixtures: the
 * input of a 480 V three-phase drive of our own invention (mains-connected: a circuit that can
 * kill), two 400 V electrolytics in series (tests/rules/dc-link-strings.test.ts checks the numbers).
 */
import { describe, it } from 'vitest';
import { expectAnnotated, withoutAnnotations } from './check';

/** The drive up to its DC link: mains, load, ratings, the three phases and the six diodes. */
const DRIVE = `*@ mains 480V 60Hz phases=3 tol=-10%,+10%
*@ load 5000W
*@ rate C1 vrated=400V tol=-20%,+20%
*@ rate C2 vrated=400V tol=-20%,+20%
VA pa 0 SIN(0 391.9 60 0 0 0)
VB pb 0 SIN(0 391.9 60 0 0 -120)
VC pc 0 SIN(0 391.9 60 0 0 120)
D1 pa dcp DR
D2 pb dcp DR
D3 pc dcp DR
D4 dcn pa DR
D5 dcn pb DR
D6 dcn pc DR
`;

const fixture = `480 V drive DC link, two capacitors in series
${DRIVE}C1 dcp mid 1000u
*^ error cap-voltage: stage 1 of 2 of the series string C1, C2, at its worst tolerance vertex: 60 % at switch-on
C2 mid dcn 1000u
*^ error cap-voltage: stage 2 of 2 of the series string C1, C2, at its worst tolerance vertex: 60 % at switch-on
RB1 dcp mid 47k
RB2 mid dcn 47k
.model DR D
.end
`;

const bare = `480 V drive DC link, two capacitors in series with no balancing resistors
${DRIVE}C1 dcp mid 1000u
*^ error cap-voltage: 60 % by capacitance
*^ warning unbalanced-string: leakage currents, which are not modelled
C2 mid dcn 1000u
*^ error cap-voltage: 60 % by capacitance
*^ warning unbalanced-string: leakage currents, which are not modelled
.model DR D
.end
`;

describe('a series DC-link string', () => {
  it('errs on each capacitor with its own share', () => {
    expectAnnotated(fixture, ['cap-voltage', 'unbalanced-string']);
  });

  it('warns on each capacitor without a balancing resistor, and still checks its voltage by capacitance', () => {
    expectAnnotated(bare, ['cap-voltage', 'unbalanced-string']);
  });

  it('is silent with 500 V parts of no stated tolerance (about 370 V each, 74 % of the rating)', () => {
    const rated = withoutAnnotations(fixture).replaceAll('vrated=400V tol=-20%,+20%', 'vrated=500V');
    expectAnnotated(rated, ['cap-voltage', 'unbalanced-string']);
  });
});
