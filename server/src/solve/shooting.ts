/**
 * Periodic steady state by shooting: Newton on the state at the start of a period, x ↦ P(x) − x,
 * with the period Jacobian dP/dx carried by the integrator. A slow RC filter (time constant many
 * periods) therefore converges in a few periods instead of hundreds: the slow decay is exactly
 * what the Jacobian captures.
 */
import type { Network } from './network';
import { StageSolver } from './stage';
import { Integrator, type IntegrateOptions } from './integrator';
import { PeriodRecord } from './record';
import { zeros } from './vec';
import { NEAR_RESIDUAL, PeriodicityTest } from './periodicity';

/**
 * The recorded period's sampling resolution where its current is smooth (integrator.ts,
 * `resolution`): the current within 0.01 % of its scale of the chord between samples. Against a
 * reference at T/20000 the solver bench's choke input kept ripple within 0.06 % and peak, RMS and
 * average current within 0.012 %, with 287 samples against 1211 (at 3e-5: 0.03 %, 455); the
 * capacitor-input bridges' figures stayed as at the plain cap, with 237 samples against 289 and
 * 347 against 347 (issue 18).
 */
export const RECORD_RESOLUTION = 1e-4;
/** The longest relaxed step of a recorded period while a path conducts, as a fraction of the period. */
const RELAXED_RECORD_STEP_FRACTION = 1 / 100;

/** Accuracy and effort settings; all optional. */
export interface SteadyStateOptions {
  /** Local error tolerance relative to the source peak voltage (default 1e-5). */
  relTol?: number;
  /** Newton iterations at most (default 30). */
  maxIterations?: number;
  /** Largest step during conduction in the recorded period, as a fraction of the period (default 1/600). */
  recordStepFraction?: number;
  /**
   * Where the recorded period's current is smooth, the step above is relaxed (up to T/100) as far
   * as keeps the current within this fraction of its scale of the chord between samples (default
   * `RECORD_RESOLUTION`); 0 keeps the cap everywhere.
   */
  recordResolution?: number;
  /** Step budget per period (default 20 000). */
  maxStepsPerPeriod?: number;
}

export interface SteadyState {
  converged: boolean;
  /** A draft (`SteadyStateRun.next(true)`): a recorded period near the orbit, not yet periodic. */
  draft: boolean;
  /** Newton iterations (periods integrated with the Jacobian). */
  iterations: number;
  /** Periods integrated in all, the recorded one included. */
  periods: number;
  y0: number[];
  mode0: number;
  /** Largest |P(x) − x| of the recorded period relative to its tolerance. */
  residual: number;
  record: PeriodRecord;
  problems: string[];
}

/** Finds the periodic steady state of a network, starting from `guess` when given. */
export function findSteadyState(net: Network, options: SteadyStateOptions = {}, guess?: { y0: readonly number[]; mode0: number }): SteadyState {
  return new SteadyStateRun(net, options, guess).next(false);
}

/**
 * A shooting run that can stop at a draft and go on from it. A draft is the first recorded period
 * within `NEAR_RESIDUAL` of periodic: its figures are those of the orbit but for the imbalance so
 * small a residual leaves (a few hundredths of a percent between a bridge's pairs), enough for a
 * loss that only moves the thermal loop to its next temperature. Its `y0` is already the start
 * Newton takes next; `next(false)` goes on from there to the periodic orbit, the same periods a
 * run without the draft would have taken.
 */
export class SteadyStateRun {
  private readonly n: number;
  private readonly integ: Integrator;
  private readonly opts: IntegrateOptions;
  private readonly fineOpts: IntegrateOptions;
  private readonly record: PeriodRecord;
  private readonly test: PeriodicityTest;
  private readonly g: number[];
  private readonly y0: number[];
  private readonly problems: string[] = [];
  private mode0 = -1;
  private periods = 0;
  private iterations = 0;
  private readonly maxIt: number;
  private readonly relTol: number;
  private done = false;
  private converged: boolean;

  constructor(private readonly net: Network, options: SteadyStateOptions = {}, guess?: { y0: readonly number[]; mode0: number }) {
    const n = net.n;
    const T = net.periodS;
    this.n = n;
    this.relTol = options.relTol ?? 1e-5;
    this.maxIt = options.maxIterations ?? 30;
    this.integ = new Integrator(net, new StageSolver(net));
    this.opts = integrationOptions(net, this.relTol, options.maxStepsPerPeriod ?? 20000);
    this.record = new PeriodRecord(net);
    // Without a guess the first period is the switch-on from empty, a physical start whose
    // Newton correction already lands near the orbit.
    this.y0 = zeros(n);
    if (guess) { for (let j = 0; j < n; j++) this.y0[j] = guess.y0[j]!; this.mode0 = guess.mode0; }
    this.converged = n === 0;
    // A guess is a neighbouring orbit (the thermal loop's previous one, another corner's): near
    // enough that its first period may already be the recorded one.
    this.test = new PeriodicityTest(n === 0 || guess !== undefined);
    this.g = zeros(n);
    const resolution = options.recordResolution ?? RECORD_RESOLUTION;
    this.fineOpts = {
      ...this.opts, record: this.record, hMaxOnS: T * (options.recordStepFraction ?? 1 / 600),
      ...(resolution > 0 ? { resolution, hMaxResolvedS: T * RELAXED_RECORD_STEP_FRACTION } : {}),
    };
  }

  /** Goes on to the periodic orbit, or with `draft` stops at the first draft on the way. */
  next(draft: boolean): SteadyState {
    if (this.done) return this.result(false);
    const { n, net, integ, test, g, y0, opts, fineOpts } = this;
    const T = net.periodS;
    // Coarse periods until the orbit is near; then every period is recorded at the fine step, so
    // the period that passes the periodicity test is the one whose figures are reported.
    for (;;) {
      const recorded = test.fine;
      const res = integ.run(0, T, y0, this.mode0, recorded ? fineOpts : opts);
      this.periods++;
      if (!res.ok) { this.problems.push('steady state: step budget exhausted within one period'); break; }
      const { verdict, worst } = test.judge(integ.y, y0, opts.atol, g);
      if (verdict === 'periodic') { this.converged = true; break; }
      if (verdict === 'record') continue;
      if (this.iterations >= this.maxIt) break;
      this.iterations++;
      const delta = solveNewton(integ.Y, g, n);
      let big = 0;
      for (let j = 0; j < n; j++) {
        const step = Math.max(-net.vScaleV, Math.min(net.vScaleV, delta[j]!));
        big = Math.max(big, Math.abs(step) / (opts.atol[j]! / this.relTol));
        y0[j] = Math.max(0, y0[j]! + step);
      }
      this.mode0 = res.mode;
      test.setFine(big < 0.02 || maxAbs(integ.Y) < 0.05);
      // The record holds the period just run, from the start before this Newton step.
      if (draft && recorded && worst <= NEAR_RESIDUAL) return this.result(true);
    }
    this.done = true;
    if (!this.converged) this.problems.push(`steady state not reached in ${this.iterations} shooting iterations; figures are from the last period`);
    if (!test.fine) {
      const res = integ.run(0, T, y0, this.mode0, fineOpts);
      this.periods++;
      if (!res.ok) this.problems.push('steady state: step budget exhausted in the recorded period');
    }
    return this.result(false);
  }

  private result(draft: boolean): SteadyState {
    const { n, integ, y0, opts } = this;
    let residual = 0;
    if (!draft) for (let j = 0; j < n; j++) residual = Math.max(residual, Math.abs(integ.y[j]! - y0[j]!) / opts.atol[j]!);
    return {
      converged: this.converged, draft, iterations: this.iterations, periods: this.periods, y0: y0.slice(), mode0: this.mode0,
      residual, record: this.record, problems: this.problems.slice(),
    };
  }
}

/** Integration settings derived from the network's scales. */
export function integrationOptions(net: Network, relTol: number, maxSteps: number): IntegrateOptions {
  const n = net.n;
  const atol = zeros(n);
  const vTol = relTol * net.vScaleV;
  for (let j = 0; j < net.nCap; j++) atol[j] = vTol;
  if (net.hasL) {
    // Current scale: the source peak over the largest path impedance at the line frequency.
    const z = Math.max(...net.paths.map((p) => Math.hypot(p.rOhm, net.omega * p.lH)), 1e-3);
    atol[n - 1] = vTol / z;
  }
  const T = net.periodS;
  return { atol, rtol: 0, hMaxS: T / 16, hMaxOnS: Infinity, hEdgeS: T * 1e-7, maxSteps, sensitivity: true };
}

/** Newton correction δ from (Φ − I)·δ = −g; falls back to δ = g when Φ − I is singular. Both engines' shooting uses it. */
export function solveNewton(phi: readonly number[], g: readonly number[], n: number): number[] {
  const a = zeros(n * n);
  const b = zeros(n);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) a[i * n + j] = phi[i * n + j]! - (i === j ? 1 : 0);
    b[i] = -g[i]!;
  }
  for (let c = 0; c < n; c++) {
    let p = c;
    for (let r = c + 1; r < n; r++) if (Math.abs(a[r * n + c]!) > Math.abs(a[p * n + c]!)) p = r;
    if (Math.abs(a[p * n + c]!) < 1e-12) return g.slice();
    if (p !== c) {
      for (let j = 0; j < n; j++) { const t = a[c * n + j]!; a[c * n + j] = a[p * n + j]!; a[p * n + j] = t; }
      const t = b[c]!; b[c] = b[p]!; b[p] = t;
    }
    for (let r = c + 1; r < n; r++) {
      const m = a[r * n + c]! / a[c * n + c]!;
      for (let j = c; j < n; j++) a[r * n + j] = a[r * n + j]! - m * a[c * n + j]!;
      b[r] = b[r]! - m * b[c]!;
    }
  }
  for (let r = n - 1; r >= 0; r--) {
    let s = b[r]!;
    for (let j = r + 1; j < n; j++) s -= a[r * n + j]! * b[j]!;
    b[r] = s / a[r * n + r]!;
  }
  return b;
}

function maxAbs(a: readonly number[]): number {
  let m = 0;
  for (const x of a) m = Math.max(m, Math.abs(x));
  return m;
}
