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
  for (const a of new Set(ctx.devices.map((d) => d.anode))) {
    for (let found = findAt(ctx, a); found; found = findAt(ctx, a)) {
      ctx.claim(found.devices.map((d) => d.device));
      out.push(found);
    }
  }
  return out;
}

function findAt(ctx: RecognizeContext, a: string): Match | undefined {
  for (const d2 of ctx.outOf(a)) {
    for (const d1 of ctx.into(a)) {
      const [p, n] = [d2.cathode, d1.anode];
      if (p === n || ctx.isStiff(p) || ctx.isStiff(n)) continue;
      const match = fullWave(ctx, d1, d2, a, p, n) ?? halfWave(ctx, d1, d2, a, p, n);
      if (match) return match;
    }
  }
  return undefined;
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
