/**
 * Figures of one recorded period: per-device stresses and the rectifier's output, capacitor and
 * source figures. All integrals use the record's quadrature weights; peaks are refined by a
 * parabola through the largest sample and its neighbours.
 */
import type { PeriodRecord } from './record';

/** Stresses of one device over a period. */
export interface DeviceStress {
  name: string;
  /** Largest reverse voltage. */
  pivV: number;
  ipkA: number;
  iavgA: number;
  irmsA: number;
  /** Average of v·i. */
  lossW: number;
}

/** Output, capacitor and source figures of a period (source currents before the turns ratio). */
export interface PeriodFigures {
  devices: DeviceStress[];
  vOutAvgV: number;
  /** RMS of the output voltage (the ripple included). */
  vOutRmsV: number;
  vOutMinV: number;
  vOutMaxV: number;
  rippleVpp: number;
  /** RMS current of each filter capacitor (empty without one). */
  capacitorIrmsA: number[];
  outputPowerW: number;
  rectifierLossW: number;
  /** Average power delivered by the source EMF(s). */
  inputPowerW: number;
  /** RMS of the reference line's current, rectifier side. */
  sourceIrmsA: number;
  sourceIpkA: number;
}

/**
 * Computes the figures of a recorded period in one pass over its points: every sum adds the same
 * terms in the same order as a pass per figure would, so the figures are the same to the bit; the
 * pass per figure, with a closure per sample, was a tenth of a rectifier's solve.
 */
export function computePeriodFigures(rec: PeriodRecord): PeriodFigures {
  const net = rec.net;
  const n = rec.count;
  const nd = net.devices.length;
  const caps = net.ports.filter((p) => !p.bare);
  const nc = caps.length;
  const bare = net.ports[0]!.bare;
  // Per device: largest reverse voltage and current (with the point of each), then Σw·i, Σw·i², Σw·v·i.
  const piv = new Float64Array(nd).fill(-Infinity), pivAt = new Int32Array(nd);
  const ipk = new Float64Array(nd).fill(-Infinity), ipkAt = new Int32Array(nd);
  const iSum = new Float64Array(nd), i2Sum = new Float64Array(nd), lossSum = new Float64Array(nd);
  const capSum = new Float64Array(nc);
  let tTotal = 0, vSum = 0, v2Sum = 0, pOutSum = 0, pInSum = 0, src2Sum = 0;
  let vMin = Infinity, vMax = -Infinity, srcPk = -Infinity, srcPkAt = 0;
  for (let k = 0; k < n; k++) {
    const w = rec.w[k]!;
    tTotal += w;
    for (let d = 0; d < nd; d++) {
      const v = rec.devV[k * nd + d]!;
      const i = rec.deviceCurrentA(k, d);
      if (-v > piv[d]!) { piv[d] = -v; pivAt[d] = k; }
      if (i > ipk[d]!) { ipk[d] = i; ipkAt[d] = k; }
      iSum[d] += w * i; i2Sum[d] += w * i ** 2; lossSum[d] += w * (v * i);
    }
    const vOut = rec.vLoadV[k]!;
    vMin = Math.min(vMin, vOut); vMax = Math.max(vMax, vOut);
    vSum += w * vOut; v2Sum += w * vOut ** 2;
    pOutSum += w * (vOut * (bare ? rec.iA[k]! : rec.iLoadA[k]!));
    const m = rec.mode[k]!;
    for (let j = 0; j < nc; j++) {
      const sj = m >= 0 ? net.paths[m]!.s[j]! : 0;
      capSum[j] += w * (sj * rec.iA[k]! - caps[j]!.l * rec.iLoadA[k]!) ** 2;
    }
    pInSum += w * rec.sourcePowerW(k);
    const src = rec.sourceCurrentA(k);
    src2Sum += w * src ** 2;
    if (Math.abs(src) > srcPk) { srcPk = Math.abs(src); srcPkAt = k; }
  }
  const avg = (sum: number) => (tTotal > 0 ? sum / tTotal : 0);
  const devices = net.devices.map((d, j): DeviceStress => ({
    name: d.name,
    pivV: refinedTop(rec.t, (k) => -rec.devV[k * nd + j]!, pivAt[j]!, piv[j]!, n),
    ipkA: refinedTop(rec.t, (k) => rec.deviceCurrentA(k, j), ipkAt[j]!, ipk[j]!, n),
    iavgA: avg(iSum[j]!), irmsA: Math.sqrt(avg(i2Sum[j]!)), lossW: avg(lossSum[j]!),
  }));
  return {
    devices, vOutAvgV: avg(vSum), vOutRmsV: Math.sqrt(avg(v2Sum)), vOutMinV: vMin, vOutMaxV: vMax, rippleVpp: vMax - vMin,
    capacitorIrmsA: Array.from(capSum, (sum) => Math.sqrt(avg(sum))), outputPowerW: avg(pOutSum),
    rectifierLossW: devices.reduce((s, d) => s + d.lossW, 0), inputPowerW: avg(pInSum),
    sourceIrmsA: Math.sqrt(avg(src2Sum)), sourceIpkA: refinedTop(rec.t, (k) => Math.abs(rec.sourceCurrentA(k)), srcPkAt, srcPk, n),
  };
}

/**
 * The largest sample of f, raised to the vertex of the parabola through it and its neighbours
 * when that vertex lies between them and both neighbours are within 20 % of the top (a smooth
 * pulse is otherwise sampled slightly below its top). Never below the largest sample.
 */
export function refinedMax(t: ArrayLike<number>, f: (k: number) => number, n: number): number {
  let best = -Infinity;
  let kb = 0;
  for (let k = 0; k < n; k++) {
    const v = f(k);
    if (v > best) { best = v; kb = k; }
  }
  return refinedTop(t, f, kb, best, n);
}

/** `refinedMax` from its largest sample `best`, the first at point `kb`. */
function refinedTop(t: ArrayLike<number>, f: (k: number) => number, kb: number, best: number, n: number): number {
  if (kb === 0 || kb === n - 1) return Math.max(best, 0);
  const t0 = t[kb - 1]!, t1 = t[kb]!, t2 = t[kb + 1]!;
  const f0 = f(kb - 1), f2 = f(kb + 1);
  // Only a resolved, rounded top is refined; next to a step (an ideal diode switching on) the
  // parabola would overshoot.
  if (!(f0 >= 0.8 * best && f2 >= 0.8 * best)) return Math.max(best, 0);
  // Divided differences of the interpolating parabola.
  const d01 = (best - f0) / (t1 - t0);
  const d12 = (f2 - best) / (t2 - t1);
  const c = (d12 - d01) / (t2 - t0);
  if (!(c < 0) || !(t1 > t0) || !(t2 > t1)) return Math.max(best, 0);
  const b = d01 - c * (t0 + t1);
  const tv = -b / (2 * c);
  if (tv <= t0 || tv >= t2) return Math.max(best, 0);
  const fv = f0 + d01 * (tv - t0) + c * (tv - t0) * (tv - t1);
  // A resolved top moves by a fraction of a percent; a larger lift means the samples straddle a
  // sharp feature (a diode edge) where the parabola is not to be trusted.
  return Math.max(best, Number.isFinite(fv) && fv <= best * 1.005 ? fv : best, 0);
}
