/**
 * The part-swap fix (DESIGN.md §6): the lowest-rated catalog or parts-file diode that passes
 * every stress rule, for all devices of the rectifier that share the failing device's model (a
 * bridge keeps one part). Candidates are ranked by `selectPassingPart` against the minimum
 * ratings the present stresses and the policy demand (never a silicon Schottky beyond its class);
 * the best few are then re-solved with their own forward model, because a part with another
 * forward drop sees other currents and another junction temperature; a re-solved part must pass
 * every stress check (ratings/stress-checks.ts) in every place of the group. The fix edits each device's
 * model reference and, when the file has no `.model` of that name, adds one with the part's
 * forward model; a thermal resistance the old model's ratings gave is carried over in a `rate`
 * line, since RθJA belongs to the mounting as much as to the part.
 *
 * The ranking is cheap and the re-solves are not, so the fix is offered as a plan naming the first
 * candidate, and verified (the re-solves run) only when the editor resolves it or `fixes` is read.
 */
import type { Fix, FixPlan, TextEdit } from '../../findings/index';
import { diodeParamsOfForwardModel, type RectifierAnalysis } from '../../equivalent/index';
import {
  diodePartsFromFiles, diodeRequirementFromStress, DIODE_CATALOG, passesEveryStress, selectPassingPart,
  type DeratingPolicy, type DiodePart, type DiodeRequirement, type Rated,
} from '../../ratings/index';
import { deviceFiguresOf, solveRectifier, type EquivalentCircuit, type SolveFn } from '../../solve/index';
import type { RuleInput } from '../registry';
import { fmt } from '../rule-context';
import { cardAt, insertLinesAfter, insertLinesBefore } from './text-edits';

/** How many ranked candidates are re-solved before giving up. */
const MAX_VERIFIED = 3;

const cache = new WeakMap<RuleInput, Map<string, FixPlan | null>>();

/**
 * The swap plan for the diode at `index` of `analysis`, or undefined when no candidate meets the
 * present stresses even before re-solving. One plan per group, so the findings of a bridge's four
 * diodes share it and its re-solves.
 */
export function diodeSwapFix(input: RuleInput, analysis: RectifierAnalysis, index: number): FixPlan | undefined {
  const group = groupOf(analysis, index);
  const key = `swap-diode|${analysis.rectifier.id}|${group.join(',')}`;
  const perInput = cache.get(input) ?? new Map<string, FixPlan | null>();
  cache.set(input, perInput);
  if (!perInput.has(key)) perInput.set(key, planSwap(input, analysis, group, key) ?? null);
  return perInput.get(key) ?? undefined;
}

/** Indices of the devices of the rectifier (same type) that share the device's model (the device alone without one). */
export function groupOf(analysis: RectifierAnalysis, index: number): number[] {
  const { model, type } = analysis.devices[index]!.ref;
  if (model === undefined) return [index];
  return analysis.devices.flatMap((d, k) => (d.ref.type === type && d.ref.model === model ? [k] : []));
}

function planSwap(input: RuleInput, analysis: RectifierAnalysis, group: readonly number[], key: string): FixPlan | undefined {
  const current = analysis.devices[group[0]!]!.model?.name.toLowerCase();
  const candidates = [...DIODE_CATALOG, ...diodePartsFromFiles(input.partsFiles ?? [])].filter((p) => p.name.toLowerCase() !== current);
  const requirement = diodeRequirementFromStress(groupStress(analysis, group), input.policy);
  const first = selectPassingPart(requirement, candidates);
  if (!first) return undefined;
  return {
    title: `Find a part that passes every stress check for ${namesOf(analysis, group)} (re-solved; first candidate ${first.name}, ${ratingsText(first)})`,
    key,
    preferred: true,
    unverified: `no part among the first ${MAX_VERIFIED} candidates passes every stress check once re-solved with its own forward model`,
    verify: () => verifySwap(input, analysis, group, requirement, candidates),
  };
}

/** Re-solves the best-ranked candidates in turn; the first that passes every stress check is the fix. */
function verifySwap(
  input: RuleInput, analysis: RectifierAnalysis, group: readonly number[], requirement: DiodeRequirement, all: DiodePart[],
): Fix | undefined {
  let candidates = all;
  for (let tries = 0; tries < MAX_VERIFIED; tries++) {
    const part = selectPassingPart(requirement, candidates);
    if (!part) return undefined;
    if (passesAfterSwap(analysis, group, part, input.policy, input.solve)) return toFix(input, analysis, group, part);
    candidates = candidates.filter((p) => p !== part);
  }
  return undefined;
}

function namesOf(analysis: RectifierAnalysis, group: readonly number[]): string {
  return group.map((k) => analysis.devices[k]!.ref.name).join(', ');
}

function ratingsText(part: DiodePart): string {
  return `${fmt(part.ratings.vrrmV?.value ?? 0)} V, ${fmt(part.ratings.ifavA?.value ?? 0)} A`;
}

function groupStress(analysis: RectifierAnalysis, group: readonly number[]) {
  const worst = (get: (k: number) => number | undefined) => Math.max(0, ...group.map(get).filter((v): v is number => v !== undefined));
  const pivV = worst((k) => analysis.devices[k]!.figures.worst?.pivV?.value);
  const iavgA = worst((k) => analysis.devices[k]!.figures.worst?.iavgA?.value);
  const surges = group.map((k) => analysis.devices[k]!.figures.surge).filter((s) => s !== undefined);
  const most = (get: (s: (typeof surges)[number]) => number) => Math.max(...surges.map(get));
  const surge = surges.length ? { peakA: most((s) => s.peakA), i2tA2s: most((s) => s.i2tA2s), durationS: surges[0]!.durationS } : undefined;
  return surge ? { pivV, iavgA, surge } : { pivV, iavgA };
}

/** Re-solves the rectifier with the part's forward model in the group's places and checks every stress rule. */
export function passesAfterSwap(
  analysis: RectifierAnalysis, group: readonly number[], part: DiodePart, policy: DeratingPolicy, solve: SolveFn = solveRectifier,
): boolean {
  const circuit = swappedCircuit(analysis, group, part);
  const solution = solve(circuit, analysis.corners, { waveformPoints: 0 });
  return group.every((k) => passesEveryStress(deviceFiguresOf(circuit, solution, k), part.ratings, policy));
}

/** The circuit as it will be once the fix is applied: the part's forward model and the RθJA the swapped devices will resolve to. */
function swappedCircuit(analysis: RectifierAnalysis, group: readonly number[], part: DiodePart): EquivalentCircuit {
  const circuit = analysis.circuit;
  const fm = part.forwardModel;
  const params = fm ? diodeParamsOfForwardModel(fm) : undefined;
  const devices = circuit.devices.map((d, k) => {
    if (!group.includes(k) || d.kind !== 'diode') return d;
    const rthjaKPerW = rthjaAfterSwap(analysis.devices[k]!.ratings.ratings.rthjaKPerW, part);
    const { rthjaKPerW: _old, ...rest } = d;
    return { ...rest, ...(params ? { params } : {}), ...(rthjaKPerW === undefined ? {} : { rthjaKPerW }) };
  });
  return { ...circuit, devices };
}

/**
 * The RθJA a swapped device resolves to (ratings/resolve-ratings.ts order): a rate line naming
 * the instance stays; else the new part's own (a catalog part's package value); else the old
 * model's, which `addedLines` carries over.
 */
function rthjaAfterSwap(old: Rated<number> | undefined, part: DiodePart): number | undefined {
  if (old?.origin.kind === 'rate-directive' && old.origin.target === 'instance') return old.value;
  return part.ratings.rthjaKPerW?.value ?? old?.value;
}

function toFix(input: RuleInput, analysis: RectifierAnalysis, group: readonly number[], part: DiodePart): Fix | undefined {
  const edits: TextEdit[] = [];
  for (const k of group) {
    const origin = analysis.devices[k]!.ref.origin;
    const card = cardAt(input.parsed?.get(origin.uri) ?? (origin.uri === input.rootUri ? input.netlist : undefined), origin.span);
    if (card?.kind !== 'diode' || !card.model) return undefined;
    edits.push({ uri: origin.uri, span: card.model.span, newText: part.name });
  }
  const added = addedLines(input, analysis, group, part);
  if (added.length) edits.push(placeLines(input, analysis, group, added));
  return { title: `Use ${part.name} (${ratingsText(part)}) for ${namesOf(analysis, group)}`, edits, preferred: true };
}

/** A `.model` for the part when the circuit has none of that name, and the carried-over RθJA. */
function addedLines(input: RuleInput, analysis: RectifierAnalysis, group: readonly number[], part: DiodePart): string[] {
  const lines: string[] = [];
  const name = part.name.toLowerCase();
  const known = [...input.flat.models.keys()].some((k) => k === name || k.endsWith(`.${name}`));
  const fm = part.forwardModel;
  if (!known && fm) {
    const num = (v: number) => String(Number(v.toPrecision(4)));
    lines.push(`.model ${part.name} D(IS=${num(fm.isA)} N=${num(fm.n)} RS=${num(fm.rsOhm)} EG=${num(fm.egEv)} XTI=${num(fm.xti)} TNOM=${num(fm.tnomC)})`);
  }
  const rth = analysis.devices[group[0]!]!.ratings.ratings.rthjaKPerW;
  const instanceLevel = rth?.origin.kind === 'rate-directive' && rth.origin.target === 'instance';
  if (rth && !instanceLevel && !part.ratings.rthjaKPerW) lines.push(`*@ rate ${part.name} rthja=${fmt(rth.value)}`);
  return lines;
}

function placeLines(input: RuleInput, analysis: RectifierAnalysis, group: readonly number[], lines: string[]): TextEdit {
  const first = analysis.devices[group[0]!]!;
  const uri = first.ref.origin.uri;
  const text = input.parsed?.get(uri)?.text ?? input.netlist.text;
  const model = first.model;
  if (model && model.uri === uri) return insertLinesAfter(uri, text, model.span.end, lines);
  return insertLinesBefore(uri, text, first.ref.origin.span.start, lines);
}
