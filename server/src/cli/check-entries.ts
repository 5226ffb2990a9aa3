/**
 * Which entries the report lists and which findings each shows, from the checked files taken in
 * their order: one entry per root, written as soon as it comes, then one per other file with
 * findings (an include, a configuration, a parts file). It follows the rule of
 * `analysis/findings-by-file.ts`: a finding is listed under the file that holds its text, once,
 * however many roots read it, and a root that an earlier root includes is shown as that root reads
 * it. What it keeps between files is compact: the distinct JSON findings of included files, and the
 * keys of each root's findings.
 *
 * One difference from a whole-run view, the price of streaming: a root that a *later* root includes
 * has already been written with its own findings; the later root's findings in it follow in an
 * entry of the same path near the end, without repeats.
 */
import { LineIndex } from '../../../grammar/src/index';
import type { CheckedFile } from './check-file';
import { toJsonDiagnostic, type JsonDiagnostic, type JsonFile, type ReportedFile } from './report-json';

export class CheckEntries {
  /** Per file read by some root and not (yet) checked as a root: the roots' findings there, each once, in root order. */
  private readonly included = new Map<string, DistinctFindings>();
  /** Findings from later roots in roots already written. */
  private readonly late = new Map<string, JsonDiagnostic[]>();
  /** Each written root's finding keys, so a later root's findings in it are not repeated. */
  private readonly writtenKeys = new Map<string, Set<string>>();

  /** The entry of the next root in order, or undefined when it could not be read. */
  add(result: CheckedFile): JsonFile | undefined {
    if (result.unreadable !== undefined) return undefined;
    const own = result.byFile.find(([uri]) => uri === result.path)?.[1] ?? [];
    // Read by an earlier root (even without a finding there): shown as the includers read it.
    const diagnostics = this.included.get(result.path)?.list ?? own;
    this.included.delete(result.path);
    this.writtenKeys.set(result.path, new Set(diagnostics.map(findingKey)));
    for (const [uri, list] of result.byFile) {
      if (uri === result.path) continue;
      if (this.writtenKeys.has(uri)) {
        const seen = this.writtenKeys.get(uri)!;
        const fresh = list.filter((d) => !seen.has(findingKey(d)));
        fresh.forEach((d) => seen.add(findingKey(d)));
        if (fresh.length) this.late.set(uri, [...(this.late.get(uri) ?? []), ...fresh]);
        continue;
      }
      if (!this.included.has(uri)) this.included.set(uri, new DistinctFindings());
      this.included.get(uri)!.addAll(list);
    }
    return { path: result.path, rectifiers: result.rectifiers, diagnostics };
  }

  /** The entries after the roots: included files with findings, then configuration and parts files. */
  finish(extra: readonly ReportedFile[]): JsonFile[] {
    const elsewhere = new Map<string, JsonDiagnostic[]>();
    for (const [uri, { list }] of this.included) if (list.length) elsewhere.set(uri, list);
    for (const [uri, list] of this.late) elsewhere.set(uri, list);
    for (const file of extra) {
      const lines = new LineIndex(file.text);
      const list = file.findings.map((f) => toJsonDiagnostic(f, () => lines, false));
      elsewhere.set(file.path, [...(elsewhere.get(file.path) ?? []), ...list]);
    }
    return [...elsewhere].map(([path, list]) => {
      const seen = new Set<string>();
      const diagnostics = list.filter((d) => !seen.has(diagnosticKey(d)) && Boolean(seen.add(diagnosticKey(d))));
      return { path, rectifiers: [], diagnostics };
    });
  }
}

/** The JSON twin of `FindingSet`'s identity (place, code, message or its length when long), within one file. */
function findingKey(d: JsonDiagnostic): string {
  return `${d.line}:${d.column}:${d.endLine}:${d.endColumn}\u0000${d.code}\u0000${d.message.length > 200 ? d.message.length : d.message}`;
}

function diagnosticKey(d: JsonDiagnostic): string {
  return `${d.line}:${d.column}:${d.endLine}:${d.endColumn}:${d.code}:${d.message}`;
}

/** Findings gathered from root after root, each kept once in the order first seen (`withoutRepeats` of the whole list). */
class DistinctFindings {
  readonly list: JsonDiagnostic[] = [];
  private readonly seen = new Set<string>();

  addAll(list: readonly JsonDiagnostic[]): void {
    for (const d of list) {
      const key = findingKey(d);
      if (this.seen.has(key)) continue;
      this.seen.add(key);
      this.list.push(d);
    }
  }
}
