/**
 * A DC choke: an inductor (not coupled) between a rectifier's output rail and its filter
 * capacitor, so the rectifier current flows through it to the capacitor ("choke input"). It is
 * found only where no capacitor sits across the rails themselves: an inductor from DC+ (or DC−)
 * to a node with a capacitor across it and the other rail. The capacitor and the load are then
 * read across that node.
 */
import type { RecognizeContext } from './context';
import type { CapacitorFinding, ChokeFinding } from './rectifier';

/** A choke and the node pair beyond it, where the filter and the load sit. */
export interface ChokeSide {
  choke: ChokeFinding;
  capacitor: CapacitorFinding;
  /** The output node pair beyond the choke (positive, negative). */
  p: string;
  n: string;
}

type FindCapacitor = (ctx: RecognizeContext, x: string, y: string) => CapacitorFinding | undefined;

/** The choke from `p` or `n` to a filter capacitor, when there is exactly one such inductor. */
export function findDcChoke(ctx: RecognizeContext, p: string, n: string, findCapacitor: FindCapacitor): ChokeSide | undefined {
  const found: ChokeSide[] = [];
  for (const [rail, other, positive] of [[p, n, true], [n, p, false]] as const) {
    for (const { element: e, terminal } of ctx.graph.at(rail)) {
      if (e.kind !== 'inductor' || e.terminals.length !== 2 || ctx.coupled.has(e.key) || !(e.value! > 0)) continue;
      const far = e.terminals[1 - terminal]!.node;
      if (far === other || far === rail) continue;
      const capacitor = positive ? findCapacitor(ctx, far, other) : findCapacitor(ctx, other, far);
      if (!capacitor) continue;
      found.push({ choke: { names: [e.name], lH: e.value!, rOhm: 0 }, capacitor, p: positive ? far : p, n: positive ? n : far });
    }
  }
  return found.length === 1 ? found[0] : undefined;
}
