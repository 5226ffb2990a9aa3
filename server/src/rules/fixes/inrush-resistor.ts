/**
 * The inrush-resistor fix (DESIGN.md §6): a series resistor of an IEC 60063 E12 value between
 * the AC source and the bridge, the smallest that keeps every device's switch-on surge within
 * its derated IFSM. The source card's first node is renamed to a new node and the resistor joins
 * the new node to the old one, so the netlist stays valid for any simulator.
 *
 * The value is found by re-solving the high-line corners (where the inrush is worst, in every
 * inrush case: both crests, and with an NTC limiter the hot restart, which a fixed resistor
 * limits where the NTC no longer does) with the
 * added resistance in the source loop — referred through a transformer by the square of its
 * turns ratio — and bisecting the E12 ladder from 0.1 Ω to 1 kΩ (surge falls monotonically as
 * series resistance rises). The title states the steady-state dissipation I²R at high line, which
 * the designer must rate the resistor for (or choose an NTC thermistor of that cold value).
 * Offered as a plan (the resistor's place and name), the bisection's re-solves run when it is chosen.
 */
import type { Fix, FixPlan } from '../../findings/index';
import type { RectifierAnalysis } from '../../equivalent/index';
import type { SourceElement } from '../../circuit/index';
import { E_SERIES_SOURCE, nextPreferredValue, stressVerdict, type DeratingPolicy } from '../../ratings/index';
import { deviceFiguresOf, solveRectifier, type RectifierSolution } from '../../solve/index';
import type { SolveFn } from '../../solve/index';
import type { RuleInput } from '../registry';
import { circuitIndexOf, fmt } from '../rule-context';
import { cardAt, insertLinesAfter, spiceNumber } from './text-edits';

/** The E12 ladder the fix searches, 0.1 Ω … 1 kΩ. */
export const INRUSH_LADDER_OHM: readonly number[] = ladder(0.1, 1000);

const cache = new WeakMap<RuleInput, Map<string, FixPlan | null>>();

/** The inrush-resistor plan for a rectifier, or undefined when it has no single source card to put it beside. */
export function inrushResistorFix(input: RuleInput, analysis: RectifierAnalysis): FixPlan | undefined {
  const perInput = cache.get(input) ?? new Map<string, FixPlan | null>();
  cache.set(input, perInput);
  if (!perInput.has(analysis.rectifier.id)) perInput.set(analysis.rectifier.id, planResistor(input, analysis) ?? null);
  return perInput.get(analysis.rectifier.id) ?? undefined;
}

function planResistor(input: RuleInput, analysis: RectifierAnalysis): FixPlan | undefined {
  const source = sourceOf(input, analysis);
  const card = source && cardAt(input.netlist, source.origin.span);
  if (!source || card?.kind !== 'source' || !card.nodes[0]) return undefined;
  return {
    title: `Find the smallest E12 series resistor for ${source.name} that holds the switch-on surge within IFSM (re-solved)`,
    key: `inrush-resistor|${analysis.rectifier.id}`,
    unverified: `no E12 value from ${fmt(INRUSH_LADDER_OHM[0]!)} Ω to ${fmt(INRUSH_LADDER_OHM.at(-1)!)} Ω holds the switch-on surge within IFSM`,
    verify: () => buildFix(input, analysis, source),
  };
}

function buildFix(input: RuleInput, analysis: RectifierAnalysis, source: SourceElement): Fix | undefined {
  const card = cardAt(input.netlist, source.origin.span);
  if (card?.kind !== 'source' || !card.nodes[0]) return undefined;
  const policy = input.policy;
  const trial = (ohm: number) => solveWithSeries(analysis, ohm, input.solve);
  let lo = 0;
  let hi = INRUSH_LADDER_OHM.length - 1;
  let best: { ohm: number; solution: RectifierSolution } | undefined;
  while (lo <= hi) {
    const mid = (lo + hi) >> 1;
    const solution = trial(INRUSH_LADDER_OHM[mid]!);
    if (surgePasses(analysis, solution, policy)) { best = { ohm: INRUSH_LADDER_OHM[mid]!, solution }; hi = mid - 1; } else lo = mid + 1;
  }
  if (!best) return undefined;
  const index = circuitIndexOf(input);
  const name = freshName('RINRUSH', (n) => index.elementKeys.has(n.toLowerCase()));
  const oldNode = card.nodes[0];
  const newNode = freshName(`${oldNode.text}_rin`, (n) => index.nodeNames.has(n.toLowerCase()));
  const irms = Math.max(...best.solution.corners.map((c) => c.sourceIrmsA ?? 0));
  return {
    title: `Insert ${name} ${fmt(best.ohm)} Ω (E12, ${E_SERIES_SOURCE.split(',')[0]}) in series with ${source.name}: ` +
      `switch-on surge within IFSM; it dissipates about ${fmt(irms * irms * best.ohm)} W at high line`,
    edits: [
      { uri: input.rootUri, span: oldNode.span, newText: newNode },
      insertLinesAfter(input.rootUri, input.netlist.text, card.span.end, [`${name} ${newNode} ${oldNode.text} ${spiceNumber(best.ohm)}`]),
    ],
  };
}

/** The rectifier's single voltage source, when it is a card of the root file. */
function sourceOf(input: RuleInput, analysis: RectifierAnalysis): SourceElement | undefined {
  const found = analysis.rectifier.surroundings.source;
  if (found.assumed || analysis.rectifier.kind === 'three-phase-bridge') return undefined;
  const names = new Set(found.elements.map((n) => n.toLowerCase()));
  const sources = circuitIndexOf(input).voltageSources.filter((e) => names.has(e.key));
  const source = sources.length === 1 ? sources[0] : undefined;
  return source && source.origin.chain.length === 0 && source.origin.uri === input.rootUri ? source : undefined;
}

/** The high-line corners re-solved with `ohm` more in series on the source side. */
export function solveWithSeries(analysis: RectifierAnalysis, ohm: number, solve: SolveFn = solveRectifier): RectifierSolution {
  const src = analysis.circuit.source;
  const tr = src.turnsRatio > 0 ? src.turnsRatio : 1;
  const circuit = { ...analysis.circuit, source: { ...src, seriesROhm: src.seriesROhm + ohm * tr * tr } };
  const top = Math.max(...analysis.corners.map((c) => c.lineScale));
  return solve(circuit, analysis.corners.filter((c) => c.lineScale === top), { waveformPoints: 0 });
}

/** Whether every rated device's surge is within its derated IFSM in `solution` (an unrated one is missing-rating's). */
export function surgePasses(analysis: RectifierAnalysis, solution: RectifierSolution, policy: DeratingPolicy): boolean {
  return analysis.devices.every((d, k) => {
    const status = stressVerdict('surge', deviceFiguresOf(analysis.circuit, solution, k), d.ratings.ratings, policy)?.status;
    return status === undefined || status === 'pass' || status === 'unrated';
  });
}

function freshName(base: string, taken: (name: string) => boolean): string {
  if (!taken(base)) return base;
  for (let k = 2; ; k++) if (!taken(`${base}${k}`)) return `${base}${k}`;
}

function ladder(fromOhm: number, toOhm: number): number[] {
  const out: number[] = [];
  for (let v = nextPreferredValue(fromOhm, 'E12', 'up'); v !== undefined && v <= toOhm; v = nextPreferredValue(v * 1.0001, 'E12', 'up')) out.push(v);
  return out;
}
