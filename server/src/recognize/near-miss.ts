/**
 * Near misses: four devices in a ring a–P–b–N that would be a bridge but for one reversed device.
 * Such a device shorts the source on one half-cycle (it conducts together with its neighbour on the
 * same AC node). Reported as `reversed-device`, an error, with a quick fix that swaps the device's
 * anode and cathode (drain and source) in its card.
 */
import { anchorOf } from '../circuit/index';
import { type Finding, type Fix } from '../findings/index';
import type { DeviceRole } from '../solve/equivalent-circuit';
import type { RecognizeContext } from './context';
import { deviceRef, type RectDevice } from './devices';
import type { NearMiss } from './rectifier';

interface Reading {
  ring: RectDevice[];
  roles: DeviceRole[];
  reversed: number;
  ac: [string, string];
  p: string;
  n: string;
  score: number;
}

/** Finds and claims every would-be bridge with exactly one reversed device. */
export function matchNearMisses(ctx: RecognizeContext): { nearMisses: NearMiss[]; diagnostics: Finding[] } {
  const nearMisses: NearMiss[] = [];
  for (const ring of findRings(ctx)) {
    if (!ring.every((d) => ctx.isFree(d))) continue;
    const best = readings(ctx, ring).sort((x, y) => y.score - x.score)[0];
    if (!best) continue;
    ctx.claim(ring);
    nearMisses.push(toNearMiss(best));
  }
  return { nearMisses, diagnostics: nearMisses.map(toDiagnostic) };
}

/**
 * Rings of four free devices through four distinct nodes, each ring once, in node order. Every
 * device looked at is a step of the recognition budget: a dense graph ends the search (and the
 * caller reports it) instead of stalling recognition.
 */
function findRings(ctx: RecognizeContext): RectDevice[][] {
  const free = ctx.devices.filter((d) => ctx.isFree(d));
  const at = new Map<string, RectDevice[]>();
  for (const d of free) {
    for (const node of [d.anode, d.cathode]) {
      const list = at.get(node);
      if (list) list.push(d);
      else at.set(node, [d]);
    }
  }
  const other = (d: RectDevice, node: string) => (d.anode === node ? d.cathode : d.anode);
  const rings: RectDevice[][] = [];
  const seen = new Set<string>();
  for (const d1 of free) {
    const [u, v] = [d1.anode, d1.cathode];
    if (!ctx.spend(at.get(v)?.length ?? 0)) return rings;
    for (const d2 of at.get(v) ?? []) {
      const w = other(d2, v);
      if (d2 === d1 || w === u) continue;
      if (!ctx.spend(at.get(w)?.length ?? 0)) return rings;
      for (const d3 of at.get(w) ?? []) {
        const x = other(d3, w);
        if (d3 === d2 || d3 === d1 || x === u || x === v) continue;
        if (!ctx.spend(at.get(x)?.length ?? 0)) return rings;
        for (const d4 of at.get(x) ?? []) {
          if (d4 === d3 || d4 === d2 || d4 === d1 || other(d4, x) !== u) continue;
          const id = [d1, d2, d3, d4].map((d) => d.element.key).sort().join('|');
          if (seen.has(id)) continue;
          seen.add(id);
          rings.push([d1, d2, d3, d4]);
        }
      }
    }
  }
  return rings;
}

/**
 * Every way to read a ring as a bridge with exactly one device against its role. A ring has two
 * such readings (P and N on either diagonal); the one whose AC nodes are fed by a source and whose
 * DC nodes carry a capacitor or load wins.
 */
function readings(ctx: RecognizeContext, ring: RectDevice[]): Reading[] {
  const nodes = ringNodes(ring);
  const out: Reading[] = [];
  for (const diagonal of [0, 1]) {
    for (const flip of [false, true]) {
      const [p, n] = flip ? [nodes[diagonal + 2]!, nodes[diagonal]!] : [nodes[diagonal]!, nodes[diagonal + 2]!];
      const ac: [string, string] = [nodes[(diagonal + 1) % 4]!, nodes[(diagonal + 3) % 4]!];
      if (ctx.isStiff(p) || ctx.isStiff(n)) continue;
      const roles = ring.map((d) => roleIn(d, ac, p, n));
      const wrong = roles.flatMap((r, i) => (r ? [] : [i]));
      if (wrong.length !== 1) continue;
      const reversed = wrong[0]!;
      const dev = ring[reversed]!;
      roles[reversed] = roleIn({ ...dev, anode: dev.cathode, cathode: dev.anode }, ac, p, n);
      const score = (ctx.acLoop(ac[0], ac[1], ring) ? 2 : 0) + (ctx.between('capacitor', p, n).length + ctx.between('resistor', p, n).length > 0 ? 1 : 0);
      out.push({ ring, roles: roles as DeviceRole[], reversed, ac, p, n, score });
    }
  }
  return out;
}

/** The ring's nodes in order, starting where the first and last devices meet. */
function ringNodes(ring: RectDevice[]): string[] {
  const first = ring[0]!;
  const last = ring[3]!;
  const start = [first.anode, first.cathode].find((n) => n === last.anode || n === last.cathode)!;
  const nodes = [start];
  for (const d of ring.slice(0, 3)) nodes.push(d.anode === nodes[nodes.length - 1] ? d.cathode : d.anode);
  return nodes;
}

function roleIn(d: Pick<RectDevice, 'anode' | 'cathode'>, ac: [string, string], p: string, n: string): DeviceRole | undefined {
  const side = (node: string) => (node === ac[0] ? 'a' : node === ac[1] ? 'b' : undefined);
  if (d.cathode === p && side(d.anode)) return `upper-${side(d.anode)!}` as DeviceRole;
  if (d.anode === n && side(d.cathode)) return `lower-${side(d.cathode)!}` as DeviceRole;
  return undefined;
}

function toNearMiss(r: Reading): NearMiss {
  const devices = r.ring.map((d, i) => deviceRef(d, r.roles[i]!));
  const dev = r.ring[r.reversed]!;
  const fix: Fix = {
    title: `Reverse ${dev.element.name} (swap ${dev.anodeTerminal.text} and ${dev.cathodeTerminal.text})`,
    preferred: true,
    edits: [
      { uri: dev.anodeTerminal.uri, span: dev.anodeTerminal.span, newText: dev.cathodeTerminal.text },
      { uri: dev.cathodeTerminal.uri, span: dev.cathodeTerminal.span, newText: dev.anodeTerminal.text },
    ].sort((x, y) => x.span.start - y.span.start),
  };
  return {
    kind: 'reversed-device', devices, reversed: devices[r.reversed]!, acNodes: r.ac, dcPositive: r.p, dcNegative: r.n,
    anchor: anchorOf(dev.element.origin), fix,
  };
}

function toDiagnostic(miss: NearMiss): Finding {
  const dev = miss.reversed;
  const inside = dev.origin.chain.length > 0;
  return {
    ...miss.anchor, severity: 'error', code: 'reversed-device',
    message: `${dev.name} is reversed: with it, the bridge from ${miss.acNodes.join('/')} to ${miss.dcPositive}/${miss.dcNegative} shorts the source on one half-cycle; swap its ${dev.type === 'diode' ? 'anode and cathode' : 'drain and source'}`,
    related: inside ? [{ uri: dev.origin.uri, span: dev.origin.nameSpan, message: `${dev.name} is defined here` }] : undefined,
    fixes: [miss.fix],
  };
}
