/**
 * One filter capacitor's stress over the corners: its share of its group's ripple current, the
 * ripple loss in its ESR, its core temperature and its life estimate (ratings/capacitor-life.ts),
 * with the worst of each and the corner that gave it (the life at the corner that shortens it most).
 *
 * Share: recognition merges parallel capacitors; their ripple current divides in proportion to
 * their capacitance (as rules/capacitor-view.ts takes it). ESR: the part's `esr=` rating, else,
 * for a capacitor alone in its group, the series resistance recognition found for it; parallel
 * parts without a rating have no ESR of their own, so no loss. The loss is taken with the rated
 * (initial) ESR at every corner, also where the solver ran an aged ESR: the ESR rises towards the
 * end of life, and the rated endurance the estimate starts from already ends there.
 */
import type { FlatCircuit } from '../circuit/index';
import { capacitorLifeHours, coreRiseK, rippleLossW, type CoreRiseModel, type RatingsOf } from '../ratings/index';
import type { Rectifier } from '../recognize/index';
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
  const share = shareOf(flat, found.names, name);
  const esr = ratings.esrOhm ? { ohm: ratings.esrOhm.value, from: 'rating' as const }
    : found.names.length === 1 && found.esrOhm > 0 ? { ohm: found.esrOhm, from: 'series resistor' as const } : undefined;
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

function shareOf(flat: FlatCircuit, names: readonly string[], name: string): number {
  const value = (n: string) => {
    const e = flat.elements.find((x) => x.key === n.toLowerCase());
    return e && e.kind === 'capacitor' ? (e.value ?? 0) : 0;
  };
  const total = names.reduce((s, n) => s + value(n), 0);
  return total > 0 ? value(name) / total : 1 / names.length;
}
