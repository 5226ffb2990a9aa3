/**
 * One corner of a three-phase diode bridge with series line inductance, solved with commutation
 * overlap (overlap-stage.ts): steady state inside the electro-thermal loop, then the same figures
 * as the one-path solve (output-figures.ts), waveforms and the inrush with the line inductance.
 * MOSFET bridges and a line inductance together with a DC choke stay on the one-path network,
 * which says what it leaves out.
 */
import type { Corner, EquivalentCircuit } from './equivalent-circuit';
import type { CornerSolution } from './solution';
import type { SolveOptions } from './solve-rectifier';
import { buildNetwork, setDeviceTemperatures, type NetworkOptions } from './network';
import { settleJunctionTemperatures } from './thermal';
import { addInrushFigures, assembleCorner } from './output-figures';
import { dropNonFiniteFigures } from './finite-figures';
import type { PeriodFigures } from './figures';
import type { OverlapSystem } from './overlap-stage';
import { overlapPeriodFigures } from './overlap-record';
import { findOverlapSteadyState, type OverlapSteadyState } from './overlap-shooting';
import { overlapWorstInrush } from './overlap-inrush';

const BRIDGE_ROLES = ['upper-a', 'upper-b', 'upper-c', 'lower-a', 'lower-b', 'lower-c'];

/** Whether the overlap solver takes this circuit: a six-diode three-phase bridge with line L and no DC choke. */
export function overlapApplies(c: EquivalentCircuit): boolean {
  if (c.kind !== 'three-phase-bridge' || !(c.source.seriesLH > 0) || !Number.isFinite(c.source.seriesLH)) return false;
  if (c.choke && c.choke.lH > 0) return false;
  const roles = c.devices.map((d): string => d.role).sort();
  return c.devices.every((d) => d.kind === 'diode') && roles.join() === [...BRIDGE_ROLES].sort().join();
}

/**
 * The overlap system at a corner: the network of the circuit with its lines' inductance taken
 * out (that network holds the EMFs, devices, port and load), and the inductance held apart.
 */
export function overlapSystemOf(c: EquivalentCircuit, lineScale: number, tjC: readonly number[], problems: string[], opts?: NetworkOptions): OverlapSystem | undefined {
  const net = buildNetwork({ ...c, source: { ...c.source, seriesLH: 0 } }, lineScale, tjC, problems, opts);
  if (!net) return undefined;
  const upper = [0, 1, 2].map((x) => net.devices.findIndex((d) => d.line === x && d.upper));
  const lower = [0, 1, 2].map((x) => net.devices.findIndex((d) => d.line === x && !d.upper));
  if (upper.includes(-1) || lower.includes(-1)) return undefined;
  return { net, lH: c.source.seriesLH, rOhm: Math.max(c.source.seriesROhm, 0), upper, lower, n: 2 + net.nCap, hasCap: net.nCap > 0 };
}

export function solveOverlapCorner(circuit: EquivalentCircuit, corner: Corner, base: CornerSolution, options: SolveOptions): CornerSolution {
  const notes = base.notes;
  const ta = corner.ambientC;
  const sys = overlapSystemOf(circuit, corner.lineScale, circuit.devices.map(() => ta), notes, options.network);
  if (!sys) return base;
  let last: { ss: OverlapSteadyState; figs: PeriodFigures } | undefined;
  let iterations = 0;
  const lossAt = (tj: number[]) => {
    setDeviceTemperatures(sys.net, tj);
    const ss = findOverlapSteadyState(sys, options.steadyState, last?.ss);
    iterations += ss.iterations;
    last = { ss, figs: overlapPeriodFigures(ss.record) };
    return last.figs.devices.map((d) => d.lossW);
  };
  const thermal = settleJunctionTemperatures(ta, circuit.devices.map((d) => d.rthjaKPerW), lossAt, options.thermal);
  const { ss, figs } = last!;
  notes.push(...ss.problems);
  const points = options.waveformPoints ?? 200;
  const solution = assembleCorner(base, { converged: ss.converged, shootingIterations: iterations, thermal, figs, record: ss.record, net: sys.net }, circuit, points);
  if (options.inrush ?? true) addInrushFigures(solution, overlapWorstInrush(circuit, sys, ta, options.steadyState?.relTol), points, circuit.source.turnsRatio);
  dropNonFiniteFigures(solution);
  return solution;
}
