/**
 * `shorted-source` — a voltage source shorted by a 0 Ω resistor across its terminals, or a source
 * of 0 V across a rectifier's AC input (which shorts that input).
 *
 * Why: a short leaves the rectifier with no drive of its own; the analysis then falls back on an
 * assumed source (or finds nothing to solve), and the figures no longer describe the netlist.
 *
 * Threshold: exactly zero (a value written as 0, or evaluating to 0): any finite resistance or
 * voltage is a circuit the solver can take as it is.
 */
import type { Finding } from '../analysis/findings';
import type { SourceElement } from '../circuit/index';
import type { Rule } from './registry';
import { circuitIndexOf, placeOf } from './rule-context';

export const shortedSourceRule: Rule = {
  code: 'shorted-source',
  check(input) {
    const findings: Finding[] = [];
    const sources = circuitIndexOf(input).voltageSources;
    for (const r of input.flat.elements) {
      if (r.kind !== 'resistor' || r.value !== 0 || r.terminals.length !== 2) continue;
      const shorted = sources.find((v) => sameNodes(v.terminals.map((t) => t.node), r.terminals.map((t) => t.node)));
      if (shorted) findings.push(finding(r.origin, r.name, `${r.name} is 0 Ω across ${shorted.name}: it shorts the source`));
    }
    const inputs = input.rectifiers.map((a) => a.rectifier.acNodes.slice(0, 2));
    for (const v of sources) {
      if (!isZeroVolts(v)) continue;
      if (!inputs.some((ac) => ac.length === 2 && sameNodes(ac, v.terminals.map((t) => t.node)))) continue;
      findings.push(finding(v.origin, v.name, `${v.name} is a 0 V source across a rectifier's AC input: it shorts the input`));
    }
    return findings;
  },
};

function finding(origin: SourceElement['origin'], name: string, message: string): Finding {
  return { ...placeOf(origin, name), severity: 'warning', code: 'shorted-source', message };
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
