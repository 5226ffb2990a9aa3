/**
 * `duplicate-name` — a second element or instance card with the name of an earlier one in the
 * same scope (names compare without case, as SPICE reads them). The finding sits on the second
 * card and names the line of the first.
 *
 * Why: element names are the netlist's identifiers; a simulator may refuse the file or keep
 * only one of the two (from memory), while this analysis keeps both, so what is analysed and
 * what is simulated can differ, and ratings written for the name apply to both parts.
 *
 * Threshold: any repeat. Copies made by instantiating one subcircuit twice are not repeats; a
 * repeat inside a subcircuit body is reported once, on its card in the body.
 */
import type { Finding } from '../findings/index';
import { LineIndex } from '../../../grammar/src/index';
import type { Origin } from '../circuit/index';
import type { Rule, RuleInput } from './registry';
import { circuitIndexOf } from './rule-context';

interface Named {
  name: string;
  key: string;
  origin: Origin;
}

export const duplicateNameRule: Rule = {
  code: 'duplicate-name',
  check(input) {
    // The index already met every key once: only keys it saw twice need looking at again.
    const { repeatedKeys } = circuitIndexOf(input);
    const findings: Finding[] = [];
    if (repeatedKeys.size === 0) return findings;
    const first = new Map<string, Named>();
    const lines = lineFinder(input);
    const check = (item: Named): void => {
      if (!repeatedKeys.has(item.key)) return;
      const earlier = first.get(item.key);
      if (!earlier) {
        first.set(item.key, item);
        return;
      }
      // The same card reached through two instances of its subcircuit is one part per instance, not a repeat.
      if (earlier.origin.uri === item.origin.uri && earlier.origin.span.start === item.origin.span.start) return;
      const where = `line ${lines(earlier.origin)}${earlier.origin.uri === item.origin.uri ? '' : ` of ${earlier.origin.uri}`}`;
      findings.push({
        uri: item.origin.uri, span: item.origin.nameSpan, severity: 'warning', code: 'duplicate-name',
        message: `${item.name} is already defined on ${where}: a simulator may refuse the file or keep only one of them; this analysis keeps both`,
        related: [{ uri: earlier.origin.uri, span: earlier.origin.nameSpan, message: `the first ${earlier.name}` }],
      });
    };
    for (const element of input.flat.elements) check(element);
    for (const instance of input.flat.instances) check(instance);
    return findings;
  },
};

/** 1-based line of an origin's card, with one line index per file built on first use. */
function lineFinder(input: RuleInput): (origin: Origin) => number {
  const indexes = new Map<string, LineIndex | undefined>();
  return (origin) => {
    if (!indexes.has(origin.uri)) {
      const text = (input.parsed?.get(origin.uri) ?? (origin.uri === input.rootUri ? input.netlist : undefined))?.text;
      indexes.set(origin.uri, text === undefined ? undefined : new LineIndex(text));
    }
    const index = indexes.get(origin.uri);
    return index ? index.positionAt(origin.span.start).line + 1 : 0;
  };
}
