/**
 * Entry points: one corner (steady state inside the electro-thermal loop, then harmonics,
 * inrush and hold-up) and a whole rectifier over its corners with the worst case of each figure.
 */
import type { Corner, EquivalentCircuit, FixedLoad } from './equivalent-circuit';
import { circuitAtCorner } from './corner-circuit';
import type { CornerSolution, DeviceWorst, RectifierSolution, WorstFigures } from './solution';
import { buildNetwork, setDeviceTemperatures, type Network, type NetworkOptions } from './network';
import { findSteadyState, type SteadyState, type SteadyStateOptions } from './shooting';
import { computePeriodFigures, type PeriodFigures } from './figures';
import { settleJunctionTemperatures, type ThermalOptions } from './thermal';
import { computeHarmonics } from './harmonics';
import { checkHarmonicLimits } from './iec61000-3-2';
import { worstInrush } from './inrush-cases';
import { sampleWaveform } from './waveform';
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

/** Solves one corner of a rectifier: the circuit with the corner's frequency, load and part vertex (corner-circuit.ts). */
export function solveCorner(nominal: EquivalentCircuit, corner: Corner, options: SolveOptions = {}): CornerSolution {
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
  const net = buildNetwork(circuit, corner.lineScale, circuit.devices.map(() => ta), notes, options.network);
  if (!net) return base;
  let last: { ss: SteadyState; figs: PeriodFigures } | undefined;
  let iterations = 0;
  const lossAt = (tj: number[]) => {
    setDeviceTemperatures(net, tj);
    const ss = findSteadyState(net, options.steadyState, last?.ss);
    iterations += ss.iterations;
    last = { ss, figs: computePeriodFigures(ss.record) };
    return last.figs.devices.map((d) => d.lossW);
  };
  const thermal = settleJunctionTemperatures(ta, circuit.devices.map((d) => d.rthjaKPerW), lossAt, options.thermal);
  const { ss, figs } = last!;
  notes.push(...ss.problems);
  circuit.devices.forEach((d, k) => {
    if (d.rthjaKPerW === undefined) notes.push(`${d.name}: no RθJA given; Tj taken as ambient`);
    if (thermal.runaway[k]) notes.push(`${d.name}: thermal runaway — no settled junction temperature (Tj ≥ ${Math.round(thermal.tjC[k]!)} °C)`);
  });
  const solution: CornerSolution = {
    ...base, converged: ss.converged, shootingIterations: iterations, thermalIterations: thermal.iterations,
    devices: figs.devices.map((d, k) => ({
      name: d.name, pivV: d.pivV, ipkA: d.ipkA, iavgA: d.iavgA, irmsA: d.irmsA, lossW: d.lossW,
      tjC: thermal.tjC[k], thermalRunaway: thermal.runaway[k] ?? false,
    })),
  };
  addOutputFigures(solution, figs, net, circuit, notes);
  addSourceFigures(solution, figs, ss, net, circuit, notes);
  const points = options.waveformPoints ?? 200;
  if (points > 0) solution.waveform = sampleWaveform(ss.record, points, circuit.source.turnsRatio);
  if (options.inrush ?? true) addInrush(solution, net, circuit, corner, points, options);
  dropNonFiniteFigures(solution);
  return solution;
}

function addOutputFigures(s: CornerSolution, f: PeriodFigures, net: Network, c: EquivalentCircuit, notes: string[]): void {
  s.vOutAvgV = f.vOutAvgV; s.vOutRmsV = f.vOutRmsV; s.vOutMinV = f.vOutMinV; s.vOutMaxV = f.vOutMaxV; s.rippleVpp = f.rippleVpp;
  if (f.capacitorIrmsA.length > 0) { s.capacitorIrmsA = f.capacitorIrmsA; s.capRippleIrmsA = Math.max(...f.capacitorIrmsA); }
  // The controller's quiescent draw is part of the load the network sees; its power is loss.
  const controllerW = controllerLossW(c, f);
  if (controllerW !== undefined) s.controllerLossW = controllerW;
  s.outputPowerW = f.outputPowerW - (controllerW ?? 0); s.rectifierLossW = f.rectifierLossW + (controllerW ?? 0);
  if (s.outputPowerW > 0) s.efficiency = s.outputPowerW / (s.outputPowerW + s.rectifierLossW);
  else notes.push('efficiency not defined: no output power');
  const load = c.load;
  if (load.kind === 'power' && load.vminV !== undefined && load.w > 0) {
    const cOut = outputCapacitanceF(net);
    if (cOut <= 0) notes.push('hold-up time not defined: no output capacitor');
    else s.holdUpS = f.vOutMinV > load.vminV ? holdUpS(cOut, f.vOutMinV, load.vminV, load.w, c.fixedLoad) : 0;
    if (s.holdUpS === 0) notes.push('output already falls below the load vmin in steady state: hold-up 0');
  }
}

/** Average power of Iq(v) = i0 + v/R over the period: i0·v̄ + v_rms²/R (exact for the recorded output). */
function controllerLossW(c: EquivalentCircuit, f: PeriodFigures): number | undefined {
  const q = c.controllerSupply;
  if (!q) return undefined;
  return Math.max(q.iA, 0) * f.vOutAvgV + (q.ohm !== undefined && q.ohm > 0 ? f.vOutRmsV ** 2 / q.ohm : 0);
}

/** Simpson intervals for the hold-up integral with a fixed load beside the power load (error far below 1e-6 for these smooth integrands). */
const HOLD_UP_INTERVALS = 256;

/**
 * Time for the output capacitance to fall from v0 to vmin with the source gone. A constant-power
 * load alone: the energy balance C·(v0² − vmin²)/(2P). With a bleeder or current sink beside it,
 * C·dv/dt = −(P/v + v/R + I), so t = ∫ C·dv/(P/v + v/R + I) from vmin to v0, by Simpson's rule.
 */
function holdUpS(cF: number, v0: number, vmin: number, pW: number, fixed: FixedLoad | undefined): number {
  const gR = fixed?.ohm !== undefined && fixed.ohm > 0 ? 1 / fixed.ohm : 0;
  const iA = fixed?.a ?? 0;
  if (gR === 0 && iA === 0) return (cF * (v0 ** 2 - vmin ** 2)) / (2 * pW);
  const f = (v: number) => cF / (pW / v + gR * v + iA);
  const h = (v0 - vmin) / HOLD_UP_INTERVALS;
  let sum = f(vmin) + f(v0);
  for (let k = 1; k < HOLD_UP_INTERVALS; k++) sum += (k % 2 === 1 ? 4 : 2) * f(vmin + k * h);
  return (sum * h) / 3;
}

/** Capacitance the load sees: the sum of parallel ports in series where the load spans several. */
function outputCapacitanceF(net: Network): number {
  const caps = net.ports.filter((p) => !p.bare && p.l > 0);
  if (caps.length === 0) return 0;
  return 1 / caps.reduce((s, p) => s + 1 / p.cF, 0);
}

function addSourceFigures(s: CornerSolution, f: PeriodFigures, ss: SteadyState, net: Network, c: EquivalentCircuit, notes: string[]): void {
  const tr = c.source.turnsRatio > 0 ? c.source.turnsRatio : 1;
  s.inputPowerW = f.inputPowerW;
  if (!(f.sourceIrmsA > 0)) { notes.push('no source current: power factor and harmonics not defined'); return; }
  s.sourceIrmsA = f.sourceIrmsA * tr;
  s.powerFactor = f.inputPowerW / (net.phases * net.lineVrms * f.sourceIrmsA);
  const h = computeHarmonics(ss.record, tr);
  s.harmonicsA = h.harmonicsA; s.thd = h.thd; s.displacementPowerFactor = h.displacementPowerFactor;
  const mains = c.source.mainsVrms;
  s.iecClassA = checkHarmonicLimits(h.harmonicsA, 'A', mains, c.source.freqHz, f.inputPowerW);
  s.iecClassD = checkHarmonicLimits(h.harmonicsA, 'D', mains, c.source.freqHz, f.inputPowerW);
  if (net.phases > 1) notes.push('harmonics are those of line a; the Class A/D comparison assumes a single-phase connection');
}

function addInrush(s: CornerSolution, net: Network, c: EquivalentCircuit, corner: Corner, points: number, options: SolveOptions): void {
  const r = worstInrush(c, net, corner.lineScale, corner.ambientC, options.steadyState?.relTol, options.network);
  if (!r) { s.notes.push('inrush: step budget exhausted'); return; }
  s.inrushPeakA = r.peakA;
  s.inrushCase = r.peakCase;
  s.inrushI2tA2s = Math.max(...r.devices.map((d) => d.i2tA2s));
  s.devices.forEach((d, k) => {
    const own = r.devices[k];
    if (own) Object.assign(d, { inrushI2tA2s: own.i2tA2s, inrushPeakA: own.peakA, inrushCase: own.case });
  });
  if (points > 0) s.inrushWaveform = sampleWaveform(r.record, points, c.source.turnsRatio);
}

/** Solves a rectifier at each corner (default: `defaultCorners()`) and picks the worst of each figure. */
export function solveRectifier(circuit: EquivalentCircuit, corners: Corner[] = defaultCorners(), options: SolveOptions = {}): RectifierSolution {
  const solved = corners.map((k) => solveCorner(circuit, k, options));
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
