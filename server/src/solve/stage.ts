/**
 * One implicit stage: solve y − dh·f(t, y) = r for the network's states. Because at most one
 * path conducts, every state is an affine function of that path's current i, and the stage
 * reduces to one monotone scalar equation G(i) = 0 — solved by safeguarded Newton in
 * ψ = ln(1 + i/IS), where the diode law is linear and an ideal-ish diode cannot overflow. The
 * stage also returns dy/dr and df/dr (implicit function theorem), which give the integrator its
 * error filter and the shooting method its period Jacobian without finite differences.
 */
import type { Network } from './network';
import { deviceVoltageV } from './mosfet-model';
import { copyInto, zeros } from './vec';

/** Everything one stage produces; buffers are reused. */
export class StageOut {
  readonly y: number[];
  readonly f: number[];
  /** dy/dr, row-major n×n. */
  readonly dydr: number[];
  /** df/dr, row-major n×n. */
  readonly dfdr: number[];
  /** Port voltages u_j (capacitor plus ESR drop, or the bare load's voltage). */
  readonly u: number[];
  /** Conducting path, or −1. */
  mode = -1;
  /** Edge function: positive while a path conducts, crossing zero at its edges. */
  phi = 0;
  iA = 0;
  didtAps = 0;
  iLoadA = 0;
  vLoadV = 0;
  /** sin ωt and cos ωt at the stage's time, kept so the record need not evaluate them again. */
  sinWt = 0;
  cosWt = 1;
  constructor(n: number, nPorts: number) {
    this.y = zeros(n);
    this.f = zeros(n);
    this.dydr = zeros(n * n);
    this.dfdr = zeros(n * n);
    this.u = zeros(nPorts);
  }
  copyFrom(o: StageOut): void {
    copyInto(this.y, o.y); copyInto(this.f, o.f); copyInto(this.dydr, o.dydr); copyInto(this.dfdr, o.dfdr); copyInto(this.u, o.u);
    this.mode = o.mode; this.phi = o.phi; this.iA = o.iA; this.didtAps = o.didtAps;
    this.iLoadA = o.iLoadA; this.vLoadV = o.vLoadV; this.sinWt = o.sinWt; this.cosWt = o.cosWt;
  }
}

/** The stage solver for one network; holds scratch space and warm starts. */
export class StageSolver {
  private readonly k: number[];
  private readonly rp: number[];
  private readonly psiWarm: number[];
  // Per path, when its devices are ungated diodes with one IS: that IS, ΣN·Vt and ΣRS (else
  // isRef 0). Read once: a solver lives for one steady state or one inrush case, during which
  // the devices' temperatures (network.ts setDeviceTemperatures) stay put.
  private readonly pathIs: number[];
  private readonly pathNVt: number[];
  private readonly pathRs: number[];
  private readonly slope = [0];
  // Load solution scratch: voltage, current, dI/dV.
  private vL = 0;
  private g = 0;
  private gp = 0;

  constructor(private readonly net: Network) {
    this.k = zeros(net.ports.length);
    this.rp = zeros(net.ports.length);
    this.psiWarm = zeros(net.paths.length);
    this.pathIs = zeros(net.paths.length);
    this.pathNVt = zeros(net.paths.length);
    this.pathRs = zeros(net.paths.length);
    net.paths.forEach((path, p) => {
      const ds = path.devices.map((k) => net.devices[k]!);
      const is = ds[0]?.isA ?? 0;
      if (ds.length === 0 || ds.some((d) => d.gate !== undefined || d.isA !== is)) return;
      this.pathIs[p] = is;
      this.pathNVt[p] = ds.reduce((a, d) => a + d.nVtV, 0);
      this.pathRs[p] = ds.reduce((a, d) => a + d.rsOhm, 0);
    });
  }

  /** Solves one stage at time t with coefficient dh from right-hand side r; modeIn is the path holding the inductor current. */
  solve(t: number, dh: number, r: readonly number[], modeIn: number, out: StageOut): void {
    const net = this.net;
    const ports = net.ports;
    const np = ports.length;
    let A = 0;
    let K = 0;
    for (let j = 0; j < np; j++) {
      const p = ports[j]!;
      this.k[j] = p.bare ? net.load.rOhm : dh / p.cF + p.esrOhm;
      this.rp[j] = p.bare ? 0 : r[j]!;
      A += p.l * this.rp[j]!;
      K += p.l * this.k[j]!;
    }
    const rL = net.hasL ? r[net.n - 1]! : 0;
    this.solveLoad(A, K);
    const g0 = this.g;
    const sn = Math.sin(net.omega * t);
    const cs = Math.cos(net.omega * t);
    let best = -1;
    let bestDrive = -Infinity;
    for (let p = 0; p < net.paths.length; p++) {
      const path = net.paths[p]!;
      // A line inductor's current must reach zero before another path conducts; a shared DC
      // choke's current passes to whichever path the EMFs favour.
      const carries = p === modeIn || net.sharedL;
      if (net.hasL && modeIn >= 0 && rL > 0 && !carries) continue;
      let drive = path.a * sn + path.b * cs + (carries && path.lH > 0 ? (path.lH / dh) * rL : 0);
      for (let j = 0; j < np; j++) drive -= path.s[j]! * (this.rp[j]! - this.k[j]! * ports[j]!.l * g0);
      if (drive > bestDrive) { bestDrive = drive; best = p; }
    }
    out.phi = bestDrive;
    let i = 0;
    let D = 1;
    if (best >= 0 && bestDrive > 0) {
      i = this.solvePath(best, dh, A, K, bestDrive, sn, cs, modeIn === best || net.sharedL ? rL : 0);
      D = this.dG;
    } else {
      best = -1;
      this.solveLoad(A, K);
    }
    this.fillOutputs(out, best, i, D, dh, K, sn, cs);
  }

  private dG = 1;

  /** The load behind a series resistance K at source voltage a, as in a stage: returns its current (off-advance.ts). */
  loadAt(a: number, K: number): number {
    this.solveLoad(a, K);
    return this.g;
  }

  /** Load voltage and dI/dV of the last `loadAt`. */
  get loadVoltageV(): number { return this.vL; }
  get loadSlope(): number { return this.gp; }

  /** Load voltage from vL = a − K·g(vL), with the load current g and its slope. */
  private solveLoad(a: number, K: number): void {
    const ld = this.net.load;
    const vf = ld.vFloorV;
    if (ld.mixed) {
      this.solveMixedLoad(a, K);
    } else if (ld.kind === 'resistance') {
      this.vL = a / (1 + K / ld.rOhm); this.g = this.vL / ld.rOhm; this.gp = 1 / ld.rOhm;
    } else if (ld.kind === 'current' || ld.kind === 'power') {
      const p = ld.pW;
      let v = a - K * ld.iA;
      if (ld.kind === 'power') {
        const disc = a * a - 4 * K * p;
        v = disc >= 0 ? 0.5 * (a + Math.sqrt(disc)) : -Infinity;
      }
      if (v >= vf) {
        this.vL = v; this.g = ld.kind === 'power' ? p / v : ld.iA; this.gp = ld.kind === 'power' ? -p / (v * v) : 0;
        return;
      }
      // Fade region: g = G0·v with G0 = I/vf or P/vf².
      const g0 = ld.kind === 'power' ? p / (vf * vf) : ld.iA / vf;
      v = a / (1 + K * g0);
      if (v >= 0) { this.vL = v; this.g = g0 * v; this.gp = g0; } else { this.vL = a; this.g = 0; this.gp = 0; }
    } else {
      this.vL = a; this.g = 0; this.gp = 0;
    }
  }

  /**
   * A load of several kinds: v + K·(v/R + I + P/v) = a. Above the floor that is the quadratic
   * c·v² − (a − K·I)·v + K·P = 0 with c = 1 + K/R, whose larger root is the operating point (as
   * for a power load alone); below it the current and power parts fade linearly, as there.
   */
  private solveMixedLoad(a: number, K: number): void {
    const ld = this.net.load;
    const vf = ld.vFloorV;
    const gR = Number.isFinite(ld.rOhm) ? 1 / ld.rOhm : 0;
    const c = 1 + K * gR;
    const b = a - K * ld.iA;
    const disc = b * b - 4 * c * K * ld.pW;
    const v = disc >= 0 ? (ld.pW > 0 ? (b + Math.sqrt(disc)) / (2 * c) : b / c) : -Infinity;
    if (v >= vf && v > 0) {
      this.vL = v; this.g = gR * v + ld.iA + ld.pW / v; this.gp = gR - ld.pW / (v * v);
      return;
    }
    const g0 = gR + ld.iA / vf + ld.pW / (vf * vf);
    const w = a / (1 + K * g0);
    if (w >= 0) { this.vL = w; this.g = g0 * w; this.gp = g0; } else { this.vL = a; this.g = 0; this.gp = 0; }
  }

  /** Path current from G(i) = 0 by Newton in ψ with a bracket; leaves G'(i) in dG. */
  private solvePath(p: number, dh: number, A: number, K: number, drive0: number, sn: number, cs: number, rL: number): number {
    const net = this.net;
    const path = net.paths[p]!;
    const devs = path.devices;
    // Diodes that share IS (a bridge's pair, usually) have ln(1 + i/IS) = ψ itself: their voltage
    // is ΣN·Vt·ψ + ΣRS·i with no logarithm per iteration.
    const plain = this.pathIs[p]! > 0;
    const nVt = this.pathNVt[p]!;
    const rs = this.pathRs[p]!;
    let isRef = this.pathIs[p]!;
    if (!plain) { isRef = Infinity; for (const k of devs) isRef = Math.min(isRef, net.devices[k]!.isA); }
    const lOverDh = path.lH / dh;
    const R = path.rOhm + lOverDh;
    const emf = path.a * sn + path.b * cs + lOverDh * rL;
    let S1 = 0, S2 = 0, B = 0;
    for (let j = 0; j < net.ports.length; j++) {
      const s = path.s[j]!;
      S1 += s * this.rp[j]!; S2 += s * s * this.k[j]!; B += net.ports[j]!.l * this.k[j]! * s;
    }
    // The linear part bounds the current: G(i) ≥ lin·i − drive0 with lin the smaller of R + S2
    // and the slope with a resistive load folded in. That gives a finite upper bracket, and the
    // cold start sits there (Newton in i is exact when the linear part dominates).
    const lin = Math.min(R + S2, R + S2 - (B * B * this.gp) / (1 + K * this.gp));
    const psiHi = lin > 0 ? Math.min(Math.log1p(drive0 / lin / isRef), 700) : 700;
    const warm = this.psiWarm[p]!;
    let psi = warm > 0 && warm < psiHi ? warm : psiHi;
    let lo = 0;
    let hi = psiHi * (1 + 1e-12) + 1e-300;
    for (let it = 0; it < 100; it++) {
      const i = isRef * Math.expm1(psi);
      let v = 0, dv = 0;
      if (plain) { v = nVt * psi + rs * i; dv = nVt / (isRef + i) + rs; }
      else for (const k of devs) { v += deviceVoltageV(net.devices[k]!, i, this.slope); dv += this.slope[0]!; }
      this.solveLoad(A + B * i, K);
      const G = R * i + v + S1 + S2 * i - B * this.g - emf;
      this.dG = R + dv + S2 - (B * B * this.gp) / (1 + K * this.gp);
      if (G === 0) break;
      if (G < 0) lo = psi; else hi = psi;
      // G is concave in i and convex in ψ: Newton in i is the bolder move downwards, Newton in
      // ψ the bolder move upwards. Take the bold one inside the bracket, else the other, else bisect.
      const psiN = psi - G / (this.dG * (i + isRef));
      // Newton in i, as ψ: its logarithm only when it is the move taken.
      let next = psiN;
      if (G > 0 || !(psiN < hi)) {
        const iN = i - G / this.dG;
        const psiI = iN > 0 ? Math.log1p(iN / isRef) : -1;
        next = G > 0 ? (psiI > lo ? psiI : psiN) : psiI;
      }
      const newton = next > lo && next < hi;
      if (!newton) next = Number.isFinite(hi) ? 0.5 * (lo + hi) : Math.min(lo + 2 * (psi - lo) + 1, 700);
      // Relative in ψ, hence in i: an ideal-ish diode can sit at ψ ≪ 1. A Newton step also bounds
      // the error it leaves: G''/G' ≤ 1 in ψ for the diode law (and, in i, |G''/G'| ≤ 1/(IS + i)),
      // so after a step Δψ the error is at most Δψ²/2, and the iteration may stop once that is a
      // hundredth of the tolerance, one evaluation before a step itself falls under it.
      const step = Math.abs(next - psi);
      const done = step <= 1e-11 * psi || (newton && 0.5 * step * step <= 1e-13 * psi);
      psi = next;
      if (done) break;
    }
    this.psiWarm[p] = psi;
    const i = isRef * Math.expm1(psi);
    this.solveLoad(A + B * i, K);
    return i;
  }

  private fillOutputs(out: StageOut, mode: number, i: number, D: number, dh: number, K: number, sn: number, cs: number): void {
    const net = this.net;
    const n = net.n;
    const nc = net.nCap;
    const ports = net.ports;
    const path = mode >= 0 ? net.paths[mode]! : undefined;
    const on = path !== undefined;
    const gp = this.gp;
    const den = 1 + K * gp;
    let B = 0;
    if (path) for (let j = 0; j < ports.length; j++) B += ports[j]!.l * this.k[j]! * path.s[j]!;
    out.mode = mode; out.iA = i; out.iLoadA = this.g; out.vLoadV = this.vL; out.sinWt = sn; out.cosWt = cs;
    let sumSu = 0;
    for (let j = 0; j < ports.length; j++) {
      const s = path ? path.s[j]! : 0;
      const iPort = s * i - ports[j]!.l * this.g;
      out.u[j] = this.rp[j]! + this.k[j]! * iPort;
      sumSu += s * out.u[j]!;
      if (j < nc) { out.f[j] = iPort / ports[j]!.cF; out.y[j] = this.rp[j]! + dh * out.f[j]!; }
    }
    if (ports[0]!.bare) out.vLoadV = out.u[0]!;
    if (net.hasL) {
      let vdev = 0;
      if (path) for (const k of path.devices) vdev += deviceVoltageV(net.devices[k]!, i, this.slope);
      out.y[n - 1] = i;
      out.didtAps = path && path.lH > 0 ? (path.a * sn + path.b * cs - path.rOhm * i - vdev - sumSu) / path.lH : 0;
      out.f[n - 1] = out.didtAps;
    } else out.didtAps = 0;
    // Sensitivities: for each column m, di/dr_m from ∂G/∂r_m, then the load, then y and f.
    for (let m = 0; m < n; m++) {
      let di = 0;
      let dvL: number;
      if (m < nc) {
        if (on) di = -(path.s[m]! - (B * gp * ports[m]!.l) / den) / D;
        dvL = (ports[m]!.l + B * di) / den;
      } else {
        if (on) di = path.lH / dh / D;
        dvL = (B * di) / den;
      }
      const dload = gp * dvL;
      for (let j = 0; j < nc; j++) {
        const s = path ? path.s[j]! : 0;
        const df = (s * di - ports[j]!.l * dload) / ports[j]!.cF;
        out.dfdr[j * n + m] = df;
        out.dydr[j * n + m] = (j === m ? 1 : 0) + dh * df;
      }
      if (net.hasL) {
        out.dydr[(n - 1) * n + m] = di;
        out.dfdr[(n - 1) * n + m] = on ? (di - (m === n - 1 ? 1 : 0)) / dh : 0;
      }
    }
  }
}
