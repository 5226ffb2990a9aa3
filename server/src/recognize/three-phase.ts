/**
 * Three-phase six-pulse bridges: three AC nodes, each with one device forward into DC+ and one
 * forward from DC−. Matched before single-phase bridges, which are subsets of this pattern.
 */
import type { DeviceRole } from '../solve/equivalent-circuit';
import type { RecognizeContext } from './context';
import type { RectDevice } from './devices';
import type { Match } from './match';
import { hasAcDriver, walkChain, type Step } from './source-trace';

/** Finds and claims every six-pulse bridge among the free devices. */
export function matchThreePhase(ctx: RecognizeContext): Match[] {
  const out: Match[] = [];
  for (const p of ctx.cathodeNodes()) {
    for (let found = findAt(ctx, p); found; found = findAt(ctx, p)) {
      ctx.claim(found.devices.map((d) => d.device));
      out.push(found);
    }
  }
  return out;
}

function findAt(ctx: RecognizeContext, p: string): Match | undefined {
  const ups = ctx.into(p);
  if (ups.length < 3 || ctx.isStiff(p)) return undefined;
  for (let i = 0; i < ups.length; i++) {
    for (let j = i + 1; j < ups.length; j++) {
      for (let k = j + 1; k < ups.length; k++) {
        const upper = [ups[i]!, ups[j]!, ups[k]!];
        const phases = upper.map((d) => d.anode);
        if (new Set(phases).size !== 3) continue;
        const lower = lowersFor(ctx, phases, p);
        if (lower) return sixPulseMatch(ctx, upper, lower, phases, p);
      }
    }
  }
  return undefined;
}

/** One device from a common DC− into each phase node, or undefined. */
function lowersFor(ctx: RecognizeContext, phases: string[], p: string): RectDevice[] | undefined {
  for (const first of ctx.into(phases[0]!)) {
    const n = first.anode;
    if (n === p || phases.includes(n) || ctx.isStiff(n)) continue;
    const rest = phases.slice(1).map((ph) => ctx.into(ph).find((d) => d.anode === n));
    if (rest.every((d) => d)) return [first, ...(rest as RectDevice[])];
  }
  return undefined;
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
