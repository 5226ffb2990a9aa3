/**
 * Half-wave: one device between an AC port (a source after its series R and L) and a DC node
 * that has a capacitor, resistor or current source back to the port's other end. Requiring the AC
 * source and something to feed keeps diode strings, diode-OR gates and clamps to a supply rail out.
 */
import type { RecognizeContext } from './context';
import type { RectDevice } from './devices';
import type { Match } from './match';
import { reverseSteps, type Step } from './source-trace';

/** Finds and claims every half-wave rectifier among the free devices. */
export function matchHalfWaves(ctx: RecognizeContext): Match[] {
  const out: Match[] = [];
  // Whether a DC node is fed back to the return, by node pair: a thousand devices into one output
  // node look at its terminals once, not a thousand times.
  const fed = new Map<string, boolean>();
  const isFed = (node: string, ret: string) => {
    const id = `${node}\u0000${ret}`;
    let known = fed.get(id);
    if (known === undefined) fed.set(id, (known = FEEDS.some((kind) => ctx.between(kind, node, ret).length > 0)));
    return known;
  };
  for (const port of ctx.ports) {
    for (const [line, ret] of [port.ends, [port.ends[1], port.ends[0]]] as const) {
      if (ctx.exhausted) return out;
      const loop = line === port.ends[0] ? port.steps : reverseSteps(port.steps);
      for (const device of [...ctx.outOf(line), ...ctx.into(line)]) {
        const match = halfWaveOf(ctx, device, line, ret, loop, isFed);
        if (!match) continue;
        ctx.claim([device]);
        out.push(match);
      }
    }
  }
  return out;
}

const FEEDS = ['capacitor', 'resistor', 'isource'] as const;

function halfWaveOf(
  ctx: RecognizeContext, device: RectDevice, line: string, ret: string, loop: Step[], isFed: (node: string, ret: string) => boolean,
): Match | undefined {
  if (!ctx.isFree(device)) return undefined;
  const positive = device.anode === line;
  const out = positive ? device.cathode : device.anode;
  if (out === ret || ctx.isStiff(out) || !isFed(out, ret)) return undefined;
  const [p, n] = positive ? [out, ret] : [ret, out];
  return {
    kind: 'half-wave', devices: [{ device, role: 'series' }], acNodes: [line, ret],
    dcPositive: p, dcNegative: n, loops: [loop], capacitorSlots: [[p, n]],
  };
}

