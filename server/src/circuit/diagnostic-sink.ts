/**
 * Collects core diagnostics without repeats: a subcircuit instantiated a hundred times reports a
 * fault in its definition once, not a hundred times.
 */
import type { SyntaxDiagnostic } from '../../../grammar/src/index';
import type { CoreDiagnostic } from './flat-circuit';

export class DiagnosticSink {
  readonly list: CoreDiagnostic[] = [];
  private readonly seen = new Set<string>();

  add(diagnostic: CoreDiagnostic): void {
    // Uri, span and code identify a finding; a short message tells apart the rare two at one place. A long
    // one (a cycle through thousands of parameters names them all) is keyed by its length only: reading it
    // would copy it, and ten thousand such copies cost seconds.
    const { uri, span, code, message } = diagnostic;
    const id = `${uri}\u0000${span.start}\u0000${span.end}\u0000${code}\u0000${message.length > 200 ? message.length : message}`;
    if (this.seen.has(id)) return;
    this.seen.add(id);
    this.list.push(diagnostic);
  }

  /** Adds a grammar-level diagnostic (parameters, values) found in a file. */
  addSyntax(uri: string, diagnostic: SyntaxDiagnostic): void {
    this.add({ uri, ...diagnostic });
  }
}
