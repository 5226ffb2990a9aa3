/**
 * The device stress rules on a 230 V 50 Hz bridge: piv-margin, current-rating, surge-rating,
 * junction-temp, thermal-runaway. Each trips at the expected card and severity, and a fixture
 * just inside the limit does not. Limits are chosen around the solver's figures for this circuit;
 * the figures themselves are checked against analytic values where one exists.
 */
import { describe, expect, it } from 'vitest';
import { analyseText, checkAnnotated, findingsOf } from './check';
import { bridge, underDiodes } from './fixtures';

/** Crest of 230 V rms at +10 % line: 230·1.1·√2 = 357.8 V (D). A bridge diode's PIV is about Vm (REFERENCES.md §1, C). */
const HIGH_LINE_CREST_V = 230 * 1.1 * Math.SQRT2;

describe('piv-margin', () => {
  it('warns when PIV passes the default 80 % of VRRM, with the numbers and the policy origin', () => {
    const file = checkAnnotated(bridge({
      diode: 'vrrm=440V ifav=1A ifsm=60A tjmax=150C rthja=80',
      notes: underDiodes('*^ warning piv-margin: at high-line hot is 80 % of VRRM 440 V; policy allows 80 % (default: IPC-9592B'),
    }), ['piv-margin']);
    const pivV = Number(/PIV ([\d.]+) V/.exec(findingsOf(file, 'piv-margin')[0]!.message)![1]);
    // Bridge PIV ≈ Vm less a little (REFERENCES.md §1: "Vm − VD with real diodes"); within 3 % of the crest.
    expect(pivV).toBeLessThan(HIGH_LINE_CREST_V);
    expect(pivV).toBeGreaterThan(HIGH_LINE_CREST_V * 0.97);
  });

  it('is an error when PIV exceeds VRRM itself', () => {
    checkAnnotated(bridge({
      diode: 'vrrm=350V ifav=1A ifsm=60A tjmax=150C rthja=80',
      notes: underDiodes('*^ error piv-margin: of VRRM 350 V'),
    }), ['piv-margin']);
  });

  it('is silent just inside the limit (PIV ≈ 354 V against 0.8 × 450 V = 360 V)', () => {
    checkAnnotated(bridge({ diode: 'vrrm=450V ifav=1A ifsm=60A tjmax=150C rthja=80' }), ['piv-margin']);
  });

  it('follows a derate directive before settings, and settings before the default', () => {
    const rate = 'vrrm=450V ifav=1A ifsm=60A tjmax=150C rthja=80';
    checkAnnotated(bridge({ diode: rate, head: '*@ derate vr=75%', notes: underDiodes('*^ warning piv-margin: policy allows 75 % (derate directive)') }), ['piv-margin']);
    checkAnnotated(bridge({ diode: rate, notes: underDiodes('*^ warning piv-margin: policy allows 70 % (setting derating.vr)') }), ['piv-margin'],
      { settings: { derating: { reverseVoltage: 0.7 } } });
    // The directive wins over the setting.
    checkAnnotated(bridge({ diode: rate, head: '*@ derate vr=90%' }), ['piv-margin'], { settings: { derating: { reverseVoltage: 0.7 } } });
  });
});

describe('current-rating', () => {
  // 20 W from a ~300 V bus: Idc ≈ 0.07 A, each diode carries Idc/2 ≈ 0.035 A on average (REFERENCES.md §1: I_D,avg = Idc/2).
  it('warns above 70 % of IF(AV) and errs above IF(AV)', () => {
    checkAnnotated(bridge({ diode: 'vrrm=600V ifav=0.05A ifsm=60A tjmax=150C rthja=80', notes: underDiodes('*^ warning current-rating: of IF(AV) 0.05 A; policy allows 70 %') }), ['current-rating']);
    checkAnnotated(bridge({ diode: 'vrrm=600V ifav=0.03A ifsm=60A tjmax=150C rthja=80', notes: underDiodes('*^ error current-rating: of IF(AV) 0.03 A') }), ['current-rating']);
  });

  it('is silent just inside (0.0355 A against 0.7 × 0.051 A = 0.0357 A)', () => {
    checkAnnotated(bridge({ diode: 'vrrm=600V ifav=0.051A ifsm=60A tjmax=150C rthja=80' }), ['current-rating']);
  });

  it('states Iavg close to half the load current', () => {
    const file = analyseText(bridge({ diode: 'vrrm=600V ifav=0.03A ifsm=60A tjmax=150C rthja=80' }));
    const iavgA = Number(/average current ([\d.]+) A/.exec(findingsOf(file, 'current-rating')[0]!.message)![1]);
    const vAvg = file.rectifiers[0]!.solution.worst.vOutAvgV!.value;
    // Analytic: I_D,avg = Idc/2 = P/(2·Vdc) at the corner of lowest Vdc (REFERENCES.md §1, D).
    expect(iavgA).toBeCloseTo(20 / (2 * vAvg), 3);
  });
});

describe('surge-rating', () => {
  // With RS = 10 Ω the switch-on peak at high line is about 357.8/10 = 36 A less the drops (D): the solver gives 35.2 A.
  // Both crests are switched on (solve/inrush-cases.ts), so each pair takes its own surge and all four diodes are judged.
  it('warns when the peak passes IFSM with the I²t inside its rating', () => {
    const file = checkAnnotated(bridge({
      diode: 'vrrm=600V ifav=1A ifsm=34A tjmax=150C rthja=80',
      notes: underDiodes('*^ warning surge-rating: peak 35.2 A against IFSM 34 A (8.3 ms)'),
    }), ['surge-rating']);
    // The rating's I²t: 34²·0.0083/2 = 4.80 A²s (REFERENCES.md §5, D).
    expect((34 * 34 * 0.0083) / 2).toBeCloseTo(4.8, 2);
    expect(findingsOf(file, 'surge-rating')[0]!.message).toContain('the rated 4.8 A²s');
  });

  it('is an error when the I²t itself exceeds the rating’s I²t (IFSM²·8.3 ms/2)', () => {
    // I²t of each diode is about 0.289 A²s; 8 A gives 8²·0.0083/2 = 0.266 A²s (D).
    checkAnnotated(bridge({
      diode: 'vrrm=600V ifav=1A ifsm=8A tjmax=150C rthja=80',
      notes: underDiodes('*^ error surge-rating: I²t 0.289 A²s against the rated 0.266 A²s'),
    }), ['surge-rating']);
  });

  it('is silent just inside (35.2 A against 36 A), and takes a 10 ms rating as stated', () => {
    checkAnnotated(bridge({ diode: 'vrrm=600V ifav=1A ifsm=36A tjmax=150C rthja=80' }), ['surge-rating']);
    checkAnnotated(bridge({ diode: 'vrrm=600V ifav=1A ifsm=36A@10ms tjmax=150C rthja=80' }), ['surge-rating']);
  });
});

describe('junction-temp', () => {
  // Tj ≈ 50 °C + 0.03 W·80 K/W ≈ 52.4 °C at the hot corner; the default limit is min(125, Tjmax − 20) (IPC-9592B, from memory).
  it('warns above Tjmax − 20 °C and errs above Tjmax', () => {
    checkAnnotated(bridge({ diode: 'vrrm=600V ifav=1A ifsm=60A tjmax=72C rthja=80', notes: underDiodes('*^ warning junction-temp: Tjmax 72 °C; policy allows 52 °C') }), ['junction-temp']);
    checkAnnotated(bridge({ diode: 'vrrm=600V ifav=1A ifsm=60A tjmax=52C rthja=80', notes: underDiodes('*^ error junction-temp: at low-line hot (loss') }), ['junction-temp']);
  });

  it('is silent just inside (52.4 °C against 53 °C)', () => {
    checkAnnotated(bridge({ diode: 'vrrm=600V ifav=1A ifsm=60A tjmax=73C rthja=80' }), ['junction-temp']);
  });

  it('an absolute derate tj= limit applies', () => {
    checkAnnotated(bridge({ head: '*@ derate tj=52C', notes: underDiodes('*^ warning junction-temp: policy allows 52 °C (derate directive)') }), ['junction-temp']);
  });
});

describe('thermal-runaway', () => {
  it('is an error when the junction does not settle (Tj would pass 400 °C)', () => {
    checkAnnotated(bridge({ diode: 'vrrm=600V ifav=1A ifsm=60A tjmax=150C rthja=20000', notes: underDiodes('*^ error thermal-runaway: do not settle at') }), ['thermal-runaway']);
  });

  it('is silent when it settles, however hot', () => {
    checkAnnotated(bridge({ diode: 'vrrm=600V ifav=1A ifsm=60A tjmax=150C rthja=5000' }), ['thermal-runaway']);
  });
});
