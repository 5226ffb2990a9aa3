/**
 * Surge arithmetic for half-sine pulses (REFERENCES.md §5): the I²t of a half-sine and the
 * equal-I²t conversion of an IFSM rating to another pulse length.
 */

/** ∫(Ip·sin(πt/tp))² dt over one half-sine = Ip²·tp/2 (REFERENCES.md §5; D). */
export function halfSineI2tA2s(peakA: number, durationS: number): number {
  return (peakA * peakA * durationS) / 2;
}

/**
 * The half-sine peak with the same I²t over `pulseS` as IFSM over `ratedS`:
 * I_eq = IFSM·√(t_rated/t) (REFERENCES.md §5; D). 8.3 ms → 10 ms gives ×0.911. Valid for pulses
 * near the rated length; for several cycles the per-cycle surge curve governs and I²t
 * extrapolation is not conservative (REFERENCES.md §5, practice, M).
 */
export function equivalentSurgeA(ifsmA: number, ratedS: number, pulseS: number): number {
  return ifsmA * Math.sqrt(ratedS / pulseS);
}
