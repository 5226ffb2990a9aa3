/**
 * The stress engine: pure functions from an equivalent circuit and corners to figures.
 */
export type * from './equivalent-circuit';
export { SPICE_DIODE_DEFAULTS } from './equivalent-circuit';
export type * from './solution';
export { solveRectifier, solveCorner, type SolveOptions } from './solve-rectifier';
export { defaultCorners, pickWorst, type CornerInputs, type WorstValue } from './corners';
export { circuitAtCorner, hasPartSpread } from './corner-circuit';
export { isNominalCorner, PART_VERTICES } from './corners';
export {
  thermalVoltageV, scaleDiodeToTemp, diodeVoltageV, diodeCurrentA, fitDiodeFromTwoPoints, lambertWOfExp,
  type DiodeAtTemp, type ForwardPoint,
} from './diode-model';
export { rdsOnOhm, DEFAULT_CONTROLLER_VMIN_V, DEFAULT_GATE_ON_V, DEFAULT_RDSON_TEMP_EXPONENT } from './mosfet-model';
export { classALimitA, classDLimitA, checkHarmonicLimits, type HarmonicCompliance, type HarmonicClass } from './iec61000-3-2';
export { buildNetwork, type Network } from './network';
export { findSteadyState, type SteadyState, type SteadyStateOptions } from './shooting';
export { simulateInrush, type InrushPolarity, type InrushResult } from './inrush';
export { inrushCasesOf, surgeFigureA, worstInrush, type CornerInrush, type DeviceInrush, type InrushStart } from './inrush-cases';
export { settleJunctionTemperatures, type ThermalResult, type ThermalOptions } from './thermal';
export type { Waveform } from './waveform';
export { NON_FINITE_NOTE } from './finite-figures';
export { deviceFiguresOf, type DeviceAtCorner, type DeviceFigures, type SurgeStress } from './device-figures';
export { memoisedSolver, type SolutionCache, type SolveFn } from './solver-memo';
export { UNMODELLED_INDUCTANCE_NOTES } from './network';
