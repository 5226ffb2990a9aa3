/**
 * Centre-tapped full-wave: two devices with a common cathode (or a common anode for a negative
 * output), each fed from one end of a tapped winding (two coupled inductors, or two sources in
 * series) whose tap is the other DC node. The two halves must be in antiphase seen from the tap;
 * in phase they would be two half-wave rectifiers in parallel.
 */
import type { FlatElement } from '../circuit/index';
import type { RecognizeContext } from './context';
import type { RectDevice } from './devices';
import type { Match } from './match';
import { hasAcDriver, type Chain, type Step } from './source-trace';

/** Finds and claims every centre-tapped rectifier among the free devices. */
export function matchCentreTaps(ctx: RecognizeContext): Match[] {
  const out: Match[] = [];
  const commons = new Set(ctx.devices.flatMap((d) => [d.anode, d.cathode]));
  for (const common of commons) {
    for (const polarity of ['cathode', 'anode'] as const) {
      if (ctx.exhausted) return out;
      for (const match of matchAt(ctx, common, polarity)) out.push(match);
    }
  }
  return out;
}

/**
 * Every centre tap on one common node, in the order a search over device pairs would find them.
 * Each device's winding is walked once with only that device left out (`windingsOf`); a pair is
 * then tried only when both windings reach the same tap, or when one winding looked at a node the
 * other device touches (there, leaving both out can change the walk). A thousand devices on one
 * node cost a thousand walks, not a million pairs of walks.
 */
function matchAt(ctx: RecognizeContext, common: string, polarity: 'cathode' | 'anode'): Match[] {
  const row = polarity === 'cathode' ? ctx.into(common) : ctx.outOf(common);
  if (row.length < 2 || ctx.isStiff(common)) return [];
  const far = (d: RectDevice) => (polarity === 'cathode' ? d.anode : d.cathode);
  const windings = windingsOf(ctx, row, far, common);
  const index = pairIndex(row, windings);
  const out: Match[] = [];
  for (let i = 0; i < row.length; i++) {
    const wa = windings[i];
    if (!wa || !ctx.isFree(row[i]!)) continue;
    for (const j of index.partnersOf(i)) {
      if (!ctx.isFree(row[j]!)) continue;
      // A pair costs about as much as ten devices listed elsewhere: charged so, the budget stays a bound on time.
      if (!ctx.spend(10)) return out;
      const found = pairAt(ctx, [row[i]!, wa], [row[j]!, windings[j]!], common, polarity);
      if (!found) continue;
      ctx.claim(found.devices.map((d) => d.device));
      out.push(found);
      break;
    }
  }
  return out;
}

/**
 * A device's winding, walked from its far end with only the device itself left out: the chain, the
 * nodes it looked at, its EMF, and whether it can be half of a centre tap on its own terms.
 */
interface Winding {
  end: string;
  chain: Chain;
  nodes: Set<string>;
  emf: Emf | undefined;
  /** It reaches a tap other than its own end and the common node, through an AC driver. */
  usable: boolean;
}

/** Each device's winding; none for a device whose far end another device of the row shares (that one makes a junction there). */
function windingsOf(ctx: RecognizeContext, row: readonly RectDevice[], far: (d: RectDevice) => string, common: string): (Winding | undefined)[] {
  const ends = new Map<string, number>();
  for (const d of row) ends.set(far(d), (ends.get(far(d)) ?? 0) + 1);
  return row.map((d) => {
    const end = far(d);
    if (ends.get(end)! > 1) return undefined;
    const chain = ctx.walk(end, new Set([d.element.key]));
    const usable = chain.end !== end && chain.end !== common && hasAcDriver(chain.steps, ctx.coupled);
    return { end, chain, nodes: new Set([end, ...chain.steps.map((s) => s.to)]), emf: roughEmf(chain.steps, ctx.coupled), usable };
  });
}

/** For each device of the row, the later devices worth pairing it with, in row order. */
function pairIndex(row: readonly RectDevice[], windings: readonly (Winding | undefined)[]) {
  const byTap = new Map<string, number[]>();
  const rowAt = new Map<string, number[]>();
  const visitors = new Map<string, number[]>();
  row.forEach((d, i) => {
    const w = windings[i];
    if (!w) return;
    if (w.usable) push(byTap, w.chain.end, i);
    for (const node of new Set(d.element.terminals.map((t) => t.node))) push(rowAt, node, i);
    for (const node of w.nodes) push(visitors, node, i);
  });
  return {
    partnersOf(i: number): number[] {
      const w = windings[i]!;
      const found = new Set<number>(w.usable ? byTap.get(w.chain.end) : []);
      for (const node of w.nodes) for (const j of rowAt.get(node) ?? []) found.add(j);
      for (const t of row[i]!.element.terminals) for (const j of visitors.get(t.node) ?? []) found.add(j);
      return [...found].filter((j) => j > i && windings[j]).sort((x, y) => x - y);
    },
  };
}

function push<K, V>(map: Map<K, V[]>, key: K, value: V): void {
  const list = map.get(key);
  if (list) list.push(value);
  else map.set(key, [value]);
}

/**
 * The centre tap formed by two devices of a row, checked in full, or undefined. Leaving the
 * partner device out as well changes a walk only at the nodes that device touches, so a winding
 * that looked at none of them is reused as it is.
 */
function pairAt(ctx: RecognizeContext, [da, wa]: [RectDevice, Winding], [db, wb]: [RectDevice, Winding], common: string, polarity: 'cathode' | 'anode'): Match | undefined {
  const [a, b] = [wa.end, wb.end];
  const touches = (w: Winding, d: RectDevice) => d.element.terminals.some((t) => w.nodes.has(t.node));
  const [rewalkA, rewalkB] = [touches(wa, db), touches(wb, da)];
  // The common case, two windings reused whole, is settled without walking anything.
  if (!rewalkA && !rewalkB && (!wa.usable || !wb.usable || wa.chain.end !== wb.chain.end || !antiphase(wa.emf, wb.emf))) return undefined;
  const exclude = new Set([da.element.key, db.element.key]);
  const toTapA = rewalkA ? ctx.walk(a, exclude) : wa.chain;
  const toTapB = rewalkB ? ctx.walk(b, exclude) : wb.chain;
  const tap = toTapA.end;
  if (tap !== toTapB.end || [a, b, common].includes(tap)) return undefined;
  if (!hasAcDriver(toTapA.steps, ctx.coupled) || !hasAcDriver(toTapB.steps, ctx.coupled)) return undefined;
  const emfA = rewalkA ? roughEmf(toTapA.steps, ctx.coupled) : wa.emf;
  const emfB = rewalkB ? roughEmf(toTapB.steps, ctx.coupled) : wb.emf;
  if (!antiphase(emfA, emfB)) return undefined;
  const [p, n] = polarity === 'cathode' ? [common, tap] : [tap, common];
  return {
    kind: 'centre-tap', devices: [{ device: da, role: 'winding-a' }, { device: db, role: 'winding-b' }],
    acNodes: [a, b], dcPositive: p, dcNegative: n, tap, loops: [toTapA.steps, toTapB.steps], capacitorSlots: [[p, n]],
  };
}

/** Whether the EMFs of two chains (each walked from a winding end to the tap) point opposite ways; unknown counts as yes. */
function antiphase(ea: Emf | undefined, eb: Emf | undefined): boolean {
  if (!ea || !eb || ea.kind !== eb.kind) return true;
  return ea.re * eb.re + ea.im * eb.im < 0;
}

interface Emf {
  kind: 'source' | 'winding';
  re: number;
  im: number;
}

/**
 * The open-circuit EMF along a chain, v(start) − v(end), as a phasor: sine sources by amplitude
 * and phase; windings by √L at phase 0 (windings on one core are in phase at their dotted ends).
 */
function roughEmf(steps: readonly Step[], coupled: ReadonlySet<string>): Emf | undefined {
  let re = 0;
  let im = 0;
  let kind: 'source' | 'winding' | undefined;
  for (const { element, from } of steps) {
    const sign = element.terminals[0]!.node === from ? 1 : -1;
    const amplitude = windingOrSine(element, coupled);
    if (!amplitude) continue;
    kind = amplitude.kind;
    re += sign * amplitude.value * Math.cos(amplitude.phaseRad);
    im += sign * amplitude.value * Math.sin(amplitude.phaseRad);
  }
  return kind ? { kind, re, im } : undefined;
}

function windingOrSine(e: FlatElement, coupled: ReadonlySet<string>) {
  if (e.kind === 'vsource' && e.sine && e.sine.amplitude !== 0) return { kind: 'source' as const, value: e.sine.amplitude, phaseRad: (e.sine.phaseDeg * Math.PI) / 180 };
  if (e.kind === 'inductor' && coupled.has(e.key) && e.value) return { kind: 'winding' as const, value: Math.sqrt(e.value), phaseRad: 0 };
  return undefined;
}
