/**
 * `cap-voltage` — fires when a filter capacitor's peak voltage at the worst corner (the output
 * maximum, or its share in a doubler or a series string: capacitor-view.ts) exceeds the policy's fraction of its
 * rated voltage.
 *
 * Why: an electrolytic above its rated voltage heats, vents and fails; margin below the rating
 * is the main lever on its life.
 *
 * Threshold: `cap` of the policy (default 80 %, Reliability Analysis Center "Part Derating
 * Parameters", aluminium electrolytic in a benign environment; REFERENCES.md §4, C). Error above
 * the rated voltage itself, warning above the derated limit. Fix: the next standard voltage class.
 */
import type { Finding } from '../findings/index';
import type { Rule } from './registry';
import { capacitorsOf, stringShareText } from './capacitor-view';
import { raiseCapacitorVoltageFix } from './fixes/raise-cap-voltage';
import { ratioSeverity } from '../ratings/index';
import { allowsText, fmt, pct, placeOf } from './rule-context';

export const capVoltageRule: Rule = {
  code: 'cap-voltage',
  check(input) {
    const cap = input.policy.cap;
    const findings: Finding[] = [];
    for (const view of capacitorsOf(input)) {
      const rated = view.ratings.vratedV;
      if (!rated || !view.peakV) continue;
      const severity = ratioSeverity(view.peakV.value, rated.value, cap.value);
      if (!severity) continue;
      const fix = raiseCapacitorVoltageFix(view, view.peakV.value / cap.value);
      findings.push({
        ...placeOf(view.element.origin, view.name), severity, code: 'cap-voltage',
        message: `${view.name}: peak ${fmt(view.peakV.value)} V at ${view.peakV.corner} is ${pct(view.peakV.value / rated.value)} ` +
          `of its rated ${fmt(rated.value)} V; ${allowsText(cap)}${shareSuffix(stringShareText(view))}`,
        ...(fix ? { fixes: [fix] } : {}),
      });
    }
    return findings;
  },
};

function shareSuffix(text: string | undefined): string {
  return text ? `. Its share: ${text}` : '';
}
