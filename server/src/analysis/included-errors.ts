/**
 * `include-error` — an error inside a file the root includes (directly or through other
 * includes), repeated on the root's own `.include` or `.lib` card that leads to it.
 *
 * Why: an error in an included file (a syntax error where it was cut short, an include cycle
 * closed two files down, a nested include that could not be read) means part of the circuit
 * was not analysed as written. Reports that show one file (the command line's `check`, a user
 * reading only the root) would otherwise pass the root with nothing said.
 *
 * Threshold: any finding of severity error in another file; one finding per root card, counting
 * the errors behind it and quoting the first.
 */
import { clipText, type Netlist, type Span } from '../../../grammar/src/index';
import { listIncludeTargets } from '../circuit/index';
import type { Finding } from '../findings/index';
import { LineIndex } from '../../../grammar/src/index';

export const INCLUDE_ERROR_CODE = 'include-error';

/** Findings on the root's include cards for the errors found in the files behind them. */
export function includedErrorFindings(rootUri: string, parsed: ReadonlyMap<string, Netlist>, findings: readonly Finding[]): Finding[] {
  const errors = findings.filter((f) => f.severity === 'error' && f.uri !== rootUri);
  if (errors.length === 0) return [];
  const entries = entryCards(rootUri, parsed);
  const byCard = new Map<number, { span: Span; written: string; errors: Finding[] }>();
  for (const error of errors) {
    const entry = entries.get(error.uri);
    if (!entry) continue;
    const group = byCard.get(entry.span.start) ?? { ...entry, errors: [] };
    group.errors.push(error);
    byCard.set(entry.span.start, group);
  }
  return [...byCard.values()].map(({ span, written, errors: behind }) => {
    const first = behind[0]!;
    const line = lineOf(parsed.get(first.uri), first.span.start);
    const count = behind.length === 1 ? 'an error' : `${behind.length} errors`;
    return {
      uri: rootUri, span, severity: 'error', code: INCLUDE_ERROR_CODE,
      message: `'${clipText(written)}' leads to ${count}, so part of the circuit was not analysed as written; ` +
        `the first, in ${first.uri}${line ? ` line ${line}` : ''}: ${first.code}: ${first.message}`,
      related: behind.slice(0, 20).map((f) => ({ uri: f.uri, span: f.span, message: `${f.code}: ${f.message}` })),
    };
  });
}

/**
 * Findings about an included file keep their own file and gain the root's card that leads to it
 * as a related place, so a reader of either file finds the other.
 */
export function withIncludingPlace(rootUri: string, parsed: ReadonlyMap<string, Netlist>, findings: Finding[]): Finding[] {
  if (!findings.some((f) => f.uri !== rootUri)) return findings;
  const entries = entryCards(rootUri, parsed);
  for (const f of findings) {
    const entry = f.uri === rootUri ? undefined : entries.get(f.uri);
    // In place: copying would read `fixes`, which some findings compute on first read.
    if (entry) f.related = [...(f.related ?? []), { uri: rootUri, span: entry.span, message: `${f.uri} is included from here` }];
  }
  return findings;
}

/** For every file reached from the root, the root's card it is reached through first (breadth first, each file once). */
function entryCards(rootUri: string, parsed: ReadonlyMap<string, Netlist>): Map<string, { span: Span; written: string }> {
  const entries = new Map<string, { span: Span; written: string }>();
  const root = parsed.get(rootUri);
  if (!root) return entries;
  const queue: string[] = [];
  for (const target of listIncludeTargets(rootUri, root)) {
    if (target.uri === rootUri || entries.has(target.uri) || !target.card.path) continue;
    entries.set(target.uri, { span: target.card.path.span, written: target.card.path.text });
    queue.push(target.uri);
  }
  for (let next = 0; next < queue.length; next++) {
    const uri = queue[next]!;
    const netlist = parsed.get(uri);
    if (!netlist) continue;
    for (const target of listIncludeTargets(uri, netlist)) {
      if (target.uri === rootUri || entries.has(target.uri)) continue;
      entries.set(target.uri, entries.get(uri)!);
      queue.push(target.uri);
    }
  }
  return entries;
}

function lineOf(netlist: Netlist | undefined, offset: number): number | undefined {
  return netlist ? new LineIndex(netlist.text).positionAt(offset).line + 1 : undefined;
}
