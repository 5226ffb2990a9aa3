/**
 * One device's figures taken out of its rectifier's solution: the worst case over the corners,
 * its figures at each corner, its switch-on surge and the thermal resistance it was solved with.
 * The solver keeps the circuit's device order in every corner, so this is the one place that
 * joins a device to the solution by position; everything else reads the result.
 *
 * The surge: the solver integrates the first half-cycle after switch-on at each crest with the
 * capacitor empty, cold and (with an NTC limiter) hot (DESIGN.md §5, solve/inrush-cases.ts), and
 * gives each device its own peak current and ∫i²dt in its worst case.
 */
import type { EquivalentCircuit } from './equivalent-circuit';
import type { DeviceSolution, DeviceWorst, RectifierSolution } from './solution';
import { surgeFigureA } from './inrush-cases';

/** The switch-on surge one device sees. */
export interface SurgeStress {
  /** ∫i²dt of the device over the first half-cycle at switch-on. */
  i2tA2s: number;
  /** The device's largest current in the first half-cycle. */
  peakA: number;
  /** The half-cycle the surge lasts: 1/(2f). */
  durationS: number;
  /**
   * What picks the worst corner and case: max(peak, √(2·I²t/t)) over the half-cycle t. The
   * rating is judged on the peak and the I²t apart (ratings/stress-checks.ts).
   */
  figureA: number;
  corner: string;
  /** The inrush case, in words ("hot restart at the negative crest"), when the solver named it. */
  case?: string;
}

/** A device's figures at one corner. */
export interface DeviceAtCorner {
  corner: string;
  figures?: DeviceSolution;
}

export interface DeviceFigures {
  /** The worst value of each figure over the corners; absent when the solver gave none. */
  worst?: DeviceWorst;
  /** Its figures at every corner, in the solution's corner order. */
  corners: DeviceAtCorner[];
  /** The worst switch-on surge over the corners (by the surge figure), when computed. */
  surge?: SurgeStress;
  /** The junction-to-ambient resistance it was solved with; absent: its Tj is only the ambient. */
  rthjaKPerW?: number;
}

/** The figures of device `index` of `circuit` in `solution`. */
export function deviceFiguresOf(circuit: EquivalentCircuit, solution: RectifierSolution, index: number): DeviceFigures {
  const figures: DeviceFigures = {
    corners: solution.corners.map((c) => (c.devices[index] ? { corner: c.name, figures: c.devices[index] } : { corner: c.name })),
  };
  const worst = solution.devices[index];
  if (worst) figures.worst = worst;
  const surge = surgeStressOf(circuit, solution, index);
  if (surge) figures.surge = surge;
  const rthja = circuit.devices[index]?.rthjaKPerW;
  if (rthja !== undefined) figures.rthjaKPerW = rthja;
  return figures;
}

function surgeStressOf(circuit: EquivalentCircuit, solution: RectifierSolution, index: number): SurgeStress | undefined {
  let worst: SurgeStress | undefined;
  for (const corner of solution.corners) {
    // Each corner's own line frequency: a universal input's lowest frequency has the longest half-cycle.
    const durationS = 1 / (2 * (corner.freqHz ?? circuit.source.freqHz));
    const d = corner.devices[index];
    const i2t = d?.inrushI2tA2s;
    if (i2t === undefined) continue;
    const peakA = d?.inrushPeakA ?? 0;
    const figureA = surgeFigureA(peakA, i2t, durationS);
    if (worst && figureA <= worst.figureA) continue;
    worst = { i2tA2s: i2t, peakA, durationS, figureA, corner: corner.name };
    if (d?.inrushCase) worst.case = d.inrushCase;
  }
  return worst;
}
