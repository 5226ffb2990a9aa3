/**
 * The operating corners of a rectifier and the choice of the worst corner per figure.
 *
 * Every figure is worst at one end of each range, so the corners are the few vertices where some
 * figure is worst, not the whole product of the ranges (which would multiply the solves for
 * nothing). Base: line low/nominal/high × ambient nominal/maximum, at the full load:
 *
 * - high line (highest nominal × (1 + high tolerance)): the highest crest, so the peak reverse
 *   voltage, the capacitor voltage, the repetitive peak current and the inrush. Part vertex
 *   "stiff": largest capacitance, nominal ESR, lowest forward voltage — each raises the crest
 *   the capacitor charges to and the charging and inrush currents. "high-line hot" runs at the
 *   lowest line frequency (the longest half-cycle: the largest inrush I²t), "high-line nominal"
 *   at the highest (the steepest charging pulses: ωC·V grows with f).
 * - low line (lowest nominal × (1 + low tolerance)) at the lowest frequency (the longest gap
 *   between charging pulses): the ripple, the minimum output, the hold-up; with a power load
 *   also the largest currents. "low-line nominal" takes the part vertex "weak": smallest
 *   capacitance (tolerance and loss over life), aged ESR, highest forward voltage — the
 *   ripple and hold-up corner (the nominal ambient is the coldest we solve, where the forward
 *   voltage is highest). "low-line hot" takes "heat": largest capacitance and nominal ESR (the
 *   peakiest, so the highest RMS current) with the highest forward voltage — the loss and
 *   junction-temperature corner.
 * - nominal line: the source as drawn, nominal parts — the typical figures.
 *
 * A load range adds one corner, "high-line hot light-load": the light end with the stiff parts at
 * the hot ambient (the lowest forward voltage), where the capacitor charges to the crest — the
 * peak reverse voltage and capacitor voltage there are the highest of all. The base corners then
 * say "full-load". Heat, ripple and hold-up are worst at the full end, so no other corner needs
 * the light load.
 *
 * With a single line voltage, a single frequency, a single load and no part spread the corners
 * are exactly the six of line × ambient, with the names they always had.
 */
import type { Corner, Load, PartVertex } from './equivalent-circuit';

export interface CornerInputs {
  /** Low-line tolerance, e.g. −0.10. Default −10 %: the ±10 % band of IEC 60038 nominal voltages (from memory). */
  lineTolLow?: number;
  /** High-line tolerance. Default +10 % (same source). */
  lineTolHigh?: number;
  /** Nominal ambient, °C. Default 25 °C, the usual rating temperature of datasheets (common practice). */
  ambientNominalC?: number;
  /** Maximum ambient, °C. Default 50 °C, a typical enclosure rating (common practice). */
  ambientMaxC?: number;
  /**
   * A universal input: its lowest and highest nominal as multipliers of the source's nominal
   * (e.g. 100 V..240 V drawn at 240 V: [0.4167, 1]). Default [1, 1].
   */
  lineRange?: [number, number];
  /** Line frequencies when there are several (ascending); absent: the source's own. */
  freqsHz?: number[];
  /** The light end of a load range (the circuit's own load is the full end). */
  lightLoad?: Load;
  /** The circuit's parts carry spreads (solve/corner-circuit.ts `hasPartSpread`): take the part vertices. */
  partSpread?: boolean;
}

const LINE_NAMES = ['low-line', 'nominal-line', 'high-line'] as const;

/** The typical operating point: nominal line at the nominal ambient (at the full load when the load is a range). */
export function isNominalCorner(name: string): boolean {
  return name === 'nominal-line nominal' || name === 'nominal-line nominal full-load';
}

/** The part vertices, each named for what it is worst for (see above). */
export const PART_VERTICES: Readonly<Record<'stiff' | 'weak' | 'heat', PartVertex>> = {
  stiff: { capacitance: 'max', esr: 'nominal', vf: 'low' },
  weak: { capacitance: 'min', esr: 'aged', vf: 'high' },
  heat: { capacitance: 'max', esr: 'nominal', vf: 'high' },
};

/**
 * The corners (see the head of this file), named like "high-line hot", "low-line nominal" and,
 * with a load range, "high-line hot full-load" and "high-line hot light-load" (lowercase and
 * stable: they appear in JSON output).
 */
export function defaultCorners(inputs: CornerInputs = {}): Corner[] {
  const [lowEnd, highEnd] = inputs.lineRange ?? [1, 1];
  const scales = [lowEnd * (1 + (inputs.lineTolLow ?? -0.1)), 1, highEnd * (1 + (inputs.lineTolHigh ?? 0.1))];
  const ambients: [string, number][] = [['nominal', inputs.ambientNominalC ?? 25], ['hot', inputs.ambientMaxC ?? 50]];
  const freqs = inputs.freqsHz && inputs.freqsHz.length > 1 ? inputs.freqsHz : undefined;
  const lowF = freqs?.[0];
  const highF = freqs?.[freqs.length - 1];
  const ranged = inputs.lightLoad !== undefined;
  const out: Corner[] = [];
  scales.forEach((lineScale, i) => {
    for (const [label, ambientC] of ambients) {
      const corner: Corner = { name: `${LINE_NAMES[i]} ${label}${ranged ? ' full-load' : ''}`, lineScale, ambientC };
      const hot = label === 'hot';
      const freqHz = i === 0 ? lowF : i === 2 ? (hot ? lowF : highF) : undefined;
      if (freqHz !== undefined) corner.freqHz = freqHz;
      if (ranged) corner.loadLevel = 'full';
      if (inputs.partSpread && i !== 1) corner.parts = i === 2 ? PART_VERTICES.stiff : hot ? PART_VERTICES.heat : PART_VERTICES.weak;
      out.push(corner);
    }
  });
  if (inputs.lightLoad) {
    const light: Corner = { name: 'high-line hot light-load', lineScale: scales[2]!, ambientC: ambients[1]![1], load: inputs.lightLoad, loadLevel: 'light' };
    if (lowF !== undefined) light.freqHz = lowF;
    if (inputs.partSpread) light.parts = PART_VERTICES.stiff;
    out.push(light);
  }
  return out;
}

/** A figure's worst value and the corner that produced it. */
export interface WorstValue {
  value: number;
  corner: string;
}

/** The worst (largest, or smallest when `lower` is set) defined value among corners. */
export function pickWorst<T extends { name: string }>(corners: readonly T[], get: (c: T) => number | undefined, lower = false): WorstValue | undefined {
  let best: WorstValue | undefined;
  for (const c of corners) {
    const v = get(c);
    if (v === undefined || !Number.isFinite(v)) continue;
    if (!best || (lower ? v < best.value : v > best.value)) best = { value: v, corner: c.name };
  }
  return best;
}
