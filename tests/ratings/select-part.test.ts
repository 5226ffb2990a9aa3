import { describe, expect, it } from 'vitest';
import {
  DEFAULT_DERATING, DIODE_CATALOG, SCHOTTKY_MAX_VRRM_V, checkDiodeRequirement, diodePartsFromFiles, diodeRequirementFromStress,
  findCatalogDiode, selectPassingPart, validatePartsFile,
} from '../../server/src/ratings/index';
import type { DiodePart } from '../../server/src/ratings/index';

// Bridge PIV = crest of the line at +10 % (REFERENCES.md §1: PIV per bridge diode = Vm, C).
const pivAt = (vrms: number): number => vrms * 1.1 * Math.SQRT2;

function fileParts(parts: unknown[]): DiodePart[] {
  const { file, problems } = validatePartsFile({ version: 1, parts }, 'file:///w/p.rectilens-parts.json');
  expect(problems).toEqual([]);
  return diodePartsFromFiles([file]);
}

describe('selectPassingPart', () => {
  it('picks a ≥ 600 V silicon part for a 230 V +10 % bridge at 80 % derating', () => {
    const pivV = pivAt(230);
    expect(pivV).toBeCloseTo(357.8, 1); // 230·1.1·√2 (D)
    const requirement = diodeRequirementFromStress({ pivV }, DEFAULT_DERATING);
    expect(requirement.minVrrmV).toBeCloseTo(447.2, 1); // 357.8 / 0.8 (D)
    const part = selectPassingPart(requirement, DIODE_CATALOG);
    // 1 A class first; its ladder steps 400 → 600 V (REFERENCES.md §7, C).
    expect(part?.name).toBe('1N4005');
    expect(part?.ratings.vrrmV?.value).toBeGreaterThanOrEqual(600);
    expect(part?.ratings.technology?.value).toBe('silicon');
  });

  it('never offers a silicon Schottky there, even one claiming enough voltage', () => {
    const requirement = diodeRequirementFromStress({ pivV: pivAt(230) }, DEFAULT_DERATING);
    const claimed = fileParts([{ name: 'SK600', kind: 'diode', technology: 'schottky', vrrmV: 600, ifavA: 1, cost: 0.01 }]);
    const onlySchottky = [...DIODE_CATALOG.filter((d) => d.ratings.technology?.value === 'schottky'), ...claimed];
    expect(selectPassingPart(requirement, onlySchottky)).toBeUndefined();
    expect(checkDiodeRequirement(claimed[0]!, requirement)).toEqual([
      `a silicon Schottky is not offered above ${SCHOTTKY_MAX_VRRM_V} V reverse (common practice)`,
    ]);
    expect(selectPassingPart(requirement, [...DIODE_CATALOG, ...claimed])?.ratings.technology?.value).toBe('silicon');
  });

  it('offers a Schottky at low voltage when the designer keeps to Schottky', () => {
    // 12 V +10 % bridge: PIV 18.7 V, needs 23.3 V at 80 % (D) → 30 V step of the 1N5817 ladder.
    const requirement = { ...diodeRequirementFromStress({ pivV: pivAt(12) }, DEFAULT_DERATING), technologies: ['schottky'] as const };
    expect(selectPassingPart(requirement, DIODE_CATALOG)?.name).toBe('1N5818');
  });

  it('moves to the 3 A class when the average current needs it', () => {
    // 1.2 A average at 70 % needs IF(AV) ≥ 1.71 A (D): the 1 A class fails, the 3 A series takes over at 500 V.
    const requirement = diodeRequirementFromStress({ pivV: pivAt(230), iavgA: 1.2 }, DEFAULT_DERATING);
    expect(selectPassingPart(requirement, DIODE_CATALOG)?.name).toBe('1N5405');
  });

  it('holds a half-sine pulse longer than the rated one to its I²t (equal I²t over the pulse length)', () => {
    // The catalog IFSM values are typical class values from memory; the logic is what is tested.
    const part = findCatalogDiode('1N4005')!;
    const ifsm10msA = 30 * Math.sqrt(0.0083 / 0.01); // 27.3 A (REFERENCES.md §5, D)
    expect(checkDiodeRequirement(part, { surge: { peakA: ifsm10msA - 0.1, durationS: 0.01 } })).toEqual([]);
    expect(checkDiodeRequirement(part, { surge: { peakA: ifsm10msA + 0.1, durationS: 0.01 } })[0]).toMatch(/^IFSM \(peak and I²t\)/);
    const requirement = diodeRequirementFromStress({ pivV: pivAt(230), surge: { peakA: 60, durationS: 0.01 } }, DEFAULT_DERATING);
    expect(selectPassingPart(requirement, DIODE_CATALOG)?.name).toBe('1N5405');
  });

  it('refuses a part that does not state a rating the requirement needs', () => {
    const [bare] = fileParts([{ name: 'DBARE', kind: 'diode', vrrmV: 1000 }]);
    expect(checkDiodeRequirement(bare!, { minVrrmV: 100, minIfavA: 0.5 })).toEqual(['no IF(AV) rating']);
    expect(selectPassingPart({ minVrrmV: 100, minIfavA: 0.5 }, [bare!])).toBeUndefined();
  });

  it('prefers the cheapest when every passing part states a cost', () => {
    const parts = fileParts([
      { name: 'DA', kind: 'diode', technology: 'silicon', vrrmV: 600, ifavA: 1, cost: 0.05 },
      { name: 'DB', kind: 'diode', technology: 'silicon', vrrmV: 1000, ifavA: 3, cost: 0.03 },
    ]);
    expect(selectPassingPart({ minVrrmV: 447 }, parts)?.name).toBe('DB');
    // With a part without cost among the passing ones, the rating order decides.
    expect(selectPassingPart({ minVrrmV: 447 }, [...parts, findCatalogDiode('1N4007')!])?.name).toBe('DA');
  });

  it('returns undefined when nothing passes', () => {
    expect(selectPassingPart({ minVrrmV: 1200 }, DIODE_CATALOG)).toBeUndefined();
  });
});
