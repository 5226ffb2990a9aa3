/**
 * The bridge inside one implicit stage of the overlap solver: the lines' companion EMFs E'_x
 * behind Z, star-connected with a floating star point s, into the six diodes and the DC port,
 * whose voltage u follows from the DC current i in closed form (overlap-port.ts). Unknowns
 * (s, i): Σ i_x(s, u(i)) = 0 at the star point and i = Σ upper-diode currents.
 *
 * A joint Newton on (s, i) takes one or two evaluations of the phases (six diode solves each): it
 * starts on the line through the last two stages' solutions, and its last step, once every
 * diode's second-order term is negligible, is taken along the tangents without evaluating again.
 * Its Jacobian [S, −P·a; −P, 1 + P·a] (S = Σ slopes, P = Σ upper slopes, a = du/di) has
 * det ≥ S > 0 whenever a diode conducts. The diodes switch on and off in (s, i), so the system is
 * only piecewise smooth: where Newton stops halving its residual (CONTRACTION_WINDOW) or runs out
 * of evaluations (JOINT_LIMIT), the nested monotone bracketed searches (DC current ← bus voltage
 * ← star point ← each diode) take over, slow (about twenty evaluations) but certain.
 */
import type { DiodeAtTemp } from './diode-model';
import type { LoadModel } from './network';
import { DiodeBehindZ } from './overlap-phase';
import { solvePort, type PortPoint } from './overlap-port';

/** Evaluations of the phases the joint Newton may take before the nested searches take over. */
const JOINT_LIMIT = 30;
/** Evaluations the joint Newton may go without halving its residual. */
const CONTRACTION_WINDOW = 4;
/** A Newton step this small (relative to the EMF spread, or its current over Z) ends the iteration. */
const STEP_TOL = 1e-12;

export class OverlapBridge {
  readonly up = [new DiodeBehindZ(), new DiodeBehindZ(), new DiodeBehindZ()];
  readonly low = [new DiodeBehindZ(), new DiodeBehindZ(), new DiodeBehindZ()];
  /** Companion EMFs of the lines, set by the caller before each solve, and their impedance. */
  readonly ep = new Float64Array(3);
  Z = 1;
  /** The solution: star point, bus voltage, port point, Σ slopes, Σ upper slopes, DC current. */
  s = 0;
  u = 0;
  readonly port: PortPoint = { v: 0, g: 0, gp: 0 };
  S = 0;
  P = 0;
  idc = 0;
  /** Work: evaluations of the phases (six diode solves each) and solves left to the nested searches. */
  evaluations = 0;
  fallbacks = 0;
  private sWarm = 0;
  private iWarm = 0;
  /** The two solutions before, (t, s, i), for a linear predictor of the next. */
  private readonly past = new Float64Array(6);
  private pastCount = 0;
  private A = 0;
  private K = 1;

  /**
   * `devices` is read at every solve: the thermal loop sets their temperatures in place.
   * `jointLimit` 0 leaves every solve to the nested searches (the tests compare the two).
   */
  constructor(
    private readonly load: LoadModel, private readonly hasCap: boolean, private readonly devices: readonly DiodeAtTemp[],
    private readonly upper: readonly number[], private readonly lower: readonly number[], private readonly jointLimit = JOINT_LIMIT,
  ) {}

  /**
   * Solves the bridge for the EMFs in `ep` behind `Z` and the port (the capacitor's companion
   * source A behind K, or the bare load K = R); leaves the phases evaluated at the solution.
   */
  solve(A: number, K: number, t: number): void {
    this.A = A; this.K = K;
    const ep = this.ep;
    const eMax = Math.max(ep[0]!, ep[1]!, ep[2]!);
    const eMin = Math.min(ep[0]!, ep[1]!, ep[2]!);
    const u0 = Math.max(this.uOf(0), 0);
    if (u0 - eMax >= -eMin) {
      // Every line inside [0, u]: nothing conducts; the star point sits mid-window.
      this.iWarm = 0;
      this.pastCount = 0;
      this.u = u0;
      this.s = 0.5 * (u0 - eMax - eMin);
      this.phases(u0, this.s);
      return;
    }
    this.predict(t);
    if (!this.joint(eMax, eMin)) { this.fallbacks++; this.nested(); }
    this.remember(t);
  }

  /** The warm start at t, on the line through the last two solutions when t lies near them. */
  private predict(t: number): void {
    if (this.pastCount < 2) return;
    const p = this.past;
    const dt = p[3]! - p[0]!;
    if (!(dt !== 0 && Math.abs(t - p[3]!) <= 2 * Math.abs(dt))) return;
    const f = (t - p[3]!) / dt;
    this.sWarm = p[4]! + f * (p[4]! - p[1]!);
    this.iWarm = p[5]! + f * (p[5]! - p[2]!);
  }

  private remember(t: number): void {
    const p = this.past;
    p[0] = p[3]!; p[1] = p[4]!; p[2] = p[5]!;
    p[3] = t; p[4] = this.sWarm; p[5] = this.iWarm;
    this.pastCount++;
  }

  private joint(eMax: number, eMin: number): boolean {
    const tolS = STEP_TOL * (eMax - eMin);
    const tolI = tolS / this.Z;
    let s = this.sWarm;
    let i = Math.max(this.iWarm, 0);
    // Newton that does not halve the residual in CONTRACTION_WINDOW evaluations is cycling among
    // the diodes' pieces; the nested searches take over at once.
    let best = Infinity, itBest = 0;
    for (let it = 0; it < this.jointLimit; it++) {
      const uRaw = this.uOf(i);
      const u = Math.max(uRaw, 0);
      const a = uRaw > 0 ? (this.hasCap ? this.K / (1 + this.K * this.port.gp) : this.K) : 0;
      // The star point lies strictly between all lowers and all uppers conducting.
      if (!(s > -eMax && s < u - eMin)) s = 0.5 * (u - eMax - eMin);
      const F1 = this.phases(u, s);
      const F2 = i - this.idc;
      const m = Math.abs(F1) + Math.abs(F2);
      if (m <= 0.5 * best) { best = m; itBest = it; } else if (it - itBest >= CONTRACTION_WINDOW) return false;
      const S = this.S, P = this.P, pa = P * a;
      if (!(S > 0)) {
        // Nothing conducts here though something must (the window is closed at i = 0): the bus
        // voltage is too high (a poor warm start), so halve the current.
        i *= 0.5;
        continue;
      }
      const det = S * (1 + pa) - P * pa;
      if (!(det > 0)) return false;
      const ds = (-F1 * (1 + pa) - pa * F2) / det;
      const di = (-S * F2 - P * F1) / det;
      if (!(Number.isFinite(ds) && Number.isFinite(di))) return false;
      if (Math.abs(ds) <= tolS && Math.abs(di) <= tolI) {
        // Converged: the evaluated point stands (the last step is below the tolerance).
        this.s = s; this.u = u; this.sWarm = s; this.iWarm = i;
        return true;
      }
      if (this.tangentStep(s, ds, i + di, u, uRaw, 0.1 * tolI)) { this.sWarm = this.s; this.iWarm = i + di; return true; }
      s += ds;
      i = Math.max(i + di, 0);
    }
    return false;
  }

  /**
   * The last Newton step taken along the tangents, sparing an evaluation: when every diode's
   * neglected second-order term is below tol (each conducting one moved by DiodeBehindZ.shift, each
   * blocked one still blocked); the port is evaluated exactly at the new current. On refusal the
   * phases are left as they were, save the diodes already moved, which the next evaluation solves.
   */
  private tangentStep(s: number, ds: number, iNew: number, u: number, uRaw: number, tol: number): boolean {
    if (!(iNew > 0)) return false;
    const uRawNew = this.uOf(iNew);
    if ((uRawNew > 0) !== (uRaw > 0)) return false;
    const du = Math.max(uRawNew, 0) - u;
    const sNew = s + ds;
    let idc = 0, sum = 0;
    for (let x = 0; x < 3; x++) {
      const up = this.up[x]!, low = this.low[x]!;
      const h = this.ep[x]! + sNew;
      if (up.d > 0 ? !up.shift(this.devices[this.upper[x]!]!, ds - du, tol) : h - u - du > 0) return false;
      if (low.d > 0 ? !low.shift(this.devices[this.lower[x]!]!, -ds, tol) : -h > 0) return false;
      idc += up.d; sum += up.d - low.d;
    }
    // The step was linear in the port too: its curvature (a power load) shows in the residuals.
    if (!(Math.abs(sum) <= 10 * tol && Math.abs(iNew - idc) <= 10 * tol)) return false;
    this.s = sNew; this.u = u + du; this.idc = idc;
    return true;
  }

  /** The DC current by a bracketed search: H(i) = i − I_bridge(u(i)) rises with slope ≥ 1 from H(0) ≤ 0. */
  private nested(): void {
    const iMax = this.bridge(Math.max(this.uOf(0), 0));
    let i = 0;
    if (iMax > 0) {
      let lo = 0, hi = iMax;
      i = Math.min(Math.max(this.iWarm, 0), iMax);
      for (let it = 0; it < 100; it++) {
        const u = Math.max(this.uOf(i), 0);
        const H = i - this.bridge(u);
        if (H === 0) break;
        if (H < 0) lo = i; else hi = i;
        const ua = this.hasCap ? this.K / (1 + this.K * this.port.gp) : this.K;
        const dIdu = this.S > 0 ? this.P * (this.P / this.S - 1) : 0;
        let next = i - H / (1 - dIdu * ua);
        if (!(next > lo && next < hi)) next = 0.5 * (lo + hi);
        const done = Math.abs(next - i) <= 1e-13 * iMax || hi - lo <= 1e-14 * iMax;
        i = next;
        if (done) break;
      }
    }
    this.iWarm = i;
    this.u = Math.max(this.uOf(i), 0);
    this.bridge(this.u);
  }

  /** Bus voltage at DC current i (unclipped); leaves the port point. */
  private uOf(i: number): number {
    const K = this.K, port = this.port;
    if (!this.hasCap) { port.v = K * i; port.g = i; port.gp = 1 / K; return port.v; }
    solvePort(this.load, this.A + K * i, K, port);
    return port.v;
  }

  /**
   * DC current out of the bridge at bus voltage u: the star point s from Σ i_x(s) = 0 (rising in
   * s, bracketed by all lowers or all uppers conducting), each phase's current from its diodes.
   */
  private bridge(u: number): number {
    const ep = this.ep;
    const eMax = Math.max(ep[0]!, ep[1]!, ep[2]!);
    const eMin = Math.min(ep[0]!, ep[1]!, ep[2]!);
    const openLo = -eMin, openHi = u - eMax;
    if (openLo <= openHi) {
      this.s = 0.5 * (openLo + openHi);
      this.phases(u, this.s);
      return 0;
    }
    let lo = -eMax, hi = u - eMin;
    let s = this.sWarm > lo && this.sWarm < hi ? this.sWarm : 0.5 * (lo + hi);
    const scale = Math.max(eMax - eMin, u, 1e-300);
    for (let it = 0; it < 200; it++) {
      const F = this.phases(u, s);
      if (F === 0) break;
      if (F < 0) lo = s; else hi = s;
      let next = this.S > 0 ? s - F / this.S : NaN;
      if (!(next > lo && next < hi)) next = 0.5 * (lo + hi);
      const done = Math.abs(next - s) <= 1e-14 * scale || hi - lo <= 1e-14 * scale;
      s = next;
      if (done) break;
    }
    this.s = s;
    this.sWarm = s;
    this.phases(u, s);
    return this.idc;
  }

  /** Phase currents at (u, s); returns Σ i_x and leaves S, P and the DC current. */
  private phases(u: number, s: number): number {
    this.evaluations++;
    let sum = 0, S = 0, P = 0, idc = 0;
    for (let x = 0; x < 3; x++) {
      const h = this.ep[x]! + s;
      const up = this.up[x]!, low = this.low[x]!;
      const du = up.solve(this.devices[this.upper[x]!]!, this.Z, h - u);
      const dl = low.solve(this.devices[this.lower[x]!]!, this.Z, -h);
      sum += du - dl; idc += du;
      S += up.slope + low.slope; P += up.slope;
    }
    this.S = S; this.P = P; this.idc = idc;
    return sum;
  }
}
