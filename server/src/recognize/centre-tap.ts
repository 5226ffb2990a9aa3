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
import { hasAcDriver, walkChain, type Step } from './source-trace';

/** Finds and claims every centre-tapped rectifier among the free devices. */
export function matchCentreTaps(ctx: RecognizeContext): Match[] {
  const out: Match[] = [];
  const commons = new Set(ctx.devices.flatMap((d) => [d.anode, d.cathode]));
  for (const common of commons) {
    for (const polarity of ['cathode', 'anode'] as const) {
      for (let found = findAt(ctx, common, polarity); found; found = findAt(ctx, common, polarity)) {
        ctx.claim(found.devices.map((d) => d.device));
        out.push(found);
      }
    }
  }
  return out;
}

function findAt(ctx: RecognizeContext, common: string, polarity: 'cathode' | 'anode'): Match | undefined {
  const pair = polarity === 'cathode' ? ctx.into(common) : ctx.outOf(common);
  const far = (d: RectDevice) => (polarity === 'cathode' ? d.anode : d.cathode);
  for (let i = 0; i < pair.length; i++) {
    for (let j = i + 1; j < pair.length; j++) {
      const [da, db] = [pair[i]!, pair[j]!];
      const [a, b] = [far(da), far(db)];
      if (a === b) continue;
      const exclude = new Set([da.element.key, db.element.key]);
      const toTapA = walkChain(ctx.graph, a, exclude);
      const toTapB = walkChain(ctx.graph, b, exclude);
      const tap = toTapA.end;
      if (tap !== toTapB.end || [a, b, common].includes(tap) || ctx.isStiff(common)) continue;
      if (!hasAcDriver(toTapA.steps, ctx.coupled) || !hasAcDriver(toTapB.steps, ctx.coupled)) continue;
      if (!antiphase(toTapA.steps, toTapB.steps, ctx.coupled)) continue;
      const [p, n] = polarity === 'cathode' ? [common, tap] : [tap, common];
      return {
        kind: 'centre-tap', devices: [{ device: da, role: 'winding-a' }, { device: db, role: 'winding-b' }],
        acNodes: [a, b], dcPositive: p, dcNegative: n, tap, loops: [toTapA.steps, toTapB.steps], capacitorSlots: [[p, n]],
      };
    }
  }
  return undefined;
}

/** Whether the EMFs of two chains (each walked from a winding end to the tap) point opposite ways; unknown counts as yes. */
function antiphase(a: readonly Step[], b: readonly Step[], coupled: ReadonlySet<string>): boolean {
  const ea = roughEmf(a, coupled);
  const eb = roughEmf(b, coupled);
  if (!ea || !eb || ea.kind !== eb.kind) return true;
  return ea.re * eb.re + ea.im * eb.im < 0;
}

/**
 * The open-circuit EMF along a chain, v(start) − v(end), as a phasor: sine sources by amplitude
 * and phase; windings by √L at phase 0 (windings on one core are in phase at their dotted ends).
 */
function roughEmf(steps: readonly Step[], coupled: ReadonlySet<string>): { kind: 'source' | 'winding'; re: number; im: number } | undefined {
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
