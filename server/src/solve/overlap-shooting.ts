/**
 * Periodic steady state of the overlap system by shooting, with the one-path solver's rules
 * (shooting.ts): Newton on x ↦ P(x) − x with the period Jacobian from the integrator, coarse
 * periods until the residual is within 2 tolerances, then recorded fine periods; an orbit is
 * periodic when a fine residual falls to 0.02 tolerances, or when Newton stalls (improving by
 * less than 3× from one fine period to the next) at no more than 20, the integrator's noise floor.
 */
import { solveNewton, type SteadyStateOptions } from './shooting';
import { OverlapIntegrator, type OverlapOptions } from './overlap-integrator';
import { OverlapRecord } from './overlap-record';
import type { OverlapSystem } from './overlap-stage';
import { zeros } from './vec';
import { PeriodicityTest } from './periodicity';


export interface OverlapSteadyState {
  converged: boolean;
  iterations: number;
  periods: number;
  /** Integration steps over all periods, rejected ones included. */
  steps: number;
  /** Evaluations of the bridge's six diodes over all stages, and stages left to the nested searches (overlap-bridge.ts). */
  evaluations: number;
  fallbacks: number;
  y0: number[];
  residual: number;
  record: OverlapRecord;
  problems: string[];
}

export function findOverlapSteadyState(sys: OverlapSystem, options: SteadyStateOptions = {}, guess?: { y0: readonly number[] }): OverlapSteadyState {
  const n = sys.n;
  const T = sys.net.periodS;
  const relTol = options.relTol ?? 1e-5;
  const maxIt = options.maxIterations ?? 30;
  const integ = new OverlapIntegrator(sys);
  const opts = overlapOptions(sys, relTol, options.maxStepsPerPeriod ?? 20000);
  const record = new OverlapRecord(sys);
  const fineOpts: OverlapOptions = { ...opts, record, hMaxOnS: T * (options.recordStepFraction ?? 1 / 600) };
  const problems: string[] = [];
  const y0 = guess ? guess.y0.slice() : zeros(n);
  const g = zeros(n);
  let periods = 0, iterations = 0;
  let converged = false;
  const test = new PeriodicityTest(false);
  for (;;) {
    const ok = integ.run(0, T, y0, test.fine ? fineOpts : opts);
    periods++;
    if (!ok) { problems.push('steady state: step budget exhausted within one period'); break; }
    const { verdict } = test.judge(integ.y, y0, opts.atol, g);
    if (verdict === 'periodic') { converged = true; break; }
    if (verdict === 'record') continue;
    if (iterations >= maxIt) break;
    iterations++;
    const delta = solveNewton(integ.Y, g, n);
    let big = 0;
    for (let j = 0; j < n; j++) {
      const lim = opts.atol[j]! / relTol;
      const step = Math.max(-lim, Math.min(lim, delta[j]!));
      big = Math.max(big, Math.abs(step) / lim);
      y0[j] = y0[j]! + step;
      // The capacitor cannot be charged negative by the bridge.
      if (j === 2) y0[j] = Math.max(0, y0[j]!);
    }
    test.setFine(test.fine || big < 0.02);
  }
  if (!converged) problems.push(`steady state not reached in ${iterations} shooting iterations; figures are from the last period`);
  if (!test.fine || record.count === 0) { integ.run(0, T, y0, fineOpts); periods++; }
  let residual = 0;
  for (let j = 0; j < n; j++) residual = Math.max(residual, Math.abs(integ.y[j]! - y0[j]!) / opts.atol[j]!);
  return { converged, iterations, periods, steps: integ.work, evaluations: integ.evaluations, fallbacks: integ.fallbacks, y0, residual, record, problems };
}

/** Tolerances: relTol of the line-to-line peak for the capacitor, that over twice the line impedance for the currents. */
export function overlapOptions(sys: OverlapSystem, relTol: number, maxSteps: number): OverlapOptions {
  const net = sys.net;
  const vTol = relTol * net.vScaleV;
  const z = Math.max(2 * Math.hypot(sys.rOhm, net.omega * sys.lH), 1e-3);
  const atol = zeros(sys.n);
  atol[0] = vTol / z; atol[1] = vTol / z;
  if (sys.hasCap) atol[2] = vTol;
  const T = net.periodS;
  return { atol, hMaxS: T / 48, hMaxOnS: T / 200, maxSteps, sensitivity: true };
}

