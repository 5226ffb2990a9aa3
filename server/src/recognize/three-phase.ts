/**
 * Three-phase six-pulse bridges: three AC nodes, each with one device forward into DC+ and one
 * forward from DC−. Matched before single-phase bridges, which are subsets of this pattern.
 */
import type { DeviceRole } from '../solve/equivalent-circuit';
import type { RecognizeContext } from './context';
import type { RectDevice } from './devices';
import type { Match } from './match';
import { deviceFrom, firstLowerGroup, upperRow } from './rail-index';
import { hasAcDriver, walkChain, type Step } from './source-trace';

/** Finds and claims every six-pulse bridge among the free devices. */
export function matchThreePhase(ctx: RecognizeContext): Match[] {
  const out: Match[] = [];
  for (const p of ctx.cathodeNodes()) {
    if (ctx.exhausted) break;
    for (let found = findAt(ctx, p); found; found = ctx.exhausted ? undefined : findAt(ctx, p)) {
      ctx.claim(found.devices.map((d) => d.device));
      out.push(found);
    }
  }
  return out;
}

/**
 * The first six-pulse bridge on DC+ node `p`: three AC nodes with a device into `p`, fed from one
 * DC− node, chosen in device order (rail-index.ts), in time linear in the devices around `p`.
 */
function findAt(ctx: RecognizeContext, p: string): Match | undefined {
  if (ctx.isStiff(p)) return undefined;
  const uppers = upperRow(ctx, p);
  if (uppers.size < 3) return undefined;
  const group = firstLowerGroup(ctx, p, [...uppers.keys()], 3);
  if (!group) return undefined;
  const upper = group.ac.map((x) => uppers.get(x)!);
  const lower = group.ac.map((x) => deviceFrom(ctx, group.n, x)!);
  return sixPulseMatch(ctx, upper, lower, group.ac, p);
}

function sixPulseMatch(ctx: RecognizeContext, upper: RectDevice[], lower: RectDevice[], phases: string[], p: string): Match {
  const letters = ['a', 'b', 'c'] as const;
  const devices = [
    ...upper.map((device, i) => ({ device, role: `upper-${letters[i]}` as DeviceRole })),
    ...lower.map((device, i) => ({ device, role: `lower-${letters[i]}` as DeviceRole })),
  ];
  const exclude = new Set(devices.map((d) => d.device.element.key));
  // Each phase is traced to its source; a star of sources meets at the neutral.
  const loops: Step[][] = phases.map((ph) => walkChain(ctx.graph, ph, exclude).steps);
  const traced = loops.every((l) => hasAcDriver(l, ctx.coupled));
  return {
    kind: 'three-phase-bridge', devices, acNodes: phases, dcPositive: p, dcNegative: lower[0]!.anode,
    loops: traced ? loops : [], capacitorSlots: [[p, lower[0]!.anode]],
  };
}
