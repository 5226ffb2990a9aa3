/**
 * A corner's output and source figures out of its period figures, shared by the one-path solve
 * (solve-rectifier.ts) and the three-phase overlap solve (overlap-corner.ts), so both report the
 * same figures in the same way.
 */
import type { EquivalentCircuit, FixedLoad } from './equivalent-circuit';
import type { CornerSolution } from './solution';
import type { Network } from './network';
import type { PeriodFigures } from './figures';
import { computeHarmonics, type HarmonicSource } from './harmonics';
import { checkHarmonicLimits } from './iec61000-3-2';
import type { ThermalResult } from './thermal';
import type { DeviceInrush } from './inrush-cases';
import { sampleWaveform, type WaveformSource } from './waveform';

export function addOutputFigures(s: CornerSolution, f: PeriodFigures, net: Network, c: EquivalentCircuit, notes: string[]): void {
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

/** Source RMS current, power factor, harmonics and the IEC 61000-3-2 comparison of a recorded period. */
export function addSourceFigures(s: CornerSolution, f: PeriodFigures, record: HarmonicSource, net: Network, c: EquivalentCircuit, notes: string[]): void {
  const tr = c.source.turnsRatio > 0 ? c.source.turnsRatio : 1;
  s.inputPowerW = f.inputPowerW;
  if (!(f.sourceIrmsA > 0)) { notes.push('no source current: power factor and harmonics not defined'); return; }
  s.sourceIrmsA = f.sourceIrmsA * tr;
  s.powerFactor = f.inputPowerW / (net.phases * net.lineVrms * f.sourceIrmsA);
  const h = computeHarmonics(record, tr);
  s.harmonicsA = h.harmonicsA; s.thd = h.thd; s.displacementPowerFactor = h.displacementPowerFactor;
  const mains = c.source.mainsVrms;
  s.iecClassA = checkHarmonicLimits(h.harmonicsA, 'A', mains, c.source.freqHz, f.inputPowerW);
  s.iecClassD = checkHarmonicLimits(h.harmonicsA, 'D', mains, c.source.freqHz, f.inputPowerW);
  if (net.phases > 1) notes.push('harmonics are those of line a; the Class A/D comparison assumes a single-phase connection');
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

/** A settled steady state with its thermal loop, as either engine hands it over. */
export interface SettledCorner {
  converged: boolean;
  shootingIterations: number;
  thermal: ThermalResult;
  figs: PeriodFigures;
  record: HarmonicSource & WaveformSource;
  net: Network;
}

/**
 * One corner's solution out of its settled steady state: device figures at their settled Tj, the
 * output and source figures, the waveform, and a note for each device without RθJA or in runaway.
 * Both engines (the one-path network and the overlap bridge) assemble their corners here.
 */
export function assembleCorner(
  base: CornerSolution, settled: SettledCorner, circuit: EquivalentCircuit, points: number,
): CornerSolution {
  const { thermal, figs, net } = settled;
  const notes = base.notes;
  circuit.devices.forEach((d, k) => {
    if (d.rthjaKPerW === undefined) notes.push(`${d.name}: no RθJA given; Tj taken as ambient`);
    if (thermal.runaway[k]) notes.push(`${d.name}: thermal runaway — no settled junction temperature (Tj ≥ ${Math.round(thermal.tjC[k]!)} °C)`);
  });
  const solution: CornerSolution = {
    ...base, converged: settled.converged, shootingIterations: settled.shootingIterations, thermalIterations: thermal.iterations,
    devices: figs.devices.map((d, k) => ({
      name: d.name, pivV: d.pivV, ipkA: d.ipkA, iavgA: d.iavgA, irmsA: d.irmsA, lossW: d.lossW,
      tjC: thermal.tjC[k], thermalRunaway: thermal.runaway[k] ?? false,
    })),
  };
  addOutputFigures(solution, figs, net, circuit, notes);
  addSourceFigures(solution, figs, settled.record, net, circuit, notes);
  if (points > 0) solution.waveform = sampleWaveform(settled.record, points, circuit.source.turnsRatio);
  return solution;
}

/** The switch-on cases' worst, as either engine found it; a note when a case ran out of steps. */
export function addInrushFigures(
  s: CornerSolution, r: { peakA: number; peakCase: string; devices: DeviceInrush[]; record: WaveformSource } | undefined, points: number, turnsRatio: number,
): void {
  if (!r) { s.notes.push('inrush: step budget exhausted'); return; }
  s.inrushPeakA = r.peakA;
  s.inrushCase = r.peakCase;
  s.inrushI2tA2s = Math.max(...r.devices.map((d) => d.i2tA2s));
  s.devices.forEach((d, k) => {
    const own = r.devices[k];
    if (own) Object.assign(d, { inrushI2tA2s: own.i2tA2s, inrushPeakA: own.peakA, inrushCase: own.case });
  });
  if (points > 0) s.inrushWaveform = sampleWaveform(r.record, points, turnsRatio);
}
