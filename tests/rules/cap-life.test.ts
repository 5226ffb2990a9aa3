/**
 * Capacitor stress: the ripple loss I_rms²·ESR, the core temperature and the life estimate by the
 * 10 °C rule (ratings/capacitor-life.ts, equivalent/capacitor-stress.ts), and `cap-life` against the
 * life a file asks for. The 230 V 50 Hz, 20 W bridge of ./fixtures (our own scenario).
 */
import { describe, expect, it } from 'vitest';
import { capacitorLifeHours, RATED_RIPPLE_RISE_K } from '../../server/src/ratings/index';
import { analyseText, checkAnnotated, findingsOf } from './check';
import { bridge } from './fixtures';

const CAP = 'vrated=450V iripple=1A esr=0.5ohm endurance=2000h@105C';

describe('the 10 °C rule', () => {
  it('doubles the life for every 10 °C cooler (REFERENCES.md §4: 2000 h at 105 °C → 8000 h at 85 °C, 32 000 h at 65 °C)', () => {
    expect(capacitorLifeHours({ hours: 2000, atC: 105 }, 95)).toBeCloseTo(4000, 9);
    expect(capacitorLifeHours({ hours: 2000, atC: 105 }, 85)).toBeCloseTo(8000, 9);
    expect(capacitorLifeHours({ hours: 2000, atC: 105 }, 65)).toBeCloseTo(32000, 9);
  });
});

describe('capacitor stress', () => {
  const file = analyseText(bridge({ cap: CAP }));
  const analysis = file.rectifiers[0]!;
  const stress = analysis.capacitors.find((c) => c.name === 'CB')!.stress!;

  it('ripple loss is I_rms²·ESR, with I_rms from the rectifier current by hand', () => {
    // With a nearly constant load current, I_C,rms = √(I_rect,rms² − Idc²) (REFERENCES.md §2, D); the
    // bridge output current is D1's plus D2's, which never overlap, so I_rect,rms² = I_D1,rms² + I_D2,rms².
    for (const corner of analysis.solution.corners) {
      const [d1, d2] = [corner.devices[0]!, corner.devices[1]!];
      const idc = corner.outputPowerW! / corner.vOutAvgV!;
      const irms = Math.sqrt(d1.irmsA! ** 2 + d2.irmsA! ** 2 - idc ** 2);
      const at = stress.corners.find((c) => c.corner === corner.name)!;
      // 1 %: the load current's own ripple (a constant-power load on a few volts of ripple) is left out by the formula.
      expect(Math.abs(at.lossW! / (irms * irms * 0.5) - 1)).toBeLessThan(0.01);
    }
    expect(stress.esr).toEqual({ ohm: 0.5, from: 'rating' });
  });

  it('estimates the life at the hottest core: Ta + 5 K·(I/I_rated)², L = 2000 h·2^((105 − T)/10)', () => {
    const hot = stress.corners.find((c) => c.corner === stress.lifeH!.corner)!;
    const ambientC = analysis.solution.corners.find((c) => c.name === hot.corner)!.ambientC;
    expect(stress.riseModel).toBe('rated-ripple');
    const coreC = ambientC + RATED_RIPPLE_RISE_K * (hot.irmsA / 1) ** 2; // common practice (capacitor-life.ts)
    expect(hot.coreC).toBeCloseTo(coreC, 9);
    expect(stress.lifeH!.value).toBeCloseTo(2000 * 2 ** ((105 - coreC) / 10), 6); // REFERENCES.md §4 (C)
    // The hot ambient at low line: the largest ripple current of a constant-power load (DESIGN.md §5).
    expect(stress.lifeH!.corner).toBe('low-line hot');
    for (const c of stress.corners) expect(c.lifeH!).toBeGreaterThanOrEqual(stress.lifeH!.value);
  });

  it('heats the core by loss × rth when the part states its thermal resistance', () => {
    const withRth = analyseText(bridge({ cap: `${CAP} rth=40` })).rectifiers[0]!.capacitors[0]!.stress!;
    expect(withRth.riseModel).toBe('thermal-resistance');
    for (const c of withRth.corners) {
      const ambientC = analysis.solution.corners.find((k) => k.name === c.corner)!.ambientC;
      expect(c.coreC).toBeCloseTo(ambientC + c.lossW! * 40, 9); // Tcore = Ta + P·Rθ (D)
    }
  });
});

describe('cap-life', () => {
  it('warns when the estimate is below the life the file asks for, with the numbers', () => {
    const estimate = analyseText(bridge({ cap: CAP })).rectifiers[0]!.capacitors[0]!.stress!.lifeH!.value;
    // About 2000·2^((105 − 50.2)/10) ≈ 89 000 h at 50 °C (REFERENCES.md §4, C).
    expect(estimate).toBeGreaterThan(80000);
    expect(estimate).toBeLessThan(92000);
    const file = checkAnnotated(bridge({ cap: CAP, head: '*@ derate life=100000h', notes: { CB: '*^ warning cap-life: at low-line hot is below the 100000 h (derate directive): core' } }), ['cap-life']);
    expect(findingsOf(file, 'cap-life')[0]!.message).toContain('rated 2000 h at 105 °C, doubling per 10 °C cooler');
  });

  it('is silent when the estimate reaches the life asked for, and when no life is asked', () => {
    checkAnnotated(bridge({ cap: CAP, head: '*@ derate life=80000h' }), ['cap-life']);
    checkAnnotated(bridge({ cap: CAP }), ['cap-life']);
  });

  it('says so when a life is asked but the capacitor has no endurance rating', () => {
    checkAnnotated(bridge({ cap: 'vrated=450V iripple=1A', head: '*@ derate life=50000h', notes: { CB: '*^ info cap-life: no rated endurance' } }), ['cap-life']);
  });
});
