/**
 * Harmonics of the source current over the steady-state period. The record is taken as a
 * piecewise-linear function and its Fourier integrals are evaluated exactly (integration by
 * parts, slopes times segment phasors), so there is no resampling and no aliasing: the only
 * error is that of the integrator's own solution.
 */
/** What the harmonic analysis reads of a record (the one-path record and the overlap solver's alike). */
export interface HarmonicSource {
  count: number;
  t: number[];
  net: { omega: number };
  sourceCurrentA(k: number): number;
  sourceVoltageV(t: number): number;
}

/** Harmonic orders reported: 1…40 as in IEC 61000-3-2. */
export const HARMONIC_ORDERS = 40;

export interface HarmonicFigures {
  /** RMS of harmonic n at index n − 1, in the units of the input (A). */
  harmonicsA: number[];
  /** √(Σ_{n=2..40} I_n²)/I_1, the definition IEC 61000-3-2 uses (orders 2 to 40). */
  thd: number;
  /** cos of the angle between the fundamentals of source voltage and current. */
  displacementPowerFactor: number;
}

/** Complex Fourier amplitude (peak) of order n of the samples x(t_k) taken as piecewise linear. */
export function fourierAmplitude(t: ArrayLike<number>, x: ArrayLike<number>, n: number, count: number, omega: number): { re: number; im: number } {
  const k = n * omega;
  const t0 = t[0]!;
  const T = t[count - 1]! - t0;
  let re = 0;
  let im = 0;
  for (let s = 0; s + 1 < count; s++) {
    const h = t[s + 1]! - t[s]!;
    if (!(h > 0)) continue;
    const b = (x[s + 1]! - x[s]!) / h;
    const th = k * (0.5 * (t[s]! + t[s + 1]!) - t0);
    const S = Math.sin(0.5 * k * h);
    re -= 2 * b * S * Math.sin(th);
    im -= 2 * b * S * Math.cos(th);
  }
  re /= k * k;
  im /= k * k;
  // Boundary term of the integration by parts when the record does not close exactly.
  im += (x[count - 1]! - x[0]!) / k;
  return { re: (2 / T) * re, im: (2 / T) * im };
}

/** Harmonics 1…40, THD and displacement factor of the source current in a record. */
export function computeHarmonics(rec: HarmonicSource, scale = 1): HarmonicFigures {
  const n = rec.count;
  const x: number[] = [];
  const v: number[] = [];
  for (let k = 0; k < n; k++) { x[k] = rec.sourceCurrentA(k) * scale; v[k] = rec.sourceVoltageV(rec.t[k]!); }
  const omega = rec.net.omega;
  const harmonicsA: number[] = [];
  let i1 = { re: 0, im: 0 };
  for (let h = 1; h <= HARMONIC_ORDERS; h++) {
    const c = fourierAmplitude(rec.t, x, h, n, omega);
    if (h === 1) i1 = c;
    harmonicsA.push(Math.hypot(c.re, c.im) / Math.SQRT2);
  }
  const v1 = fourierAmplitude(rec.t, v, 1, n, omega);
  let sum2 = 0;
  for (let h = 2; h <= HARMONIC_ORDERS; h++) sum2 += harmonicsA[h - 1]! ** 2;
  const fund = harmonicsA[0]!;
  const dAngle = Math.atan2(i1.im, i1.re) - Math.atan2(v1.im, v1.re);
  return {
    harmonicsA,
    thd: fund > 0 ? Math.sqrt(sum2) / fund : 0,
    displacementPowerFactor: fund > 0 ? Math.cos(dAngle) : 1,
  };
}
