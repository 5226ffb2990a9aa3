/**
 * TR-BDF2 (Bank et al. 1985; error estimate and filter after Hosea & Shampine 1996): a
 * trapezoidal stage to t + γh, then a BDF2 stage to t + h, γ = 2 − √2 so both stages share
 * the coefficient d = γ/2. It is L-stable, so the near-instant diode currents of a stiff
 * conduction interval do not ring, and one-step, so steps can stop exactly at conduction edges
 * and gate instants. Along the way it carries dy(t)/dy(t0), the period Jacobian for shooting.
 * While no path conducts there are no TR-BDF2 steps: off-advance.ts moves the state and the
 * Jacobian to the next stop or turn-on, exactly for a resistive load, by one scalar equation else.
 */
import type { Network } from './network';
import type { PeriodRecord } from './record';
import { StageOut, type StageSolver } from './stage';
import { applyGates } from './gates';
import { OffAdvance } from './off-advance';
import { copyInto, zeros } from './vec';

import { GAMMA, D, WD, Q0, QG, Q1, filteredError, matMul, propagateSensitivity as carrySensitivity } from './tr-bdf2';
/** Length of the backward-Euler restart step, as a fraction of the period. */
const RESTART_FRACTION = 5e-5;

export interface IntegrateOptions {
  /** Absolute tolerance per state (V for capacitors, A for the inductor). */
  atol: number[];
  rtol: number;
  hMaxS: number;
  /** Largest step while a path conducts (finer when recording a period for its figures). */
  hMaxOnS: number;
  /**
   * When set (recorded periods), the conduction cap `hMaxOnS` is relaxed, up to `hMaxResolvedS`,
   * where the path current is smooth: a step may be as long as keeps the current within this
   * fraction of its scale (the path current there, at least the load current) of the chord
   * through its samples. A choke-input filter's current is smooth all period; a
   * capacitor-input pulse bends too fast for much relaxation.
   */
  resolution?: number;
  /** The longest relaxed step. */
  hMaxResolvedS?: number;
  /** Edges are located to within this time. */
  hEdgeS: number;
  maxSteps: number;
  sensitivity: boolean;
  record?: PeriodRecord;
}

export interface IntegrateResult {
  ok: boolean;
  steps: number;
  rejected: number;
  /** Conducting path at the end. */
  mode: number;
}

/** Integrates a network's states; y and the sensitivity Y are left in the public buffers. */
export class Integrator {
  readonly y: number[];
  readonly f: number[];
  /** dy/dy0, row-major. */
  readonly Y: number[];
  private readonly F: number[];
  private readonly r1: number[];
  private readonly r2: number[];
  private readonly tmp: number[];
  private readonly tmpG: number[];
  private oN: StageOut;
  private oG: StageOut;
  private o1: StageOut;
  /** Step-size proposal carried from one call to the next. */
  hGuess = 0;
  /** The step-free advance while no path conducts, where the network allows it. */
  private readonly off: OffAdvance | undefined;

  constructor(private readonly net: Network, private readonly solver: StageSolver) {
    const n = net.n;
    const np = net.ports.length;
    this.y = zeros(n); this.f = zeros(n);
    this.Y = zeros(n * n); this.F = zeros(n * n);
    this.r1 = zeros(n); this.r2 = zeros(n);
    this.tmp = zeros(n * n); this.tmpG = zeros(n * n);
    this.oN = new StageOut(n, np); this.oG = new StageOut(n, np); this.o1 = new StageOut(n, np);
    this.off = OffAdvance.applies(net) ? new OffAdvance(net, solver) : undefined;
  }

  /** Integrates from (t0, y0, mode0) to t1. */
  run(t0: number, t1: number, y0: ArrayLike<number>, mode0: number, o: IntegrateOptions): IntegrateResult {
    const n = this.net.n;
    const period = this.net.periodS;
    for (let j = 0; j < n; j++) this.y[j] = y0[j]!;
    for (let k = 0; k < n * n; k++) this.Y[k] = 0;
    for (let j = 0; j < n; j++) this.Y[j * n + j] = 1;
    const breaks = this.breakpointsBetween(t0, t1, this.net.breakpointsS);
    const crests = this.breakpointsBetween(t0, t1, this.net.crestsS);
    let nc = 0;
    let nb = 0;
    let t = t0;
    let restart = true;
    let fresh = true; // first TR-BDF2 step after a restart
    // The point at t0 itself, for the record and the first edge test (a vanishing stage).
    applyGates(this.net.devices, this.net.omega, t0);
    this.solver.solve(t0, 1e-9 * period, this.y, mode0, this.oN);
    if (o.record) { o.record.reset(); o.record.push(t0, this.oN); }
    // hCtrl is the error controller's step; edge location and gate instants only shorten
    // individual steps and do not shrink it. tEdge is the secant estimate of a pending edge.
    let hCtrl = this.hGuess > 0 ? this.hGuess : period * 1e-3;
    let tEdge = Infinity;
    let steps = 0;
    let rejected = 0;
    let mode = mode0;
    // The relaxed conduction cap; 0 until a regular step has measured the current's curvature.
    let hResolve = 0;
    while (t1 - t > 1e-12 * period) {
      if (steps + rejected > o.maxSteps) return { ok: false, steps, rejected, mode };
      const tStop = Math.min(nb < breaks.length ? breaks[nb]! : t1, nc < crests.length ? crests[nc]! : t1, tEdge);
      if (this.off && mode < 0 && this.oN.mode < 0 && this.oN.phi <= 0) {
        // Nothing conducts: advance exactly to the next stop or just past a turn-on, then restart.
        const end = this.off.advance(t, tStop, this.y, o.sensitivity ? this.Y : undefined, o.record, o.hEdgeS);
        steps++;
        t = end.t;
        this.solver.solve(t, 1e-9 * period, this.y, -1, this.oN);
        copyInto(this.f, this.oN.f);
        mode = this.oN.mode;
        if (nb < breaks.length && Math.abs(t - breaks[nb]!) <= 1e-12 * period) nb++;
        while (nc < crests.length && crests[nc]! <= t + 1e-12 * period) nc++;
        restart = true; fresh = true; tEdge = Infinity;
        if (end.turnedOn) hCtrl = Math.min(hCtrl, period * 4 * RESTART_FRACTION);
        continue;
      }
      let err = 0;
      let hTry = Math.min(hCtrl, tStop - t, mode >= 0 ? Math.max(o.hMaxOnS, hResolve) : o.hMaxS);
      if (restart) hTry = Math.min(hTry, period * RESTART_FRACTION);
      applyGates(this.net.devices, this.net.omega, t + 0.5 * hTry);
      let located: number;
      if (restart) {
        // After an edge or a gate instant (and at the start) the derivative on the new side is
        // unknown and may change within nanoseconds (an ideal diode's current steps up): one
        // short backward-Euler step, which needs no derivative at its start, restarts cleanly.
        this.solver.solve(t + hTry, hTry, this.y, mode, this.o1);
        located = this.locateEdgeBE(hTry, o.hEdgeS);
      } else {
        this.takeStages(t, hTry);
        located = this.locateEdge(hTry, o.hEdgeS);
        if (located === 0) err = this.errorNorm(hTry, o);
      }
      if (located > 0) { tEdge = t + located; rejected++; continue; }
      if (err > 1 && hTry > o.hEdgeS) {
        hCtrl = hTry * Math.max(0.2, 0.9 * Math.cbrt(1 / err));
        rejected++;
        continue;
      }
      steps++;
      const wasFresh = fresh;
      if (restart) this.acceptBE(t, hTry, o);
      else {
        if (o.sensitivity) this.propagateSensitivity(hTry);
        this.accept(t, hTry, o.record, fresh);
        fresh = false;
        const fac = Math.min(5, Math.max(0.2, 0.9 * Math.cbrt(1 / Math.max(err, 1e-12))));
        hCtrl = hTry >= 0.999 * hCtrl ? hTry * fac : Math.min(hCtrl, Math.max(hTry * fac, hCtrl * Math.min(fac, 1)));
      }
      const modeChanged = mode !== this.o1.mode;
      if (o.resolution !== undefined) {
        // Right after an edge the γ-stage current may overshoot (see accept): no curvature from it.
        hResolve = modeChanged || restart || wasFresh ? 0 : Math.min(this.resolvedStep(hTry, o.resolution), 2 * hTry, o.hMaxResolvedS ?? o.hMaxS);
      }
      const sw = this.oN; this.oN = this.o1; this.o1 = sw;
      mode = this.oN.mode;
      t += hTry;
      const hitBreak = nb < breaks.length && Math.abs(t - breaks[nb]!) <= 1e-12 * period;
      if (hitBreak) nb++;
      while (nc < crests.length && crests[nc]! <= t + 1e-12 * period) nc++;
      restart = modeChanged || hitBreak;
      if (restart) fresh = true;
      if (modeChanged) { hCtrl = Math.min(hCtrl, period * 4 * RESTART_FRACTION); tEdge = Infinity; }
      if (t >= tEdge) tEdge = Infinity;
    }
    const h = hCtrl;
    this.hGuess = h;
    return { ok: true, steps, rejected, mode: this.oN.mode };
  }

  /**
   * The step after one of length h that keeps the path current within `resolution` of its chord:
   * a chord over h misses a curve of second derivative i'' by at most |i''|·h²/8, and i'' is the
   * second divided difference of the current at the step's three points (0, γh, h).
   */
  private resolvedStep(h: number, resolution: number): number {
    const i0 = this.oN.iA, iG = this.oG.iA, i1 = this.o1.iA;
    const curvature = Math.abs((2 / h) * ((i1 - iG) / ((1 - GAMMA) * h) - (iG - i0) / (GAMMA * h)));
    // The scale is local (the current here, or the load's where the current is small): both
    // half-cycles of a symmetric bridge then meet the same rule, and neither pair is sampled finer.
    const scale = Math.max(Math.abs(i1), Math.abs(this.o1.iLoadA));
    return curvature > 0 && scale > 0 ? Math.sqrt((8 * resolution * scale) / curvature) : Infinity;
  }

  /** Absolute instants of a periodic list strictly inside (t0, t1). */
  private breakpointsBetween(t0: number, t1: number, list: number[]): number[] {
    const T = this.net.periodS;
    const out: number[] = [];
    if (list.length === 0) return out;
    for (let k = Math.floor(t0 / T) - 1; k * T < t1; k++) {
      for (const b of list) {
        const tb = b + k * T;
        if (tb > t0 + 1e-12 * T && tb < t1 - 1e-12 * T) out.push(tb);
      }
    }
    return out.sort((a, b) => a - b);
  }

  /** Turn-on location for a backward-Euler step (edge function at its two ends). */
  private locateEdgeBE(h: number, hEdge: number): number {
    const p0 = this.oN.phi;
    const p1 = this.o1.phi;
    if (h <= hEdge || p0 > 0 || p1 <= 0) return 0;
    return shortenedStep(Math.min(Math.max(p0 / (p0 - p1), 0), 1) * h, h, hEdge);
  }

  /** Accepts a backward-Euler step: trapezoidal weights, sensitivity Y ← M·Y, F ← (df/dr)·Y. */
  private acceptBE(t: number, h: number, o: IntegrateOptions): void {
    const n = this.net.n;
    if (o.sensitivity) {
      copyInto(this.tmp, this.Y);
      matMul(this.o1.dydr, this.tmp, this.Y, n);
      matMul(this.o1.dfdr, this.tmp, this.F, n);
    }
    copyInto(this.y, this.o1.y);
    copyInto(this.f, this.o1.f);
    const rec = o.record;
    if (!rec) return;
    rec.addWeight(rec.count - 1, 0.5 * h);
    rec.addWeight(rec.push(t + h, this.o1), 0.5 * h);
  }

  private takeStages(t: number, h: number): void {
    const n = this.net.n;
    const dh = D * h;
    for (let j = 0; j < n; j++) this.r1[j] = this.y[j]! + dh * this.f[j]!;
    this.solver.solve(t + GAMMA * h, dh, this.r1, this.oN.mode, this.oG);
    for (let j = 0; j < n; j++) this.r2[j] = (1 - WD) * this.y[j]! + WD * this.oG.y[j]!;
    this.solver.solve(t + h, dh, this.r2, this.oG.mode, this.o1);
  }

  /**
   * When a path starts conducting inside the step, returns a shorter step that ends just past
   * that edge (secant on the edge function between the nearest stage points); 0 when the step
   * may stand. Only turn-on is located: there an ideal diode's current steps up, while at
   * turn-off (and at any edge of a real diode) the current passes through zero smoothly.
   */
  private locateEdge(h: number, hEdge: number): number {
    const p0 = this.oN.phi;
    const pG = this.oG.phi;
    const p1 = this.o1.phi;
    if (p0 > 0 || h <= hEdge) return 0;
    if (pG > 0) return shortenedStep(GAMMA * h * (p0 / (p0 - pG)), h, hEdge);
    if (p1 > 0) return shortenedStep(GAMMA * h + (1 - GAMMA) * h * (pG / (pG - p1)), h, hEdge);
    return 0;
  }

  private errorNorm(h: number, o: IntegrateOptions): number {
    const n = this.net.n;
    let err = 0;
    for (let j = 0; j < n; j++) {
      const e = filteredError(j, n, h, this.o1.dydr, this.f, this.oG.f, this.o1.f);
      err = Math.max(err, Math.abs(e) / (o.atol[j]! + o.rtol * Math.abs(this.o1.y[j]!)));
    }
    return err;
  }

  private propagateSensitivity(h: number): void {
    carrySensitivity(h, this.net.n, this.Y, this.F, this.oG.dydr, this.o1.dydr, this.o1.dfdr, this.tmp, this.tmpG);
  }


  private accept(t: number, h: number, rec: PeriodRecord | undefined, fresh: boolean): void {
    copyInto(this.y, this.o1.y);
    copyInto(this.f, this.o1.f);
    if (!rec) return;
    if (fresh) {
      // Right after an ideal-diode edge the trapezoidal γ-stage's algebraic current can overshoot
      // (the state is fine): record only the step end, with trapezoidal weights.
      rec.addWeight(rec.count - 1, 0.5 * h);
      rec.addWeight(rec.push(t + h, this.o1), 0.5 * h);
      return;
    }
    rec.addWeight(rec.count - 1, Q0 * h);
    rec.addWeight(rec.push(t + GAMMA * h, this.oG), QG * h);
    rec.addWeight(rec.push(t + h, this.o1), Q1 * h);
  }
}

/** A step ending just past an edge estimated at tCross into the step, or 0 if h already does. */
function shortenedStep(tCross: number, h: number, hEdge: number): number {
  return h - tCross <= hEdge ? 0 : tCross + 0.5 * hEdge;
}

