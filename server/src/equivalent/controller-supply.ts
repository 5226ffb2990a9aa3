/**
 * A controller's quiescent current as the solver's straight line Iq(v) = i0 + v/R
 * (solve/equivalent-circuit.ts `ControllerSupply`), from its `iq` rating: the line through two
 * rated points (`iq=40uA@8V,300uA@60V`), or one constant current (`iq=40uA`).
 */
import type { RatingsOf } from '../ratings/index';
import type { ControllerSupply } from '../solve/index';

/**
 * The line through the two points; where it would cross zero above 0 V (a current rising faster
 * than in proportion), the intercept is held at zero so the current never goes negative and
 * the line through the origin and the higher point is used instead.
 */
export function controllerSupplyOf(ratings: RatingsOf<'controller'> | undefined): ControllerSupply | undefined {
  const points = ratings?.iqPoints?.value;
  if (points && points.length === 2) {
    const [a, b] = [...points].sort((p, q) => p.vV - q.vV) as [{ vV: number; iA: number }, { vV: number; iA: number }];
    const slope = (b.iA - a.iA) / (b.vV - a.vV);
    const i0 = a.iA - slope * a.vV;
    if (i0 < 0) return { iA: 0, ohm: b.vV / b.iA };
    return slope > 0 ? { iA: i0, ohm: 1 / slope } : { iA: Math.max(b.iA, 0) };
  }
  const iq = ratings?.iqA?.value;
  return iq !== undefined && iq > 0 ? { iA: iq } : undefined;
}

/** The quiescent current the line gives at a supply voltage. */
export function quiescentCurrentA(supply: ControllerSupply, vV: number): number {
  return supply.iA + (supply.ohm !== undefined && supply.ohm > 0 ? vV / supply.ohm : 0);
}
