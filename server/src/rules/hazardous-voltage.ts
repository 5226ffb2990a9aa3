/**
 * `hazardous-voltage` — information on every voltage source above extra-low voltage, and on a
 * rectifier output above it when its own source is not (a doubler lifting an ELV winding above
 * the band), with the caution every such output carries (DESIGN.md §1).
 *
 * Why: mains-connected and high-voltage circuits can kill; the figures are estimates, not a
 * safety or compliance test.
 *
 * Threshold: the ELV band of IEC 61140:2016 via the IEV — at most 50 V a.c. rms or 120 V
 * ripple-free d.c. (REFERENCES.md §6, C), as `isAboveExtraLowVoltage` applies it
 * (ratings/voltage-safety.ts). A rectifier's source is judged at its nominal mains RMS (a `*@
 * mains` line overrides the SIN amplitude); other sources at their SIN amplitude/√2 and DC value.
 */
import type { Finding } from '../findings/index';
import { anchorOf, type SourceElement } from '../circuit/index';
import { ELV_SOURCE, isAboveExtraLowVoltage, MAINS_CAUTION } from '../ratings/index';
import type { Rule, RuleInput } from './registry';
import { circuitIndexOf, fmt } from './rule-context';

export const hazardousVoltageRule: Rule = {
  code: 'hazardous-voltage',
  check(input) {
    const findings: Finding[] = [];
    const done = new Set<string>();
    for (const analysis of input.rectifiers) {
      const src = analysis.rectifier.surroundings.source;
      const element = firstSourceNamed(input, src.elements);
      if (element) done.add(element.key);
      if (isAboveExtraLowVoltage({ acRmsV: src.mainsVrms })) {
        const place = element ? anchorOf(element.origin) : analysis.rectifier.anchor;
        findings.push(caution(place, `${element?.name ?? 'the assumed source'}: ${fmt(src.mainsVrms)} V rms a.c. is above extra-low voltage`));
        continue;
      }
      const out = analysis.solution.worst;
      if (out.vOutAvgV && isAboveExtraLowVoltage({ dcV: out.vOutAvgV.value, ...(out.vOutMaxV ? { dcPeakV: out.vOutMaxV.value } : {}) })) {
        findings.push(caution(analysis.rectifier.anchor, `the ${analysis.rectifier.kind} output (${fmt(out.vOutMaxV?.value ?? out.vOutAvgV.value)} V peak) is above extra-low voltage`));
      }
    }
    for (const e of sourceElements(input)) {
      if (done.has(e.key)) continue;
      const acRmsV = e.sine ? e.sine.amplitude / Math.SQRT2 : e.acMagnitude !== undefined ? e.acMagnitude / Math.SQRT2 : undefined;
      const dcV = e.sine ? e.sine.offset : e.dc;
      if (!isAboveExtraLowVoltage({ ...(acRmsV !== undefined ? { acRmsV } : {}), dcV })) continue;
      findings.push(caution(anchorOf(e.origin), `${e.name}: ${acRmsV !== undefined && acRmsV > 0 ? `${fmt(acRmsV)} V rms a.c.` : `${fmt(dcV)} V d.c.`} is above extra-low voltage`));
    }
    return findings;
  },
};

/** The first voltage source in element order whose key is one of `names`. */
function firstSourceNamed(input: RuleInput, names: readonly string[]): SourceElement | undefined {
  const first = firstSourceByKey(input);
  let found: [SourceElement, number] | undefined;
  for (const n of names) {
    const hit = first.get(n.toLowerCase());
    if (hit && (!found || hit[1] < found[1])) found = hit;
  }
  return found?.[0];
}

const firstSources = new WeakMap<RuleInput, Map<string, [SourceElement, number]>>();

/** Each key's first voltage source with its place in element order, built once per analysis. */
function firstSourceByKey(input: RuleInput): Map<string, [SourceElement, number]> {
  let first = firstSources.get(input);
  if (!first) {
    firstSources.set(input, (first = new Map()));
    sourceElements(input).forEach((e, i) => { if (!first!.has(e.key)) first!.set(e.key, [e, i]); });
  }
  return first;
}

function sourceElements(input: RuleInput): readonly SourceElement[] {
  return circuitIndexOf(input).voltageSources;
}

function caution(place: Pick<Finding, 'uri' | 'span'>, what: string): Finding {
  return { uri: place.uri, span: place.span, severity: 'info', code: 'hazardous-voltage', message: `${what} (${ELV_SOURCE}). ${MAINS_CAUTION}` };
}
