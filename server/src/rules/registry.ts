/**
 * The rule registry: every rule is a function of the analysed file that returns findings. A rule
 * that throws becomes one `internal-error` finding and the others still run.
 */
import type { Netlist } from '../../../grammar/src/index';
import type { FlatCircuit } from '../circuit/index';
import type { Finding } from '../analysis/findings';
import type { RectifierAnalysis } from '../analysis/rectifier-analysis';
import type { AnalysisSettings } from '../analysis/settings';
import type { NearMiss } from '../recognize/index';

export interface RuleInput {
  rootUri: string;
  netlist: Netlist;
  flat: FlatCircuit;
  rectifiers: readonly RectifierAnalysis[];
  nearMisses: readonly NearMiss[];
  settings: AnalysisSettings;
}

export interface Rule {
  /** The code its findings carry. */
  code: string;
  check: (input: RuleInput) => Finding[];
}

/** The registered rules, in the order they run. */
export const RULES: Rule[] = [];

export function applyRules(input: RuleInput): Finding[] {
  return RULES.flatMap((rule) => {
    try {
      return rule.check(input);
    } catch (error) {
      return [{
        uri: input.rootUri, span: { start: 0, end: 0 }, severity: 'error' as const, code: 'internal-error',
        message: `rule ${rule.code} failed: ${error instanceof Error ? error.message : String(error)}`,
      }];
    }
  });
}
