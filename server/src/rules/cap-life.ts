/**
 * `cap-life` — fires when a filter capacitor's life estimate at its hottest corner is below the
 * life the file asks for (`*@ derate life=50000h`), or, as an info, when a life is asked for but
 * the capacitor states no rated endurance to estimate it from.
 *
 * Why: an aluminium electrolytic wears out: its electrolyte dries, faster the hotter its core, and
 * the supply fails when it does. Ripple current heats the core through the ESR on top of the
 * ambient.
 *
 * Threshold: the life the file asks for (no default: without `life=` nothing is judged). The
 * estimate (ratings/capacitor-life.ts): the core at ambient plus its ripple self-heating (P·Rθ with
 * `rth=`, else 5 K at the rated ripple current scaled by (I/I_rated)², common practice), and the
 * rated endurance doubled for every 10 °C the core runs below its rated temperature
 * (REFERENCES.md §4, C). A warning: the design misses its life target, it does not fail at once.
 */
import type { Finding } from '../findings/index';
import { describePolicyOrigin, type CoreRiseModel } from '../ratings/index';
import type { Rule } from './registry';
import { capacitorsOf } from './capacitor-view';
import { fmt, placeOf } from './rule-context';

const RISE_WORDS: Record<CoreRiseModel, string> = {
  'thermal-resistance': 'ripple loss × its rth',
  'rated-ripple': '5 K at its rated ripple, scaled by (I/I_rated)², common practice',
  none: 'no self-heating counted: neither rth nor a rated ripple is given',
};

export const capLifeRule: Rule = {
  code: 'cap-life',
  check(input) {
    const asked = input.policy.life;
    if (!asked) return [];
    const findings: Finding[] = [];
    for (const view of capacitorsOf(input)) {
      const stress = view.analysis.capacitors.find((c) => c.name.toLowerCase() === view.element.key)?.stress;
      const endurance = view.ratings.endurance?.value;
      const place = placeOf(view.element.origin, view.name);
      const target = `${fmt(asked.value)} h (${describePolicyOrigin(asked.origin)})`;
      if (!endurance) {
        findings.push({ ...place, severity: 'info', code: 'cap-life', message: `${view.name}: no rated endurance (endurance=hours@temperature), so its life was not estimated against the ${target} asked` });
        continue;
      }
      const life = stress?.lifeH;
      if (!life || life.value >= asked.value) continue;
      const at = stress.corners.find((c) => c.corner === life.corner)!;
      const loss = at.lossW === undefined ? 'no ESR known, so no ripple loss' : `ripple loss ${fmt(at.lossW)} W`;
      findings.push({
        ...place, severity: 'warning', code: 'cap-life',
        message: `${view.name}: life estimate ${fmt(life.value)} h at ${life.corner} is below the ${target}: core ${fmt(at.coreC)} °C ` +
          `(${loss}; ${RISE_WORDS[stress.riseModel]}), rated ${fmt(endurance.hours)} h at ${fmt(endurance.atC)} °C, doubling per 10 °C cooler (common practice)`,
      });
    }
    return findings;
  },
};
