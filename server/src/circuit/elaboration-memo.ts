/**
 * What elaboration keeps of its work for the next elaboration, keyed by the cards it came from. The
 * language server's re-parse moves the cards an edit did not touch into the new tree (the same
 * objects, offsets moved in place, and a flat element's offsets are its card's own objects), so
 * work that is a function of such cards and of the scope they sit in stands:
 *
 * - the global parameters' values, a function of the `.param` definitions alone (names and
 *   expressions), kept when resolving them said nothing;
 * - the flat element of each top-level element card, and the whole expansion of each top-level
 *   `X` card (its instances, elements and local models), kept when building it said nothing (no
 *   finding, no directive in the bodies it entered) and found again only in the same top-level
 *   scope (`ScopeToken`: the same global values, model names, subcircuit definitions card for
 *   card, and limits).
 *
 * A card that changed is a new object and misses. What is kept equals a fresh build, so an
 * elaboration's result does not depend on it (tests/circuit/elaboration-memo.test.ts,
 * tests/analysis/incremental.test.ts). The price is the last elaboration's flat circuit kept alive
 * (at 100,000 lines some 45 MB that the compacted analysis would otherwise release); an edit there
 * elaborated in 89 ms before, 18 ms with it (50,000 lines, in process).
 */
import type { Card, InstanceCard, Item, SubcktBlock } from '../../../grammar/src/index';
import type { FindingSet } from '../findings/index';
import type { FlatElement, FlatInstance, FlatModel } from './flat-circuit';
import { resolvePlaced, type PlacedParam } from './scope';

const keptGlobals = new WeakMap<PlacedParam['param'], { placed: readonly PlacedParam[]; values: Map<string, number> }>();

/** The global parameters' values: those of the last resolution of the very same definitions, else resolved (and kept when that said nothing). */
export function globalParamValues(placed: readonly PlacedParam[], sink: FindingSet): Map<string, number> {
  const first = placed[0]?.param;
  const was = first && keptGlobals.get(first);
  if (was && samePlaced(was.placed, placed)) return was.values;
  const offered = sink.offered;
  const values = resolvePlaced(placed, () => undefined, sink);
  if (first && sink.offered === offered) keptGlobals.set(first, { placed, values });
  return values;
}

function samePlaced(a: readonly PlacedParam[], b: readonly PlacedParam[]): boolean {
  if (a.length !== b.length) return false;
  for (let i = 0; i < a.length; i++) if (a[i]!.param !== b[i]!.param || a[i]!.uri !== b[i]!.uri) return false;
  return true;
}

/** What a top-level card's flat form depends on besides the card itself. */
export interface ScopeToken {
  globals: ReadonlyMap<string, number>;
  /** The top-level model keys, joined: an element holds a model's key, never its values. */
  modelKeys: string;
  /** The top-level subcircuit definitions by name, in order. */
  subckts: readonly (readonly [string, SubcktBlock])[];
  /** The elaboration's limits, joined. */
  limits: string;
}

const scopes = new WeakMap<Card, ScopeToken>();

/**
 * The token of this elaboration's top-level scope: the previous one of the same root (found by
 * its first card, which an edit below it leaves in place) when nothing in it changed, else `next`.
 */
export function scopeToken(anchor: Card | undefined, next: ScopeToken): ScopeToken {
  const was = anchor && scopes.get(anchor);
  if (was && sameScope(was, next)) return was;
  if (anchor) scopes.set(anchor, next);
  return next;
}

function sameScope(a: ScopeToken, b: ScopeToken): boolean {
  if (a.modelKeys !== b.modelKeys || a.limits !== b.limits || a.subckts.length !== b.subckts.length) return false;
  if (a.globals !== b.globals) {
    if (a.globals.size !== b.globals.size) return false;
    for (const [name, value] of a.globals) if (!Object.is(b.globals.get(name), value)) return false;
  }
  for (let i = 0; i < a.subckts.length; i++) {
    if (a.subckts[i]![0] !== b.subckts[i]![0] || !sameBlock(a.subckts[i]![1], b.subckts[i]![1])) return false;
  }
  return true;
}

/** Whether two blocks hold the same cards: a re-parse builds every block anew around the cards it moved. */
export function sameBlock(a: SubcktBlock, b: SubcktBlock): boolean {
  const pending: [Item, Item][] = [[a, b]];
  while (pending.length) {
    const [x, y] = pending.pop()!;
    if (x === y) continue;
    if (x.kind !== 'subckt-block' || y.kind !== 'subckt-block') return false;
    if (x.header !== y.header || x.ends !== y.ends || x.body.length !== y.body.length) return false;
    for (let i = 0; i < x.body.length; i++) pending.push([x.body[i]!, y.body[i]!]);
  }
  return true;
}

/** The flat form of a top-level card, with the scope and file it was built in. */
interface Kept<T> {
  scope: ScopeToken;
  uri: string;
  value: T;
}

/** A top-level X card's whole expansion, the instance itself first, and what it charged to the flattened size. */
export interface KeptExpansion {
  instances: FlatInstance[];
  elements: FlatElement[];
  models: [string, FlatModel][];
  charged: number;
  /** What the size check measured before the expansion (undefined: unknown). */
  size: number | undefined;
}

/** Flat forms by card, each found again only in the scope and file it was built in. */
class KeptByCard<C extends Card, T> {
  private readonly kept = new WeakMap<C, Kept<T>>();

  get(card: C, scope: ScopeToken, uri: string): T | undefined {
    const kept = this.kept.get(card);
    return kept && kept.scope === scope && kept.uri === uri ? kept.value : undefined;
  }

  /** Keeps `value`, or forgets what was kept for the card when there is none. */
  set(card: C, scope: ScopeToken, uri: string, value: T | undefined): void {
    if (value) this.kept.set(card, { scope, uri, value });
    else this.kept.delete(card);
  }
}

/** Each top-level element card's flat element. */
export const keptElements = new KeptByCard<Card, FlatElement>();
/** Each top-level X card's whole expansion. */
export const keptExpansions = new KeptByCard<InstanceCard, KeptExpansion>();
