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

/**
 * Complex Fourier amplitudes (peak) of orders 1…orders of the samples x(t_k) taken as piecewise
 * linear, all in one pass over the segments: the phasors of n·θ and sin(n·ωh/2) are carried from
 * order to order by rotation (angle addition), so each segment costs four trigonometric calls
 * whatever the number of orders; a flat segment (a blocked bridge) contributes nothing and is skipped.
 * The amplitudes are the series' coefficients: x ≈ x̄ + Σ re_n·cos nω(t − t0) + im_n·sin nω(t − t0).
 */
export function fourierAmplitudes(t: ArrayLike<number>, x: ArrayLike<number>, orders: number, count: number, omega: number): { re: Float64Array; im: Float64Array } {
  const re = new Float64Array(orders);
  const im = new Float64Array(orders);
  const t0 = t[0]!;
  const T = t[count - 1]! - t0;
  for (let s = 0; s + 1 < count; s++) {
    const h = t[s + 1]! - t[s]!;
    if (!(h > 0)) continue;
    const b = (x[s + 1]! - x[s]!) / h;
    if (b === 0) continue;
    const th = omega * (0.5 * (t[s]! + t[s + 1]!) - t0);
    const a = 0.5 * omega * h;
    const c1 = Math.cos(th), s1 = Math.sin(th), ca = Math.cos(a), sa = Math.sin(a);
    let cn = c1, sn = s1, can = ca, san = sa;
    for (let n = 0; n < orders; n++) {
      const w = 2 * b * san;
      re[n] += w * sn;
      im[n] += w * cn;
      const cNext = cn * c1 - sn * s1; sn = sn * c1 + cn * s1; cn = cNext;
      const caNext = can * ca - san * sa; san = san * ca + can * sa; can = caNext;
    }
  }
  const jump = x[count - 1]! - x[0]!;
  for (let n = 0; n < orders; n++) {
    const k = (n + 1) * omega;
    // Boundary term of the integration by parts when the record does not close exactly.
    re[n] = (2 / T) * (re[n]! / (k * k));
    im[n] = (2 / T) * (im[n]! / (k * k) - jump / k);
  }
  return { re, im };
}

/** Harmonics 1…40, THD and displacement factor of the source current in a record. */
export function computeHarmonics(rec: HarmonicSource, scale = 1): HarmonicFigures {
  const n = rec.count;
  const x: number[] = [];
  const v: number[] = [];
  for (let k = 0; k < n; k++) { x[k] = rec.sourceCurrentA(k) * scale; v[k] = rec.sourceVoltageV(rec.t[k]!); }
  const omega = rec.net.omega;
  const c = fourierAmplitudes(rec.t, x, HARMONIC_ORDERS, n, omega);
  const harmonicsA: number[] = [];
  for (let h = 0; h < HARMONIC_ORDERS; h++) harmonicsA.push(Math.hypot(c.re[h]!, c.im[h]!) / Math.SQRT2);
  const i1 = { re: c.re[0]!, im: c.im[0]! };
  const v1c = fourierAmplitudes(rec.t, v, 1, n, omega);
  const v1 = { re: v1c.re[0]!, im: v1c.im[0]! };
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
