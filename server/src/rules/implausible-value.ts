/**
 * `implausible-value` — a value no real part has: a capacitance of zero or below, a negative
 * resistance, a negative SIN amplitude.
 *
 * Why: such a value does not fail loudly — the capacitor or resistor is simply not seen as a filter
 * or load, and a negative amplitude is a half-period phase shift — so the figures look plausible
 * while describing another circuit. Saying so on the card is the only way the user learns of it.
 *
 * Threshold: the sign alone (common practice: passive parts have positive values; a SPICE SIN
 * amplitude is written positive and the phase argument shifts it).
 */
import type { Finding } from '../findings/index';
import type { FlatElement } from '../circuit/index';
import type { Rule } from './registry';
import { fmt, placeOf } from './rule-context';

export const implausibleValueRule: Rule = {
  code: 'implausible-value',
  check(input) {
    // A loop, not flatMap: this walks every element of the file on every analysis.
    const findings: Finding[] = [];
    for (const e of input.flat.elements) {
      const problem = problemOf(e);
      if (problem) findings.push({ ...placeOf(e.origin, e.name), severity: 'warning', code: 'implausible-value', message: `${e.name}: ${problem}` });
    }
    return findings;
  },
};

function problemOf(e: FlatElement): string | undefined {
  if (e.kind === 'capacitor' && e.value !== undefined && e.value <= 0) {
    return `a capacitance of ${fmt(e.value)} F stores no charge; it is not counted as a filter capacitor`;
  }
  if (e.kind === 'resistor' && e.value !== undefined && e.value < 0) {
    return `a negative resistance (${fmt(e.value)} Ω) is not a passive part; it is not counted as a load`;
  }
  if (e.kind === 'vsource' && e.sine && e.sine.amplitude < 0) {
    return `a negative SIN amplitude (${fmt(e.sine.amplitude)} V) is the same wave shifted by half a period; write it positive and use the phase argument`;
  }
  return undefined;
}
