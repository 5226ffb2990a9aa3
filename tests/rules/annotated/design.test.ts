/**
 * The design rules as annotated fixtures: harmonic-limit, missing-rating, mixed-bridge and
 * hazardous-voltage, on 230 V 50 Hz bridges of our own invention written out whole (the rule
 * tests' bridge, tests/rules/fixtures.ts, with the changes each case names).
 */
import { describe, expect, it } from 'vitest';
import { expectAnnotated, withoutAnnotations } from './check';

describe('harmonic-limit (IEC 61000-3-2:2018)', () => {
  // 800 W through 0.5 Ω into 470 µF: a peaky line current well past Class A (tests/rules/other-rules.test.ts).
  const fixture = `230 V bridge at 800 W
*@ mains 230V 50Hz
*@ load 800W
*@ rate DR vrrm=600V ifav=3A ifsm=1000A tjmax=150C
*@ rate CB vrated=450V iripple=10A
VAC L N SIN(0 325 50)
RS L A 0.5
D1 A P DR
*^ warning harmonic-limit: of the IEC 61000-3-2:2018 Class A limit
D2 N P DR
D3 0 A DR
D4 0 N DR
CB P 0 470u
.model DR D(IS=5n N=1.8 RS=0.05)
.end
`;

  it('warns on Class A (Table 1) at the rectifier; Class D does not apply above 600 W', () => {
    const [finding] = expectAnnotated(fixture, 'harmonic-limit');
    // Table 1 (REFERENCES.md §3, C): orders 3…13 have fixed limits, 15…39 have 0.15·15/n A; the message cites the order's own.
    const n = Number(/harmonic (\d+)/.exec(finding!.message)![1]);
    const limitA = n >= 15 ? (0.15 * 15) / n : { 3: 2.3, 5: 1.14, 7: 0.77, 9: 0.4, 11: 0.33, 13: 0.21 }[n]!;
    expect(finding!.message).toContain(`Class A limit ${Number(limitA.toPrecision(3))} A (Table 1)`);
  });

  it('gives Class D (Table 3) as information only between 75 W and 600 W', () => {
    const text = withoutAnnotations(fixture).replace('*@ load 800W', '*@ load 150W').replace('RS L A 0.5', 'RS L A 4.7').replace('CB P 0 470u', 'CB P 0 150u')
      .replace('D1 A P DR', 'D1 A P DR\n*^ info harmonic-limit: Class D limit');
    expectAnnotated(text, 'harmonic-limit');
  });

  it('does not apply at 75 W or less (clause 7)', () => {
    expectAnnotated(withoutAnnotations(fixture).replace('*@ load 800W', '*@ load 70W'), 'harmonic-limit');
  });
});

describe('missing-rating', () => {
  const fixture = `230 V bridge with no ratings
*@ mains 230V 50Hz
*@ load 20W
VAC L N SIN(0 325 50)
RS L A 10
D1 A P DR
*^ warning missing-rating: (model DR) has no vrrm, ifav, ifsm, tjmax
D2 N P DR
*^ warning missing-rating: (model DR) has no vrrm, ifav, ifsm, tjmax
D3 0 A DR
*^ warning missing-rating: (model DR) has no vrrm, ifav, ifsm, tjmax
D4 0 N DR
*^ warning missing-rating: (model DR) has no vrrm, ifav, ifsm, tjmax
CB P 0 47u
*^ warning missing-rating: CB has no vrated, iripple
.model DR D(IS=5n N=1.8 RS=0.05)
.end
`;

  it('warns on each part without its principal rating', () => expectAnnotated(fixture, 'missing-rating'));

  it('only informs when the principal ratings are there and others lack', () => {
    const text = withoutAnnotations(fixture).replace('*@ load 20W', '*@ load 20W\n*@ rate DR vrrm=600V ifav=1A rthja=80\n*@ rate CB vrated=450V')
      .replace(/^(D\d .*)$/gm, '$1\n*^ info missing-rating: has no ifsm, tjmax').replace('CB P 0 47u', 'CB P 0 47u\n*^ info missing-rating: has no iripple');
    expectAnnotated(text, 'missing-rating');
  });

  it('is silent when every checked rating is given', () => {
    const rated = withoutAnnotations(fixture).replace('*@ load 20W', '*@ load 20W\n*@ rate DR vrrm=600V ifav=1A ifsm=60A tjmax=150C rthja=80\n*@ rate CB vrated=450V iripple=1A');
    expectAnnotated(rated, 'missing-rating');
  });
});

describe('mixed-bridge', () => {
  const fixture = `230 V bridge with two diode models
*@ mains 230V 50Hz
*@ load 20W
*@ rate DR vrrm=600V ifav=1A ifsm=60A tjmax=150C rthja=80
*@ rate DQ vrrm=600V ifav=1A ifsm=60A tjmax=150C rthja=80
*@ rate CB vrated=450V iripple=1A
VAC L N SIN(0 325 50)
RS L A 10
D1 A P DR
*^ info mixed-bridge: diodes use 2 models: D1, D2 DR; D3, D4 DQ
D2 N P DR
D3 0 A DQ
D4 0 N DQ
CB P 0 47u
.model DR D(IS=5n N=1.8 RS=0.05)
.model DQ D(IS=5n N=1.8 RS=0.05)
.end
`;

  it('informs at the rectifier when one bridge uses two diode models', () => expectAnnotated(fixture, 'mixed-bridge'));

  it('is silent with one model, whatever the case it is written in', () => {
    expectAnnotated(withoutAnnotations(fixture).replace('D3 0 A DQ', 'D3 0 A dr').replace('D4 0 N DQ', 'D4 0 N DR'), 'mixed-bridge');
  });
});

describe('hazardous-voltage (IEC 61140 ELV band: 50 V a.c. rms, REFERENCES.md §6)', () => {
  it('informs on a mains source, on its card, with the caution', () => {
    const fixture = `230 V bridge
*@ mains 230V 50Hz
*@ load 20W
*@ rate DR vrrm=600V ifav=1A ifsm=60A tjmax=150C rthja=80
*@ rate CB vrated=450V iripple=1A
VAC L N SIN(0 325 50)
*^^ info hazardous-voltage: VAC: 230 V rms a.c. is above extra-low voltage (IEC 61140:2016
RS L A 10
D1 A P DR
D2 N P DR
D3 0 A DR
D4 0 N DR
CB P 0 47u
.model DR D(IS=5n N=1.8 RS=0.05)
.end
`;
    const [finding] = expectAnnotated(fixture, 'hazardous-voltage');
    expect(finding!.message).toContain('Mains-connected circuits can kill');
  });

  it('fires on a standalone source just above the band and not just below it', () => {
    // 72.2 V peak is 72.2/√2 = 51.05 V rms (D), shown to three digits; 70.7 V peak is 49.99 V rms (D).
    const fixture = `standalone source
V1 a 0 SIN(0 72.2 50)
*^ info hazardous-voltage: V1: 51.1 V rms a.c. is above extra-low voltage
R1 a 0 1k
`;
    expectAnnotated(fixture, 'hazardous-voltage');
    expectAnnotated(withoutAnnotations(fixture).replace('72.2', '70.7'), 'hazardous-voltage');
  });
});
