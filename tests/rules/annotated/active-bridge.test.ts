/**
 * controller-undervoltage, controller-overvoltage and mosfet-vds as annotated fixtures, on our active bridge on a 6 V rms
 * (8.5 V crest) winding (tests/rules/fixtures.ts) written out whole. Low-line crest 8.5·0.9 =
 * 7.65 V (D, the default ±10 % line); the blocking voltage is about the high-line crest
 * 8.5·1.1 = 9.35 V (D), the solver gives 9.34 V (tests/rules/other-rules.test.ts).
 */
import { describe, it } from 'vitest';
import { expectAnnotated, withoutAnnotations } from './check';

const fixture = `active bridge for rule tests
*@ rate XC vmin=9V
*@ rate NM vds=11V id=5A tjmax=150C
V1 ac1 ac2 SIN(0 8.5 50)
XC ac1 ac2 g1 g2 g3 g4 SYNCDRV
*^ warning controller-undervoltage: input crest 7.65 V at low-line nominal never reaches the controller XC's vmin 9 V (rated)
M1 out g1 ac1 ac1 NM
*^ warning mosfet-vds: blocking voltage 9.34 V at high-line nominal is 85 % of VDS 11 V; policy allows 80 %
M2 out g2 ac2 ac2 NM
*^ warning mosfet-vds: is 85 % of VDS 11 V
M3 ac1 g3 0 0 NM
*^ warning mosfet-vds: is 85 % of VDS 11 V
M4 ac2 g4 0 0 NM
*^ warning mosfet-vds: is 85 % of VDS 11 V
C1 out 0 2200u
RL out 0 24
.subckt SYNCDRV a b g1 g2 g3 g4
.ends SYNCDRV
.model NM NMOS(rdson=0.02)
.end
`;

describe('controller-undervoltage and mosfet-vds', () => {
  it('warn when the low-line crest never reaches vmin, and on VDS past 80 %', () => {
    expectAnnotated(fixture, ['controller-undervoltage', 'mosfet-vds']);
  });

  it('mosfet-vds is an error past VDS itself (9.34 V > 9 V)', () => {
    const text = withoutAnnotations(fixture).replace('vds=11V', 'vds=9V').replace(/^(M\d .*)$/gm, '$1\n*^ error mosfet-vds: of VDS 9 V');
    expectAnnotated(text, 'mosfet-vds');
  });

  it('both are silent just inside (7.65 V ≥ vmin 7.6 V; 9.34 V ≤ 0.8 × 11.7 V = 9.36 V)', () => {
    expectAnnotated(withoutAnnotations(fixture).replace('vmin=9V', 'vmin=7.6V').replace('vds=11V', 'vds=11.7V'), ['controller-undervoltage', 'mosfet-vds']);
  });
});

describe('controller-overvoltage', () => {
  it('is an error when the high-line crest exceeds the controller\'s vmax (8.5·1.1 = 9.35 V > 9 V, D)', () => {
    const text = withoutAnnotations(fixture).replace('vmin=9V', 'vmin=7.6V vmax=9V').replace('vds=11V', 'vds=11.7V')
      .replace('XC ac1 ac2 g1 g2 g3 g4 SYNCDRV', `XC ac1 ac2 g1 g2 g3 g4 SYNCDRV
*^ error controller-overvoltage: input crest 9.35 V at high-line nominal exceeds the controller XC's rated vmax 9 V`);
    expectAnnotated(text, 'controller-overvoltage');
  });

  it('is silent when vmax holds the crest (9.35 V ≤ 9.4 V), and when no vmax is rated', () => {
    expectAnnotated(withoutAnnotations(fixture).replace('vmin=9V', 'vmin=7.6V vmax=9.4V'), 'controller-overvoltage');
    expectAnnotated(withoutAnnotations(fixture), 'controller-overvoltage');
  });
});
