/**
 * Capacitor stress arithmetic: the ripple loss, the core's rise above the ambient, and the life
 * estimate by the 10 °C rule.
 *
 * - Loss: P = I_rms²·ESR (Joule heating of the equivalent series resistance; D). Leakage-current
 *   heating is left out: it is small beside the ripple loss in a mains filter (common practice).
 * - Core rise: P·Rθ with the part's core-to-ambient thermal resistance (`rth=`) when given. Without
 *   it, the rated ripple current is taken to heat the core by `RATED_RIPPLE_RISE_K` at rated
 *   conditions, so ΔT = ΔT_rated·(I/I_rated)² (the loss scales as I² at a fixed ESR). Without
 *   either, the core is taken at the ambient and the estimate says so.
 * - Life: L = L0·2^((T0 − T)/10), the rated endurance L0 at T0 doubling for every 10 °C cooler
 *   (REFERENCES.md §4: the 10 °C rule, C). T is the core temperature. Taking T0 as the core
 *   temperature of the rating ignores the rise the rated ripple caused during the endurance test,
 *   which errs on the short side (conservative). The rule is an extrapolation; it is applied as is,
 *   without a ceiling, and is not a guarantee.
 */
import type { CapacitorEndurance } from './rating-records';

/**
 * Core rise at the rated ripple current: 5 K. Common practice, from memory: makers state 5–10 K
 * for general-purpose aluminium electrolytics; the lower end gives the longer (less conservative)
 * life, so a part with an `rth=` rating should state it.
 */
export const RATED_RIPPLE_RISE_K = 5;

/** How the core's rise above the ambient was found. */
export type CoreRiseModel = 'thermal-resistance' | 'rated-ripple' | 'none';

/** I_rms²·ESR (D). */
export function rippleLossW(irmsA: number, esrOhm: number): number {
  return irmsA * irmsA * esrOhm;
}

/** The core's rise above the ambient, and the model that gave it (see the file comment). */
export function coreRiseK(irmsA: number, lossW: number | undefined, rthKPerW?: number, ratedRippleA?: number): { riseK: number; model: CoreRiseModel } {
  if (rthKPerW !== undefined && lossW !== undefined) return { riseK: lossW * rthKPerW, model: 'thermal-resistance' };
  if (ratedRippleA !== undefined && ratedRippleA > 0) return { riseK: RATED_RIPPLE_RISE_K * (irmsA / ratedRippleA) ** 2, model: 'rated-ripple' };
  return { riseK: 0, model: 'none' };
}

/** L = L0·2^((T0 − T)/10) at core temperature `coreC` (REFERENCES.md §4, C). */
export function capacitorLifeHours(endurance: CapacitorEndurance, coreC: number): number {
  return endurance.hours * 2 ** ((endurance.atC - coreC) / 10);
}
