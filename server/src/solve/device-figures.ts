/**
 * One device's figures taken out of its rectifier's solution: the worst case over the corners,
 * its figures at each corner, its switch-on surge and the thermal resistance it was solved with.
 * The solver keeps the circuit's device order in every corner, so this is the one place that
 * joins a device to the solution by position; everything else reads the result.
 *
 * The surge: the solver integrates the first half-cycle after switch-on at the crest with the
 * capacitor empty (DESIGN.md §5) and gives each device's ∫i²dt over it, and the largest current.
 * A device carrying the inrush sees that peak; a device that mostly blocks sees the half-sine
 * peak with its own I²t, √(2·I²t/t), over the half-cycle t = 1/(2f).
 */
import type { EquivalentCircuit } from './equivalent-circuit';
import type { DeviceSolution, DeviceWorst, RectifierSolution } from './solution';

/** The switch-on surge one device sees. */
export interface SurgeStress {
  /** ∫i²dt of the device over the first half-cycle at switch-on. */
  i2tA2s: number;
  /** Largest current of the first half-cycle (the rectifier's, carried by the conducting devices). */
  peakA: number;
  /** The half-cycle the surge lasts: 1/(2f). */
  durationS: number;
  /**
   * What a rating is held against: max(peak, √(2·I²t/t)). A short spike above the rated peak is
   * not excused by a small I²t (common practice), and a long, low pulse is caught by its I²t.
   */
  figureA: number;
  corner: string;
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

/** A device carries the inrush when its I²t is a good part of the largest; the others block. */
const CONDUCTING_SHARE = 0.25;

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
  const durationS = 1 / (2 * circuit.source.freqHz);
  let worst: SurgeStress | undefined;
  for (const corner of solution.corners) {
    const i2t = corner.devices[index]?.inrushI2tA2s;
    if (i2t === undefined || corner.inrushPeakA === undefined) continue;
    const largest = Math.max(...corner.devices.map((d) => d.inrushI2tA2s ?? 0));
    const peakA = i2t >= CONDUCTING_SHARE * largest ? corner.inrushPeakA : Math.sqrt((2 * i2t) / durationS);
    const figureA = Math.max(peakA, Math.sqrt((2 * i2t) / durationS));
    if (!worst || figureA > worst.figureA) worst = { i2tA2s: i2t, peakA, durationS, figureA, corner: corner.name };
  }
  return worst;
}
