/**
 * `cap-ripple` — fires when a filter capacitor's RMS ripple current at the worst corner (its
 * share of its group's: capacitor-view.ts) exceeds the policy's fraction of its rated ripple.
 *
 * Why: ripple current heats an electrolytic through its ESR, and its life halves for every
 * 10 °C hotter (REFERENCES.md §4, C); the rating is the current that keeps it at its rated life.
 *
 * Threshold: `ripple` of the policy (default 100 %, IPC-9592B from memory: within the rated
 * ripple). The rating is taken as given, without frequency or temperature multipliers. Error
 * above the rating itself, warning above a stricter derated limit only. Fix: a bank of parallel
 * parts (fixes/cap-bank.ts).
 */
import { withLazyFixes, type Finding } from '../findings/index';
import type { Rule } from './registry';
import { capacitorsOf } from './capacitor-view';
import { capacitorBankFix } from './fixes/cap-bank';
import { ratioSeverity } from '../ratings/index';
import { allowsText, fmt, pct, placeOf } from './rule-context';

export const capRippleRule: Rule = {
  code: 'cap-ripple',
  check(input) {
    const ripple = input.policy.ripple;
    const files = input.parsed ?? new Map([[input.rootUri, input.netlist]]);
    const findings: Finding[] = [];
    for (const view of capacitorsOf(input)) {
      const rated = view.ratings.iRippleA;
      if (!rated || !view.irmsA) continue;
      const severity = ratioSeverity(view.irmsA.value, rated.value, ripple.value);
      if (!severity) continue;
      findings.push(withLazyFixes({
        ...placeOf(view.element.origin, view.name), severity, code: 'cap-ripple',
        message: `${view.name}: ripple current ${fmt(view.irmsA.value)} A rms at ${view.irmsA.corner} is ${pct(view.irmsA.value / rated.value)} ` +
          `of its rated ${fmt(rated.value)} A; ${allowsText(ripple)}`,
      }, () => [capacitorBankFix(view, ripple.value, files, input.solve)]));
    }
    return findings;
  },
};
