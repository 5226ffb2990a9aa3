/**
 * One implicit stage of the three-phase bridge with line inductance: solve y − dh·f(t, y) = r
 * for the states y = (i_a, i_b[, v_C]), i_c = −i_a − i_b. Each line's inductor becomes its
 * companion, E'_x = e_x + (L/dh)·r_x behind Z = L/dh + R, star-connected with a floating star
 * point s; the capacitor becomes r_C behind K = dh/C + ESR beside the load. Any number of the six
 * diodes may conduct (commutation overlap: three). The bridge itself (star point and DC current)
 * is solved by overlap-bridge.ts; dy/dr and df/dr follow from the linearised equations there.
 */
import type { Network } from './network';
import { OverlapBridge } from './overlap-bridge';
import { zeros } from './vec';

/** The bridge and its line: the corner's network (lines without L), the line's L and R. */
export interface OverlapSystem {
  net: Network;
  lH: number;
  rOhm: number;
  /** Device index of each phase's upper and lower diode. */
  upper: number[];
  lower: number[];
  /** States: 2 line currents, then the capacitor voltage unless the port is bare. */
  n: number;
  hasCap: boolean;
}

/** What one stage produces; buffers are reused. */
export class OverlapPoint {
  readonly y: number[];
  readonly f: number[];
  readonly dydr: number[];
  readonly dfdr: number[];
  readonly iLine = [0, 0, 0];
  /** Bridge AC terminal voltages relative to DC−. */
  readonly vTerm = [0, 0, 0];
  /** Port (load) voltage, load current, DC current out of the bridge. */
  u = 0;
  g = 0;
  idc = 0;
  constructor(n: number) {
    this.y = zeros(n); this.f = zeros(n); this.dydr = zeros(n * n); this.dfdr = zeros(n * n);
  }
  copyFrom(o: OverlapPoint): void {
    for (let j = 0; j < this.y.length; j++) { this.y[j] = o.y[j]!; this.f[j] = o.f[j]!; }
    for (let j = 0; j < this.dydr.length; j++) { this.dydr[j] = o.dydr[j]!; this.dfdr[j] = o.dfdr[j]!; }
    for (let x = 0; x < 3; x++) { this.iLine[x] = o.iLine[x]!; this.vTerm[x] = o.vTerm[x]!; }
    this.u = o.u; this.g = o.g; this.idc = o.idc;
  }
}

export class OverlapStage {
  readonly bridge: OverlapBridge;

  constructor(private readonly sys: OverlapSystem) {
    this.bridge = new OverlapBridge(sys.net.load, sys.hasCap, sys.net.devices, sys.upper, sys.lower);
  }

  solve(t: number, dh: number, r: readonly number[], out: OverlapPoint): void {
    const { net, lH, rOhm, hasCap } = this.sys;
    const b = this.bridge;
    const lam = lH / dh;
    b.Z = lam + rOhm;
    const sn = Math.sin(net.omega * t);
    const cs = Math.cos(net.omega * t);
    const r0 = r[0]!, r1 = r[1]!;
    const l = net.lines;
    b.ep[0] = l[0]!.a * sn + l[0]!.b * cs + lam * r0;
    b.ep[1] = l[1]!.a * sn + l[1]!.b * cs + lam * r1;
    b.ep[2] = l[2]!.a * sn + l[2]!.b * cs - lam * (r0 + r1);
    const port = net.ports[0]!;
    const A = hasCap ? r[2]! : 0;
    const K = hasCap ? dh / port.cF + port.esrOhm : net.load.rOhm;
    b.solve(A, K, t);
    this.fill(out, dh, r, A, K);
  }

  private fill(out: OverlapPoint, dh: number, r: readonly number[], A: number, K: number): void {
    const { n, hasCap, lH } = this.sys;
    const b = this.bridge;
    const Z = b.Z;
    const lam = lH / dh;
    const cF = hasCap ? this.sys.net.ports[0]!.cF : 1;
    out.u = b.u; out.g = b.port.g; out.idc = b.idc;
    for (let x = 0; x < 3; x++) {
      const i = b.up[x]!.d - b.low[x]!.d;
      out.iLine[x] = i;
      out.vTerm[x] = b.ep[x]! + b.s - Z * i;
    }
    out.y[0] = out.iLine[0]!; out.y[1] = out.iLine[1]!;
    out.f[0] = (out.iLine[0]! - r[0]!) / dh; out.f[1] = (out.iLine[1]! - r[1]!) / dh;
    const iCap = out.idc - out.g;
    if (hasCap) { out.f[2] = iCap / cF; out.y[2] = A + dh * out.f[2]!; }
    // Linearisation: di_x = q_x·(dE'_x + ds) − pu_x·du; S·ds − P·du = −Σq·dE';
    // du = ua·(dA + K·Σpu·(dE' + ds − du)) (ua = 1/(1 + K·g'), bare: du = R·di_dc).
    // Column m < 2 moves r_m: dE'_m = λ, dE'_c = −λ; column 2 moves the capacitor's source A.
    const pu0 = b.up[0]!.slope, pu1 = b.up[1]!.slope, pu2 = b.up[2]!.slope;
    const q0 = pu0 + b.low[0]!.slope, q1 = pu1 + b.low[1]!.slope, q2 = pu2 + b.low[2]!.slope;
    const S = b.S, P = b.P;
    const ua = hasCap ? 1 / (1 + K * b.port.gp) : 1;
    const kk = hasCap ? K : this.sys.net.load.rOhm;
    const a11 = S, a12 = -P, a21 = -ua * kk * P, a22 = 1 + ua * kk * P;
    const det = a11 * a22 - a12 * a21;
    for (let m = 0; m < n; m++) {
      const e0 = m === 0 ? lam : 0, e1 = m === 1 ? lam : 0, e2 = m < 2 ? -lam : 0;
      const dA = m === 2 ? 1 : 0;
      const sq = q0 * e0 + q1 * e1 + q2 * e2;
      const spu = pu0 * e0 + pu1 * e1 + pu2 * e2;
      let ds: number, du: number;
      if (S > 0) {
        // [S, −P; −ua·K·P, 1 + ua·K·P]·[ds; du] = [−sq; ua·(dA + K·spu)]
        const b1 = -sq, b2 = ua * (dA + kk * spu);
        ds = (b1 * a22 - a12 * b2) / det;
        du = (a11 * b2 - a21 * b1) / det;
      } else { du = ua * dA; ds = 0.5 * du; }
      const di0 = q0 * (e0 + ds) - pu0 * du;
      const di1 = q1 * (e1 + ds) - pu1 * du;
      const didc = pu0 * (e0 + ds - du) + pu1 * (e1 + ds - du) + pu2 * (e2 + ds - du);
      const dicap = hasCap ? didc - b.port.gp * du : 0;
      out.dydr[m] = di0;
      out.dfdr[m] = (di0 - (m === 0 ? 1 : 0)) / dh;
      out.dydr[n + m] = di1;
      out.dfdr[n + m] = (di1 - (m === 1 ? 1 : 0)) / dh;
      if (hasCap) {
        out.dfdr[2 * n + m] = dicap / cF;
        out.dydr[2 * n + m] = dA + dh * dicap / cF;
      }
    }
  }
}
