import { describe, expect, it } from 'vitest';
import { ALUMINIUM_ELECTROLYTIC_VOLTAGE_CLASSES_V, nextCapacitorVoltageClass } from '../../server/src/ratings/index';

describe('aluminium electrolytic voltage classes (common practice)', () => {
  it('is the usual ladder, strictly increasing', () => {
    expect(ALUMINIUM_ELECTROLYTIC_VOLTAGE_CLASSES_V).toEqual([6.3, 10, 16, 25, 35, 50, 63, 100, 160, 200, 250, 350, 400, 450]);
    const list = ALUMINIUM_ELECTROLYTIC_VOLTAGE_CLASSES_V;
    for (let k = 1; k < list.length; k++) expect(list[k]).toBeGreaterThan(list[k - 1]!);
  });

  it('picks the next class at or above the requirement', () => {
    // 230 V +10 % crest 357.8 V at 80 % (RAC/SRC benign) needs 447 V → 450 V class (D).
    expect(nextCapacitorVoltageClass((230 * 1.1 * Math.SQRT2) / 0.8)).toBe(450);
    // 12 V +10 % crest 18.7 V at 80 % needs 23.3 V → 25 V (D).
    expect(nextCapacitorVoltageClass((12 * 1.1 * Math.SQRT2) / 0.8)).toBe(25);
    // A requirement exactly on a class, after floating-point division, stays on it.
    expect(nextCapacitorVoltageClass(280 / 0.8)).toBe(350);
    expect(nextCapacitorVoltageClass(6.3)).toBe(6.3);
    expect(nextCapacitorVoltageClass(1)).toBe(6.3);
  });

  it('has no class above 450 V or for nonsense', () => {
    expect(nextCapacitorVoltageClass(451)).toBeUndefined();
    expect(nextCapacitorVoltageClass(Number.NaN)).toBeUndefined();
  });
});
