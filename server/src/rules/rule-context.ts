/**
 * Helpers the rules share: the derating policy for a file, where a finding about a device goes,
 * the severity of a figure against a rating and its derated limit, and number formatting.
 */
import type { Severity } from '../../../grammar/src/index';
import { anchorOf, type FlatElement, type Origin, type SourceElement } from '../circuit/index';
import type { Finding, RelatedPlace } from '../analysis/findings';
import type { AnalysisSettings } from '../analysis/settings';
import type { DeviceAnalysis, RectifierAnalysis } from '../analysis/rectifier-analysis';
import {
  describeOrigin, describePolicyOrigin, resolveDeratingPolicy,
  type DeratingPolicy, type DeratingSettings, type PolicyEntry, type Rated,
} from '../ratings/index';
import type { DeviceWorst } from '../solve/index';
import type { RuleInput } from './registry';

/** The settings' derating names mapped to the policy keys of `*@ derate`. */
export function deratingSettings(settings: AnalysisSettings): DeratingSettings {
  const d = settings.derating ?? {};
  const out: DeratingSettings = {};
  // Only real numbers count: an unset editor setting may arrive as null.
  const given = (v: unknown): v is number => typeof v === 'number' && Number.isFinite(v);
  if (given(d.reverseVoltage)) out.vr = d.reverseVoltage;
  if (given(d.forwardCurrent)) out.if = d.forwardCurrent;
  if (given(d.surgeCurrent)) out.ifsm = d.surgeCurrent;
  if (given(d.junctionTempC)) out.tj = d.junctionTempC;
  if (given(d.capacitorVoltage)) out.cap = d.capacitorVoltage;
  return out;
}

const policies = new WeakMap<RuleInput, DeratingPolicy>();

/** The file's derating policy: directive, then settings, then the cited defaults. */
export function policyOf(input: RuleInput): DeratingPolicy {
  let policy = policies.get(input);
  if (!policy) {
    policy = resolveDeratingPolicy(input.flat.directives, deratingSettings(input.settings)).policy;
    policies.set(input, policy);
  }
  return policy;
}

/** Where a finding about an element goes, with the inner card as related when it sits in a subcircuit. */
export function placeOf(origin: Origin, name: string): Pick<Finding, 'uri' | 'span' | 'related'> {
  const anchor = anchorOf(origin);
  if (origin.chain.length === 0) return anchor;
  const related: RelatedPlace[] = [{ uri: origin.uri, span: origin.nameSpan, message: `${name} is defined here` }];
  return { ...anchor, related };
}

/** One device of an analysed rectifier with its worst figures. */
export interface DeviceView {
  analysis: RectifierAnalysis;
  index: number;
  device: DeviceAnalysis;
  worst: DeviceWorst | undefined;
}

/** Every device of every rectifier of the file. */
export function devicesOf(input: RuleInput): DeviceView[] {
  return input.rectifiers.flatMap((analysis) =>
    analysis.devices.map((device, index) => ({ analysis, index, device, worst: analysis.solution.devices[index] })));
}

/**
 * Severity of a figure against a rating and the allowed fraction of it: beyond the rating itself
 * the part is outside what its maker guarantees (error); beyond only the policy's fraction it
 * lacks the margin the policy asks for (warning). Undefined when within the policy.
 */
export function severityOf(figure: number, rating: number, allowedFraction: number): Severity | undefined {
  if (figure > rating) return 'error';
  if (figure > rating * allowedFraction) return 'warning';
  return undefined;
}

/** A number with three significant digits, without exponent noise: 358, 0.142, 1.05, 1200. */
export function fmt(value: number): string {
  if (!Number.isFinite(value)) return String(value);
  const abs = Math.abs(value);
  if (abs >= 1000) return String(Math.round(value));
  return String(Number(value.toPrecision(3)));
}

/** A fraction as a whole percentage: 0.8 → "80 %". */
export function pct(fraction: number): string {
  return `${Math.round(fraction * 100)} %`;
}

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
