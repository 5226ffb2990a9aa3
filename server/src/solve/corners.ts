/**
 * Line × ambient corners and the choice of the worst corner per figure.
 */
import type { Corner } from './equivalent-circuit';

export interface CornerInputs {
  /** Low-line tolerance, e.g. −0.10. Default −10 %: the ±10 % band of IEC 60038 nominal voltages (from memory). */
  lineTolLow?: number;
  /** High-line tolerance. Default +10 % (same source). */
  lineTolHigh?: number;
  /** Nominal ambient, °C. Default 25 °C, the usual rating temperature of datasheets (common practice). */
  ambientNominalC?: number;
  /** Maximum ambient, °C. Default 50 °C, a typical enclosure rating (common practice). */
  ambientMaxC?: number;
}

const LINE_NAMES = ['low-line', 'nominal-line', 'high-line'] as const;

/**
 * The six corners line low/nominal/high × ambient nominal/maximum, named like "high-line hot"
 * and "low-line nominal" (lowercase, stable: they appear in JSON output).
 */
export function defaultCorners(inputs: CornerInputs = {}): Corner[] {
  const scales = [1 + (inputs.lineTolLow ?? -0.1), 1, 1 + (inputs.lineTolHigh ?? 0.1)];
  const ambients: [string, number][] = [['nominal', inputs.ambientNominalC ?? 25], ['hot', inputs.ambientMaxC ?? 50]];
  const out: Corner[] = [];
  scales.forEach((lineScale, i) => {
    for (const [label, ambientC] of ambients) out.push({ name: `${LINE_NAMES[i]} ${label}`, lineScale, ambientC });
  });
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
