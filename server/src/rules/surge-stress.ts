/**
 * The switch-on surge one device sees and how it compares with the part's IFSM, shared by the
 * `surge-rating` rule and the fixes that answer it.
 *
 * The solver integrates the first half-cycle after switch-on at the crest with the capacitor
 * empty (DESIGN.md §5) and gives each device's ∫i²dt over it, and the largest device current.
 * IFSM is rated for one half-sine of its stated length (8.3 ms unless the part says 10 ms). We
 * compare over the same duration, the half-cycle t = 1/(2f): the rating converted at equal I²t is
 * I_eq = IFSM·√(t_rated/t), whose half-sine I²t over t is IFSM²·t_rated/2 (REFERENCES.md §5, D).
 * The device's surge figure is the larger of its measured peak and the half-sine peak with its
 * measured I²t, √(2·I²t/t): a short spike above the rated peak is not excused by a small I²t
 * (common practice), and a long, low pulse is caught by its I²t.
 */
import type { RectifierAnalysis } from '../analysis/rectifier-analysis';
import { DEFAULT_IFSM_DURATION_S, equivalentSurgeA, type DiodeRatings } from '../ratings/index';

export interface SurgeStress {
  /** ∫i²dt of the device over the first half-cycle at switch-on. */
  i2tA2s: number;
  /** Largest current of the first half-cycle (the rectifier's, carried by the conducting devices). */
  peakA: number;
  /** The half-cycle the surge lasts: 1/(2f). */
  durationS: number;
  corner: string;
}

/** A device carries the inrush when its I²t is a good part of the largest; the others block. */
const CONDUCTING_SHARE = 0.25;

/** The worst surge of device `index` over the corners, or undefined when none was computed. */
export function surgeStressOf(analysis: RectifierAnalysis, index: number): SurgeStress | undefined {
  const durationS = 1 / (2 * analysis.circuit.source.freqHz);
  let worst: SurgeStress | undefined;
  for (const corner of analysis.solution.corners) {
    const i2t = corner.devices[index]?.inrushI2tA2s;
    if (i2t === undefined || corner.inrushPeakA === undefined) continue;
    const largest = Math.max(...corner.devices.map((d) => d.inrushI2tA2s ?? 0));
    const peakA = i2t >= CONDUCTING_SHARE * largest ? corner.inrushPeakA : Math.sqrt((2 * i2t) / durationS);
    const stress = { i2tA2s: i2t, peakA, durationS, corner: corner.name };
    if (!worst || surgeFigureA(stress) > surgeFigureA(worst)) worst = stress;
  }
  return worst;
}

/** The surge figure compared with the rating: max(peak, √(2·I²t/t)). */
export function surgeFigureA(stress: SurgeStress): number {
  return Math.max(stress.peakA, Math.sqrt((2 * stress.i2tA2s) / stress.durationS));
}

/** The IFSM rating converted to the surge's duration at equal I²t, with the I²t it allows. */
export function surgeCapability(ratings: DiodeRatings, durationS: number): { ifsmA: number; ratedS: number; equivalentA: number; i2tA2s: number } | undefined {
  const ifsmA = ratings.ifsmA?.value;
  if (ifsmA === undefined) return undefined;
  const ratedS = ratings.ifsmDurationS?.value ?? DEFAULT_IFSM_DURATION_S;
  return { ifsmA, ratedS, equivalentA: equivalentSurgeA(ifsmA, ratedS, durationS), i2tA2s: (ifsmA * ifsmA * ratedS) / 2 };
}
