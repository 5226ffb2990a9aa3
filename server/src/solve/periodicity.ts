/**
 * The one periodicity test of both shooting engines (shooting.ts, overlap-shooting.ts): coarse
 * periods until the orbit is near, then recorded fine periods, and an orbit called periodic only
 * on a fine period — settled to its tolerance, or stalled at the integrator's noise floor, a stall
 * judged between periods of one step regime only.
 */
/**
 * Largest |P(x) − x|, in absolute tolerances of the state (relTol × the voltage scale), at which
 * coarse periods give way to recorded fine ones.
 */
export const NEAR_RESIDUAL = 2;

/**
 * Largest |P(x) − x| of a recorded (fine) period accepted as periodic. A capacitor-input filter's
 * currents follow the small difference between charge in and charge out per period, so the
 * imbalance between a bridge's diode pairs grows as the residual over the ripple: an orbit
 * accepted at 2 tolerances left 0.1 % at 1.7 % ripple, one at 0.2 still 0.016 % at 1.5 %. The
 * coarse and fine step sequences differ by a few tenths of a tolerance, so the first fine period
 * after coarse ones rarely passes this; one Newton step on fine periods lands below 0.001
 * (tests/solve/warm-start-symmetry.test.ts, pairs equal to 0.01 % over random bridges).
 */
export const CONVERGED_RESIDUAL = 0.02;

/**
 * Largest residual accepted when Newton stops improving (by less than 3× per period): the
 * integrator's noise floor, from the adaptive step sequence. Across the solver, rule and report
 * suites the stalls sat at 0.5–7.7 tolerances; beyond 20 an orbit is not called periodic, the
 * iterations go on and, if they run out, the corner is reported as not converged.
 */
export const STALL_RESIDUAL = 20;

/** What to do after a period: it is periodic, switch to recorded periods, or take a Newton step. */
export type PeriodVerdict = 'periodic' | 'record' | 'newton';

export class PeriodicityTest {
  private lastWorst = Infinity;

  constructor(public fine: boolean) {}

  /** Writes the residual g = y(T) − y0 and judges it, in tolerances `atol`; returns its worst too. */
  judge(yEnd: readonly number[], y0: readonly number[], atol: readonly number[], g: number[]): { verdict: PeriodVerdict; worst: number } {
    let worst = 0;
    for (let j = 0; j < y0.length; j++) { g[j] = yEnd[j]! - y0[j]!; worst = Math.max(worst, Math.abs(g[j]!) / atol[j]!); }
    const stalled = worst <= STALL_RESIDUAL && worst >= 0.3 * this.lastWorst;
    const settled = worst <= (this.fine ? CONVERGED_RESIDUAL : NEAR_RESIDUAL);
    this.lastWorst = worst;
    if (!settled && !stalled) return { verdict: 'newton', worst };
    if (this.fine) return { verdict: 'periodic', worst };
    this.setFine(true);
    return { verdict: 'record', worst };
  }

  /**
   * Enters or leaves the recorded regime; the stall reference resets on a change, so the first
   * fine period is compared with fine periods only, never with the last coarse residual (which
   * would accept an orbit several tolerances from periodic).
   */
  setFine(fine: boolean): void {
    if (fine !== this.fine) this.lastWorst = Infinity;
    this.fine = fine;
  }
}
