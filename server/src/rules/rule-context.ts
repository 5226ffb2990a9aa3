/**
 * Helpers the rules share: where a finding about a device goes, the devices of the file with
 * their figures, and number formatting. The policy is `input.policy`; the stress thresholds are
 * ratings/stress-checks.ts.
 */
import { displayNumber, displayPercent } from '../../../grammar/src/index';
import { anchorOf, type FlatElement, type Origin, type SourceElement } from '../circuit/index';
import type { Finding, RelatedPlace } from '../findings/index';
import type { DeviceAnalysis, RectifierAnalysis } from '../equivalent/index';
import {
  describeOrigin, describePolicyOrigin, stressVerdict, type PolicyEntry, type Rated, type StressKind, type StressVerdict,
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

/** Every device of every rectifier of the file. */
export function devicesOf(input: RuleInput): DeviceView[] {
  return input.rectifiers.flatMap((analysis) =>
    analysis.devices.map((device, index) => ({ analysis, index, device, worst: device.figures.worst })));
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
    const verdict = stressVerdict(kind, view.device.figures, view.device.ratings.ratings, input.policy);
    if (verdict?.status !== 'warning' && verdict?.status !== 'error') return [];
    return build(view, verdict as FailedStress) ?? [];
  });
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

/** Look-ups over the flat circuit that several rules need, built once per analysis. */
export interface CircuitIndex {
  elementKeys: ReadonlySet<string>;
  nodeNames: ReadonlySet<string>;
  voltageSources: readonly SourceElement[];
  byKey: ReadonlyMap<string, FlatElement>;
}

const indexes = new WeakMap<RuleInput, CircuitIndex>();

export function circuitIndexOf(input: RuleInput): CircuitIndex {
  let index = indexes.get(input);
  if (!index) {
    const elements = input.flat.elements;
    index = {
      elementKeys: new Set(elements.map((e) => e.key)),
      nodeNames: new Set(elements.flatMap((e) => e.terminals.map((t) => t.node))),
      voltageSources: elements.filter((e): e is SourceElement => e.kind === 'vsource'),
      byKey: new Map(elements.map((e) => [e.key, e])),
    };
    indexes.set(input, index);
  }
  return index;
}
