/**
 * How many cards a subcircuit instance would add to the flattened circuit, counted on the
 * definitions before anything is built. A "billion laughs" (each level instantiating the next
 * twice, forty levels deep: 2^40 diodes) is then refused at its outermost instance at once, with a
 * finding, instead of being built until the element limit stops it.
 */
import { key, type SubcktBlock } from '../../../grammar/src/index';
import type { PlacedItem } from './includes';
import type { PlacedParam } from './scope';

/** A subcircuit definition and where it is written; its expanded body and nested definitions once needed. */
export interface SubcktDef {
  block: SubcktBlock;
  uri: string;
  body?: PlacedItem[];
  own?: Map<string, SubcktDef>;
  /** The body's `.param` lines, gathered once for every instance of the definition. */
  params?: PlacedParam[];
}

/** Definitions visible in a scope: its own, then the enclosing ones. */
export interface Defs {
  own: Map<string, SubcktDef>;
  outer?: Defs;
}

export function lookupDef(defs: Defs | undefined, name: string): SubcktDef | undefined {
  for (let d = defs; d; d = d.outer) {
    const found = d.own.get(name);
    if (found) return found;
  }
  return undefined;
}

/** What the sizer needs from the elaborator: a definition's expanded body and its nested definitions. */
export interface DefinitionReader {
  body(def: SubcktDef): PlacedItem[];
  own(def: SubcktDef): Map<string, SubcktDef>;
}

/**
 * Sizes by instance path (the subcircuit names from the root down), which fixes every name lookup
 * below it, so each path is counted once. Every card of an expanded body counts, models and
 * parameters too: each costs work per instance. Counting itself has a step budget; once spent,
 * sizes are unknown and the elaborator's running count is the only bound left.
 */
export class ExpansionSizer {
  private readonly sizes = new Map<string, number>();
  private stepsLeft: number;

  constructor(private readonly reader: DefinitionReader, private readonly maxDepth: number, private readonly cap: number, steps = 2 * cap) {
    this.stepsLeft = steps;
  }

  /**
   * Cards an instance of `def` entered from scope `outer` at `path` (ending with the definition's
   * own name) would add, at most `cap + 1`; undefined once the counting budget is spent. Recursion
   * here is bounded by the nesting limit: a path never grows past `maxDepth`.
   */
  sizeOf(def: SubcktDef, outer: Defs, path: readonly string[]): number | undefined {
    const id = path.join('\u0000');
    const known = this.sizes.get(id);
    if (known !== undefined) return known;
    const body = this.reader.body(def);
    const defs: Defs = { own: this.reader.own(def), outer };
    let total = body.length;
    for (const { item } of body) {
      if (total > this.cap) break;
      if (--this.stepsLeft < 0) return undefined;
      if (item.kind !== 'instance' || !item.subckt) continue;
      const name = key(item.subckt);
      const child = lookupDef(defs, name);
      // The same cuts as the elaborator's: recursion and nesting past the limit are not expanded.
      if (!child || path.includes(name) || path.length >= this.maxDepth) continue;
      const inner = this.sizeOf(child, defs, [...path, name]);
      if (inner === undefined) return undefined;
      total += inner;
    }
    const size = Math.min(total, this.cap + 1);
    this.sizes.set(id, size);
    return size;
  }
}
