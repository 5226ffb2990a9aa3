/**
 * The topology comparison (DESIGN.md §7): a single-phase bridge solved as drawn and as four
 * constructions of the same circuit (silicon, Schottky, hybrid, synchronous) at the file's own
 * corners, with the worst efficiency, rectifier loss, hottest junction, inrush peak and, when
 * the file states part costs, the cost of each. A pure function of one analysed rectifier and its
 * file's derating policy (which picks the variants' catalog parts); the variants are solved
 * through the caller's solver, the memoised one in the analysis and the language server.
 */
import type { DeviceAnalysis, RectifierAnalysis } from '../equivalent/index';
import type { SolveFn } from '../solve/index';
import type { DeratingPolicy, MosfetRatings } from '../ratings/index';
import type { RectifierSolution, WorstValue } from '../solve/index';
import { deviceFiguresOf, isNominalCorner } from '../solve/index';
import { displayNumber as trim } from '../../../grammar/src/index';
import { judgeRow, type RowVerdict } from './row-verdict';
import { planVariants, type VariantBasis, type VariantId, type VariantPlan } from './variants';

export type { VariantId } from './variants';

/** One row of the comparison. */
export interface ComparisonRow {
  id: VariantId | 'as-drawn';
  label: string;
  construction: string;
  /** False when the construction does not suit this circuit; `reason` says why. */
  applicable: boolean;
  reason?: string;
  /** Lowest efficiency over the corners, with its corner. */
  efficiency?: WorstValue;
  /** Highest total rectifier loss over the corners. */
  rectifierLossW?: WorstValue;
  /** Hottest junction over devices and corners, with the device. */
  hottestTjC?: WorstValue & { device: string };
  inrushPeakA?: WorstValue;
  thermalRunaway: boolean;
  /** Rectifier loss at the nominal corner (nominal line and ambient): the typical operating loss, for energy over life. */
  typicalLossW?: number;
  /** Sum of the parts' costs in the file's own currency, when the file gives them. */
  cost?: number;
  /**
   * Pass or fail under the file's own policy, with the rule each failure falls under; absent for a
   * row not applicable. Only a passing row is a construction the comparison proposes.
   */
  verdict?: RowVerdict;
  assumptions: string[];
}

export interface TopologyComparison {
  rectifierId: string;
  kind: string;
  /** False for rectifiers other than single-phase bridges. */
  applicable: boolean;
  reason?: string;
  rows: ComparisonRow[];
  /** Assumptions shared by every variant (listed once). */
  assumptions: string[];
}

const BRIDGE_KINDS = new Set(['diode-bridge', 'active-bridge', 'hybrid-bridge']);

/**
 * Compares constructions of one rectifier under its file's policy (`FileAnalysis.policy`); the
 * variants are solved with `solve` (a few milliseconds each, nothing when the cache holds them).
 */
export function compareTopologies(analysis: RectifierAnalysis, policy: DeratingPolicy, solve: SolveFn): TopologyComparison {
  const { rectifier, solution, circuit, devices } = analysis;
  const base = { rectifierId: rectifier.id, kind: rectifier.kind };
  if (!isComparable(analysis)) {
    return { ...base, applicable: false, reason: 'the comparison covers single-phase four-device bridges only', rows: [], assumptions: [] };
  }
  const plans = planVariants(variantBasisOf(analysis, policy));
  const costs = partCosts(analysis);
  const asDrawn: ComparisonRow = {
    id: 'as-drawn', label: 'As drawn', construction: describeAsDrawn(analysis), applicable: true,
    ...figuresOf(solution), cost: costs.asDrawn, assumptions: asDrawnNotes(solution),
    verdict: judgeRow(devices.map((d, k) => ({ name: d.ref.name, kind: circuit.devices[k]!.kind, figures: d.figures, ratings: d.ratings.ratings })), policy),
  };
  if (circuit.controllerVminV !== undefined) withControllerLimit(asDrawn.verdict!, analysis);
  const rows = [asDrawn, ...plans.map((plan) => solvePlan(plan, analysis, policy, costs, solve))];
  const shared = plans.map((p) => p.assumptions).reduce((a, b) => a.filter((x) => b.includes(x)));
  for (const row of rows.slice(1)) row.assumptions = row.assumptions.filter((a) => !shared.includes(a));
  return { ...base, applicable: true, rows, assumptions: shared };
}

/** True for the rectifiers the comparison covers: single-phase four-device bridges. */
export function isComparable(analysis: RectifierAnalysis): boolean {
  return BRIDGE_KINDS.has(analysis.rectifier.kind) && analysis.circuit.devices.length === 4;
}

/** What the variants of a bridge are built from; the comparison and the load sweep plan from the same basis. */
export function variantBasisOf(analysis: RectifierAnalysis, policy: DeratingPolicy): VariantBasis {
  const { circuit, devices } = analysis;
  return {
    circuit,
    policy,
    pivV: maxWorst(devices, 'pivV'),
    iavgA: maxWorst(devices, 'iavgA'),
    controllerVminV: circuit.controllerVminV ?? analysis.controller?.vminV?.value,
    ...(circuit.controllerSupply ? { controllerSupply: circuit.controllerSupply } : {}),
    ...mosfetRatingsOf(devices),
  };
}

function solvePlan(plan: VariantPlan, analysis: RectifierAnalysis, policy: DeratingPolicy, costs: PartCosts, solve: SolveFn): ComparisonRow {
  const row: ComparisonRow = {
    id: plan.id, label: plan.label, construction: plan.construction, applicable: !plan.notApplicable && !!plan.circuit,
    thermalRunaway: false, assumptions: plan.assumptions,
  };
  if (plan.notApplicable || !plan.circuit) return { ...row, reason: plan.notApplicable ?? 'not built' };
  // Waveforms are not drawn for variants; leaving them out keeps the comparison quick.
  const { circuit } = plan;
  const solved = solve(circuit, analysis.corners, { waveformPoints: 0 });
  const cost = costs.variant(plan.id);
  const verdict = judgeRow(circuit.devices.map((d, k) => ({
    name: d.name, kind: d.kind, figures: deviceFiguresOf(circuit, solved, k), ratings: plan.ratings?.[k],
  })), policy);
  if (plan.id === 'synchronous') withControllerLimit(verdict, analysis);
  return { ...row, ...figuresOf(solved), ...(cost !== undefined ? { cost } : {}), verdict };
}

/**
 * A construction with the file's controller fails where `controller-overvoltage` would fire: the
 * highest corner's crest above the controller's rated `vmax` (the same comparison as the rule).
 */
function withControllerLimit(verdict: RowVerdict, analysis: RectifierAnalysis): void {
  const vmaxV = analysis.controller?.vmaxV?.value;
  if (vmaxV === undefined) return;
  const crestV = Math.max(0, ...analysis.solution.corners.map((c) => c.lineVrms * Math.SQRT2));
  if (crestV <= vmaxV) return;
  verdict.failures.push({ devices: ['controller'], code: 'controller-overvoltage', text: `input crest ${trim(crestV)} V against the controller's rated vmax ${trim(vmaxV)} V` });
  verdict.status = 'fail';
}

/** The file's own MOSFET ratings, when the bridge as drawn has a rated MOSFET: the MOSFET variants keep the part. */
function mosfetRatingsOf(devices: readonly DeviceAnalysis[]): { mosfetRatings?: MosfetRatings } {
  for (const d of devices) {
    const r = d.ratings.ratings;
    if (r.kind === 'mosfet' && (r.vdsV || r.idA)) return { mosfetRatings: r };
  }
  return {};
}

function figuresOf(solution: RectifierSolution): Pick<ComparisonRow, 'efficiency' | 'rectifierLossW' | 'hottestTjC' | 'inrushPeakA' | 'thermalRunaway' | 'typicalLossW'> {
  const typical = solution.corners.find((c) => isNominalCorner(c.name))?.rectifierLossW;
  let hottest: (WorstValue & { device: string }) | undefined;
  for (const d of solution.devices) {
    if (d.tjC && (!hottest || d.tjC.value > hottest.value)) hottest = { ...d.tjC, device: d.name };
  }
  return {
    efficiency: solution.worst.efficiency, rectifierLossW: solution.worst.rectifierLossW, hottestTjC: hottest,
    inrushPeakA: solution.worst.inrushPeakA, thermalRunaway: solution.devices.some((d) => d.thermalRunaway),
    ...(typical !== undefined ? { typicalLossW: typical } : {}),
  };
}

function asDrawnNotes(solution: RectifierSolution): string[] {
  return solution.notes.some((n) => n.includes('no RθJA')) ? ['no RθJA in the file for some parts: their Tj is taken as ambient'] : [];
}

function maxWorst(devices: readonly DeviceAnalysis[], key: 'pivV' | 'iavgA'): number {
  return Math.max(0, ...devices.map((d) => d.figures.worst?.[key]?.value ?? 0));
}

function describeAsDrawn(analysis: RectifierAnalysis): string {
  const byModel = new Map<string, number>();
  for (const d of analysis.devices) {
    const name = `${d.ref.type === 'diode' ? 'diode' : 'MOSFET'} ${d.model?.name ?? '(no model)'}`;
    byModel.set(name, (byModel.get(name) ?? 0) + 1);
  }
  return [...byModel].map(([name, n]) => `${n} × ${name}`).join(' + ');
}

interface PartCosts {
  asDrawn?: number;
  variant: (id: VariantId) => number | undefined;
}

/**
 * Costs come only from the file's own `cost=` ratings: a variant is costed when the file prices a
 * part of each kind it uses (a diode of the same technology, a MOSFET, the controller).
 */
function partCosts(analysis: RectifierAnalysis): PartCosts {
  const costOf = (d: DeviceAnalysis) => d.ratings.ratings.cost?.value;
  const diodes = analysis.devices.filter((d) => d.ref.type === 'diode');
  const techOf = (d: DeviceAnalysis) => (d.ratings.ratings.kind === 'diode' ? d.ratings.ratings.technology?.value ?? 'silicon' : undefined);
  const diodeCost = (tech: string) => diodes.filter((d) => techOf(d) === tech).map(costOf).find((c) => c !== undefined);
  const fetCost = analysis.devices.filter((d) => d.ref.type === 'mosfet').map(costOf).find((c) => c !== undefined);
  const controllerCost = analysis.controller?.cost?.value;
  const sum = (...parts: (number | undefined)[]) => (parts.every((p) => p !== undefined) ? parts.reduce<number>((a, b) => a + b!, 0) : undefined);
  const hasFets = analysis.devices.some((d) => d.ref.type === 'mosfet') && analysis.rectifier.kind === 'active-bridge';
  return {
    asDrawn: sum(...analysis.devices.map(costOf), ...(hasFets ? [controllerCost] : [])),
    variant: (id) => {
      const si = diodeCost('silicon');
      if (id === 'silicon') return sum(si, si, si, si);
      if (id === 'schottky') { const s = diodeCost('schottky'); return sum(s, s, s, s); }
      if (id === 'hybrid') return sum(si, si, fetCost, fetCost);
      return sum(fetCost, fetCost, fetCost, fetCost, controllerCost);
    },
  };
}
