/**
 * Whole runs of a root's top level taken from its last elaboration. An edit changes a few cards;
 * the top-level items before and after them are the same objects (the re-parse moves them), and
 * what each produced is kept card by card (elaboration-memo.ts). Looking each one up again still
 * made elaboration about 21 ms of a 50,000-line edit in the worker (placing every item, a look-up
 * per card, the size check per instance); with the runs copied it is about 10. Here the items are compared with the last elaboration's, position by position
 * from both ends, and the unchanged runs at either end are copied whole: their placed items, and
 * the elements, instances and local models they produced.
 *
 * Only what the card-by-card reuse would have produced is copied: a run is taken only in the same
 * scope (`ScopeToken`), when none of its items said anything or was built anew when it was made,
 * when the files the top level reads are the very trees read then, and when no splice (`.include`,
 * `.lib`) sits in the changed part. The flattened-size count and the size check are charged as a
 * card-by-card pass would charge them (elaborate.ts `copyRun`). Proven equal to a fresh build by
 * tests/circuit/top-level-runs.test.ts and the incremental property test.
 */
import type { Card, Item, Netlist } from '../../../grammar/src/index';
import { sameBlock, type ScopeToken } from './elaboration-memo';
import type { FlatElement, FlatInstance, FlatModel } from './flat-circuit';
import type { PlacedItem } from './includes';

/** What the last elaboration of a root made of its top level, for the next to copy runs of. */
export interface TopLevelTrace {
  /** The root's uri: a tree is copied from only under the name it was elaborated under. */
  uri: string;
  scope: ScopeToken;
  rootItems: readonly Item[];
  /** Where each root item's placed items start (length rootItems + 1). */
  placedStart: Int32Array;
  /** How many root items before each index splice in other items (`.include`, `.lib` with a path, a library section). */
  splicingBefore: Int32Array;
  placed: readonly PlacedItem[];
  /** The files the top level read (the root first) and the trees read, and the included cards it counted. */
  files: readonly (readonly [string, Netlist])[];
  spliced: number;
  /** Before each placed item (length placed + 1): the outputs so far, and how many items said something or were built anew. */
  outputs: RunOutputs;
  /** The subcircuit each placed item instantiates, for the size check. */
  subckts: (string | undefined)[];
  elements: readonly FlatElement[];
  instances: readonly FlatInstance[];
  models: readonly (readonly [string, FlatModel])[];
}

/** Running counts before each placed item of a top level. */
export interface RunOutputs {
  elements: Int32Array;
  instances: Int32Array;
  models: Int32Array;
  charged: Float64Array;
  unkept: Int32Array;
}

export function runOutputs(placedCount: number): RunOutputs {
  const n = placedCount + 1;
  return { elements: new Int32Array(n), instances: new Int32Array(n), models: new Int32Array(n), charged: new Float64Array(n), unkept: new Int32Array(n) };
}

/** The placed top level of a new elaboration, with the runs that may be copied from `previous`. */
export interface TopLevelPlan {
  previous: TopLevelTrace;
  placed: PlacedItem[];
  placedStart: Int32Array;
  splicingBefore: Int32Array;
  /** New placed items [0, prefixEnd) are old [0, prefixEnd); new [suffixStart, end) are old [oldSuffixStart, old end). */
  prefixEnd: number;
  suffixStart: number;
  oldSuffixStart: number;
}

const traces = new WeakMap<Card, TopLevelTrace>();

/** The last trace of the root whose first card is `anchor` (an edit below it leaves it in place). */
export function lastTrace(anchor: Card | undefined): TopLevelTrace | undefined {
  return anchor && traces.get(anchor);
}

export function keepTrace(anchor: Card | undefined, trace: TopLevelTrace | undefined): void {
  if (!anchor) return;
  if (trace) traces.set(anchor, trace);
  else traces.delete(anchor);
}

/** Whether a root item splices other items in place of itself. */
export function isSplicing(item: Item): boolean {
  return item.kind === 'include' || item.kind === 'lib-section' || (item.kind === 'lib' && item.path !== undefined);
}

/** The same card, or a block rebuilt around the same cards (a re-parse builds every block anew). */
function sameItem(a: Item, b: Item): boolean {
  if (a === b) return true;
  return a.kind === 'subckt-block' && b.kind === 'subckt-block' && sameBlock(a, b);
}

/**
 * The new top level placed from the last one where only unchanged items surround a changed part
 * with no splice in it (before or after the edit), or undefined when it must be placed afresh.
 * `sameTree` says whether an included file is still the tree read last time.
 */
export function planTopLevel(previous: TopLevelTrace, items: readonly Item[], uri: string, sameTree: (uri: string, tree: Netlist) => boolean): TopLevelPlan | undefined {
  if (previous.uri !== uri) return undefined;
  const old = previous.rootItems;
  const n = items.length;
  const m = old.length;
  let p = 0;
  while (p < n && p < m && sameItem(old[p]!, items[p]!)) p++;
  let s = 0;
  while (s < n - p && s < m - p && sameItem(old[m - 1 - s]!, items[n - 1 - s]!)) s++;
  const was = previous.splicingBefore;
  if (was[m - s]! - was[p]! !== 0) return undefined;
  for (let i = p; i < n - s; i++) if (isSplicing(items[i]!)) return undefined;
  for (let f = 1; f < previous.files.length; f++) if (!sameTree(previous.files[f]![0], previous.files[f]![1])) return undefined;
  const oldStart = previous.placedStart;
  const prefixEnd = oldStart[p]!;
  const oldSuffixStart = oldStart[m - s]!;
  const window = n - s - p;
  const placed = previous.placed.slice(0, prefixEnd);
  for (let i = p; i < n - s; i++) placed.push({ item: items[i]!, uri });
  const suffixStart = placed.length;
  for (let j = oldSuffixStart; j < previous.placed.length; j++) placed.push(previous.placed[j]!);
  // A rebuilt block is placed as the new tree's own object.
  for (let i = 0; i < p; i++) if (old[i] !== items[i]) placed[oldStart[i]!] = { item: items[i]!, uri };
  for (let k = 0; k < s; k++) if (old[m - 1 - k] !== items[n - 1 - k]) placed[suffixStart + oldStart[m - 1 - k]! - oldSuffixStart] = { item: items[n - 1 - k]!, uri };
  const placedStart = new Int32Array(n + 1);
  placedStart.set(oldStart.subarray(0, p + 1));
  for (let k = 1; k <= window; k++) placedStart[p + k] = prefixEnd + k;
  for (let k = 1; k <= s; k++) placedStart[n - s + k] = oldStart[m - s + k]! - oldSuffixStart + suffixStart;
  const splicingBefore = new Int32Array(n + 1);
  splicingBefore.set(was.subarray(0, p + 1));
  splicingBefore.fill(was[p]!, p + 1, n - s + 1);
  splicingBefore.set(was.subarray(m - s + 1), n - s + 1);
  return { previous, placed, placedStart, splicingBefore, prefixEnd, suffixStart, oldSuffixStart };
}

/** The splicing counts of a top level placed afresh. */
export function splicingCounts(items: readonly Item[]): Int32Array {
  const before = new Int32Array(items.length + 1);
  for (let i = 0; i < items.length; i++) before[i + 1] = before[i]! + (isSplicing(items[i]!) ? 1 : 0);
  return before;
}
