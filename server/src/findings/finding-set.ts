/**
 * The one de-duplication of findings: the same finding reached twice (a subcircuit instantiated a
 * hundred times, a file included by two others) is kept once, in the order first seen.
 */
import type { SyntaxDiagnostic } from '../../../grammar/src/index';
import type { Finding } from './finding';

export class FindingSet {
  readonly list: Finding[] = [];
  private readonly seen = new Set<string>();
  private offeredCount = 0;

  /** Findings offered so far, repeats included (so a caller can tell whether a step said anything). */
  get offered(): number {
    return this.offeredCount;
  }

  add(finding: Finding): void {
    this.offeredCount++;
    // Uri, span and code identify a finding; a short message tells apart the rare two at one place. A long
    // one (a cycle through thousands of parameters names them all) is keyed by its length only: reading it
    // would copy it, and ten thousand such copies cost seconds.
    const { uri, span, code, message } = finding;
    const id = `${uri}\u0000${span.start}\u0000${span.end}\u0000${code}\u0000${message.length > 200 ? message.length : message}`;
    if (this.seen.has(id)) return;
    this.seen.add(id);
    this.list.push(finding);
  }

  addAll(findings: Iterable<Finding>): this {
    for (const f of findings) this.add(f);
    return this;
  }

  /** Adds a grammar-level diagnostic (syntax, parameters, values) found in a file. */
  addSyntax(uri: string, diagnostic: SyntaxDiagnostic): void {
    this.add({ uri, ...diagnostic });
  }
}

/** The findings without repeats. */
export function withoutRepeats(findings: Iterable<Finding>): Finding[] {
  return new FindingSet().addAll(findings).list;
}
