/**
 * Part tolerance and ageing carried into the equivalent circuit, for the corners' part vertices
 * to pick from (solve/corners.ts says which vertex each figure is worst at):
 *
 * - a filter capacitor's ESR from its rating (`*@ rate C1 esr=`), in series with any resistor
 *   drawn with it; at end of life (or cold) the rated ESR times `esrlife=`, default
 *   {@link DEFAULT_ESR_LIFE_FACTOR};
 * - its capacitance spread: the smallest is nominal × (1 + low tolerance) × (1 + loss over life)
 *   (`tol=-20%,+20% life=-20%`: × 0.8 × 0.8), the largest nominal × (1 + high tolerance);
 * - a diode's forward-voltage spread (`*@ rate D1 vfspread=-0.05V,+0.1V`).
 *
 * Parallel capacitors merge as in the surroundings: capacitances add, ESRs combine in parallel.
 * A part without a spread keeps its nominal values at every vertex, so a file without these keys
 * is solved exactly as before.
 */
import type { RatingsOf, ResolvedRatings } from '../ratings/index';
import type { CapacitorFinding } from '../recognize/index';
import type { FilterCapacitor, RectifierDevice } from '../solve/index';

/**
 * End-of-life ESR over initial ESR: an electrolytic is commonly taken as worn out once its ESR
 * has doubled, and ESR at the coldest rated ambient is of the same order (common practice).
 */
export const DEFAULT_ESR_LIFE_FACTOR = 2;

type CapacitorRatingsByName = ReadonlyMap<string, RatingsOf<'capacitor'>>;

/** The filter capacitor of a merged group, with its rated ESR and its spreads. */
export function filterCapacitorOf(found: CapacitorFinding, ratings: CapacitorRatingsByName | undefined): FilterCapacitor {
  const name = found.names.join('+');
  const members = found.members ?? [];
  const rated = members.map((m) => ratings?.get(m.name));
  if (!rated.some((r) => r?.esrOhm || r?.capTolerance || r?.capLifeLoss)) return { name, cF: found.cF, esrOhm: found.esrOhm };
  const parts = members.map((m, k) => {
    const r = rated[k];
    const esr = r?.esrOhm?.value ?? 0;
    const [low, high] = r?.capTolerance?.value ?? [0, 0];
    const life = r?.capLifeLoss?.value ?? 0;
    return {
      cF: m.cF, cMinF: m.cF * (1 + low) * (1 + life), cMaxF: m.cF * (1 + high),
      esrOhm: m.esrOhm + esr, esrAgedOhm: m.esrOhm + esr * (r?.esrLifeFactor?.value ?? DEFAULT_ESR_LIFE_FACTOR),
    };
  });
  const sum = (get: (p: (typeof parts)[number]) => number) => parts.reduce((s, p) => s + get(p), 0);
  const parallel = (get: (p: (typeof parts)[number]) => number) => (parts.some((p) => get(p) === 0) ? 0 : 1 / sum((p) => 1 / get(p)));
  const cap: FilterCapacitor = { name, cF: sum((p) => p.cF), esrOhm: parallel((p) => p.esrOhm) };
  const cMinF = sum((p) => p.cMinF);
  const cMaxF = sum((p) => p.cMaxF);
  const esrAgedOhm = parallel((p) => p.esrAgedOhm);
  if (cMinF !== cap.cF) cap.cMinF = cMinF;
  if (cMaxF !== cap.cF) cap.cMaxF = cMaxF;
  if (esrAgedOhm !== cap.esrOhm) cap.esrAgedOhm = esrAgedOhm;
  return cap;
}

/** A diode with its rated forward-voltage spread attached. */
export function withVfSpread(device: RectifierDevice, rated: ResolvedRatings<'diode'> | ResolvedRatings<'mosfet'> | undefined): RectifierDevice {
  if (device.kind !== 'diode' || rated?.ratings.kind !== 'diode') return device;
  const spread = rated.ratings.vfSpreadV?.value;
  return spread && (spread[0] !== 0 || spread[1] !== 0) ? { ...device, vfSpreadV: [spread[0], spread[1]] } : device;
}
