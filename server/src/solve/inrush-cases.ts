/**
 * The inrush check's cases at one corner, and the worst of them per device. Every case starts
 * with the capacitors empty at a crest of the line:
 *
 * - both switch-on polarities, the positive and the negative crest of the first path's EMF: in a
 *   bridge, a centre tap, a doubler or a three-phase bridge each polarity drives different
 *   devices, so each device's surge is the worse of the two. A half-wave rectifier charges on one
 *   polarity only; switched on at the other crest it starts from a zero crossing, which is milder,
 *   so it is not run.
 * - with an NTC inrush limiter in the source loop: a cold start (the limiter at its cold value,
 *   the card's) and a hot restart (the supply switched off and on again while the limiter is
 *   still at its hot value but the capacitor has already been discharged by the load). The hot
 *   restart is the worst inrush such a supply sees (common practice).
 */
import type { EquivalentCircuit } from './equivalent-circuit';
import { buildNetwork, setDeviceTemperatures, type Network, type NetworkOptions } from './network';
import { simulateInrush, type InrushPolarity, type InrushResult } from './inrush';

export type InrushStart = 'switch-on' | 'cold start' | 'hot restart';

/** One device's worst surge over the cases. */
export interface DeviceInrush {
  peakA: number;
  i2tA2s: number;
  /** The case that gave it, in words ("hot restart at the negative crest"). */
  case: string;
}

export interface CornerInrush {
  /** Largest device current over the cases, and the case that gave it. */
  peakA: number;
  peakCase: string;
  devices: DeviceInrush[];
  /** The record of the case with the largest peak (for the waveform). */
  record: InrushResult['record'];
}

/**
 * What a surge is held against when picking the worst: the larger of its peak and the half-sine
 * peak with the same I²t over `durationS`, √(2·I²t/t) (REFERENCES.md §5, D).
 */
export function surgeFigureA(peakA: number, i2tA2s: number, durationS: number): number {
  return Math.max(peakA, Math.sqrt((2 * i2tA2s) / durationS));
}

/** The starts and polarities to run for a circuit, with the series resistance of each start. */
export function inrushCasesOf(c: EquivalentCircuit): { start: InrushStart; seriesROhm: number; polarity: InrushPolarity }[] {
  const r = c.source.seriesROhm;
  const lim = c.inrushLimiter;
  const starts: { start: InrushStart; seriesROhm: number }[] = lim
    ? [{ start: 'cold start', seriesROhm: r - lim.hotROhm + lim.coldROhm }, { start: 'hot restart', seriesROhm: r }]
    : [{ start: 'switch-on', seriesROhm: r }];
  const polarities: InrushPolarity[] = c.kind === 'half-wave' ? ['positive'] : ['positive', 'negative'];
  return starts.flatMap((s) => polarities.map((polarity) => ({ ...s, polarity })));
}

/**
 * Runs every case at one corner on `net` (the corner's network, whose series resistance is the
 * circuit's) with the junctions at the ambient; undefined when a case ran out of steps.
 */
export function worstInrush(
  c: EquivalentCircuit, net: Network, lineScale: number, ambientC: number, relTol?: number, options?: NetworkOptions,
): CornerInrush | undefined {
  const tj = c.devices.map(() => ambientC);
  const durationS = 1 / (2 * c.source.freqHz);
  const mirror = bridgeMirror(c);
  const positive = new Map<InrushStart, InrushResult>();
  let worst: CornerInrush | undefined;
  for (const k of inrushCasesOf(c)) {
    const mirrored = mirror && k.polarity === 'negative' ? positive.get(k.start) : undefined;
    let r: InrushResult;
    if (mirrored && mirror) r = { ...mirrored, devicePeakA: mirror.map((m) => mirrored.devicePeakA[m]!), i2tA2s: mirror.map((m) => mirrored.i2tA2s[m]!) };
    else {
      const caseNet = k.seriesROhm === c.source.seriesROhm ? net
        : buildNetwork({ ...c, source: { ...c.source, seriesROhm: k.seriesROhm } }, lineScale, tj, [], options);
      if (!caseNet) return undefined;
      setDeviceTemperatures(caseNet, tj);
      r = simulateInrush(caseNet, relTol, k.polarity);
      if (!r.ok) return undefined;
      if (k.polarity === 'positive') positive.set(k.start, r);
    }
    const label = `${k.start} at the ${k.polarity} crest`;
    if (!worst) {
      worst = { peakA: r.peakA, peakCase: label, record: r.record, devices: r.devicePeakA.map((p, d) => ({ peakA: p, i2tA2s: r.i2tA2s[d]!, case: label })) };
      continue;
    }
    if (r.peakA > worst.peakA) Object.assign(worst, { peakA: r.peakA, peakCase: label, record: r.record });
    worst.devices.forEach((d, i) => {
      const peakA = r.devicePeakA[i]!;
      const i2tA2s = r.i2tA2s[i]!;
      if (surgeFigureA(peakA, i2tA2s, durationS) > surgeFigureA(d.peakA, d.i2tA2s, durationS)) Object.assign(d, { peakA, i2tA2s, case: label });
    });
  }
  return worst;
}

const MIRROR_ROLE: Readonly<Record<string, string>> = { 'upper-a': 'upper-b', 'upper-b': 'upper-a', 'lower-a': 'lower-b', 'lower-b': 'lower-a' };

/**
 * For a single-phase diode bridge whose mirrored devices (upper-a ↔ upper-b, lower-a ↔ lower-b)
 * have the same model, the negative crest's surge is the positive crest's with the two halves
 * swapped (the loop is the same, traversed by the other pair): each device's index → the index
 * of its mirror. Undefined when the bridge is not symmetric, so both crests are integrated.
 */
function bridgeMirror(c: EquivalentCircuit): number[] | undefined {
  if (c.kind !== 'diode-bridge') return undefined;
  const mirror = c.devices.map((d) => c.devices.findIndex((e) => e.role === MIRROR_ROLE[d.role]));
  const same = c.devices.every((d, k) => {
    const m = c.devices[mirror[k]!];
    return m !== undefined && d.kind === 'diode' && m.kind === 'diode' && JSON.stringify(d.params) === JSON.stringify(m.params);
  });
  return same ? mirror : undefined;
}
