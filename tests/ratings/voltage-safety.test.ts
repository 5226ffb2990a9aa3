import { describe, expect, it } from 'vitest';
import { ELV_AC_RMS_V, ELV_DC_V, ELV_SOURCE, MAINS_CAUTION, isAboveExtraLowVoltage } from '../../server/src/ratings/index';

describe('extra-low voltage band (IEC 61140 via IEV; REFERENCES.md §6, C)', () => {
  it('is 50 V a.c. rms and 120 V ripple-free d.c., cited', () => {
    expect([ELV_AC_RMS_V, ELV_DC_V]).toEqual([50, 120]);
    expect(ELV_SOURCE).toMatch(/IEC 61140/);
  });

  it('classifies a.c. sources', () => {
    expect(isAboveExtraLowVoltage({ acRmsV: 230 })).toBe(true);
    expect(isAboveExtraLowVoltage({ acRmsV: 120 })).toBe(true);
    expect(isAboveExtraLowVoltage({ acRmsV: 50 })).toBe(false); // "≤ 50 V" is inside the band
    expect(isAboveExtraLowVoltage({ acRmsV: 50.1 })).toBe(true);
    expect(isAboveExtraLowVoltage({ acRmsV: 24 })).toBe(false);
  });

  it('classifies ripple-free d.c. against 120 V and its 140 V peak', () => {
    expect(isAboveExtraLowVoltage({ dcV: 120 })).toBe(false);
    expect(isAboveExtraLowVoltage({ dcV: 121 })).toBe(true);
    // 10 % rms ripple is still ripple-free (IEC 61558-1 §3.7.16 via IEV, C); peak 130 ≤ 140 V.
    expect(isAboveExtraLowVoltage({ dcV: 110, dcRippleRmsV: 11, dcPeakV: 130 })).toBe(false);
    expect(isAboveExtraLowVoltage({ dcV: 115, dcRippleRmsV: 11, dcPeakV: 145 })).toBe(true);
  });

  it('holds d.c. with heavy ripple to the a.c. crest 50·√2 = 70.7 V (our conservative reading)', () => {
    // 48 V with 10 V rms sawtooth ripple: crest 48 + √3·10 = 65.3 V (D) — inside.
    expect(isAboveExtraLowVoltage({ dcV: 48, dcRippleRmsV: 10 })).toBe(false);
    // 60 V with 8 V rms: crest 73.9 V (D) — above.
    expect(isAboveExtraLowVoltage({ dcV: 60, dcRippleRmsV: 8 })).toBe(true);
  });

  it('has the caution text of DESIGN.md §1', () => {
    expect(MAINS_CAUTION).toMatch(/estimates only, not a safety or compliance test; follow local codes and licensed practice/);
  });

  it('is false when nothing is known', () => {
    expect(isAboveExtraLowVoltage({})).toBe(false);
  });
});
