/**
 * Helpers the rules share: where a finding about a device goes, the devices of the file with
 * their figures, and number formatting. The policy is `input.policy`; the stress thresholds are
 * ratings/stress-checks.ts.
 */
import { displayNumber, displayPercent } from '../../../grammar/src/index';
import { anchorOf, buildNodeGraph, NextCircuitMemo, nodeGraphOf, type FlatCircuit, type FlatElement, type FlatInstance, type NodeGraph, type Origin, type PassiveElement, type SourceElement } from '../circuit/index';
import type { Finding, RelatedPlace } from '../findings/index';
import type { DeviceAnalysis, RectifierAnalysis } from '../equivalent/index';
import {
  describeOrigin, describePolicyOrigin, stressVerdicts, type PolicyEntry, type Rated, type StressKind, type StressVerdict,
} from '../ratings/index';
import type { DeviceWorst } from '../solve/index';
import type { RuleInput } from './registry';

/** Where a finding about an element goes, with the inner card as related when it sits in a subcircuit. */
export function placeOf(origin: Origin, name: string): Pick<Finding, 'uri' | 'span' | 'related'> {
  const anchor = anchorOf(origin);
  if (origin.chain.length === 0) return anchor;
  const related: RelatedPlace[] = [{ uri: origin.uri, span: origin.nameSpan, message: `${name} is defined here` }];
  return { ...anchor, related };
}

/** One device of an analysed rectifier with its worst figures (the device's own `figures.worst`). */
export interface DeviceView {
  analysis: RectifierAnalysis;
  index: number;
  device: DeviceAnalysis;
  worst: DeviceWorst | undefined;
}

const deviceViews = new WeakMap<RuleInput, readonly DeviceView[]>();

/** Every device of every rectifier of the file, listed once per analysis (most rules walk them). */
export function devicesOf(input: RuleInput): readonly DeviceView[] {
  let views = deviceViews.get(input);
  if (!views) {
    views = input.rectifiers.flatMap((analysis) => analysis.devices.map((device, index) => ({ analysis, index, device, worst: device.figures.worst })));
    deviceViews.set(input, views);
  }
  return views;
}

/** A stress verdict that fails the policy: its status is the finding's severity. */
export type FailedStress = StressVerdict & { status: 'warning' | 'error' };

/**
 * The findings of a stress rule, in device order: for each device that fails its `stress`
 * (ratings/stress-checks.ts; unrated and passing devices give none), the finding `build` words.
 */
export function stressFindings(
  input: RuleInput, stress: StressKind | ((device: DeviceAnalysis) => StressKind), build: (view: DeviceView, failed: FailedStress) => Finding | undefined,
): Finding[] {
  return devicesOf(input).flatMap((view) => {
    const kind = typeof stress === 'function' ? stress(view.device) : stress;
    const verdict = verdictsOf(input, view.device).find((v) => v.stress === kind);
    if (verdict?.status !== 'warning' && verdict?.status !== 'error') return [];
    return build(view, verdict as FailedStress) ?? [];
  });
}

const verdictLists = new WeakMap<RuleInput, Map<DeviceAnalysis, readonly StressVerdict[]>>();

/**
 * Every stress verdict of a device under the file's policy, judged once per analysis: each stress
 * rule picks its own from the list (`stressVerdict` would judge them all again for each rule).
 */
function verdictsOf(input: RuleInput, device: DeviceAnalysis): readonly StressVerdict[] {
  let byDevice = verdictLists.get(input);
  if (!byDevice) verdictLists.set(input, (byDevice = new Map()));
  let verdicts = byDevice.get(device);
  if (!verdicts) byDevice.set(device, (verdicts = stressVerdicts(device.figures, device.ratings.ratings, input.policy)));
  return verdicts;
}

/** A number for a message: three significant digits, never NaN or a raw double (grammar/src/display.ts). */
export const fmt = displayNumber;

/** A fraction as a whole percentage: 0.8 → "80 %" (grammar/src/display.ts). */
export const pct = displayPercent;

/** "policy allows 80 % (origin)". */
export function allowsText(entry: PolicyEntry<number>): string {
  return `policy allows ${pct(entry.value)} (${describePolicyOrigin(entry.origin)})`;
}

/** A short tag for a rating that is not one the user wrote: the BV fallback, a catalog value. */
export function ratingTag(rated: Rated<number>): string {
  const o = rated.origin;
  if (o.kind === 'model-param') return ` (from .model ${o.modelName} ${o.param.toUpperCase()}, a fallback)`;
  if (o.kind === 'catalog') return ` (${o.partName}, built-in catalog)`;
  if (o.kind === 'parts-file') return ` (parts file, ${o.partName})`;
  return '';
}

/** The full origin of a rating, for related messages. */
export function ratingOriginText(rated: Rated<number>): string {
  return describeOrigin(rated.origin);
}

/** The same key for a two-node pair in either order, for look-ups of parts across two nodes. */
export function nodePairKey(a: string, b: string): string {
  return a < b ? `${a}\u0000${b}` : `${b}\u0000${a}`;
}

/**
 * Look-ups over the flat circuit that the rules need, built in one pass per analysis so that no
 * rule scans the whole circuit for each rectifier or device (at 50 bridges the scans were most of
 * the rules' time), or taken from the root's last analysis where its circuit is the same
 * (`keyCensusOf`). The node names (wanted only by fixes) and the resistors across two nodes are
 * read off the node graph recognition built.
 */
export interface CircuitIndex {
  elementKeys: ReadonlySet<string>;
  /** Keys held by more than one element, or by more than one instance: usually none, so `duplicate-name` builds no map of its own. */
  repeatedKeys: ReadonlySet<string>;
  /** Node names in use, for fixes that make a new node: the node graph's id map, which keeps no element alive after `compactAfterRules`. */
  readonly nodeNames: { has(name: string): boolean };
  voltageSources: readonly SourceElement[];
  capacitorsByKey: ReadonlyMap<string, PassiveElement>;
  /** Resistors of known value ≥ 0 with two terminals, between nodes a and b (either way round), in element order. */
  resistorsAcross(a: string, b: string): readonly FlatElement[];
  /** Two-terminal resistors of exactly 0 Ω, in element order. */
  zeroOhmResistors: readonly FlatElement[];
  instancesByKey: ReadonlyMap<string, FlatInstance>;
}

const indexes = new WeakMap<RuleInput, CircuitIndex>();

export function circuitIndexOf(input: RuleInput): CircuitIndex {
  let index = indexes.get(input);
  if (!index) indexes.set(input, (index = buildIndex(input.flat)));
  return index;
}

function buildIndex(flat: FlatCircuit, graphOf: (flat: FlatCircuit) => NodeGraph = nodeGraphOf, census = keyCensusOf(flat)): CircuitIndex {
  const { voltageSources, capacitorsByKey, zeroOhmResistors } = census.kinds;
  return {
    elementKeys: census.elementKeys,
    repeatedKeys: census.repeatedKeys,
    get nodeNames() {
      return graphOf(flat).nodeIds;
    },
    // From the node graph: the few pairs asked about (a device's two ends) need no index of every resistor.
    resistorsAcross(a, b) {
      const found: FlatElement[] = [];
      for (const { element: e, terminal } of graphOf(flat).at(a)) {
        if (e.kind !== 'resistor' || e.terminals.length !== 2 || e.value === undefined || !(e.value >= 0)) continue;
        // A resistor with both ends on a is listed at a twice: once is enough.
        if (a === b ? terminal === 0 && e.terminals[1]!.node === a : e.terminals[1 - terminal]!.node === b) found.push(e);
      }
      return found;
    },
    voltageSources, capacitorsByKey, zeroOhmResistors, instancesByKey: census.instancesByKey,
  };
}

/** The index's look-ups by key (the keys in use, those held twice, the first instance of each key) and by kind. */
interface KeyCensus {
  elementKeys: ReadonlySet<string>;
  repeatedKeys: ReadonlySet<string>;
  instancesByKey: ReadonlyMap<string, FlatInstance>;
  kinds: ElementsByKind;
}

type ElementsByKind = Pick<CircuitIndex, 'voltageSources' | 'capacitorsByKey' | 'zeroOhmResistors'>;

function elementsByKind(elements: readonly FlatElement[]): ElementsByKind {
  const voltageSources: SourceElement[] = [];
  const capacitorsByKey = new Map<string, PassiveElement>();
  const zeroOhmResistors: FlatElement[] = [];
  for (const e of elements) {
    if (e.kind === 'vsource') voltageSources.push(e);
    // A later element of the same key replaces an earlier one (a duplicate is its own finding).
    else if (e.kind === 'capacitor') capacitorsByKey.set(e.key, e);
    else if (e.kind === 'resistor' && e.value === 0 && e.terminals.length === 2) zeroOhmResistors.push(e);
  }
  return { voltageSources, capacitorsByKey, zeroOhmResistors };
}

/**
 * The last census of a root's flat circuit, kept as the node graph keeps its terminal index
 * (circuit/node-graph.ts): an edit that renames nothing leaves every key where it was, and the
 * sets of 50,000 keys cost some 8 ms to make again; a comment line leaves every element the same
 * object, and the lists by kind stand too.
 */
const lastCensus = new NextCircuitMemo<{ elements: readonly FlatElement[]; instances: readonly FlatInstance[]; census: KeyCensus }>();

function keyCensusOf(flat: FlatCircuit): KeyCensus {
  const last = lastCensus.get(flat.elements);
  let census: KeyCensus;
  if (last && sameKeys(last.elements, flat.elements) && sameKeys(last.instances, flat.instances)) {
    // The elements and instances themselves may be new objects (a value typed, a definition
    // edited): the lists by kind and the map of instances then point at these.
    const kinds = sameItems(last.elements, flat.elements) ? last.census.kinds : elementsByKind(flat.elements);
    const instancesByKey = sameItems(last.instances, flat.instances) ? last.census.instancesByKey : firstInstances(flat.instances);
    census = { ...last.census, instancesByKey, kinds };
  } else census = takeCensus(flat);
  lastCensus.set(flat.elements, { elements: flat.elements, instances: flat.instances, census });
  return census;
}

function takeCensus(flat: FlatCircuit): KeyCensus {
  const elementKeys = new Set<string>();
  const repeatedKeys = new Set<string>();
  for (const e of flat.elements) {
    const size = elementKeys.size;
    elementKeys.add(e.key);
    if (elementKeys.size === size) repeatedKeys.add(e.key);
  }
  const instancesByKey = firstInstances(flat.instances);
  if (instancesByKey.size < flat.instances.length) {
    const seen = new Set<string>();
    for (const i of flat.instances) if (seen.has(i.key)) repeatedKeys.add(i.key); else seen.add(i.key);
  }
  return { elementKeys, repeatedKeys, instancesByKey, kinds: elementsByKind(flat.elements) };
}

/** The first instance of a key, as a search in card order finds it. */
function firstInstances(instances: readonly FlatInstance[]): Map<string, FlatInstance> {
  const byKey = new Map<string, FlatInstance>();
  for (const i of instances) if (!byKey.has(i.key)) byKey.set(i.key, i);
  return byKey;
}

function sameKeys(a: readonly { key: string }[], b: readonly { key: string }[]): boolean {
  if (a.length !== b.length) return false;
  for (let i = 0; i < a.length; i++) if (a[i] !== b[i] && a[i]!.key !== b[i]!.key) return false;
  return true;
}

function sameItems<T>(a: readonly T[], b: readonly T[]): boolean {
  if (a.length !== b.length) return false;
  for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) return false;
  return true;
}

/**
 * The flat circuit cut down, once the rules have run, to what is still read afterwards: the views,
 * the review record and the capacitor hover (the rectifiers' filter capacitors and the sources),
 * the fixes computed on request (the models, and the names in use, which the index keeps from the
 * whole circuit so that a fix never picks a name that is taken). Every element of every card is
 * otherwise most of an analysis's memory, twice over in an adapter that keeps two analyses.
 */
export function compactAfterRules(input: RuleInput): FlatCircuit {
  const whole = circuitIndexOf(input);
  const nodeNames = whole.nodeNames;
  const wanted = new Set<string>();
  for (const a of input.rectifiers) {
    for (const found of a.rectifier.surroundings.capacitors) for (const n of found.names) wanted.add(n.toLowerCase());
    for (const d of a.rectifier.devices) wanted.add(d.key);
  }
  const elements = input.flat.elements.filter((e) => e.kind === 'vsource' || wanted.has(e.key));
  const flat: FlatCircuit = { ...input.flat, elements, instances: [] };
  // The whole circuit's keys (so that a fix never takes a name in use) over the cut-down circuit's
  // own lists and graph, which no one keeps: the whole circuit's are what the next analysis may reuse.
  let graph: NodeGraph | undefined;
  const census: KeyCensus = { elementKeys: whole.elementKeys, repeatedKeys: whole.repeatedKeys, instancesByKey: new Map(), kinds: elementsByKind(elements) };
  // Field by field: a spread would read `nodeNames`, which makes the cut-down circuit's graph.
  const { voltageSources, capacitorsByKey, resistorsAcross, zeroOhmResistors, instancesByKey, elementKeys, repeatedKeys } = buildIndex(flat, (f) => (graph ??= buildNodeGraph(f)), census);
  indexes.set(input, { voltageSources, capacitorsByKey, resistorsAcross, zeroOhmResistors, instancesByKey, elementKeys, repeatedKeys, nodeNames });
  input.flat = flat;
  return flat;
}
