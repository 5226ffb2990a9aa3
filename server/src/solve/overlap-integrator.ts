/**
 * TR-BDF2 for the overlap system, with the same stages, error estimate and filter as
 * integrator.ts (Bank et al. 1985; Hosea & Shampine 1996) and the period Jacobian carried along.
 * Every state is an inductor current or a capacitor voltage, so the solution is continuous and a
 * diode's turn-on or turn-off is only a kink in the derivatives: the error control finds it, and
 * no edge needs locating. Steps still stop at the line-to-line crests, where PIV peaks.
 */
import type { OverlapRecord } from './overlap-record';
import { OverlapPoint, OverlapStage, type OverlapSystem } from './overlap-stage';
import { copyInto, zeros } from './vec';

import { GAMMA, D, WD, Q0, QG, Q1, filteredError, matMul, propagateSensitivity } from './tr-bdf2';
/** The backward-Euler start step, as a fraction of the period. */
const START_FRACTION = 5e-5;

export interface OverlapOptions {
  atol: number[];
  hMaxS: number;
  /** Largest step while a diode conducts. */
  hMaxOnS: number;
  maxSteps: number;
  sensitivity: boolean;
  record?: OverlapRecord;
}

export class OverlapIntegrator {
  readonly y: number[];
  readonly Y: number[];
  private readonly f: number[];
  private readonly F: number[];
  private readonly r1: number[];
  private readonly r2: number[];
  private readonly R: number[];
  private readonly tmp: number[];
  private oN: OverlapPoint;
  private oG: OverlapPoint;
  private o1: OverlapPoint;
  private readonly stage: OverlapStage;
  hGuess = 0;
  /** Steps taken (accepted and rejected) over the integrator's life: the work count. */
  work = 0;

  /** Evaluations of the bridge's phases over the integrator's life, and solves left to the nested searches. */
  get evaluations(): number { return this.stage.bridge.evaluations; }
  get fallbacks(): number { return this.stage.bridge.fallbacks; }

  constructor(private readonly sys: OverlapSystem) {
    const n = sys.n;
    this.y = zeros(n); this.f = zeros(n); this.Y = zeros(n * n); this.F = zeros(n * n);
    this.r1 = zeros(n); this.r2 = zeros(n); this.R = zeros(n * n); this.tmp = zeros(n * n);
    this.oN = new OverlapPoint(n); this.oG = new OverlapPoint(n); this.o1 = new OverlapPoint(n);
    this.stage = new OverlapStage(sys);
  }

  run(t0: number, t1: number, y0: ArrayLike<number>, o: OverlapOptions): boolean {
    const n = this.sys.n;
    const T = this.sys.net.periodS;
    for (let j = 0; j < n; j++) this.y[j] = y0[j]!;
    this.Y.fill(0);
    for (let j = 0; j < n; j++) this.Y[j * n + j] = 1;
    const crests = crestsBetween(t0, t1, this.sys.net.crestsS, T);
    let nc = 0;
    const rec = o.record;
    // The point at t0 itself (a vanishing stage returns the state).
    this.stage.solve(t0, 1e-9 * T, this.y, this.oN);
    if (rec) { rec.reset(); rec.push(t0, this.oN); }
    let t = t0;
    let steps = 0;
    // Start: one backward-Euler step, which needs no derivative at t0.
    let h = Math.min(T * START_FRACTION, t1 - t0);
    this.stage.solve(t + h, h, this.y, this.o1);
    if (o.sensitivity) { copyInto(this.tmp, this.Y); matMul(this.o1.dydr, this.tmp, this.Y, n); matMul(this.o1.dfdr, this.tmp, this.F, n); }
    if (rec) { rec.addWeight(0, 0.5 * h); rec.addWeight(rec.push(t + h, this.o1), 0.5 * h); }
    this.swap();
    t += h;
    let hCtrl = this.hGuess > 0 ? this.hGuess : T * 1e-3;
    while (t1 - t > 1e-12 * T) {
      if (steps > o.maxSteps) return false;
      steps++; this.work++;
      while (nc < crests.length && crests[nc]! <= t + 1e-12 * T) nc++;
      const tStop = Math.min(nc < crests.length ? crests[nc]! : t1, t1);
      const il = this.oN.iLine;
      const on = this.oN.idc > 0 || il[0] !== 0 || il[1] !== 0 || il[2] !== 0;
      h = Math.min(hCtrl, tStop - t, on ? o.hMaxOnS : o.hMaxS);
      this.takeStages(t, h);
      const err = this.errorNorm(h, o.atol);
      if (err > 1 && h > 1e-9 * T) { hCtrl = h * Math.max(0.2, 0.9 * Math.cbrt(1 / err)); continue; }
      if (o.sensitivity) this.propagate(h);
      if (rec) {
        rec.addWeight(rec.count - 1, Q0 * h);
        rec.addWeight(rec.push(t + GAMMA * h, this.oG), QG * h);
        rec.addWeight(rec.push(t + h, this.o1), Q1 * h);
      }
      this.swap();
      t += h;
      const fac = Math.min(5, Math.max(0.2, 0.9 * Math.cbrt(1 / Math.max(err, 1e-12))));
      hCtrl = h >= 0.999 * hCtrl ? h * fac : Math.min(hCtrl, Math.max(h * fac, hCtrl * Math.min(fac, 1)));
    }
    this.hGuess = hCtrl;
    return true;
  }

  private swap(): void {
    const o = this.oN; this.oN = this.o1; this.o1 = o;
    copyInto(this.y, this.oN.y);
    copyInto(this.f, this.oN.f);
  }

  private takeStages(t: number, h: number): void {
    const n = this.sys.n;
    const dh = D * h;
    for (let j = 0; j < n; j++) this.r1[j] = this.y[j]! + dh * this.f[j]!;
    this.stage.solve(t + GAMMA * h, dh, this.r1, this.oG);
    for (let j = 0; j < n; j++) this.r2[j] = (1 - WD) * this.y[j]! + WD * this.oG.y[j]!;
    this.stage.solve(t + h, dh, this.r2, this.o1);
  }

  private errorNorm(h: number, atol: number[]): number {
    const n = this.sys.n;
    let err = 0;
    for (let j = 0; j < n; j++) {
      const e = filteredError(j, n, h, this.o1.dydr, this.f, this.oG.f, this.o1.f);
      err = Math.max(err, Math.abs(e) / atol[j]!);
    }
    return err;
  }

  private propagate(h: number): void {
    propagateSensitivity(h, this.sys.n, this.Y, this.F, this.oG.dydr, this.o1.dydr, this.o1.dfdr, this.R, this.tmp);
  }

}

/** Absolute instants of a periodic list strictly inside (t0, t1). */
function crestsBetween(t0: number, t1: number, list: number[], T: number): number[] {
  const out: number[] = [];
  for (let k = Math.floor(t0 / T) - 1; k * T < t1; k++) {
    for (const b of list) {
      const tb = b + k * T;
      if (tb > t0 + 1e-12 * T && tb < t1 - 1e-12 * T) out.push(tb);
    }
  }
  return out.sort((a, b) => a - b);
}
