/**
 * The topology comparison: a single-phase bridge as drawn beside four constructions of the same
 * circuit, solved through the caller's (memoised) solver and picked under the file's own policy.
 * The renderers live with the other views (report/comparison-svg.ts, view-content.ts).
 */
export { verdictSummary, type RowVerdict, type RowFailure } from './row-verdict';
export { compareTopologies, type ComparisonRow, type TopologyComparison, type VariantId } from './compare-topologies';
export { ASSUMED_RDSON_BY_VOLTAGE, ASSUMED_RTHJA_K_PER_W, planVariants, type VariantBasis, type VariantPlan } from './variants';
export { isComparable, variantBasisOf } from './compare-topologies';
export { sweepLoad, SWEEP_VIEW_BUDGET, type SweepBudget, solveAtLoad, sweepCorners, sweepFiguresOf, spacedAmounts, SWEEP_POINTS, SWEEP_MAX_CORNER_SOLVES, type LoadSweep, type SweepPoint, type SweepFigures, type SeriesId } from './load-sweep';
export { findCrossovers, type Crossover } from './crossovers';
export { compareEnergy, operatingProfileOf, type EnergyComparison, type EnergyRow, type OperatingProfile, type Payback } from './energy-cost';
