/**
 * Indexes for the bridge matchers, so that finding a bridge on a rail costs the devices around it,
 * not every pair or triple of them: 800 diodes into one rail are 85 million triples but 800
 * entries here. A bridge on DC+ node `p` needs AC nodes, each with a device into `p` (the upper
 * row) and a device into it from one common DC− node `n` (the lower row).
 */
import type { RecognizeContext } from './context';
import type { RectDevice } from './devices';

/** AC-node candidates of a rail: the first free device into `p` from each node, in device order. */
export function upperRow(ctx: RecognizeContext, p: string): Map<string, RectDevice> {
  const first = new Map<string, RectDevice>();
  for (const d of ctx.into(p)) if (!first.has(d.anode)) first.set(d.anode, d);
  return first;
}

/** A choice of AC nodes sharing one DC− node. */
export interface LowerGroup {
  /** The AC nodes, in the upper row's order. */
  ac: string[];
  n: string;
}

/**
 * The first `size` AC nodes (in the upper row's order, compared as a sequence) that one DC− node
 * feeds, and that node: the same choice a search over every combination in that order would
 * reach first. DC− is neither `p` nor a node held by a DC source.
 */
export function firstLowerGroup(ctx: RecognizeContext, p: string, acNodes: readonly string[], size: number): LowerGroup | undefined {
  // DC− node → the AC nodes it feeds; a Set keeps them in the upper row's order and answers membership.
  const fed = new Map<string, Set<string>>();
  for (const x of acNodes) {
    for (const d of ctx.into(x)) {
      const n = d.anode;
      if (n === p || ctx.isStiff(n)) continue;
      const set = fed.get(n);
      if (set) set.add(x);
      else fed.set(n, new Set([x]));
    }
  }
  const rank = new Map(acNodes.map((x, i) => [x, i]));
  let best: string[] | undefined;
  for (const set of fed.values()) {
    if (set.size < size) continue;
    const group = firstOf(set, size);
    if (!best || isEarlier(group, best, rank)) best = group;
  }
  if (!best) return undefined;
  // Among the DC− nodes feeding these AC nodes, the one of the first device into the first AC node.
  const chosen = best;
  const n = ctx.into(chosen[0]!).map((d) => d.anode).find((node) => chosen.every((x) => fed.get(node)?.has(x)));
  return n === undefined ? undefined : { ac: chosen, n };
}

function firstOf(set: ReadonlySet<string>, size: number): string[] {
  const out: string[] = [];
  for (const x of set) {
    if (out.length === size) break;
    out.push(x);
  }
  return out;
}

/** The first free device from `n` into `x`. */
export function deviceFrom(ctx: RecognizeContext, n: string, x: string): RectDevice | undefined {
  return ctx.into(x).find((d) => d.anode === n);
}

function isEarlier(a: readonly string[], b: readonly string[], rank: ReadonlyMap<string, number>): boolean {
  for (let i = 0; i < a.length; i++) {
    const d = rank.get(a[i]!)! - rank.get(b[i]!)!;
    if (d !== 0) return d < 0;
  }
  return false;
}
