/**
 * The rule registry: every rule is a function of the analysed file that returns findings. A rule
 * that throws becomes one `internal-error` finding and the others still run. The findings come
 * back as the rules found them; the analysis applies the file's `*@ allow` once, to every finding.
 */
import type { Netlist } from '../../../grammar/src/index';
import type { FlatCircuit } from '../circuit/index';
import type { Finding } from '../findings/index';
import type { RectifierAnalysis } from '../equivalent/index';
import type { SolveFn } from '../solve/index';
import type { DeratingPolicy, PartsFile } from '../ratings/index';
import type { NearMiss } from '../recognize/index';
import { ALL_RULES } from './all-rules';

export interface RuleInput {
  rootUri: string;
  netlist: Netlist;
  flat: FlatCircuit;
  rectifiers: readonly RectifierAnalysis[];
  nearMisses: readonly NearMiss[];
  /** The file's derating policy, resolved once per analysis (ratings/derating-policy.ts `resolvePolicy`). */
  policy: DeratingPolicy;
  /** Validated workspace parts files: candidates for the part-swap fix. */
  partsFiles?: readonly PartsFile[];
  /** Every file the analysis parsed, by URI (the root included), for fixes that edit them. */
  parsed?: ReadonlyMap<string, Netlist>;
  /** The solver for fix trials, memoised across analyses by the adapter's cache; plain solving when absent. */
  solve?: SolveFn;
}

export interface Rule {
  /** The code its findings carry. */
  code: string;
  check: (input: RuleInput) => Finding[];
}

/** The registered rules, in the order they run. */
export const RULES: readonly Rule[] = ALL_RULES;

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
