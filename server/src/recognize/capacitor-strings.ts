/**
 * Series capacitor strings across a rectifier's output: DC-link capacitors stacked to reach a
 * voltage no single part is rated for (two 400 V parts for a 480 V three-phase bus), each stage
 * one capacitor or a parallel bank, usually with a balancing resistor across each stage.
 *
 * A string is a path of stages from x to y through internal nodes that hold nothing but the
 * string: capacitors (each alone, or with one series resistor through a node of its own, taken
 * as its ESR) and resistors across a stage (balancing). An internal node that touches anything
 * else (a source, a diode, a load to another node, a midpoint tap) is not a string node, and the
 * path is not taken as a filter. Balancing resistors drawn as several in series are not followed.
 */
import type { FlatElement } from '../circuit/index';
import type { RecognizeContext } from './context';
import type { CapacitorFinding, CapacitorMember, CapacitorStage, CapacitorString } from './rectifier';

/** Stages followed at most; a longer chain is not taken as a string (no DC link stacks more). */
export const MAX_STRING_STAGES = 16;

/** The parallel capacitors across a–b: directly, or each through one series resistor (its ESR). */
export function membersBetween(ctx: RecognizeContext, a: string, b: string): CapacitorMember[] {
  const parts: CapacitorMember[] = [];
  for (const c of ctx.between('capacitor', a, b)) if (c.kind === 'capacitor' && c.value) parts.push({ name: c.name, cF: c.value, esrOhm: 0 });
  ctx.spend(ctx.graph.at(a).length + ctx.graph.at(b).length);
  for (const { element: c, terminal } of [...ctx.graph.at(a), ...ctx.graph.at(b)]) {
    if (c.kind !== 'capacitor' || !c.value || c.terminals.length !== 2) continue;
    const mid = c.terminals[1 - terminal]!.node;
    const far = c.terminals[terminal]!.node === a ? b : a;
    if (mid === a || mid === b) continue;
    const esr = seriesResistor(ctx, mid, far, c);
    if (esr && esr.kind === 'resistor' && esr.value !== undefined) parts.push({ name: c.name, cF: c.value, esrOhm: esr.value, esr: esr.name });
  }
  return parts;
}

/** The series strings from x to y, in the order their first stage appears at x. */
export function findStrings(ctx: RecognizeContext, x: string, y: string): CapacitorString[] {
  const strings: CapacitorString[] = [];
  const tried = new Set<string>();
  ctx.spend(ctx.graph.at(x).length);
  for (const { element, terminal } of ctx.graph.at(x)) {
    if (ctx.exhausted) break;
    // Parts straight across the slot are its parallel members, not the start of a string.
    const end = element.terminals.length === 2 ? element.terminals[1 - terminal]!.node : undefined;
    if (end === x || end === y) continue;
    const hop = hopFrom(ctx, element, terminal);
    if (!hop?.capacitor || hop.far === x || hop.far === y || tried.has(hop.far)) continue;
    tried.add(hop.far);
    const found = walkString(ctx, x, hop.far, y);
    if (found) strings.push(found);
  }
  return strings;
}

/** Follows a string from `first` (its first internal node) to y; undefined when it is not a pure string. */
function walkString(ctx: RecognizeContext, x: string, first: string, y: string): CapacitorString | undefined {
  const nodes = [x];
  let node = first;
  while (node !== y) {
    if (nodes.length > MAX_STRING_STAGES || nodes.includes(node)) return undefined;
    const next = nextNode(ctx, nodes[nodes.length - 1]!, node);
    if (next === undefined) return undefined;
    nodes.push(node);
    node = next;
  }
  nodes.push(y);
  const stages: CapacitorStage[] = [];
  for (let k = 0; k + 1 < nodes.length; k++) {
    const [a, b] = [nodes[k]!, nodes[k + 1]!];
    const members = membersBetween(ctx, a, b);
    if (members.length === 0) return undefined;
    const balancing = ctx.between('resistor', a, b).flatMap((r) => (r.kind === 'resistor' && r.value !== undefined && r.value > 0 ? [{ name: r.name, ohm: r.value }] : []));
    stages.push({ members, balancing });
  }
  return { nodes, stages };
}

/**
 * The one node past the internal node `node` (entered from `prev`), or undefined when `node`
 * holds anything but capacitors and resistors to `prev` or to that one next node, or no
 * capacitor leads on.
 */
function nextNode(ctx: RecognizeContext, prev: string, node: string): string | undefined {
  let next: string | undefined;
  let onward = false;
  const around = ctx.graph.at(node);
  ctx.spend(around.length);
  for (const { element, terminal } of around) {
    const hop = hopFrom(ctx, element, terminal);
    if (!hop) return undefined;
    if (hop.far === prev) continue;
    if (hop.far === node || (next !== undefined && hop.far !== next)) return undefined;
    next = hop.far;
    onward ||= hop.capacitor;
  }
  return onward ? next : undefined;
}

/**
 * Where a capacitor or resistor at a node leads: its other end, or past a node of its own that
 * holds only it and one partner (a capacitor with its series resistor). Undefined for any other
 * element, or a private node holding two capacitors or two resistors.
 */
function hopFrom(ctx: RecognizeContext, element: FlatElement, terminal: number): { far: string; capacitor: boolean } | undefined {
  if ((element.kind !== 'capacitor' && element.kind !== 'resistor') || element.terminals.length !== 2) return undefined;
  const end = element.terminals[1 - terminal]!.node;
  const other = soleOther(ctx, end, element);
  const pair = other && new Set([element.kind, other.element.kind]);
  if (!other || other.element.terminals.length !== 2 || !pair!.has('capacitor') || !pair!.has('resistor')) return { far: end, capacitor: element.kind === 'capacitor' };
  return { far: other.element.terminals[1 - other.terminal]!.node, capacitor: true };
}

/** The one element at `node` besides `element`, or undefined when there are none or several (it stops at the second). */
function soleOther(ctx: RecognizeContext, node: string, element: FlatElement): { element: FlatElement; terminal: number } | undefined {
  let sole: { element: FlatElement; terminal: number } | undefined;
  for (const incidence of ctx.graph.at(node)) {
    ctx.spend(1);
    if (incidence.element === element) continue;
    if (sole) return undefined;
    sole = incidence;
  }
  return sole;
}

/** The one resistor from `mid` to `far`, when `mid` holds nothing but it and the capacitor. */
export function seriesResistor(ctx: RecognizeContext, mid: string, far: string, cap: FlatElement): FlatElement | undefined {
  const others = ctx.graph.at(mid).filter((i) => i.element !== cap);
  if (others.length !== 1) return undefined;
  const r = others[0]!.element;
  return r.kind === 'resistor' && r.terminals.length === 2 && r.terminals[1 - others[0]!.terminal]!.node === far ? r : undefined;
}

/**
 * The group across a slot: parallel members and strings merged into one capacitor. A stage's
 * capacitances add and its ESRs combine in parallel; a string's stages add in series
 * (1/C = Σ 1/Cₖ, ESR = Σ ESRₖ); the branches then combine as parallel members do (capacitances
 * add, ESRs in parallel: exact when the time constants match).
 */
export function mergeGroup(members: readonly CapacitorMember[], strings: readonly CapacitorString[]): CapacitorFinding | undefined {
  if (members.length === 0 && strings.length === 0) return undefined;
  const branches = [...members.map((m) => ({ cF: m.cF, esrOhm: m.esrOhm })), ...strings.map(seriesOf)];
  const found: CapacitorFinding = {
    names: [...members.map((m) => m.name), ...strings.flatMap((s) => s.stages.flatMap((st) => st.members.map((m) => m.name)))],
    cF: branches.reduce((s, b) => s + b.cF, 0),
    esrOhm: parallelOhm(branches.map((b) => b.esrOhm)),
    esrResistors: [...members, ...strings.flatMap((s) => s.stages.flatMap((st) => st.members))].flatMap((m) => (m.esr ? [m.esr] : [])),
    members: [...members],
  };
  if (strings.length) found.strings = [...strings];
  return found;
}

/** A string's series equivalent. */
function seriesOf(string: CapacitorString): { cF: number; esrOhm: number } {
  const stages = string.stages.map((st) => ({ cF: st.members.reduce((s, m) => s + m.cF, 0), esrOhm: parallelOhm(st.members.map((m) => m.esrOhm)) }));
  return { cF: 1 / stages.reduce((s, st) => s + 1 / st.cF, 0), esrOhm: stages.reduce((s, st) => s + st.esrOhm, 0) };
}

/** Resistances in parallel; 0 when any is 0 (a branch without ESR takes the ripple). */
function parallelOhm(values: readonly number[]): number {
  return values.some((v) => v === 0) ? 0 : 1 / values.reduce((s, v) => s + 1 / v, 0);
}

/**
 * The DC path the balancing resistors of a string make across the output: the series sum of
 * each stage's resistors in parallel. None when some stage has no resistor (no DC path but leakage).
 */
export function balancingLoadOf(string: CapacitorString): { ohm: number; elements: string[] } | undefined {
  if (string.stages.some((st) => st.balancing.length === 0)) return undefined;
  const ohm = string.stages.reduce((s, st) => s + 1 / st.balancing.reduce((g, r) => g + 1 / r.ohm, 0), 0);
  return { ohm, elements: string.stages.flatMap((st) => st.balancing.map((r) => r.name)) };
}

/**
 * A capacitor's fraction of its group's ripple current: the group's branches (each part across
 * the output, each string) share it in proportion to their capacitance, a string passes its whole
 * branch current through every stage, and the parts of a stage share that by capacitance (equal
 * impedance phase when ESR is small against 1/ωC). Undefined for a name not in the group.
 */
export function rippleShareOf(found: CapacitorFinding, name: string): number | undefined {
  const key = name.toLowerCase();
  const own = (found.members ?? []).find((m) => m.name.toLowerCase() === key);
  if (own) return own.cF / found.cF;
  for (const string of found.strings ?? []) {
    const stage = string.stages.find((st) => st.members.some((m) => m.name.toLowerCase() === key));
    if (!stage) continue;
    const member = stage.members.find((m) => m.name.toLowerCase() === key)!;
    return (seriesOf(string).cF / found.cF) * (member.cF / stage.members.reduce((s, m) => s + m.cF, 0));
  }
  return undefined;
}
