/**
 * The rule that reports each stress verdict (ratings/stress-checks.ts), so that a judgement made
 * outside the rules (the comparison's rows) names the finding `check` would give.
 */
import type { StressKind } from '../ratings/index';

export const RULE_OF_STRESS: Readonly<Record<StressKind, string>> = {
  'reverse-voltage': 'piv-margin',
  vds: 'mosfet-vds',
  'average-current': 'current-rating',
  'drain-current': 'current-rating',
  surge: 'surge-rating',
  'junction-temperature': 'junction-temp',
};

/** The rule for a junction whose temperature does not settle. */
export const RUNAWAY_RULE = 'thermal-runaway';
