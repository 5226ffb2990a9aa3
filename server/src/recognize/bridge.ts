/**
 * Single-phase bridges (DESIGN §4): four devices, AC nodes a and b, DC+ and DC−; each AC node has
 * one device forward into DC+ and one forward from DC−. The device types decide the kind: four
 * diodes a diode bridge, four MOSFETs (their body diodes form the bridge) an active bridge, two
 * diodes on one rail and two MOSFETs on the other a hybrid bridge.
 */
import type { DeviceRole, RectifierKind } from '../solve/equivalent-circuit';
import type { RecognizeContext } from './context';
import type { RectDevice } from './devices';
import type { Match } from './match';
import { deviceFrom, firstLowerGroup, upperRow } from './rail-index';

/** Finds and claims every single-phase bridge among the free devices. */
export function matchBridges(ctx: RecognizeContext): Match[] {
  const out: Match[] = [];
  for (const dcPositive of ctx.cathodeNodes()) {
    if (ctx.exhausted) break;
    for (let found = findBridgeAt(ctx, dcPositive); found; found = ctx.exhausted ? undefined : findBridgeAt(ctx, dcPositive)) {
      ctx.claim(found.devices.map((d) => d.device));
      out.push(found);
    }
  }
  return out;
}

/**
 * The first bridge on DC+ node `p`: two AC nodes with a device into `p`, fed from one DC− node,
 * chosen in device order (rail-index.ts), in time linear in the devices around `p`.
 */
function findBridgeAt(ctx: RecognizeContext, p: string): Match | undefined {
  if (ctx.isStiff(p)) return undefined;
  const uppers = upperRow(ctx, p);
  if (uppers.size < 2) return undefined;
  const group = firstLowerGroup(ctx, p, [...uppers.keys()], 2);
  if (!group) return undefined;
  const [a, b] = group.ac as [string, string];
  const roles = { 'upper-a': uppers.get(a)!, 'upper-b': uppers.get(b)!, 'lower-a': deviceFrom(ctx, group.n, a)!, 'lower-b': deviceFrom(ctx, group.n, b)! };
  return bridgeMatch(ctx, roles, [a, b], p, group.n);
}

type BridgeRoles = Record<'upper-a' | 'upper-b' | 'lower-a' | 'lower-b', RectDevice>;

function bridgeMatch(ctx: RecognizeContext, roles: BridgeRoles, ac: [string, string], p: string, n: string): Match {
  const devices = (Object.entries(roles) as [DeviceRole, RectDevice][]).map(([role, device]) => ({ role, device }));
  const { kind, mixed } = bridgeKind(roles);
  const loop = ctx.acLoop(ac[0], ac[1], devices.map((d) => d.device));
  return { kind, mixed, devices, acNodes: ac, dcPositive: p, dcNegative: n, loops: loop ? [loop] : [], capacitorSlots: [[p, n]] };
}

/** Diode, active or hybrid; anything else is mixed and named after the majority. */
export function bridgeKind(roles: BridgeRoles): { kind: RectifierKind; mixed?: boolean } {
  const isFet = (d: RectDevice) => d.type === 'mosfet';
  const fets = Object.values(roles).filter(isFet).length;
  if (fets === 0) return { kind: 'diode-bridge' };
  if (fets === 4) return { kind: 'active-bridge' };
  const upperFets = isFet(roles['upper-a']) && isFet(roles['upper-b']);
  const lowerFets = isFet(roles['lower-a']) && isFet(roles['lower-b']);
  if (fets === 2 && (upperFets || lowerFets)) return { kind: 'hybrid-bridge' };
  return { kind: fets > 2 ? 'active-bridge' : 'diode-bridge', mixed: true };
}
