/**
 * One filter capacitor's stress over the corners: its share of its group's ripple current, the
 * ripple loss in its ESR, its core temperature and its life estimate (ratings/capacitor-life.ts),
 * with the worst of each and the corner that gave it (the life at the corner that shortens it most).
 *
 * Share: recognition merges parallel capacitors and series strings; the ripple current divides as
 * `rippleShareOf` (recognize/capacitor-strings.ts) says, as rules/capacitor-view.ts takes it.
 * ESR: the part's `esr=` rating, else, for a capacitor alone in its group or in its stage of a
 * series string, the series resistance recognition found for it; parallel parts without a rating
 * have no ESR of their own, so no loss. The loss is taken with the rated
 * (initial) ESR at every corner, also where the solver ran an aged ESR: the ESR rises towards the
 * end of life, and the rated endurance the estimate starts from already ends there.
 */
import type { FlatCircuit } from '../circuit/index';
import { capacitorLifeHours, coreRiseK, rippleLossW, type CoreRiseModel, type RatingsOf } from '../ratings/index';
import { rippleShareOf, type CapacitorFinding, type Rectifier } from '../recognize/index';
import type { RectifierSolution, WorstValue } from '../solve/index';

export interface CapacitorAtCorner {
  corner: string;
  irmsA: number;
  lossW?: number;
  coreC: number;
  lifeH?: number;
}

export interface CapacitorStress {
  /** The ESR the loss was computed with, and where it came from. */
  esr?: { ohm: number; from: 'rating' | 'series resistor' };
  riseModel: CoreRiseModel;
  lossW?: WorstValue;
  coreC?: WorstValue;
  /** The shortest life estimate over the corners; absent without an `endurance=` rating. */
  lifeH?: WorstValue;
  corners: CapacitorAtCorner[];
}

/** The stress of the capacitor `name` of a rectifier, or undefined when it is not among its filter capacitors. */
export function capacitorStressOf(
  rectifier: Rectifier, flat: FlatCircuit, solution: RectifierSolution, name: string, ratings: RatingsOf<'capacitor'>,
): CapacitorStress | undefined {
  const groups = rectifier.surroundings.capacitors;
  const group = groups.findIndex((g) => g.names.some((n) => n.toLowerCase() === name.toLowerCase()));
  if (group < 0) return undefined;
  const found = groups[group]!;
  const share = rippleShareOf(found, name) ?? 1 / found.names.length;
  // A drawn series resistor is a part's own ESR when the part is alone in its group or in its string stage.
  const drawnOhm = found.names.length === 1 ? found.esrOhm : loneStageEsrOhm(found, name);
  const esr = ratings.esrOhm ? { ohm: ratings.esrOhm.value, from: 'rating' as const }
    : drawnOhm !== undefined && drawnOhm > 0 ? { ohm: drawnOhm, from: 'series resistor' as const } : undefined;
  const stress: CapacitorStress = { riseModel: 'none', corners: [] };
  if (esr) stress.esr = esr;
  for (const corner of solution.corners) {
    const groupIrms = corner.capacitorIrmsA?.[group];
    if (groupIrms === undefined) continue;
    const irmsA = groupIrms * share;
    const lossW = esr ? rippleLossW(irmsA, esr.ohm) : undefined;
    const rise = coreRiseK(irmsA, lossW, ratings.rthKPerW?.value, ratings.iRippleA?.value);
    stress.riseModel = rise.model;
    const at: CapacitorAtCorner = { corner: corner.name, irmsA, coreC: corner.ambientC + rise.riseK };
    if (lossW !== undefined) at.lossW = lossW;
    if (ratings.endurance) at.lifeH = capacitorLifeHours(ratings.endurance.value, at.coreC);
    stress.corners.push(at);
  }
  const worst = (get: (c: CapacitorAtCorner) => number | undefined, lower = false): WorstValue | undefined => {
    let best: WorstValue | undefined;
    for (const c of stress.corners) {
      const v = get(c);
      if (v !== undefined && Number.isFinite(v) && (!best || (lower ? v < best.value : v > best.value))) best = { value: v, corner: c.corner };
    }
    return best;
  };
  const lossW = worst((c) => c.lossW);
  const coreC = worst((c) => c.coreC);
  const lifeH = worst((c) => c.lifeH, true);
  if (lossW) stress.lossW = lossW;
  if (coreC) stress.coreC = coreC;
  if (lifeH) stress.lifeH = lifeH;
  return stress;
}

/** The drawn series resistance of a capacitor alone in its stage of a string, if it is one. */
function loneStageEsrOhm(found: CapacitorFinding, name: string): number | undefined {
  const key = name.toLowerCase();
  const stage = (found.strings ?? []).flatMap((s) => s.stages).find((st) => st.members.some((m) => m.name.toLowerCase() === key));
  return stage?.members.length === 1 ? stage.members[0]!.esrOhm : undefined;
}
