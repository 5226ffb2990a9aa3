/**
 * `.include "file"` and `.lib "file" section` across files. Paths are relative to the including
 * file (posix joining; backslashes read as slashes). The core never reads a file: the adapter
 * supplies parsed files, and `listIncludeTargets` / `collectDependencies` tell it what to load.
 */
import { key, type IncludeCard, type Item, type LibCard, type Netlist } from '../../../grammar/src/index';
import type { DiagnosticSink } from './diagnostic-sink';
import type { FileSource } from './flat-circuit';

/** Deeper include nesting than this is reported rather than followed. */
export const MAX_INCLUDE_DEPTH = 64;

/** An item with the file it was read from. */
export interface PlacedItem {
  item: Item;
  uri: string;
}

/** A file an `.include` or `.lib` card asks for. */
export interface IncludeTarget {
  /** Resolved URI of the target. */
  uri: string;
  card: IncludeCard | LibCard;
  /** Lowercase section name for `.lib "file" section`. */
  section?: string;
}

/** Joins a path written in a card onto the folder of the including file; absolute paths keep their scheme. */
export function resolveIncludePath(fromUri: string, written: string): string {
  const path = written.replace(/\\/g, '/');
  const scheme = /^[a-z][a-z0-9+.-]*:\/\/[^/]*/i.exec(fromUri)?.[0] ?? '';
  if (/^[a-z][a-z0-9+.-]*:\/\//i.test(path)) return path;
  const fromPath = fromUri.slice(scheme.length).replace(/\\/g, '/');
  const joined = path.startsWith('/') || /^[a-z]:\//i.test(path) ? path : fromPath.slice(0, fromPath.lastIndexOf('/') + 1) + path;
  return scheme + normalizePosix(joined);
}

function normalizePosix(path: string): string {
  const absolute = path.startsWith('/');
  const out: string[] = [];
  for (const part of path.split('/')) {
    if (part === '' || part === '.') continue;
    if (part === '..' && out.length > 0 && out[out.length - 1] !== '..') out.pop();
    else if (part !== '..' || !absolute) out.push(part);
  }
  return (absolute ? '/' : '') + out.join('/');
}

/** Every include and library reference in a file, wherever it sits, with its resolved target. */
export function listIncludeTargets(uri: string, netlist: Netlist): IncludeTarget[] {
  const targets: IncludeTarget[] = [];
  for (const card of netlist.cards) {
    if ((card.kind === 'include' || card.kind === 'lib') && card.path) {
      const section = card.kind === 'lib' && card.section ? key(card.section) : undefined;
      targets.push({ uri: resolveIncludePath(uri, card.path.text), card, section });
    }
  }
  return targets;
}

/** Reads a file from the source the adapter gave. */
export function readSource(files: FileSource, uri: string): Netlist | undefined {
  return typeof files === 'function' ? files(uri) : files.get(uri);
}

/**
 * Every file reachable from a root through includes (the root first) and the targets that could
 * not be read. Iterative, each file visited once, so cycles end.
 */
export function collectDependencies(rootUri: string, files: FileSource): { files: string[]; missing: string[] } {
  const seen = new Set<string>([rootUri]);
  const found: string[] = [];
  const missing: string[] = [];
  const queue = [rootUri];
  while (queue.length) {
    const uri = queue.shift()!;
    const netlist = readSource(files, uri);
    if (!netlist) {
      missing.push(uri);
      continue;
    }
    found.push(uri);
    for (const target of listIncludeTargets(uri, netlist)) {
      if (seen.has(target.uri)) continue;
      seen.add(target.uri);
      queue.push(target.uri);
    }
  }
  return { files: found, missing };
}

/** Splices included files and library sections into a list of items, reporting cycles and missing files on the card. */
export class IncludeExpander {
  /** Files that were read, in first-read order. */
  readonly used: string[] = [];

  constructor(private readonly files: FileSource, private readonly sink: DiagnosticSink) {}

  /** Reads a file and remembers that the analysis depends on it. */
  read(uri: string): Netlist | undefined {
    const netlist = readSource(this.files, uri);
    if (netlist && !this.used.includes(uri)) this.used.push(uri);
    return netlist;
  }

  /** Items of a block with every include expanded; `stack` holds the `uri#section` keys being expanded. */
  expand(items: readonly Item[], uri: string, stack: readonly string[]): PlacedItem[] {
    const out: PlacedItem[] = [];
    for (const item of items) {
      if (item.kind === 'include' || (item.kind === 'lib' && item.path)) out.push(...this.expandCard(item, uri, stack));
      else if (item.kind !== 'lib-section') out.push({ item, uri });
    }
    return out;
  }

  private expandCard(card: IncludeCard | LibCard, uri: string, stack: readonly string[]): PlacedItem[] {
    if (!card.path) return [];
    const target = resolveIncludePath(uri, card.path.text);
    const section = card.kind === 'lib' && card.section ? key(card.section) : undefined;
    const frame = section ? `${target}#${section}` : target;
    const where = { uri, span: card.path.span };
    if (stack.includes(frame)) {
      this.sink.add({ ...where, severity: 'error', code: 'include-cycle', message: `'${card.path.text}' is already being read (${[...stack, frame].join(' → ')}); this include is skipped` });
      return [];
    }
    if (stack.length >= MAX_INCLUDE_DEPTH) {
      this.sink.add({ ...where, severity: 'error', code: 'include-depth', message: `includes nest deeper than ${MAX_INCLUDE_DEPTH} files; '${card.path.text}' is not read` });
      return [];
    }
    const netlist = this.read(target);
    if (!netlist) {
      this.sink.add({ ...where, severity: 'error', code: 'missing-include', message: `cannot read '${card.path.text}' (looked for ${target})` });
      return [];
    }
    if (!section) return this.expand(netlist.items, target, [...stack, frame]);
    const block = netlist.items.find((i) => i.kind === 'lib-section' && i.header.section && key(i.header.section) === section);
    if (!block || block.kind !== 'lib-section') {
      const at = card.kind === 'lib' && card.section ? card.section.span : card.path.span;
      this.sink.add({ uri, span: at, severity: 'error', code: 'missing-lib-section', message: `'${card.path.text}' has no section '${section}'` });
      return [];
    }
    return this.expand(block.body, target, [...stack, frame]);
  }
}
