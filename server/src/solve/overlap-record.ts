/**
 * The record of one integrated interval of the overlap solver, and its period figures in the
 * shape of the one-path record's (figures.ts): device currents are the line currents split by
 * sign (a phase carries current through its upper diode or its lower one, never both while the
 * bus is above zero), device voltages the terminal voltages against the rails.
 */
import type { Network } from './network';
import type { OverlapPoint, OverlapSystem } from './overlap-stage';
import type { PeriodFigures, DeviceStress } from './figures';
import { refinedMax } from './figures';

export class OverlapRecord {
  count = 0;
  t: number[] = [];
  w: number[] = [];
  /** Line currents and terminal voltages, count × 3. */
  iLine: number[] = [];
  vTerm: number[] = [];
  vLoadV: number[] = [];
  iLoadA: number[] = [];
  idcA: number[] = [];
  readonly net: Network;
  /** Phase and side of each device. */
  private readonly where: { x: number; upper: boolean }[];

  constructor(readonly sys: OverlapSystem) {
    this.net = sys.net;
    this.where = sys.net.devices.map((_, k) => {
      const up = sys.upper.indexOf(k);
      return up >= 0 ? { x: up, upper: true } : { x: sys.lower.indexOf(k), upper: false };
    });
  }

  reset(): void { this.count = 0; }

  push(t: number, o: OverlapPoint): number {
    const k = this.count++;
    this.t[k] = t; this.w[k] = 0;
    for (let x = 0; x < 3; x++) { this.iLine[3 * k + x] = o.iLine[x]!; this.vTerm[3 * k + x] = o.vTerm[x]!; }
    this.vLoadV[k] = o.u; this.iLoadA[k] = this.sys.hasCap ? o.g : o.idc; this.idcA[k] = o.idc;
    return k;
  }

  addWeight(k: number, wS: number): void { this.w[k] = this.w[k]! + wS; }

  deviceCurrentA(k: number, d: number): number {
    const { x, upper } = this.where[d]!;
    const i = this.iLine[3 * k + x]!;
    return upper ? Math.max(i, 0) : Math.max(-i, 0);
  }

  /** Anode − cathode: an upper diode from its line to DC+, a lower one from DC− to its line. */
  deviceVoltageV(k: number, d: number): number {
    const { x, upper } = this.where[d]!;
    const v = this.vTerm[3 * k + x]!;
    return upper ? v - this.vLoadV[k]! : -v;
  }

  /** Line a's current (the reference line, mains-referred before the turns ratio), a transformer's magnetising current beside it. */
  sourceCurrentA(k: number): number {
    const { magA, magB, omega } = this.net;
    const own = this.iLine[3 * k]!;
    if (magA === 0 && magB === 0) return own;
    const wt = omega * this.t[k]!;
    return own + magA * Math.sin(wt) + magB * Math.cos(wt);
  }

  sourceVoltageV(t: number): number { return this.emf(0, t); }

  /** Power delivered by the three EMFs at point k. */
  sourcePowerW(k: number): number {
    const wt = this.net.omega * this.t[k]!;
    const sn = Math.sin(wt), cs = Math.cos(wt);
    let p = 0;
    for (let x = 0; x < 3; x++) {
      const l = this.net.lines[x]!;
      p += (l.a * sn + l.b * cs) * this.iLine[3 * k + x]!;
    }
    return p;
  }

  private emf(x: number, t: number): number {
    const l = this.net.lines[x]!;
    return l.a * Math.sin(this.net.omega * t) + l.b * Math.cos(this.net.omega * t);
  }
}

/**
 * The figures of a recorded period, as computePeriodFigures gives them for the one-path record:
 * every weighted average in one pass over the points (the record is read once, not once a figure).
 */
export function overlapPeriodFigures(rec: OverlapRecord): PeriodFigures {
  const n = rec.count;
  const nd = rec.net.devices.length;
  const sI = new Float64Array(nd), sI2 = new Float64Array(nd), sVI = new Float64Array(nd);
  let tTotal = 0, sV = 0, sV2 = 0, sCap2 = 0, sOut = 0, sIn = 0, sSrc2 = 0;
  let vMin = Infinity, vMax = -Infinity;
  for (let k = 0; k < n; k++) {
    const w = rec.w[k]!;
    const u = rec.vLoadV[k]!;
    tTotal += w;
    sV += w * u; sV2 += w * u * u;
    vMin = Math.min(vMin, u); vMax = Math.max(vMax, u);
    const iCap = rec.idcA[k]! - rec.iLoadA[k]!;
    sCap2 += w * iCap * iCap;
    sOut += w * u * rec.iLoadA[k]!;
    sIn += w * rec.sourcePowerW(k);
    const src = rec.sourceCurrentA(k);
    sSrc2 += w * src * src;
    for (let d = 0; d < nd; d++) {
      const i = rec.deviceCurrentA(k, d);
      sI[d] += w * i; sI2[d] += w * i * i; sVI[d] += w * rec.deviceVoltageV(k, d) * i;
    }
  }
  const avg = (sum: number) => (tTotal > 0 ? sum / tTotal : 0);
  const devices = rec.net.devices.map((d, j): DeviceStress => ({
    name: d.name, pivV: refinedMax(rec.t, (k) => -rec.deviceVoltageV(k, j), n), ipkA: refinedMax(rec.t, (k) => rec.deviceCurrentA(k, j), n),
    iavgA: avg(sI[j]!), irmsA: Math.sqrt(avg(sI2[j]!)), lossW: avg(sVI[j]!),
  }));
  return {
    devices, vOutAvgV: avg(sV), vOutRmsV: Math.sqrt(avg(sV2)),
    vOutMinV: vMin, vOutMaxV: vMax, rippleVpp: vMax - vMin, capacitorIrmsA: rec.sys.hasCap ? [Math.sqrt(avg(sCap2))] : [],
    outputPowerW: avg(sOut), rectifierLossW: devices.reduce((s, d) => s + d.lossW, 0),
    inputPowerW: avg(sIn), sourceIrmsA: Math.sqrt(avg(sSrc2)),
    sourceIpkA: refinedMax(rec.t, (k) => Math.abs(rec.sourceCurrentA(k)), n),
  };
}
