/**
 * `unbalanced-string` — fires on each capacitor of a series string (a DC link stacked from
 * lower-voltage parts) that has no balancing resistor across its stage.
 *
 * Why: in steady state the DC voltage of a string divides by the parts' leakage currents, which
 * differ from part to part and with temperature and age; without resistors across each stage to
 * swamp them, one capacitor can take far more than its share and fail, then the next. Leakage is
 * not modelled here, so the voltage check used the capacitive share (how the string charges at
 * switch-on and how the ripple divides) and cannot vouch for the DC share: the finding says so
 * instead of letting the check pass in silence.
 *
 * Threshold: none; any stage without a resistor across it. A warning: the voltage check's
 * premise is unknown, not known to fail. Common practice: a resistor across every stage, sized to
 * carry several times the largest leakage current.
 */
import type { Finding } from '../findings/index';
import type { Rule } from './registry';
import { capacitorsOf } from './capacitor-view';
import { pct, placeOf } from './rule-context';

export const unbalancedStringRule: Rule = {
  code: 'unbalanced-string',
  check(input) {
    const findings: Finding[] = [];
    for (const view of capacitorsOf(input)) {
      const s = view.stringShare;
      if (!s || !s.unbalanced.includes(s.stage)) continue;
      findings.push({
        ...placeOf(view.element.origin, view.name), severity: 'warning', code: 'unbalanced-string',
        message: `${view.name}: stage ${s.stage} of ${s.stages} of the series string ${s.stringNames.join(', ')} has no balancing resistor across it, ` +
          `so leakage currents, which are not modelled, set how the DC voltage divides; its voltage was checked with its share by capacitance ` +
          `(${pct(s.capacitive)}${s.spread ? ' at its worst tolerance vertex' : ''}) only. A resistor across each stage sets the share`,
      });
    }
    return findings;
  },
};
