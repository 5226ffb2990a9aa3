/**
 * `shorted-source` — a short the analysis would otherwise pass over: a voltage source with both
 * terminals on one node, a 0 Ω resistor across a voltage source, a source of 0 V across a
 * rectifier's AC input, or a 0 Ω resistor across a rectifier's DC output.
 *
 * Why: a short leaves the rectifier with no drive of its own, or (at the output) carries the
 * whole short-circuit current through its devices; the analysis then falls back on an assumed
 * source or no load, and the figures no longer describe the netlist. A shorted output is an
 * error, because the figures then understate every device stress; the others are warnings.
 *
 * Threshold: exactly zero (a value written as 0, or evaluating to 0), or one node for both
 * terminals: any finite resistance or voltage is a circuit the solver can take as it is.
 */
import type { Severity } from '../../../grammar/src/index';
import type { Finding } from '../findings/index';
import type { FlatElement, SourceElement } from '../circuit/index';
import type { Rule, RuleInput } from './registry';
import type { Rectifier } from '../recognize/index';
import { circuitIndexOf, nodePairKey, placeOf } from './rule-context';

export const shortedSourceRule: Rule = {
  code: 'shorted-source',
  check(input) {
    return [...sameNodeSources(input), ...shortedSources(input), ...zeroVoltInputs(input), ...shortedOutputs(input)];
  },
};

/** `V1 a a`: both terminals on one node, so the source drives nothing. */
function sameNodeSources(input: RuleInput): Finding[] {
  return circuitIndexOf(input).voltageSources
    .filter((v) => v.terminals.length === 2 && v.terminals[0]!.node === v.terminals[1]!.node)
    .map((v) => finding(v, `${v.name} has both terminals on node ${v.terminals[0]!.node}: the source is shorted and drives nothing`));
}

function shortedSources(input: RuleInput): Finding[] {
  const sources = new Map<string, SourceElement>();
  for (const v of circuitIndexOf(input).voltageSources) {
    const key = pairKeyOf(v);
    if (key && !sources.has(key)) sources.set(key, v);
  }
  return zeroOhmResistors(input).flatMap((r) => {
    const shorted = sources.get(pairKeyOf(r) ?? '');
    return shorted ? [finding(r, `${r.name} is 0 Ω across ${shorted.name}: it shorts the source`)] : [];
  });
}

function zeroVoltInputs(input: RuleInput): Finding[] {
  const inputs = input.rectifiers.map((a) => a.rectifier.acNodes.slice(0, 2));
  return circuitIndexOf(input).voltageSources
    .filter((v) => isZeroVolts(v) && inputs.some((ac) => ac.length === 2 && sameNodes(ac, v.terminals.map((t) => t.node))))
    .map((v) => finding(v, `${v.name} is a 0 V source across a rectifier's AC input: it shorts the input`));
}

/** A 0 Ω load: recognition takes no resistance of zero as a load, so without this the output short would read as "no load". */
function shortedOutputs(input: RuleInput): Finding[] {
  const outputs = new Map<string, Rectifier[]>();
  for (const { rectifier } of input.rectifiers) {
    const key = nodePairKey(rectifier.dcPositive, rectifier.dcNegative);
    outputs.set(key, [...(outputs.get(key) ?? []), rectifier]);
  }
  return zeroOhmResistors(input).flatMap((r) => (outputs.get(pairKeyOf(r) ?? '') ?? [])
    .map((rectifier) => finding(r,
      `${r.name} is 0 Ω across the output ${rectifier.dcPositive}/${rectifier.dcNegative} of the ${rectifier.kind.replace(/-/g, ' ')}: ` +
        'it shorts the output; the rectifier was solved with no load, so its figures understate every device stress', 'error')));
}

function zeroOhmResistors(input: RuleInput): readonly FlatElement[] {
  return circuitIndexOf(input).zeroOhmResistors;
}

/** The node pair of a two-terminal element on two different nodes. */
function pairKeyOf(e: FlatElement): string | undefined {
  const [a, b] = e.terminals;
  return e.terminals.length === 2 && a!.node !== b!.node ? nodePairKey(a!.node, b!.node) : undefined;
}

function finding(e: FlatElement, message: string, severity: Severity = 'warning'): Finding {
  return { ...placeOf(e.origin, e.name), severity, code: 'shorted-source', message };
}

function sameNodes(a: readonly string[], b: readonly string[]): boolean {
  return a.length === 2 && b.length === 2 && a[0] !== a[1] && ((a[0] === b[0] && a[1] === b[1]) || (a[0] === b[1] && a[1] === b[0]));
}

/** A voltage source that drives nothing: no DC, no AC magnitude, no sine (or one of zero amplitude and offset). */
function isZeroVolts(v: SourceElement): boolean {
  if (v.otherWaveform !== undefined) return false;
  const sine = v.sine ? v.sine.amplitude === 0 && v.sine.offset === 0 : true;
  return sine && v.dc === 0 && !v.acMagnitude;
}
