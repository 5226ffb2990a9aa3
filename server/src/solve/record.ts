/**
 * The record of one integrated interval: the solution at every stage point with a quadrature
 * weight, so averages and RMS values are integrals of the integrator's own solution (third-order
 * weights on the TR-BDF2 nodes 0, γ, 1) rather than of a resampled copy.
 */
import type { Network } from './network';
import type { StageOut } from './stage';
import { deviceVoltageV } from './mosfet-model';

/** Structure-of-arrays storage of solution points. */
export class PeriodRecord {
  count = 0;
  t: number[] = [];
  /** Quadrature weight of each point, seconds. */
  w: number[] = [];
  mode: number[] = [];
  iA: number[] = [];
  vLoadV: number[] = [];
  iLoadA: number[] = [];
  /** Port voltages, count × nPorts. */
  u: number[] = [];
  /** Device voltages anode − cathode, count × nDevices (negative while blocking). */
  devV: number[] = [];
  private readonly slope = [0];
  private readonly lineV: number[];
  /** onPath[p·nDevices + d]: device d conducts in path p. */
  private readonly onPath: boolean[];
  /** A conducting device's voltage at the current point, computed once per point. */
  private readonly devOn: number[];

  constructor(readonly net: Network) {
    this.lineV = net.lines.map(() => 0);
    this.onPath = net.paths.flatMap((p) => net.devices.map((_, d) => p.devices.includes(d)));
    this.devOn = net.devices.map(() => 0);
  }

  reset(): void {
    this.count = 0;
  }

  /** Appends the solution point of a stage at time t; returns its index. */
  push(t: number, o: StageOut): number {
    // Arrays are overwritten in place after a reset and grow by assignment past their end.
    const k = this.count++;
    const np = this.net.ports.length;
    const nd = this.net.devices.length;
    this.t[k] = t; this.w[k] = 0; this.mode[k] = o.mode; this.iA[k] = o.iA;
    this.vLoadV[k] = o.vLoadV; this.iLoadA[k] = o.iLoadA;
    for (let j = 0; j < np; j++) this.u[k * np + j] = o.u[j]!;
    this.fillDeviceVoltages(o, k * nd);
    return k;
  }

  addWeight(k: number, wS: number): void {
    this.w[k] = this.w[k]! + wS;
  }

  /** Current of device d at point k. */
  deviceCurrentA(k: number, d: number): number {
    const m = this.mode[k]!;
    return m >= 0 && this.onPath[m * this.net.devices.length + d]! ? this.iA[k]! : 0;
  }

  /** Source (mains-referred, before the turns ratio) current at point k. */
  sourceCurrentA(k: number): number {
    const m = this.mode[k]!;
    const own = m >= 0 ? this.net.paths[m]!.srcSign * this.iA[k]! : 0;
    const { magA, magB, omega } = this.net;
    if (magA === 0 && magB === 0) return own;
    // A transformer's magnetising current flows in the primary whether or not a path conducts.
    const wt = omega * this.t[k]!;
    return own + magA * Math.sin(wt) + magB * Math.cos(wt);
  }

  /** Reference line EMF (line a) at time t. */
  sourceVoltageV(t: number): number {
    const l = this.net.lines[0]!;
    return l.a * Math.sin(this.net.omega * t) + l.b * Math.cos(this.net.omega * t);
  }

  /** Instantaneous power delivered by the source EMFs at point k. */
  sourcePowerW(k: number): number {
    const m = this.mode[k]!;
    if (m < 0) return 0;
    const p = this.net.paths[m]!;
    const wt = this.net.omega * this.t[k]!;
    return (p.a * Math.sin(wt) + p.b * Math.cos(wt)) * this.iA[k]!;
  }

  private fillDeviceVoltages(o: StageOut, off: number): void {
    const net = this.net;
    const path = o.mode >= 0 ? net.paths[o.mode]! : undefined;
    if (path) for (const k of path.devices) this.devOn[k] = deviceVoltageV(net.devices[k]!, o.iA, this.slope);
    // The stage evaluated the source phase at this same instant t.
    const sn = o.sinWt;
    const cs = o.cosWt;
    let vMax = -Infinity, vMin = Infinity;
    for (let x = 0; x < net.lines.length; x++) {
      const l = net.lines[x]!;
      let v = l.a * sn + l.b * cs;
      for (let j = 0; j < l.portCoeff.length; j++) v += l.portCoeff[j]! * o.u[j]!;
      const dir = path ? (path.upLine === x ? 1 : path.lowLine === x ? -1 : 0) : 0;
      v -= dir * (o.iA * l.rOhm + o.didtAps * l.lH);
      this.lineV[x] = v;
      vMax = Math.max(vMax, v); vMin = Math.min(vMin, v);
    }
    let vPlus = 0, vMinus = 0;
    if (net.floatingRails) {
      const vBus = o.u[0]!;
      if (path && path.upLine >= 0 && path.lowLine >= 0) {
        const [du, dl] = path.devices;
        vPlus = this.lineV[path.upLine]! - this.devOn[du!]!;
        vMinus = this.lineV[path.lowLine]! + this.devOn[dl!]!;
      } else {
        // All off: the rails float; put them symmetrically about the extreme lines.
        const mid = 0.5 * (vMax + vMin);
        vPlus = mid + 0.5 * vBus; vMinus = mid - 0.5 * vBus;
      }
    } else {
      for (let j = 0; j < net.ports.length; j++) { vPlus += net.railPlus[j]! * o.u[j]!; vMinus += net.railMinus[j]! * o.u[j]!; }
    }
    const nd = net.devices.length;
    for (let k = 0; k < nd; k++) {
      const d = net.devices[k]!;
      const conducting = path !== undefined && this.onPath[o.mode * nd + k]!;
      this.devV[off + k] = conducting
        ? this.devOn[k]!
        : d.upper ? this.lineV[d.line]! - vPlus : vMinus - this.lineV[d.line]!;
    }
  }
}
