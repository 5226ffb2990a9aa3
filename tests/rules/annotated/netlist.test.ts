/**
 * The rules about what the netlist says, as annotated fixtures: implausible-value, shorted-source,
 * bypassed-device and duplicate-name. Fixtures of our own invention; the bridges are the rule
 * tests' 230 V bridge (tests/rules/fixtures.ts) and the 12 V bridge of tests/rules/null-settings.test.ts.
 */
import { describe, expect, it } from 'vitest';
import { analyseText, findingsOf } from '../check';
import { expectAnnotated, withoutAnnotations } from './check';

describe('implausible-value (common practice: passive parts are positive, a SIN amplitude is written positive)', () => {
  const fixture = `values no part has
V1 a 0 SIN(0 -10 50)
*^ warning implausible-value: V1: a negative SIN amplitude (-10 V) is the same wave shifted by half a period
R1 a b -5
*^ warning implausible-value: R1: a negative resistance (-5 Ω) is not a passive part
C1 b 0 -1u
*^ warning implausible-value: C1: a capacitance of -0.000001 F stores no charge
C2 b 0 0
*^ warning implausible-value: C2: a capacitance of 0 F stores no charge
R2 b 0 0
.end
`;
  it('warns on a negative amplitude, a negative resistance, and a capacitance of zero or below; a 0 Ω resistor is a short, not implausible', () => {
    expectAnnotated(fixture, 'implausible-value');
  });
  it('is silent once the values are positive', () => {
    expectAnnotated(withoutAnnotations(fixture).replace('-10', '10').replace('-5', '5').replace('-1u', '1u').replace('C2 b 0 0', 'C2 b 0 1p'), 'implausible-value');
  });
});

describe('shorted-source', () => {
  it('warns on a source with both terminals on one node and on 0 Ω across a source', () => {
    expectAnnotated(`shorted sources
V9 q q 5
*^ warning shorted-source: V9 has both terminals on node q: the source is shorted and drives nothing
R9 q 0 1k
V2 s 0 5
R3 s 0 0
*^ warning shorted-source: R3 is 0 Ω across V2: it shorts the source
.end
`, 'shorted-source');
  });

  const bridge = `12 V bridge
*@ rate DG vrrm=100V ifav=1A ifsm=30A tjmax=150C rthja=80
V1 a b SIN(0 17 50)
D1 a p DG
D2 b p DG
D3 n a DG
D4 n b DG
C1 p n 2200u
R1 p n 24
.model DG D(IS=2.5n N=1.75 RS=0.04)
`;

  it('is an error on 0 Ω across a rectifier output', () => {
    expectAnnotated(bridge.replace('R1 p n 24', `R1 p n 0
*^ error shorted-source: R1 is 0 Ω across the output p/n of the diode bridge: it shorts the output`), 'shorted-source');
  });

  it('warns on a 0 V source across a rectifier input', () => {
    expectAnnotated(`${bridge}VZ a b 0
*^ warning shorted-source: VZ is a 0 V source across a rectifier's AC input: it shorts the input
`, 'shorted-source');
  });

  it('is silent for a 1 mΩ load: any finite value is a circuit the solver takes as it is', () => {
    expectAnnotated(bridge.replace('R1 p n 24', 'R1 p n 1m'), 'shorted-source');
  });
});

describe('bypassed-device', () => {
  const bridgeWith = (extra: string) => `230 V bridge
*@ mains 230V 50Hz
*@ load 20W
*@ rate DR vrrm=600V ifav=1A ifsm=60A tjmax=150C rthja=80
*@ rate CB vrated=450V iripple=1A
VAC L N SIN(0 325 50)
RS L A 10
D1 A P DR
D2 N P DR
D3 0 A DR
D4 0 N DR
CB P 0 47u
${extra}
.model DR D(IS=5n N=1.8 RS=0.05)
.end
`;

  it('by share of the device current PIV/R (Ohm\'s law): a short, a share the figures leave out, a negligible one', () => {
    // PIV ≈ 354 V, I_D,avg ≈ 0.0355 A (tests/rules/stress-rules.test.ts). 1 mΩ passes far more than the peak: error.
    // 10 kΩ passes 354/10k = 35 mA, about all of the average current: warning. 10 MΩ passes 35 µA, 0.1 %: info.
    const [short] = expectAnnotated(bridgeWith(`RB A P 1m
*^ error bypassed-device: RB (0.001 Ω) is across D1 of the diode bridge and conducts both ways`), 'bypassed-device');
    expect(short!.message).toContain('so it shorts D1');
    expect(short!.related?.map((r) => r.message)).toEqual(['D1 is the device it bypasses']);
    expectAnnotated(bridgeWith(`RB N P 10k
*^ warning bypassed-device: RB (10000 Ω) is across D2 of the diode bridge`), 'bypassed-device');
    expectAnnotated(bridgeWith(`RB 0 A 10MEG
*^ info bypassed-device: under 1 % of its average current`), 'bypassed-device');
  });

  it('is silent for a bleeder across the AC input, which bypasses no device', () => {
    expectAnnotated(bridgeWith('RB A N 10k'), 'bypassed-device');
  });

  it('FIXME: with a bypass resistor at each AC node the source is no longer traced', () => {
    // Expected: VAC through RS is the source, as with one bypass resistor, and two bypassed-device warnings.
    // Actual: both series chains stop at a node with two resistors (recognize/source-trace.ts walks only through
    // a node's sole element), so the mains is assumed directly across A/N and the switch-on surge loses RS.
    const file = analyseText(bridgeWith('RB1 A P 10k\nRB2 N P 10k'));
    expect(findingsOf(file, 'bypassed-device').map((f) => f.severity)).toEqual(['warning', 'warning']);
    expect(findingsOf(file, 'assumed-condition').map((f) => f.message)).toEqual([expect.stringContaining('no AC source traced to a/n')]);
  });
});

describe('duplicate-name', () => {
  it('warns on the second card of a name, compared without case, naming the line of the first', () => {
    expectAnnotated(`names used twice
R1 a 0 1k
r1 a 0 2k
*^ warning duplicate-name: r1 is already defined on line 2: a simulator may refuse the file or keep only one of them
.subckt S p n
R1 p n 1k
.ends S
`, 'duplicate-name');
  });

  it('is silent for the copies two instances make of one subcircuit', () => {
    expectAnnotated('names once each\n.subckt S p n\nR1 p n 1k\n.ends S\nX1 a 0 S\nX2 b 0 S\n', 'duplicate-name');
  });
});

describe('unsolved-rectifier', () => {
  const fixture = `bridge with nothing at its output
*@ rate DG vrrm=100V ifav=1A ifsm=30A tjmax=150C rthja=80
V1 a b SIN(0 17 50)
D1 a p DG
*^ error unsolved-rectifier: could not be solved at any corner (no filter capacitor and no load resistance
D2 b p DG
D3 n a DG
D4 n b DG
.model DG D(IS=2.5n N=1.75 RS=0.04)
`;
  it('is an error at the rectifier when no corner could be solved, quoting the solver\'s reason', () => {
    const [finding] = expectAnnotated(fixture, 'unsolved-rectifier');
    expect(finding!.message).toContain('none of its parts was checked');
  });
  it('is silent once the output has its capacitor and load', () => {
    expectAnnotated(withoutAnnotations(fixture).replace('D4 n b DG', 'D4 n b DG\nC1 p n 2200u\nR1 p n 24'), 'unsolved-rectifier');
  });
});
