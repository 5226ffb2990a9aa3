/**
 * The load sweep of a single-phase bridge: the bridge as drawn and every construction of the
 * comparison, with its parts as the comparison picks them at the file's load, solved over a load
 * range at the file's own corners. A point is exactly what an analysis of the file with that
 * single load would find (the same corners, the same solver through the caller's `SolveFn`), so a
 * sweep point at the file's load equals the comparison's row.
 *
 * The range is the file's `*@ load` range, else 5 %–150 % of its load; the points are log-spaced
 * when the range spans more than a decade's half (ratio ≥ 5), else evenly spaced. A resistance
 * is swept as its conductance (more load is less resistance). The work is counted, not timed: in
 * corner solves (with many corners the sweep plans fewer points) and in the solver's periods (a
 * sweep that reaches its limit keeps the points solved, which span the range).
 */
import { solverPeriods, type RectifierAnalysis } from '../equivalent/index';
import type { DeratingPolicy } from '../ratings/index';
import type { Corner, EquivalentCircuit, Load, RectifierSolution, SolveFn } from '../solve/index';
import { isComparable, variantBasisOf, type VariantId } from './compare-topologies';
import { findCrossovers, type Crossover } from './crossovers';
import { planVariants } from './variants';

/** Points a sweep aims for (the "about 20"). */
export const SWEEP_POINTS = 20;
/** Fewest points worth drawing. */
export const SWEEP_MIN_POINTS = 5;
/** Corner solves one sweep may spend (points × constructions × corners): 20 × 5 × 8. */
export const SWEEP_MAX_CORNER_SOLVES = 800;
/**
 * Periods the solver may integrate for one sweep (solutions from the cache count the same, so the
 * cut falls in the same place on every run): about what twenty points of a six-corner bridge take
 * with its thermal loop (the 12 V bench supply of the tests spends about 5600).
 */
export const SWEEP_MAX_PERIODS = 8000;
/** Without a range: the sweep runs from 5 % to 150 % of the file's load (the span). */
export const SWEEP_SPAN: readonly [number, number] = [0.05, 1.5];
/** A range whose ends differ by at least this ratio is swept on a log scale. */
const LOG_RATIO = 5;

export type SeriesId = VariantId | 'as-drawn';

/** A construction's worst-case figures at one load, as the comparison's rows give them. */
export interface SweepFigures {
  /** Lowest over the corners. */
  efficiency?: number;
  /** Highest total rectifier loss (devices and any controller). */
  rectifierLossW?: number;
  /** Hottest junction over devices and corners. */
  hottestTjC?: number;
  /** Lowest average output over the corners. */
  vOutAvgV?: number;
  /** Largest peak-to-peak ripple over the corners. */
  rippleVpp?: number;
  thermalRunaway?: boolean;
}

export interface SweepPoint {
  /** The load amount in the sweep's unit (A, W or Ω). */
  amount: number;
  load: Load;
  /** Each series' figures, by series id; a construction that is not applicable is absent. */
  figures: Partial<Record<SeriesId, SweepFigures>>;
}

export interface LoadSweep {
  rectifierId: string;
  applicable: boolean;
  reason?: string;
  /** What is swept: a current, a power or a resistance (swept as conductance). */
  quantity: 'current' | 'power' | 'resistance';
  unit: 'A' | 'W' | 'Ω';
  /** The points are spaced evenly in log(amount) (else linearly). */
  logScale: boolean;
  /** The file's own load amount (the full end of a range), marked on the charts. */
  fileAmount?: number;
  /** The series in order, with their labels. */
  series: { id: SeriesId; label: string }[];
  /** Ordered from the lightest load to the heaviest. */
  points: SweepPoint[];
  /** Loads where one construction's efficiency overtakes another's. */
  crossovers: Crossover[];
  /** Set when the work limit cut the number of points. */
  limited?: string;
}

const LABELS: Readonly<Record<SeriesId, string>> = {
  'as-drawn': 'As drawn', silicon: 'Silicon bridge', schottky: 'Schottky bridge', hybrid: 'Hybrid bridge', synchronous: 'Synchronous bridge',
};

/** How much one sweep may do: the points it aims for and the solver periods it may integrate. */
export interface SweepBudget {
  points: number;
  maxPeriods: number;
}

/**
 * The editor's comparison view runs in the language server's analysis worker, where a sweep holds
 * up the next analysis: it aims for fewer points and stops at a quarter of the periods.
 */
export const SWEEP_VIEW_BUDGET: Readonly<SweepBudget> = { points: 12, maxPeriods: 2000 };

/** Sweeps one bridge; `points` (or a whole budget) overrides the count, the work limits still apply. */
export function sweepLoad(analysis: RectifierAnalysis, policy: DeratingPolicy, solve: SolveFn, budget: number | SweepBudget = SWEEP_POINTS): LoadSweep {
  const points = typeof budget === 'number' ? budget : budget.points;
  const maxPeriods = typeof budget === 'number' ? SWEEP_MAX_PERIODS : budget.maxPeriods;
  const range = sweepRange(analysis);
  const base = { rectifierId: analysis.rectifier.id, series: [], points: [], crossovers: [] };
  if (!isComparable(analysis) || !range) {
    return { ...base, applicable: false, quantity: 'current', unit: 'A', logScale: false, reason: !range ? 'the bridge has no load to sweep' : 'the sweep covers single-phase four-device bridges only' };
  }
  const plans = planVariants(variantBasisOf(analysis, policy)).filter((p) => !p.notApplicable && p.circuit);
  const circuits: { id: SeriesId; circuit: EquivalentCircuit }[] = [{ id: 'as-drawn', circuit: analysis.circuit }, ...plans.map((p) => ({ id: p.id, circuit: p.circuit! }))];
  const corners = sweepCorners(analysis.corners);
  const affordable = Math.floor(SWEEP_MAX_CORNER_SOLVES / Math.max(1, circuits.length * corners.length));
  const count = Math.max(SWEEP_MIN_POINTS, Math.min(points, affordable));
  const amounts = spacedAmounts(range.light, range.full, count, range.logScale);
  // Solved ends first, then halving the gaps, so a sweep cut short by its work limit still spans the range.
  const solved: SweepPoint[] = [];
  let periods = 0;
  for (const k of refinementOrder(amounts.length)) {
    if (periods >= maxPeriods) break;
    const amount = amounts[k]!;
    const load = loadOf(range.quantity, amount, analysis.circuit.load);
    const figures: SweepPoint['figures'] = {};
    for (const { id, circuit } of circuits) {
      const solution = solveAtLoad(circuit, corners, load, solve);
      periods += solverPeriods(solution);
      figures[id] = sweepFiguresOf(solution);
    }
    solved.push({ amount, load, figures });
  }
  const sweepPoints = solved.sort((a, b) => amounts.indexOf(a.amount) - amounts.indexOf(b.amount));
  const series = circuits.map(({ id }) => ({ id, label: LABELS[id] }));
  const sweep: LoadSweep = {
    ...base, applicable: true, quantity: range.quantity, unit: range.unit, logScale: range.logScale, fileAmount: range.fileAmount,
    series, points: sweepPoints, crossovers: findCrossovers(sweepPoints, series, range.logScale),
  };
  if (count < points) sweep.limited = `${count} points instead of ${points}: ${corners.length} corners × ${circuits.length} constructions would exceed the sweep's ${SWEEP_MAX_CORNER_SOLVES} corner solves`;
  else if (sweepPoints.length < count) sweep.limited = `${sweepPoints.length} points instead of ${count}: the solver's periods reached the sweep's limit of ${maxPeriods}`;
  return sweep;
}

/** 0, n − 1, then the middle of each gap, widest first: every prefix spreads over the whole range. */
export function refinementOrder(n: number): number[] {
  const order = n > 1 ? [0, n - 1] : n === 1 ? [0] : [];
  const gaps: [number, number][] = n > 2 ? [[0, n - 1]] : [];
  while (gaps.length) {
    const [lo, hi] = gaps.shift()!;
    const mid = Math.floor((lo + hi) / 2);
    if (mid === lo) continue;
    order.push(mid);
    gaps.push([lo, mid], [mid, hi]);
  }
  return order;
}

/** The solution of a circuit with its load replaced, at the sweep's corners: what an analysis at that single load solves. */
export function solveAtLoad(circuit: EquivalentCircuit, corners: Corner[], load: Load, solve: SolveFn): RectifierSolution {
  // Waveforms and inrush do not depend on what is charted here; leaving them out keeps the sweep quick.
  return solve({ ...circuit, load }, corners, { waveformPoints: 0, inrush: false });
}

/** The figures the sweep charts, from a solution, as the comparison's rows take them. */
export function sweepFiguresOf(solution: RectifierSolution): SweepFigures {
  const tj = solution.devices.map((d) => d.tjC?.value).filter((v): v is number => v !== undefined);
  const out: SweepFigures = {};
  if (solution.worst.efficiency) out.efficiency = solution.worst.efficiency.value;
  if (solution.worst.rectifierLossW) out.rectifierLossW = solution.worst.rectifierLossW.value;
  if (tj.length) out.hottestTjC = Math.max(...tj);
  if (solution.worst.vOutAvgV) out.vOutAvgV = solution.worst.vOutAvgV.value;
  if (solution.worst.rippleVpp) out.rippleVpp = solution.worst.rippleVpp.value;
  if (solution.devices.some((d) => d.thermalRunaway)) out.thermalRunaway = true;
  return out;
}

/**
 * The file's corners as an analysis with one load would have them: the light-load corner of a
 * range is left out (the light end is a point of the sweep) and the others lose their
 * "full-load" mark.
 */
export function sweepCorners(corners: readonly Corner[]): Corner[] {
  return corners.filter((c) => c.loadLevel !== 'light' && c.load === undefined).map((c) => {
    const { loadLevel: _level, ...rest } = c;
    return { ...rest, name: c.name.replace(/ full-load$/, '') };
  });
}

interface SweepRange {
  quantity: LoadSweep['quantity'];
  unit: LoadSweep['unit'];
  /** In "more load" order: amounts, except a resistance, whose light end is the larger value. */
  light: number;
  full: number;
  fileAmount: number;
  logScale: boolean;
}

function sweepRange(analysis: RectifierAnalysis): SweepRange | undefined {
  const full = analysis.circuit.load;
  const amount = amountOf(full);
  if (amount === undefined || !(amount > 0)) return undefined;
  const lightLoad = analysis.corners.find((c) => c.loadLevel === 'light')?.load;
  const lightAmount = lightLoad && lightLoad.kind === full.kind ? amountOf(lightLoad) : undefined;
  const quantity = full.kind as SweepRange['quantity'];
  const unit = quantity === 'current' ? 'A' : quantity === 'power' ? 'W' : 'Ω';
  // A resistance's load grows as it falls: 5 % of the load is twenty times the resistance.
  const [lo, hi] = quantity === 'resistance' ? [amount / SWEEP_SPAN[0], amount / SWEEP_SPAN[1]] : [amount * SWEEP_SPAN[0], amount * SWEEP_SPAN[1]];
  const light = lightAmount !== undefined && lightAmount > 0 ? lightAmount : lo;
  const heavy = lightAmount !== undefined && lightAmount > 0 ? amount : hi;
  const ratio = Math.max(light, heavy) / Math.min(light, heavy);
  return { quantity, unit, light, full: heavy, fileAmount: amount, logScale: ratio >= LOG_RATIO };
}

function amountOf(load: Load): number | undefined {
  if (load.kind === 'current') return load.a;
  if (load.kind === 'power') return load.w;
  if (load.kind === 'resistance') return load.ohm;
  return undefined;
}

/** The sweep's load at an amount; a power load keeps its vmin (hold-up). */
function loadOf(quantity: SweepRange['quantity'], amount: number, own: Load): Load {
  if (quantity === 'current') return { kind: 'current', a: amount };
  if (quantity === 'resistance') return { kind: 'resistance', ohm: amount };
  return own.kind === 'power' && own.vminV !== undefined ? { kind: 'power', w: amount, vminV: own.vminV } : { kind: 'power', w: amount };
}

/** `count` amounts from `light` to `full`, evenly in log or linearly (a resistance in conductance). */
export function spacedAmounts(light: number, full: number, count: number, logScale: boolean): number[] {
  const n = Math.max(2, count);
  return Array.from({ length: n }, (_, k) => {
    const f = k / (n - 1);
    if (logScale) return light * (full / light) ** f;
    // Linear in the load: in conductance for a resistance (its load current), else in the amount.
    return full < light ? 1 / (1 / light + f * (1 / full - 1 / light)) : light + f * (full - light);
  });
}
