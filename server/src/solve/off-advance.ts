/**
 * The advance between conduction intervals, without time steps. While no path conducts, every
 * capacitor the load spans carries the load current alone, so the load sees one capacitor
 * C = 1/Σ(l_j/C_j) charged to V = Σ l_j·v_j behind R = Σ l_j·ESR_j:
 *
 *   C·dV/dt = −g(vL),   vL = V − R·g(vL),
 *
 * a scalar autonomous equation (the other capacitors and an inductor whose current has reached
 * zero stand still). A resistive load decays exactly, V·e^(−t/((R_load + R)·C)); current, power
 * and mixed loads take classic fourth-order Runge–Kutta substeps of at most 1/20 of the local
 * time constant on this smooth scalar equation, whose error is far below the tolerance.
 *
 * Turn-on is the first instant the best path's drive (EMF minus the port voltages) turns
 * positive: sampled on a grid of T/64 (the EMF crests are breakpoints, so a narrow window at the
 * crest of a light load is sampled at its top) and refined by the Illinois method to the edge
 * tolerance. The advance ends just past it, where the stage solver takes over.
 *
 * The period Jacobian needs no integration either: for an autonomous scalar equation
 * dV(t)/dV(0) = f(V(t))/f(V(0)), and each capacitor moves by its share of the charge lost.
 */
import type { Network } from './network';
import type { PeriodRecord } from './record';
import { StageOut, type StageSolver } from './stage';
import { copyInto, zeros } from './vec';

/** Sampling of the drive and of the record, as a fraction of the period. */
const GRID_FRACTION = 1 / 64;
/** Largest Runge–Kutta substep as a fraction of the local time constant. */
const RK_FRACTION = 0.05;
/** Most Runge–Kutta substeps of one advance; a stiffer load takes the backward-Euler path. */
const MAX_RK_SUBSTEPS = 256;
/** Backward-Euler substeps of one stiff advance. */
const STIFF_SUBSTEPS = 32;

/** Where an advance ended: at the limit, or just past a turn-on. */
export interface OffAdvanceEnd {
  t: number;
  turnedOn: boolean;
}

export class OffAdvance {
  private readonly cEq: number;
  private readonly rEq: number;
  private readonly exact: boolean;
  private readonly y0: number[];
  private readonly yAt: number[];
  private readonly jac: number[];
  private readonly tmp: number[];
  private readonly out: StageOut;
  private v0 = 0;

  /** Whether a network's off state is this scalar equation: capacitor ports only, each wholly in or out of the load. */
  static applies(net: Network): boolean {
    return net.ports.every((p) => !p.bare && (p.l === 0 || p.l === 1) && p.cF > 0) && net.ports.some((p) => p.l === 1);
  }

  constructor(private readonly net: Network, private readonly solver: StageSolver) {
    let invC = 0;
    let r = 0;
    for (const p of net.ports) if (p.l === 1) { invC += 1 / p.cF; r += p.esrOhm; }
    this.cEq = 1 / invC;
    this.rEq = r;
    this.exact = net.load.kind === 'resistance' && !net.load.mixed;
    this.y0 = zeros(net.n);
    this.yAt = zeros(net.n);
    this.jac = zeros(net.n * net.n);
    this.tmp = zeros(net.n * net.n);
    this.out = new StageOut(net.n, net.ports.length);
  }

  /**
   * Advances y (and, when given, the sensitivity Y ← J·Y) from t0 towards tLimit with no path
   * conducting; stops just past a turn-on. With a record, pushes the interval's points with
   * Simpson weights (the point at t0 is the record's last).
   */
  advance(t0: number, tLimit: number, y: number[], Y: number[] | undefined, rec: PeriodRecord | undefined, hEdgeS: number): OffAdvanceEnd {
    const T = this.net.periodS;
    copyInto(this.y0, y);
    let v0 = 0;
    for (let j = 0; j < this.net.ports.length; j++) if (this.net.ports[j]!.l === 1) v0 += y[j]!;
    this.v0 = v0;
    const grid = T * GRID_FRACTION;
    let tk = t0;
    let vk = v0;
    let pk = this.drive(t0, v0);
    let tEnd = tLimit;
    let turnedOn = false;
    while (tk < tLimit) {
      const tn = Math.min(tk + grid, tLimit);
      const vn = this.decay(vk, tn - tk);
      const pn = this.drive(tn, vn);
      if (pn > 0) {
        tEnd = this.turnOn(tk, vk, pk, tn, pn, hEdgeS);
        turnedOn = true;
        break;
      }
      tk = tn; vk = vn; pk = pn;
    }
    if (rec) this.record(rec, t0, tEnd, v0);
    const vEnd = this.decay(vk, tEnd - tk);
    this.stateAt(vEnd, y);
    if (Y) this.propagate(v0, vEnd, Y);
    return { t: tEnd, turnedOn };
  }

  /** V after dt of the off-state equation from V. */
  private decay(v: number, dt: number): number {
    if (dt <= 0) return v;
    const c = this.cEq;
    if (this.exact) {
      const rl = this.net.load.rOhm;
      return Number.isFinite(rl) ? v * Math.exp(-dt / ((rl + this.rEq) * c)) : v;
    }
    const g = this.solver.loadAt(v, this.rEq);
    const gp = Math.abs(this.solver.loadSlope);
    const rate = Math.max(gp / (c * (1 + this.rEq * gp)), v > 0 ? Math.abs(g) / (c * v) : 0);
    const n = Math.max(1, Math.ceil((dt * rate) / RK_FRACTION));
    // A load far stiffer than the interval (a current or power load fading below its floor into a
    // small capacitor) would need millions of substeps: there V falls onto its floor within a
    // substep, and backward Euler (stable and monotone, since g grows with V) follows it in a
    // bounded number of steps instead.
    if (n > MAX_RK_SUBSTEPS) return this.decayStiff(v, dt);
    const h = dt / n;
    const f = (x: number) => -this.solver.loadAt(x, this.rEq) / c;
    for (let k = 0; k < n; k++) {
      const k1 = f(v);
      const k2 = f(v + 0.5 * h * k1);
      const k3 = f(v + 0.5 * h * k2);
      const k4 = f(v + h * k3);
      v += (h / 6) * (k1 + 2 * k2 + 2 * k3 + k4);
    }
    return v;
  }

  /** V after dt by backward-Euler substeps: x + (h/C)·g(x) = v, solved by safeguarded Newton on its bracket. */
  private decayStiff(v: number, dt: number): number {
    const c = this.cEq;
    const h = dt / STIFF_SUBSTEPS;
    for (let k = 0; k < STIFF_SUBSTEPS; k++) {
      const g0 = this.solver.loadAt(v, this.rEq);
      // g grows with x, so F(x) = x + (h/C)·g(x) − v changes sign between v − (h/C)·g(v) and v.
      let lo = Math.min(v, v - (h / c) * g0);
      let hi = Math.max(v, v - (h / c) * g0);
      let x = v;
      for (let it = 0; it < 60; it++) {
        const g = this.solver.loadAt(x, this.rEq);
        const F = x + (h / c) * g - v;
        if (F > 0) hi = x; else lo = x;
        const slope = 1 + (h / c) * Math.abs(this.solver.loadSlope);
        let next = x - F / slope;
        if (!(next > lo && next < hi)) next = 0.5 * (lo + hi);
        if (Math.abs(next - x) <= 1e-12 * Math.max(1, Math.abs(v)) || hi - lo <= 1e-12 * Math.max(1, Math.abs(v))) { x = next; break; }
        x = next;
      }
      v = x;
    }
    return v;
  }

  /** Every state at load-side voltage V: each series capacitor gives up its share of the charge. */
  private stateAt(v: number, y: number[]): void {
    const ports = this.net.ports;
    const q = this.cEq * (this.v0 - v);
    for (let j = 0; j < ports.length; j++) y[j] = this.y0[j]! - (ports[j]!.l * q) / ports[j]!.cF;
    if (this.net.hasL) y[this.net.n - 1] = 0;
  }

  /** The best path's drive at time t and voltage V (positive: that path conducts), leaving the point in `out`. */
  private drive(t: number, v: number): number {
    const net = this.net;
    const o = this.out;
    this.stateAt(v, this.yAt);
    const g = this.solver.loadAt(v, this.rEq);
    o.mode = -1; o.iA = 0; o.didtAps = 0; o.iLoadA = g; o.vLoadV = this.solver.loadVoltageV;
    for (let j = 0; j < net.ports.length; j++) {
      const p = net.ports[j]!;
      o.u[j] = this.yAt[j]! - p.esrOhm * p.l * g;
      o.y[j] = this.yAt[j]!;
      o.f[j] = (-p.l * g) / p.cF;
    }
    if (net.hasL) { o.y[net.n - 1] = 0; o.f[net.n - 1] = 0; }
    const sn = Math.sin(net.omega * t);
    const cs = Math.cos(net.omega * t);
    o.sinWt = sn; o.cosWt = cs;
    let best = -Infinity;
    for (const path of net.paths) {
      let d = path.a * sn + path.b * cs;
      for (let j = 0; j < net.ports.length; j++) d -= path.s[j]! * o.u[j]!;
      if (d > best) best = d;
    }
    o.phi = best;
    return best;
  }

  /** Illinois regula falsi on the drive between (ta, φa ≤ 0) and (tb, φb > 0); returns a time just past the edge. */
  private turnOn(ta: number, va: number, pa: number, tb: number, pb: number, hEdge: number): number {
    const t0 = ta;
    let side = 0;
    for (let it = 0; it < 60 && tb - ta > hEdge; it++) {
      let tc = pa === pb ? 0.5 * (ta + tb) : ta + (tb - ta) * (pa / (pa - pb));
      if (!(tc > ta && tc < tb)) tc = 0.5 * (ta + tb);
      const pc = this.drive(tc, this.decay(va, tc - t0));
      if (pc > 0) { tb = tc; pb = pc; if (side === 1) pa *= 0.5; side = 1; }
      else { ta = tc; pa = pc; if (side === -1) pb *= 0.5; side = -1; }
    }
    return tb;
  }

  /** Record points on an even grid over [t0, t1] with Simpson weights. */
  private record(rec: PeriodRecord, t0: number, t1: number, v0: number): void {
    const T = this.net.periodS;
    const m = Math.max(1, Math.ceil((t1 - t0) / (2 * T * GRID_FRACTION)));
    const h = (t1 - t0) / (2 * m);
    rec.addWeight(rec.count - 1, h / 3);
    let v = v0;
    for (let k = 1; k <= 2 * m; k++) {
      v = this.decay(v, h);
      const t = k === 2 * m ? t1 : t0 + k * h;
      this.drive(t, v);
      rec.addWeight(rec.push(t, this.out), ((k === 2 * m ? 1 : k % 2 === 1 ? 4 : 2) * h) / 3);
    }
  }

  /** Y ← J·Y with J = dy(t)/dy(t0) of the off interval. */
  private propagate(v0: number, v1: number, Y: number[]): void {
    const net = this.net;
    const n = net.n;
    const g0 = this.solver.loadAt(v0, this.rEq);
    const g1 = this.solver.loadAt(v1, this.rEq);
    const sigma = g0 !== 0 ? g1 / g0 : 1;
    const J = this.jac;
    for (let i = 0; i < n; i++) {
      for (let m = 0; m < n; m++) {
        const cap = i < net.nCap && m < net.nCap;
        const li = cap ? net.ports[i]!.l : 0;
        const lm = cap ? net.ports[m]!.l : 0;
        J[i * n + m] = cap ? (i === m ? 1 : 0) - (li * lm * this.cEq * (1 - sigma)) / net.ports[i]!.cF : 0;
      }
    }
    copyInto(this.tmp, Y);
    for (let i = 0; i < n; i++) {
      for (let c = 0; c < n; c++) {
        let s = 0;
        for (let k = 0; k < n; k++) s += J[i * n + k]! * this.tmp[k * n + c]!;
        Y[i * n + c] = s;
      }
    }
  }
}
