/**
 * The one stress verdict (ratings/stress-checks.ts): each stress tripping and just inside, the
 * surge at equal I²t, the junction limit, and part selection agreeing with it — the thresholds
 * the rules, the fixes, part selection and the comparison all use.
 */
import { describe, expect, it } from 'vitest';
import {
  DEFAULT_DERATING, DIODE_CATALOG, checkDiodeRequirement, diodeRequirementFromStress, halfSineSurge, leastPassingRatings,
  passesEveryStress, resolveDeratingPolicy, stressVerdict, stressVerdicts,
  type DiodeRatings, type MosfetRatings, type Rated, type StressInputs,
} from '../../server/src/ratings/index';

const rated = (value: number): Rated<number> => ({ value, origin: { kind: 'default', text: 'test value' } });
const diode: DiodeRatings = { kind: 'diode', vrrmV: rated(600), ifavA: rated(1), ifsmA: rated(30), tjmaxC: rated(150) };
const fet: MosfetRatings = { kind: 'mosfet', vdsV: rated(100), idA: rated(10), tjmaxC: rated(150) };
const worst = (figures: Record<string, number>): StressInputs => ({
  worst: Object.fromEntries(Object.entries(figures).map(([k, value]) => [k, { value }])),
});

describe('ratio stresses: error beyond the rating, warning beyond the policy fraction', () => {
  // Default vr = 80 % (IPC-9592B, from memory): 600 V × 0.8 = 480 V (D).
  it('reverse voltage against VRRM', () => {
    const at = (pivV: number) => stressVerdict('reverse-voltage', worst({ pivV }), diode, DEFAULT_DERATING);
    expect(at(480)).toMatchObject({ status: 'pass', rating: 600, limit: 480, margin: 0 });
    expect(at(481)).toMatchObject({ status: 'warning', margin: -1 });
    expect(at(601)?.status).toBe('error');
  });
  it('VDS, average current and RMS drain current by their own policy keys', () => {
    const policy = resolveDeratingPolicy([], { vds: 0.5, if: 0.5, id: 0.5 }).policy;
    expect(stressVerdict('vds', worst({ pivV: 51 }), fet, policy)?.status).toBe('warning');
    expect(stressVerdict('vds', worst({ pivV: 50 }), fet, policy)?.status).toBe('pass');
    expect(stressVerdict('average-current', worst({ iavgA: 0.51 }), diode, policy)?.status).toBe('warning');
    expect(stressVerdict('drain-current', worst({ irmsA: 11 }), fet, policy)?.status).toBe('error');
    // A diode has no VDS and a MOSFET no VRRM: each is judged on its own reverse rating only.
    expect(stressVerdicts(worst({ pivV: 10 }), fet, policy).map((v) => v.stress)).toEqual(['vds']);
  });
  it('says unrated, never pass, for a stress the part states no rating for', () => {
    const bare: DiodeRatings = { kind: 'diode', vrrmV: rated(600) };
    expect(stressVerdict('average-current', worst({ iavgA: 0.1 }), bare, DEFAULT_DERATING)?.status).toBe('unrated');
    expect(passesEveryStress(worst({ pivV: 100, iavgA: 0.1 }), bare, DEFAULT_DERATING)).toBe(false);
    expect(passesEveryStress({}, diode, DEFAULT_DERATING)).toBe(false);
  });
});

describe('surge: peak against IFSM, I²t against IFSM²·t_rated/2 (REFERENCES.md §5, D)', () => {
  // IFSM 30 A for 8.3 ms: its I²t 30²·0.0083/2 = 3.735 A²s (D).
  const surge = (peakA: number, i2tA2s: number) => stressVerdict('surge', { worst: {}, surge: { figureA: peakA, peakA, i2tA2s, durationS: 0.01 } }, diode, DEFAULT_DERATING)!;
  it('passes with both inside and errs beyond the rated I²t', () => {
    expect(surge(29.9, 3.7)).toMatchObject({ status: 'pass', ratedI2tA2s: 3.735, rating: 30 });
    expect(surge(20, 3.8).status).toBe('error');
  });
  it('warns on a short spike above IFSM whose I²t stays within the rating, and names the peak as binding', () => {
    const v = surge(40, 1);
    expect(v.status).toBe('warning');
    expect(v.surge).toMatchObject({ binding: 'peak', peakShare: 40 / 30 });
    expect(v.surge!.i2tShare).toBeCloseTo(1 / 3.735, 9);
  });
  it('names the I²t as binding when √(I²t share) exceeds the peak share, and its figure is √(2·I²t/t_rated)', () => {
    // 3.0 A²s over 8.3 ms is the half-sine of √(2·3/0.0083) = 26.9 A, above a 25 A peak (D).
    const v = surge(25, 3);
    expect(v.surge!.binding).toBe('i2t');
    expect(v.figure).toBeCloseTo(Math.sqrt((2 * 3) / 0.0083), 9);
    expect(v.status).toBe('pass');
  });
});

describe('junction temperature', () => {
  // Default: min(125 °C, Tjmax − 20 °C) (IPC-9592B, from memory) = 125 °C for Tjmax 150 °C.
  const at = (tjC: number, extra: Partial<StressInputs> = { rthjaKPerW: 80 }) => stressVerdict('junction-temperature', { ...worst({ tjC }), ...extra }, diode, DEFAULT_DERATING);
  it('warns beyond the policy limit, errs beyond Tjmax', () => {
    expect(at(125)).toMatchObject({ status: 'pass', limit: 125, rating: 150 });
    expect(at(126)?.status).toBe('warning');
    expect(at(151)?.status).toBe('error');
  });
  it('does not judge a junction without a thermal path, and calls a runaway a failure', () => {
    expect(at(200, {})).toBeUndefined();
    const runaway = { worst: { tjC: { value: 140 }, thermalRunaway: true }, rthjaKPerW: 80 };
    expect(stressVerdict('junction-temperature', runaway, diode, DEFAULT_DERATING)?.status).toBe('runaway');
    expect(passesEveryStress(runaway, diode, DEFAULT_DERATING)).toBe(false);
  });
});

describe('the least passing ratings invert the same checks', () => {
  it('a part rated exactly at them passes, and the selection requirement is built from them', () => {
    const stress: StressInputs = { ...worst({ pivV: 357.8, iavgA: 0.42 }), surge: halfSineSurge(20, 0.01) };
    const least = leastPassingRatings(stress, DEFAULT_DERATING);
    expect(least.vrrmV).toBeCloseTo(357.8 / 0.8, 9); // PIV / vr (D)
    expect(least.ifavA).toBeCloseTo(0.42 / 0.7, 9); // Iavg / if (D)
    const exact: DiodeRatings = { kind: 'diode', vrrmV: rated(least.vrrmV!), ifavA: rated(least.ifavA!) };
    expect(stressVerdicts(worst({ pivV: 357.8, iavgA: 0.42 }), exact, DEFAULT_DERATING).map((v) => v.status)).toEqual(['pass', 'pass']);
    expect(diodeRequirementFromStress({ pivV: 357.8, iavgA: 0.42, surge: { peakA: 20, durationS: 0.01 } }, DEFAULT_DERATING))
      .toEqual({ minVrrmV: least.vrrmV, minIfavA: least.ifavA, surge: least.surge });
  });

  it('part selection and the stress verdict agree on every catalog part over a grid of stresses', () => {
    // Grid values chosen off the catalog's round ratings, so no case sits exactly on a threshold.
    for (const pivV of [13.7, 31.3, 157.1, 357.8, 623.9]) {
      for (const iavgA of [0.33, 0.71, 1.93]) {
        for (const peakA of [7.1, 24.9, 61.3]) {
          const stress = { pivV, iavgA, surge: { peakA, durationS: 0.01 } };
          const requirement = diodeRequirementFromStress(stress, DEFAULT_DERATING);
          for (const part of DIODE_CATALOG.filter((p) => p.ratings.technology?.value === 'silicon')) {
            const inputs = { ...worst({ pivV, iavgA }), surge: halfSineSurge(peakA, 0.01) };
            expect(checkDiodeRequirement(part, requirement).length === 0, `${part.name} ${pivV} V ${iavgA} A ${peakA} A`)
              .toBe(passesEveryStress(inputs, part.ratings, DEFAULT_DERATING));
          }
        }
      }
    }
  });
});
