/**
 * Switch-on inrush: the source closes at a crest of the first path's EMF with every capacitor
 * empty, and the first half-cycle is integrated. Its per-device peak current and ∫i²dt are what a
 * surge rating (IFSM, I²t over a half-sine) is compared with. The positive crest drives the first
 * path's devices; the negative crest drives the opposite half (in a bridge the other diode pair),
 * so the two polarities stress different devices (inrush-cases.ts runs both).
 */
import type { Network } from './network';
import { StageSolver } from './stage';
import { Integrator } from './integrator';
import { PeriodRecord } from './record';
import { integrationOptions } from './shooting';
import { refinedMax } from './figures';
import { zeros } from './vec';

/**
 * Largest step while conducting in the switch-on half-cycle, as a fraction of the period: 67 µs at
 * 50 Hz, enough for the plotted waveform. The error control sets the step where it matters: peak
 * and I²t within 0.02 % of odex (tests/solve/inrush-reference.test.ts). A cap of T/1000 nearly
 * doubled the steps and moved I²t by about 1e-5.
 */
export const INRUSH_STEP_FRACTION = 1 / 300;

/** Which crest of the first path's EMF the switch closes at. */
export type InrushPolarity = 'positive' | 'negative';

export interface InrushResult {
  /** Largest device current in the first half-cycle. */
  peakA: number;
  /** Each device's largest current in the first half-cycle. */
  devicePeakA: number[];
  /** Each device's ∫i²dt over the first half-cycle. */
  i2tA2s: number[];
  /** Instant of switch-on within the period, s. */
  switchOnS: number;
  record: PeriodRecord;
  ok: boolean;
}

/** Integrates the first half-cycle after switch-on at the crest of `polarity` with empty capacitors. */
export function simulateInrush(net: Network, relTol = 1e-5, polarity: InrushPolarity = 'positive'): InrushResult {
  const T = net.periodS;
  const p = net.paths[0]!;
  // Path EMF = A·sin(ωt + φ) with tan φ = b/a; its crest is at ωt + φ = π/2, its trough at 3π/2.
  const phi = Math.atan2(p.b, p.a);
  const crest = polarity === 'positive' ? Math.PI / 2 : (3 * Math.PI) / 2;
  const tOn = ((((crest - phi) / net.omega) % T) + T) % T;
  const integ = new Integrator(net, new StageSolver(net));
  const record = new PeriodRecord(net);
  const opts = { ...integrationOptions(net, relTol, 20000), sensitivity: false, record, hMaxOnS: T * INRUSH_STEP_FRACTION };
  const res = integ.run(tOn, tOn + T / 2, zeros(net.n), -1, opts);
  const nd = net.devices.length;
  const i2t = new Array<number>(nd).fill(0);
  const devicePeakA = new Array<number>(nd).fill(0);
  for (let d = 0; d < nd; d++) {
    for (let k = 0; k < record.count; k++) i2t[d] = i2t[d]! + record.w[k]! * record.deviceCurrentA(k, d) ** 2;
    devicePeakA[d] = Math.max(0, refinedMax(record.t, (k) => record.deviceCurrentA(k, d), record.count));
  }
  return { peakA: Math.max(0, ...devicePeakA), devicePeakA, i2tA2s: i2t, switchOnS: tOn, record, ok: res.ok };
}
