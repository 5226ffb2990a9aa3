import { describe, expect, it } from 'vitest';
import { equivalentSurgeA, halfSineI2tA2s } from '../../server/src/ratings/index';

describe('half-sine surge arithmetic (REFERENCES.md §5)', () => {
  it('I²t of a half-sine is Ip²·tp/2', () => {
    // REFERENCES.md §5 (D): 30 A over 8.3 ms → 3.735 A²s; 200 A over 10 ms → 200 A²s.
    expect(halfSineI2tA2s(30, 0.0083)).toBeCloseTo(3.735, 3);
    expect(halfSineI2tA2s(200, 0.01)).toBeCloseTo(200, 9);
    // Independent check: midpoint-rule integral of (Ip·sin(πt/tp))² (D).
    const steps = 20000;
    let sum = 0;
    for (let k = 0; k < steps; k++) sum += (200 * Math.sin((Math.PI * (k + 0.5)) / steps)) ** 2 * (0.0083 / steps);
    expect(halfSineI2tA2s(200, 0.0083)).toBeCloseTo(sum, 6);
  });

  it('converts an 8.3 ms rating to 10 ms at equal I²t: ×0.911', () => {
    // REFERENCES.md §5 (D): I_eq = IFSM·√(t_rated/t).
    expect(equivalentSurgeA(1, 0.0083, 0.01)).toBeCloseTo(0.911, 3);
    expect(halfSineI2tA2s(equivalentSurgeA(30, 0.0083, 0.01), 0.01)).toBeCloseTo(halfSineI2tA2s(30, 0.0083), 9);
  });
});
