/**
 * The diode law the odex references integrate (tests/solve/odex-reference.test.ts,
 * inrush-reference.test.ts, choke-input-reference.test.ts) and the figures they read off a sampled
 * period, written out from the SPICE diode equation with RS = 0 and solved by
 * bisection, so that nothing of the solver's numerics enters a reference.
 */
import type { DiodeParams } from '../../server/src/solve/equivalent-circuit';
import { bisect } from './fixtures';

/** Our own example diode (no datasheet): IS and N written out, RS = 0, TNOM 25 °C. */
export const SPICE_DIODE: DiodeParams = { isA: 5e-9, n: 1.9, rsOhm: 0, egEv: 1.11, xti: 3, tnomC: 25 };
const VT_25C = (1.380649e-23 * 298.15) / 1.602176634e-19; // kT/q, SI-exact constants

/** Forward drop of SPICE_DIODE at 25 °C: N·Vt·ln(1 + I/IS). */
export const spiceDiodeV = (i: number) => SPICE_DIODE.n * VT_25C * Math.log1p(i / SPICE_DIODE.isA);

/** Bridge current from |e| = Rs·i + 2·Vd(i) + v (zero when the diodes are reverse-biased). */
export function bridgeCurrentA(eAbs: number, v: number, rs: number): number {
  if (eAbs <= v) return 0;
  return bisect((i) => rs * i + 2 * spiceDiodeV(i) + v - eAbs, 0, (eAbs - v) / rs, 80);
}

/** One output voltage and one device current at an instant of a uniformly sampled period. */
export interface PeriodSample { v: number; i: number }

/** The mean of f over a period sampled at uniform instants (each once). */
export function meanOf(samples: readonly PeriodSample[], f: (s: PeriodSample) => number): number {
  return samples.reduce((a, s) => a + f(s), 0) / samples.length;
}

/** Ripple, and the device's peak, average and RMS current, of a period sampled at uniform instants (each once). */
export function sampledFigures(samples: readonly PeriodSample[]) {
  const vs = samples.map((s) => s.v);
  return {
    rippleVpp: Math.max(...vs) - Math.min(...vs),
    ipkA: Math.max(...samples.map((s) => s.i)),
    iavgA: meanOf(samples, (s) => s.i),
    irmsA: Math.sqrt(meanOf(samples, (s) => s.i * s.i)),
  };
}
