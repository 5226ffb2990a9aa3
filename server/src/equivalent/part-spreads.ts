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
 * Parallel capacitors merge as in the surroundings: capacitances add, ESRs combine in parallel;
 * a series string's stages add as 1/C, their ESRs add.
 * A part without a spread keeps its nominal values at every vertex, so a file without these keys
 * is solved exactly as before.
 */
import type { RatingsOf, ResolvedRatings } from '../ratings/index';
import type { CapacitorFinding, CapacitorMember } from '../recognize/index';
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
  const rated = found.names.map((n) => ratings?.get(n));
  if (!rated.some((r) => r?.esrOhm || r?.capTolerance || r?.capLifeLoss)) return { name, cF: found.cF, esrOhm: found.esrOhm };
  const partOf = (m: CapacitorMember): Spread => {
    const r = ratings?.get(m.name);
    const esr = r?.esrOhm?.value ?? 0;
    const [low, high] = r?.capTolerance?.value ?? [0, 0];
    const life = r?.capLifeLoss?.value ?? 0;
    return {
      cF: m.cF, cMinF: m.cF * (1 + low) * (1 + life), cMaxF: m.cF * (1 + high),
      esrOhm: m.esrOhm + esr, esrAgedOhm: m.esrOhm + esr * (r?.esrLifeFactor?.value ?? DEFAULT_ESR_LIFE_FACTOR),
    };
  };
  // A string's stages are in series; every other combination is parallel.
  const strings = (found.strings ?? []).map((s) => inSeries(s.stages.map((st) => inParallel(st.members.map(partOf)))));
  const whole = inParallel([...(found.members ?? []).map(partOf), ...strings]);
  const cap: FilterCapacitor = { name, cF: whole.cF, esrOhm: whole.esrOhm };
  if (whole.cMinF !== cap.cF) cap.cMinF = whole.cMinF;
  if (whole.cMaxF !== cap.cF) cap.cMaxF = whole.cMaxF;
  if (whole.esrAgedOhm !== cap.esrOhm) cap.esrAgedOhm = whole.esrAgedOhm;
  return cap;
}

/** A capacitance and ESR with their spreads: one part, a bank or a string. */
interface Spread {
  cF: number;
  cMinF: number;
  cMaxF: number;
  esrOhm: number;
  esrAgedOhm: number;
}

/** Parallel parts: capacitances add, ESRs combine in parallel (0 when any is 0). */
function inParallel(parts: readonly Spread[]): Spread {
  const sum = (get: (p: Spread) => number) => parts.reduce((s, p) => s + get(p), 0);
  const parallel = (get: (p: Spread) => number) => (parts.some((p) => get(p) === 0) ? 0 : 1 / sum((p) => 1 / get(p)));
  return { cF: sum((p) => p.cF), cMinF: sum((p) => p.cMinF), cMaxF: sum((p) => p.cMaxF), esrOhm: parallel((p) => p.esrOhm), esrAgedOhm: parallel((p) => p.esrAgedOhm) };
}

/** Series parts: 1/C adds (every part at the same end of its spread), ESRs add. */
function inSeries(parts: readonly Spread[]): Spread {
  const sum = (get: (p: Spread) => number) => parts.reduce((s, p) => s + get(p), 0);
  return { cF: 1 / sum((p) => 1 / p.cF), cMinF: 1 / sum((p) => 1 / p.cMinF), cMaxF: 1 / sum((p) => 1 / p.cMaxF), esrOhm: sum((p) => p.esrOhm), esrAgedOhm: sum((p) => p.esrAgedOhm) };
}

/** A diode with its rated forward-voltage spread attached. */
export function withVfSpread(device: RectifierDevice, rated: ResolvedRatings<'diode'> | ResolvedRatings<'mosfet'> | undefined): RectifierDevice {
  if (device.kind !== 'diode' || rated?.ratings.kind !== 'diode') return device;
  const spread = rated.ratings.vfSpreadV?.value;
  return spread && (spread[0] !== 0 || spread[1] !== 0) ? { ...device, vfSpreadV: [spread[0], spread[1]] } : device;
}
