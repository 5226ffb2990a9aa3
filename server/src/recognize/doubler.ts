/**
 * Voltage doublers: two devices in series through a node `a` (one forward from DC− into `a`, one
 * forward from `a` into DC+) and two capacitors.
 * - Full-wave (symmetrical): capacitors DC+–m and m–DC−, the source between `a` and the midpoint m.
 * - Half-wave (cascade): a series capacitor from the line `h` to `a`, the output capacitor across
 *   DC+–DC−, the source between `h` and DC−.
 * Roles: `d1` charges the lower (or series) capacitor, `d2` the upper (or output) one.
 */
import type { RecognizeContext } from './context';
import type { RectDevice } from './devices';
import type { Match } from './match';

/** Finds and claims every doubler among the free devices. */
export function matchDoublers(ctx: RecognizeContext): Match[] {
  const out: Match[] = [];
  const caps = new CapacitorIndex(ctx);
  for (const a of new Set(ctx.devices.map((d) => d.anode))) {
    if (ctx.exhausted) break;
    for (let found = findAt(ctx, a, caps); found; found = ctx.exhausted ? undefined : findAt(ctx, a, caps)) {
      ctx.claim(found.devices.map((d) => d.device));
      out.push(found);
    }
  }
  return out;
}

/**
 * The first doubler through node `a`, in the order of a search over every (d2, d1) pair. Only
 * pairs whose DC− node the capacitors around DC+ can reach are tried, so a thousand devices on
 * each side of `a` are not a million trials.
 */
function findAt(ctx: RecognizeContext, a: string, caps: CapacitorIndex): Match | undefined {
  const ins = ctx.into(a);
  if (ins.length === 0) return undefined;
  const byAnode = new Map<string, number[]>();
  ins.forEach((d, i) => {
    const list = byAnode.get(d.anode);
    if (list) list.push(i);
    else byAnode.set(d.anode, [i]);
  });
  const seriesCap = caps.neighbours(a).length > 0;
  for (const d2 of ctx.outOf(a)) {
    const p = d2.cathode;
    if (ctx.isStiff(p)) continue;
    for (const i of candidates(caps.reachableFrom(p, a, seriesCap), byAnode)) {
      const d1 = ins[i]!;
      const n = d1.anode;
      if (p === n || ctx.isStiff(n)) continue;
      const match = fullWave(ctx, d1, d2, a, p, n) ?? halfWave(ctx, d1, d2, a, p, n);
      if (match) return match;
    }
  }
  return undefined;
}

/** Indices (ascending) of the devices whose anode is among `nodes`. */
function candidates(nodes: ReadonlySet<string>, byAnode: ReadonlyMap<string, number[]>): number[] {
  const out: number[] = [];
  for (const n of nodes) for (const i of byAnode.get(n) ?? []) out.push(i);
  return out.sort((x, y) => x - y);
}

/** Which nodes capacitors link, looked up once per node. */
class CapacitorIndex {
  private readonly links = new Map<string, string[]>();

  constructor(private readonly ctx: RecognizeContext) {}

  /** Nodes one two-terminal capacitor away. */
  neighbours(node: string): string[] {
    let list = this.links.get(node);
    if (!list) {
      const at = this.ctx.graph.at(node);
      this.ctx.spend(at.length);
      list = at.flatMap(({ element: e, terminal }) => (e.kind === 'capacitor' && e.terminals.length === 2 ? [e.terminals[1 - terminal]!.node] : []));
      this.links.set(node, list);
    }
    return list;
  }

  /**
   * DC− candidates for DC+ node `p`: two capacitors away (full wave, through a midpoint other than
   * `a` and `p`), or one away when `a` has a series capacitor (half wave).
   */
  reachableFrom(p: string, a: string, seriesCap: boolean): Set<string> {
    const out = new Set<string>(seriesCap ? this.neighbours(p) : []);
    for (const m of this.neighbours(p)) {
      if (m === a || m === p) continue;
      for (const n of this.neighbours(m)) out.add(n);
    }
    return out;
  }
}

function fullWave(ctx: RecognizeContext, d1: RectDevice, d2: RectDevice, a: string, p: string, n: string): Match | undefined {
  for (const upper of ctx.graph.at(p)) {
    if (upper.element.kind !== 'capacitor' || upper.element.terminals.length !== 2) continue;
    const m = upper.element.terminals[1 - upper.terminal]!.node;
    if ([a, p, n].includes(m) || ctx.between('capacitor', m, n).length === 0) continue;
    const loop = ctx.acLoop(a, m, [d1, d2]);
    if (!loop) continue;
    return {
      kind: 'doubler', doubler: 'full-wave', devices: [{ device: d1, role: 'd1' }, { device: d2, role: 'd2' }],
      acNodes: [a, m], dcPositive: p, dcNegative: n, loops: [loop], capacitorSlots: [[m, n], [p, m]],
    };
  }
  return undefined;
}

function halfWave(ctx: RecognizeContext, d1: RectDevice, d2: RectDevice, a: string, p: string, n: string): Match | undefined {
  if (ctx.between('capacitor', p, n).length === 0) return undefined;
  for (const series of ctx.graph.at(a)) {
    if (series.element.kind !== 'capacitor' || series.element.terminals.length !== 2) continue;
    const h = series.element.terminals[1 - series.terminal]!.node;
    if ([a, p, n].includes(h)) continue;
    const loop = ctx.acLoop(h, n, [d1, d2]);
    if (!loop) continue;
    return {
      kind: 'doubler', doubler: 'half-wave', devices: [{ device: d1, role: 'd1' }, { device: d2, role: 'd2' }],
      acNodes: [h, n], dcPositive: p, dcNegative: n, loops: [loop], capacitorSlots: [[h, a], [p, n]],
    };
  }
  return undefined;
}
