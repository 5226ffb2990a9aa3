import { describe, expect, it } from 'vitest';
import {
  DIODE_CATALOG, SOURCE_1N400X_LADDER, SOURCE_1N5817_LADDER, SOURCE_1N5820_LADDER, findCatalogDiode, isCheckGrade,
} from '../../server/src/ratings/index';
import type { CatalogDiode } from '../../server/src/ratings/index';

const names = (series: string): string[] => DIODE_CATALOG.filter((d) => d.series === series).map((d) => d.name);
const vrrm = (series: string): number[] => DIODE_CATALOG.filter((d) => d.series === series).map((d) => d.ratings.vrrmV!.value);

describe('JEDEC generic diode catalog', () => {
  it('1N4001–1N4007 follow the 1 A ladder', () => {
    // REFERENCES.md §7 (C): Wikipedia, "1N400x rectifier diodes" — 50, 100, 200, 400, 600, 800, 1000 V at 1 A.
    expect(names('1n4001')).toEqual(['1N4001', '1N4002', '1N4003', '1N4004', '1N4005', '1N4006', '1N4007']);
    expect(vrrm('1n4001')).toEqual([50, 100, 200, 400, 600, 800, 1000]);
    for (const d of DIODE_CATALOG.filter((e) => e.series === '1n4001')) expect(d.ratings.ifavA?.value).toBe(1);
  });

  it('1N5400–1N5408 follow the 3 A ladder', () => {
    // REFERENCES.md §7 (C): same source — 50, 100, 200, 300, 400, 500, 600, 800, 1000 V at 3 A.
    expect(names('1n5400')).toEqual(['1N5400', '1N5401', '1N5402', '1N5403', '1N5404', '1N5405', '1N5406', '1N5407', '1N5408']);
    expect(vrrm('1n5400')).toEqual([50, 100, 200, 300, 400, 500, 600, 800, 1000]);
    for (const d of DIODE_CATALOG.filter((e) => e.series === '1n5400')) expect(d.ratings.ifavA?.value).toBe(3);
  });

  it('1N5817–1N5819 are 20/30/40 V Schottky at 1 A, flagged as weakly sourced', () => {
    // REFERENCES.md §7: 20/30/40 V at 1 A, only a non-authoritative page besides makers' sheets.
    expect(names('1n5817')).toEqual(['1N5817', '1N5818', '1N5819']);
    expect(vrrm('1n5817')).toEqual([20, 30, 40]);
    for (const d of DIODE_CATALOG.filter((e) => e.series === '1n5817')) {
      expect(d.ratings.technology?.value).toBe('schottky');
      expect(d.ratings.vrrmV?.origin).toMatchObject({ kind: 'catalog', source: SOURCE_1N5817_LADDER, confidence: 'weak' });
    }
  });

  it('the 3 A Schottky series says its ladder is from memory', () => {
    // No source in REFERENCES.md: 1N5820/21/22 = 20/30/40 V at 3 A is from memory.
    expect(vrrm('1n5820')).toEqual([20, 30, 40]);
    for (const d of DIODE_CATALOG.filter((e) => e.series === '1n5820')) {
      expect(d.ratings.vrrmV?.origin).toMatchObject({ source: SOURCE_1N5820_LADDER, confidence: 'from-memory' });
      expect(SOURCE_1N5820_LADDER).toMatch(/from memory/);
      expect(isCheckGrade(d.ratings.vrrmV!.origin)).toBe(false);
    }
  });

  it('cites the REFERENCES.md §7 source on every sourced silicon entry', () => {
    for (const d of DIODE_CATALOG.filter((e) => e.series === '1n4001' || e.series === '1n5400')) {
      expect(d.ratings.vrrmV?.origin).toEqual({ kind: 'catalog', partName: d.name, source: SOURCE_1N400X_LADDER, confidence: 'confirmed' });
      expect(isCheckGrade(d.ratings.vrrmV!.origin)).toBe(true);
    }
    expect(SOURCE_1N400X_LADDER).toMatch(/1N400x rectifier diodes/);
  });

  it('never presents IFSM, its duration, Tjmax or VF as check values', () => {
    // REFERENCES.md §7: no non-manufacturer source exists for IFSM or VF.
    for (const d of DIODE_CATALOG) {
      for (const rated of [d.ratings.ifsmA, d.ratings.ifsmDurationS, d.ratings.tjmaxC, d.ratings.vfPoints]) {
        if (!rated) continue;
        expect(isCheckGrade(rated.origin)).toBe(false);
        expect(rated.origin.kind === 'catalog' && ['from-memory', 'chosen'].includes(rated.origin.confidence)).toBe(true);
      }
      expect(d.ratings.ifsmA?.origin).toMatchObject({ source: expect.stringMatching(/typical class value, from memory, not a check value/) });
      expect(d.forwardModel?.note).toMatch(/our own choosing/);
    }
  });

  it('finds entries by model name, any case, with or without a leading D', () => {
    expect(findCatalogDiode('1n4007')?.ratings.vrrmV?.value).toBe(1000);
    expect(findCatalogDiode('D1N4004')?.name).toBe('1N4004');
    expect(findCatalogDiode('DMAIN')).toBeUndefined();
    expect(findCatalogDiode('1N400')).toBeUndefined();
  });
});

describe('catalog forward models', () => {
  // Shockley equation with series resistance (Berkeley SPICE3 diode model; REFERENCES.md §8, C),
  // Vt = kT/q from the SI-exact constants, written here independently of the code under test.
  const vtAt25 = (1.380649e-23 * 298.15) / 1.602176634e-19;
  const vAt = (d: CatalogDiode, iA: number): number => {
    const m = d.forwardModel!;
    return m.n * vtAt25 * Math.log(1 + iA / m.isA) + m.rsOhm * iA;
  };

  it('reproduces the chosen class points within 1 mV', () => {
    for (const d of DIODE_CATALOG) {
      expect(d.forwardModel, d.name).toBeDefined();
      for (const p of d.ratings.vfPoints!.value) expect(Math.abs(vAt(d, p.iA) - p.vV), `${d.name} @ ${p.iA} A`).toBeLessThan(1e-3);
    }
  });

  it('gives physical parameters and the temperature law of the technology', () => {
    for (const d of DIODE_CATALOG) {
      const m = d.forwardModel!;
      // Emission coefficient between 1 and 2.5 and RS ≥ 0 for rectifiers (common practice).
      expect(m.n).toBeGreaterThanOrEqual(1);
      expect(m.n).toBeLessThanOrEqual(2.5);
      expect(m.rsOhm).toBeGreaterThanOrEqual(0);
      // EG, XTI: 1.11 eV / 3 pn silicon, 0.69 eV / 2 Schottky (SPICE3 manual diode table; REFERENCES.md §8, C).
      const schottky = d.ratings.technology?.value === 'schottky';
      expect([m.egEv, m.xti]).toEqual(schottky ? [0.69, 2] : [1.11, 3]);
    }
  });

  it('a Schottky drops less than a silicon part of the same current class at rated current', () => {
    // Common practice: the reason to choose a Schottky at low voltage.
    expect(vAt(findCatalogDiode('1N5819')!, 1)).toBeLessThan(vAt(findCatalogDiode('1N4001')!, 1) - 0.2);
    expect(vAt(findCatalogDiode('1N5822')!, 3)).toBeLessThan(vAt(findCatalogDiode('1N5401')!, 3) - 0.2);
  });
});
