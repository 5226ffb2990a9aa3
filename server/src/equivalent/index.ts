/**
 * The equivalent-circuit step, after ratings: each recognised rectifier with its resolved ratings,
 * its equivalent circuit, its corners and its solution (through the caller's solver).
 */
export { analyseRectifiers, rateRectifier, solverPeriods, type CapacitorAnalysis, type DeviceAnalysis, type RectifierAnalysis } from './rectifier-analysis';
export { toEquivalentCircuit, controllersOf, DEFAULT_RDSON_OHM, type RatedParts } from './to-equivalent-circuit';
export { capacitorStressOf, type CapacitorAtCorner, type CapacitorStress } from './capacitor-stress';
export { bodyDiodeParams, diodeParamsOfForwardModel, diodeParamsOfModel, VSD_DEFAULT_CURRENT_A } from './diode-params';
export { controllerSupplyOf, quiescentCurrentA } from './controller-supply';
export { stageVoltage, type GroupVoltage, type StageShare } from './string-share';
export { relaxString, type StringRelaxation } from './string-relaxation';
