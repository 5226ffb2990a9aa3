/**
 * An independent reference for circuits whose diodes switch inductor currents: the registry
 * library `odex` (Hairer & Wanner's ODEX) integrates each conduction mode as a smooth ODE, and
 * the mode changes are located as events on its dense output (bisection on the guard), so no
 * kink is ever stepped over. Nothing here imports the solver under test.
 */
import type { OdexSolver } from './odex-loader';

/** A circuit as modes: a smooth right-hand side per mode, a guard that stays ≥ 0 while the mode holds. */
export interface PiecewiseSystem {
  n: number;
  rhs(mode: number, t: number, y: number[]): number[];
  /** Non-negative while `mode` holds; the mode ends where it falls below zero. */
  guard(mode: number, t: number, y: number[]): number;
  /** The consistent mode at (t, y) and the state cleaned for it (currents of blocked diodes exactly zero). */
  settle(t: number, y: number[]): { mode: number; y: number[] };
}

export interface RunResult { mode: number; y: number[] }

/**
 * Integrates from t0 to t1, calling `sample` at every multiple of `dt` in [t0, t1) when given.
 * Steps are at most `hMax`, so that a guard cannot dip below zero and back within one step unseen.
 */
export function runPiecewise(
  Solver: new (n: number) => OdexSolver, sys: PiecewiseSystem, t0: number, t1: number, y0: number[], tol: number, hMax: number,
  sample?: { dt: number; at: (t: number, y: number[], mode: number) => void },
): RunResult {
  let { mode, y } = sys.settle(t0, y0);
  let t = t0;
  let nextSample = t0;
  for (let events = 0; t < t1 && events < 100000; events++) {
    const s = new Solver(sys.n);
    s.absoluteTolerance = tol;
    s.relativeTolerance = tol;
    s.maxSteps = 1e7;
    s.maxStepSize = hMax;
    s.denseOutput = true;
    let cross: { t: number; y: number[] } | undefined;
    const m = mode;
    const out = (_nr: number, xOld: number, x: number, yy: number[], dense?: (c: number, x: number) => number): boolean | void => {
      if (!dense || x <= xOld) return;
      const at = (tt: number) => Array.from({ length: sys.n }, (_, c) => dense(c, tt));
      let end = x;
      if (sys.guard(m, x, yy) < 0) {
        let lo = xOld;
        let hi = x;
        for (let k = 0; k < 80 && hi - lo > 1e-15 * Math.max(1, Math.abs(hi)); k++) {
          const mid = 0.5 * (lo + hi);
          if (sys.guard(m, mid, at(mid)) < 0) hi = mid; else lo = mid;
        }
        end = hi;
        cross = { t: hi, y: at(hi) };
      }
      if (sample) {
        while (nextSample < end && nextSample < t1) { sample.at(nextSample, nextSample === x ? yy : at(nextSample), m); nextSample += sample.dt; }
      }
      if (cross) return false;
    };
    const res = s.solve((tt, yy) => sys.rhs(m, tt, yy), t, y, t1, out);
    if (!cross) { y = res.y; t = t1; break; }
    ({ mode, y } = sys.settle(cross.t, cross.y));
    t = cross.t;
  }
  if (sample) while (nextSample < t1 - 1e-12 * sample.dt) { sample.at(nextSample, y, mode); nextSample += sample.dt; }
  return { mode, y };
}
