/**
 * `.include "file"` and `.lib "file" section` across files. Paths are relative to the including
 * file; backslashes read as slashes. The core never reads a file: the adapter supplies parsed
 * files, and `listIncludeTargets` / `collectDependencies` tell it what to load.
 */
import { URI, Utils } from 'vscode-uri';
import { key, type IncludeCard, type Item, type LibCard, type Netlist } from '../../../grammar/src/index';
import type { FindingSet } from '../findings/index';
import { isRefusal, refusalCode, REFUSAL_SEVERITY, type ReadRefusal } from './file-text';
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

const WITH_SCHEME = /^[a-z][a-z0-9+.-]+:\/\//i;

/**
 * Joins a path written in a card onto the folder of the including file. Between URIs (the
 * editor's) the join is vscode-uri's, so `#`, `?`, spaces and letters beyond ASCII in a file name
 * are encoded as the editor encodes them; between plain paths (the command line's) it is a posix
 * join. A path written as a URI is taken as it is.
 */
export function resolveIncludePath(fromUri: string, written: string): string {
  const path = written.replace(/\\/g, '/');
  if (WITH_SCHEME.test(path)) return path;
  if (WITH_SCHEME.test(fromUri)) {
    const from = URI.parse(fromUri);
    if (/^[a-z]:\//i.test(path)) return from.with({ path: `/${path}` }).toString();
    return Utils.resolvePath(Utils.dirname(from), path).toString();
  }
  const fromPath = fromUri.replace(/\\/g, '/');
  const joined = path.startsWith('/') || /^[a-z]:\//i.test(path) ? path : fromPath.slice(0, fromPath.lastIndexOf('/') + 1) + path;
  return normalizePosix(joined);
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

/** Reads a file from the source the adapter gave; a refusal reads as no file. */
export function readSource(files: FileSource, uri: string): Netlist | undefined {
  const found = typeof files === 'function' ? files(uri) : files.get(uri);
  return isRefusal(found) ? undefined : found;
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

/**
 * Most cards spliced in from included files in one elaboration (the default; the analysis passes
 * its own limit). As many as one file may hold, so a file read through `.include` gets as far as
 * the same text inline; a fan-out (a file including another a thousand times, each including a
 * third a thousand times…) stops here instead of growing without end.
 */
export const DEFAULT_MAX_INCLUDED_CARDS = 1_000_000;

/** A file or library section being spliced in: its items, the next one to take, and where it came from. */
interface Splice {
  items: readonly Item[];
  next: number;
  uri: string;
  /** The `uri#section` keys being expanded, outermost first. */
  stack: readonly string[];
  /** The card that asked for it (absent for the block being expanded itself). */
  card?: IncludeCard | LibCard;
}

/** Splices included files and library sections into a list of items, reporting cycles and missing files on the card. */
export class IncludeExpander {
  /** Files that were read, in first-read order, and the trees read. */
  readonly used: string[] = [];
  readonly usedTrees: (readonly [string, Netlist])[] = [];
  private readonly usedSet = new Set<string>();
  /** Cards taken from included files so far, counted before each is placed. */
  private spliced = 0;

  constructor(private readonly files: FileSource, private readonly sink: FindingSet, private readonly maxIncludedCards = DEFAULT_MAX_INCLUDED_CARDS) {}

  /** Reads a file and remembers that the analysis depends on it. */
  read(uri: string): Netlist | undefined {
    const found = this.fetch(uri);
    return isRefusal(found) ? undefined : found;
  }

  /** The file, or the adapter's refusal of it. */
  private fetch(uri: string): Netlist | ReadRefusal | undefined {
    const found = typeof this.files === 'function' ? this.files(uri) : this.files.get(uri);
    if (found && !isRefusal(found)) this.markUsed(uri, found);
    return found;
  }

  private markUsed(uri: string, tree: Netlist): void {
    if (this.usedSet.has(uri)) return;
    this.usedSet.add(uri);
    this.used.push(uri);
    this.usedTrees.push([uri, tree]);
  }

  /** Included cards counted so far. */
  get splicedCards(): number {
    return this.spliced;
  }

  /** Whether the file is still the tree given (the adapter's parse of it, the very object). */
  sameTree(uri: string, tree: Netlist): boolean {
    return readSource(this.files, uri) === tree;
  }

  /**
   * Stands for a top-level expansion copied from an earlier one that read the same trees
   * (top-level-runs.ts): the files it read and the included cards it counted.
   */
  replayTopLevel(files: readonly (readonly [string, Netlist])[], spliced: number): void {
    for (const [uri, tree] of files) this.markUsed(uri, tree);
    this.spliced = spliced;
  }

  /**
   * Items of a block with every include expanded; `stack` holds the `uri#section` keys being
   * expanded. An explicit work stack, not recursion, and no spreading of a file's items into one
   * call: an included file of any length, nested to the depth limit, costs no stack.
   */
  expand(items: readonly Item[], uri: string, stack: readonly string[], starts?: number[]): PlacedItem[] {
    const out: PlacedItem[] = [];
    const work: Splice[] = [{ items, next: 0, uri, stack }];
    while (work.length) {
      const top = work[work.length - 1]!;
      // Where each of `items` starts among the placed ones, and the end (top-level-runs.ts).
      if (starts && work.length === 1) starts.push(out.length);
      const item = top.items[top.next++];
      if (!item) work.pop();
      else if (item.kind === 'include' || (item.kind === 'lib' && item.path)) {
        const child = this.open(item, top.uri, top.stack);
        if (child) work.push(child);
      } else if (item.kind !== 'lib-section') {
        if (work.length > 1 && !this.withinBudget(work[1]!.card!, uri)) work.length = 1;
        else out.push({ item, uri: top.uri });
      }
    }
    return out;
  }

  /** Counts one more included card; past the limit, reports it once on the outermost include card. */
  private withinBudget(card: IncludeCard | LibCard, uri: string): boolean {
    if (++this.spliced <= this.maxIncludedCards) return true;
    this.sink.add({
      uri, span: card.path!.span, severity: 'error', code: 'limit-exceeded',
      message: `'${card.path!.text}' and what it includes pass ${this.maxIncludedCards} cards read through includes (limit: included cards per analysis); the rest of it and every later include are not read`,
    });
    return false;
  }

  /** The splice an include card asks for, or undefined (with a finding) when it cannot be read. */
  private open(card: IncludeCard | LibCard, uri: string, stack: readonly string[]): Splice | undefined {
    if (!card.path) return undefined;
    const target = resolveIncludePath(uri, card.path.text);
    const section = card.kind === 'lib' && card.section ? key(card.section) : undefined;
    const frame = section ? `${target}#${section}` : target;
    const where = { uri, span: card.path.span };
    if (this.spliced > this.maxIncludedCards) {
      this.sink.add({ ...where, severity: 'error', code: 'limit-exceeded', message: `'${card.path.text}' is not read: earlier includes already brought in ${this.maxIncludedCards} cards (limit: included cards per analysis)` });
      return undefined;
    }
    if (stack.includes(frame)) {
      this.sink.add({ ...where, severity: 'error', code: 'include-cycle', message: `'${card.path.text}' is already being read (${[...stack, frame].join(' → ')}); this include is skipped` });
      return undefined;
    }
    if (stack.length >= MAX_INCLUDE_DEPTH) {
      this.sink.add({ ...where, severity: 'error', code: 'include-depth', message: `includes nest deeper than ${MAX_INCLUDE_DEPTH} files; '${card.path.text}' is not read` });
      return undefined;
    }
    const netlist = this.fetch(target);
    if (!netlist || isRefusal(netlist)) {
      this.sink.add({ ...where, ...unreadFinding(card.path.text, target, netlist) });
      return undefined;
    }
    if (!section) return { items: netlist.items, next: 0, uri: target, stack: [...stack, frame], card };
    const block = netlist.items.find((i) => i.kind === 'lib-section' && i.header.section && key(i.header.section) === section);
    if (!block || block.kind !== 'lib-section') {
      const at = card.kind === 'lib' && card.section ? card.section.span : card.path.span;
      this.sink.add({ uri, span: at, severity: 'error', code: 'missing-lib-section', message: `'${card.path.text}' has no section '${section}'` });
      return undefined;
    }
    return { items: block.body, next: 0, uri: target, stack: [...stack, frame], card };
  }
}

/** The finding on a card whose file was not given: why, when the adapter said, and what was not read. */
function unreadFinding(written: string, target: string, refusal: ReadRefusal | undefined) {
  const code = refusalCode(refusal, 'missing-include');
  // A missing file names where it was looked for; the other reasons name their path themselves.
  const message = refusal
    ? `'${written}' is not read: ${refusal.reason}${refusal.refused === 'missing' ? ` (looked for ${target})` : ''}; what it defines is missing from the analysis`
    : `cannot read '${written}' (looked for ${target})`;
  return { severity: REFUSAL_SEVERITY, code, message };
}
