/**
 * Regression (issue 14): the setting `rectilens.derating.reverseVoltage` is documented as the
 * largest fraction of "VRRM or VDS", yet it never reached `mosfet-vds`. The fixture is the active
 * bridge of fixtures.ts: blocking voltage ≈ the high-line crest 8.5·1.1 = 9.35 V (D), the solver
 * gives 9.34 V.
 */
import { describe, it } from 'vitest';
import { checkAnnotated } from './check';
import { activeBridge } from './fixtures';

const rated = { fet: 'vds=11.7V id=5A tjmax=150C', controller: 'vmin=7.6V' };

describe('the reverse-voltage setting reaches mosfet-vds', () => {
  it('warns on an active bridge at 9.34 V against VDS 11.7 V with the setting at 0.5 (9.34 V > 0.5 × 11.7 V = 5.85 V)', () => {
    const vds = '*^ warning mosfet-vds: blocking voltage 9.34 V at high-line nominal is 80 % of VDS 11.7 V; policy allows 50 % (setting derating.vr)';
    checkAnnotated(activeBridge(rated, { M1: vds, M2: vds, M3: vds, M4: vds }), ['mosfet-vds'], { settings: { derating: { reverseVoltage: 0.5 } } });
  });

  it('still yields to a `*@ derate vds=` directive in the file (9.34 V ≤ 0.85 × 11.7 V = 9.95 V)', () => {
    const text = activeBridge(rated).replace('\n', '\n*@ derate vds=85%\n');
    checkAnnotated(text, ['mosfet-vds'], { settings: { derating: { reverseVoltage: 0.5 } } });
  });

  it('is silent with the setting left unset (9.34 V ≤ the default 0.8 × 11.7 V = 9.36 V)', () => {
    checkAnnotated(activeBridge(rated), ['mosfet-vds'], { settings: { derating: { reverseVoltage: undefined } } });
  });
});
