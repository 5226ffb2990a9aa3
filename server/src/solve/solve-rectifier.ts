/**
 * Entry points: one corner (steady state inside the electro-thermal loop, then harmonics,
 * inrush and hold-up) and a whole rectifier over its corners with the worst case of each figure.
 */
import type { Corner, EquivalentCircuit } from './equivalent-circuit';
import { circuitAtCorner } from './corner-circuit';
import type { CornerSolution, DeviceWorst, RectifierSolution, WorstFigures } from './solution';
import { buildNetwork, setDeviceTemperatures, type NetworkOptions } from './network';
import { SteadyStateRun, type SteadyState, type SteadyStateOptions } from './shooting';
import { computePeriodFigures, type PeriodFigures } from './figures';
import { settleJunctionTemperatures, type ThermalOptions } from './thermal';
import { addInrushFigures, assembleCorner } from './output-figures';
import { overlapApplies, solveOverlapCorner } from './overlap-corner';
import { worstInrush } from './inrush-cases';
import { defaultCorners, pickWorst } from './corners';
import { dropNonFiniteFigures } from './finite-figures';

/** Solver configuration; every field has a default. */
export interface SolveOptions {
  steadyState?: SteadyStateOptions;
  thermal?: ThermalOptions;
  network?: NetworkOptions;
  /** Points in each returned waveform (default 200; 0 leaves waveforms out). */
  waveformPoints?: number;
  /** Compute the switch-on inrush (default true). */
  inrush?: boolean;
}

/**
 * What a solved corner hands the next one as its start: its orbit (scaled by the EMF ratio, which
 * is how capacitor voltages and currents scale) and each junction's rise over ambient. Only a
 * start: the next corner's shooting and thermal loop keep their own strict tests.
 */
interface CornerSeed { y0: number[]; mode0: number; vScaleV: number; riseK: number[] }

/** Solves one corner of a rectifier: the circuit with the corner's frequency, load and part vertex (corner-circuit.ts). */
export function solveCorner(nominal: EquivalentCircuit, corner: Corner, options: SolveOptions = {}): CornerSolution {
  return solveCornerFrom(nominal, corner, options).solution;
}

function solveCornerFrom(nominal: EquivalentCircuit, corner: Corner, options: SolveOptions, seed?: CornerSeed): { solution: CornerSolution; seed?: CornerSeed } {
  const circuit = circuitAtCorner(nominal, corner);
  const notes: string[] = [];
  const ta = corner.ambientC;
  const base: CornerSolution = {
    name: corner.name, lineScale: corner.lineScale, lineVrms: circuit.source.vrms * corner.lineScale, ambientC: ta,
    freqHz: circuit.source.freqHz, load: circuit.load,
    devices: circuit.devices.map((d) => ({ name: d.name, thermalRunaway: false })),
    converged: false, shootingIterations: 0, thermalIterations: 0, notes,
  };
  if (corner.loadLevel) base.loadLevel = corner.loadLevel;
  if (corner.parts) base.parts = corner.parts;
  // A three-phase diode bridge with line inductance commutates with overlap: its own solver.
  if (overlapApplies(circuit)) return { solution: solveOverlapCorner(circuit, corner, base, options) };
  const net = buildNetwork(circuit, corner.lineScale, circuit.devices.map(() => ta), notes, options.network);
  if (!net) return { solution: base };
  let last: { run: SteadyStateRun; ss: SteadyState; figs: PeriodFigures } | undefined;
  let iterations = 0;
  const guess = seed && seed.y0.length === net.n ? { y0: seed.y0.map((y) => (y * net.vScaleV) / seed.vScaleV), mode0: seed.mode0 } : undefined;
  const evaluated = (run: SteadyStateRun, ss: SteadyState, before: number) => {
    iterations += ss.iterations - before;
    last = { run, ss, figs: computePeriodFigures(ss.record) };
    return last.figs.devices.map((d) => d.lossW);
  };
  // An evaluation the thermal loop goes on from may be a draft (shooting.ts SteadyStateRun): it
  // saves the recorded period that would make it periodic; the one the loop stops on is finished.
  const lossAt = (tj: number[], mayDraft: boolean) => {
    setDeviceTemperatures(net, tj);
    const run = new SteadyStateRun(net, options.steadyState, last?.ss ?? guess);
    return evaluated(run, run.next(mayDraft), 0);
  };
  const finish = () => (last?.ss.draft ? evaluated(last.run, last.run.next(false), last.ss.iterations) : undefined);
  const thermal = settleJunctionTemperatures(ta, circuit.devices.map((d) => d.rthjaKPerW), lossAt, options.thermal, seed?.riseK.map((r) => ta + r), finish);
  const { ss, figs } = last!;
  notes.push(...ss.problems);
  const points = options.waveformPoints ?? 200;
  const solution = assembleCorner(base, { converged: ss.converged, shootingIterations: iterations, thermal, figs, record: ss.record, net }, circuit, points);
  if (options.inrush ?? true) {
    const r = worstInrush(circuit, net, corner.lineScale, corner.ambientC, options.steadyState?.relTol, options.network);
    addInrushFigures(solution, r, points, circuit.source.turnsRatio);
  }
  dropNonFiniteFigures(solution);
  const next = ss.converged && thermal.converged ? { y0: ss.y0, mode0: ss.mode0, vScaleV: net.vScaleV, riseK: thermal.tjC.map((t) => t - ta) } : undefined;
  return { solution, seed: next };
}

/** Solves a rectifier at each corner (default: `defaultCorners()`) and picks the worst of each figure. */
export function solveRectifier(circuit: EquivalentCircuit, corners: Corner[] = defaultCorners(), options: SolveOptions = {}): RectifierSolution {
  // A hotter corner at the same line and load starts from the cooler one's orbit and rise. Only
  // corners solved from nothing hand on a start, so a corner's figures depend on its own inputs
  // and at most those of its partner — never on the rest of the list (tests/corners rely on it).
  const seeds = new Map<number, CornerSeed>();
  const solved = corners.map((k, i) => {
    const from = corners.findIndex((r, j) => seeds.has(j) && r.lineScale === k.lineScale && r.ambientC < k.ambientC && r.loadLevel === k.loadLevel);
    const r = solveCornerFrom(circuit, k, options, from >= 0 ? seeds.get(from) : undefined);
    if (from < 0 && r.seed) seeds.set(i, r.seed);
    return r.solution;
  });
  const worst: WorstFigures = {
    vOutAvgV: pickWorst(solved, (s) => s.vOutAvgV, true), vOutMaxV: pickWorst(solved, (s) => s.vOutMaxV),
    rippleVpp: pickWorst(solved, (s) => s.rippleVpp), capRippleIrmsA: pickWorst(solved, (s) => s.capRippleIrmsA),
    efficiency: pickWorst(solved, (s) => s.efficiency, true), powerFactor: pickWorst(solved, (s) => s.powerFactor, true),
    thd: pickWorst(solved, (s) => s.thd), sourceIrmsA: pickWorst(solved, (s) => s.sourceIrmsA),
    rectifierLossW: pickWorst(solved, (s) => s.rectifierLossW), inrushPeakA: pickWorst(solved, (s) => s.inrushPeakA),
    inrushI2tA2s: pickWorst(solved, (s) => s.inrushI2tA2s), holdUpS: pickWorst(solved, (s) => s.holdUpS, true),
  };
  const devices: DeviceWorst[] = circuit.devices.map((d, k) => ({
    name: d.name,
    pivV: pickWorst(solved, (s) => s.devices[k]?.pivV), ipkA: pickWorst(solved, (s) => s.devices[k]?.ipkA),
    iavgA: pickWorst(solved, (s) => s.devices[k]?.iavgA), irmsA: pickWorst(solved, (s) => s.devices[k]?.irmsA),
    lossW: pickWorst(solved, (s) => s.devices[k]?.lossW), tjC: pickWorst(solved, (s) => s.devices[k]?.tjC),
    thermalRunaway: solved.some((s) => s.devices[k]?.thermalRunaway),
  }));
  const notes = [...new Set(solved.flatMap((s) => s.notes))];
  return { kind: circuit.kind, corners: solved, worst, devices, notes };
}
