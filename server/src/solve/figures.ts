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

/** Computes the figures of a recorded period. */
export function computePeriodFigures(rec: PeriodRecord): PeriodFigures {
  const net = rec.net;
  const n = rec.count;
  let tTotal = 0;
  for (let k = 0; k < n; k++) tTotal += rec.w[k]!;
  const avg = (f: (k: number) => number) => {
    let s = 0;
    for (let k = 0; k < n; k++) s += rec.w[k]! * f(k);
    return tTotal > 0 ? s / tTotal : 0;
  };
  const nd = net.devices.length;
  const devices = net.devices.map((d, j): DeviceStress => {
    const iOf = (k: number) => rec.deviceCurrentA(k, j);
    return {
      name: d.name, pivV: refinedMax(rec.t, (k) => -rec.devV[k * nd + j]!, n), ipkA: refinedMax(rec.t, iOf, n),
      iavgA: avg(iOf), irmsA: Math.sqrt(avg((k) => iOf(k) ** 2)),
      lossW: avg((k) => rec.devV[k * nd + j]! * iOf(k)),
    };
  });
  let vMin = Infinity, vMax = -Infinity;
  for (let k = 0; k < n; k++) { vMin = Math.min(vMin, rec.vLoadV[k]!); vMax = Math.max(vMax, rec.vLoadV[k]!); }
  const bare = net.ports[0]!.bare;
  const loadCurrent = (k: number) => (bare ? rec.iA[k]! : rec.iLoadA[k]!);
  const capacitorIrmsA = net.ports.filter((p) => !p.bare).map((p, j) => Math.sqrt(avg((k) => {
    const m = rec.mode[k]!;
    const s = m >= 0 ? net.paths[m]!.s[j]! : 0;
    return (s * rec.iA[k]! - p.l * rec.iLoadA[k]!) ** 2;
  })));
  const sourceAbs = (k: number) => Math.abs(rec.sourceCurrentA(k));
  return {
    devices, vOutAvgV: avg((k) => rec.vLoadV[k]!), vOutRmsV: Math.sqrt(avg((k) => rec.vLoadV[k]! ** 2)), vOutMinV: vMin, vOutMaxV: vMax, rippleVpp: vMax - vMin,
    capacitorIrmsA, outputPowerW: avg((k) => rec.vLoadV[k]! * loadCurrent(k)),
    rectifierLossW: devices.reduce((s, d) => s + d.lossW, 0), inputPowerW: avg((k) => rec.sourcePowerW(k)),
    sourceIrmsA: Math.sqrt(avg((k) => rec.sourceCurrentA(k) ** 2)), sourceIpkA: refinedMax(rec.t, sourceAbs, n),
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
