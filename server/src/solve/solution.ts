/**
 * The solver's result types: plain JSON-friendly data, SI units in the field names (DESIGN.md
 * §8). A figure that could not be computed is absent and a note says why; no field is ever NaN.
 */
import type { Load, PartVertex, RectifierKind } from './equivalent-circuit';
import type { HarmonicCompliance } from './iec61000-3-2';
import type { Waveform } from './waveform';
import type { WorstValue } from './corners';

export interface DeviceSolution {
  name: string;
  pivV?: number;
  ipkA?: number;
  iavgA?: number;
  irmsA?: number;
  lossW?: number;
  tjC?: number;
  /** No settled junction temperature (electro-thermal loop diverged). */
  thermalRunaway: boolean;
  /** ∫i²dt of this device over the first half-cycle after switch-on (worst case of the inrush check). */
  inrushI2tA2s?: number;
  /** This device's largest current in the first half-cycle of that case. */
  inrushPeakA?: number;
  /** The inrush case that gave both, in words ("hot restart at the negative crest"). */
  inrushCase?: string;
}

export interface CornerSolution {
  name: string;
  lineScale: number;
  /** RMS of the source EMF at this corner (per line, rectifier side). */
  lineVrms: number;
  ambientC: number;
  /** Line frequency at this corner. */
  freqHz?: number;
  /** The load the directive (or the drawn resistors) give at this corner; a fixed load beside it is the circuit's `fixedLoad`. */
  load?: Load;
  /** The end of a load range this corner takes; absent when the load is one value. */
  loadLevel?: 'full' | 'light';
  /** The part-tolerance vertex solved; absent: nominal parts. */
  parts?: PartVertex;
  vOutAvgV?: number;
  vOutRmsV?: number;
  vOutMinV?: number;
  vOutMaxV?: number;
  rippleVpp?: number;
  /** Largest RMS current among the filter capacitors. */
  capRippleIrmsA?: number;
  /** RMS current of each filter capacitor, in the circuit's order. */
  capacitorIrmsA?: number[];
  outputPowerW?: number;
  /** Devices plus the controller's quiescent loss (`controllerLossW`, active bridges with a rated `iq`). */
  rectifierLossW?: number;
  controllerLossW?: number;
  inputPowerW?: number;
  /** Output power over output power plus rectifier loss. */
  efficiency?: number;
  /** Source RMS current referred to the mains side by the turns ratio. */
  sourceIrmsA?: number;
  powerFactor?: number;
  displacementPowerFactor?: number;
  /** Harmonic distortion of the source current, orders 2–40 over the fundamental. */
  thd?: number;
  /** Mains-side RMS of harmonic n at index n − 1, n = 1…40. */
  harmonicsA?: number[];
  iecClassA?: HarmonicCompliance;
  iecClassD?: HarmonicCompliance;
  inrushPeakA?: number;
  /** The inrush case of the largest peak, in words. */
  inrushCase?: string;
  /** Largest per-device I²t of the first half-cycle after switch-on. */
  inrushI2tA2s?: number;
  /** Time from the steady-state minimum to the load's vmin with the source gone (constant-power load). */
  holdUpS?: number;
  devices: DeviceSolution[];
  waveform?: Waveform;
  inrushWaveform?: Waveform;
  converged: boolean;
  shootingIterations: number;
  thermalIterations: number;
  notes: string[];
}

/** Worst value of each rectifier figure across corners, with the corner that produced it. */
export interface WorstFigures {
  vOutAvgV?: WorstValue;
  vOutMaxV?: WorstValue;
  rippleVpp?: WorstValue;
  capRippleIrmsA?: WorstValue;
  efficiency?: WorstValue;
  powerFactor?: WorstValue;
  thd?: WorstValue;
  sourceIrmsA?: WorstValue;
  rectifierLossW?: WorstValue;
  inrushPeakA?: WorstValue;
  inrushI2tA2s?: WorstValue;
  holdUpS?: WorstValue;
}

/** Worst value of each device figure across corners. */
export interface DeviceWorst {
  name: string;
  pivV?: WorstValue;
  ipkA?: WorstValue;
  iavgA?: WorstValue;
  irmsA?: WorstValue;
  lossW?: WorstValue;
  tjC?: WorstValue;
  thermalRunaway: boolean;
}

export interface RectifierSolution {
  kind: RectifierKind;
  corners: CornerSolution[];
  worst: WorstFigures;
  devices: DeviceWorst[];
  notes: string[];
}
