/**
 * Plausibility of directive values that read as numbers but describe no real circuit: a mains
 * tolerance that puts low line at 0 V or below, a load that feeds the output, a surge pulse of
 * no length. Each check returns the message (with the numbers) or undefined; directives.ts
 * reports it on the word and drops the value, so a refused value never reaches the solver.
 */
import type { MainsDirective } from './directive-records';
import { displayNumber, displayPercent } from './display';

/** At −100 % or below, low line is 0 V or a negative voltage: no line falls that far. */
export function lowLineProblem(written: string, mains: MainsDirective): string | undefined {
  if (mains.tolLow === undefined || mains.tolLow > -1) return undefined;
  const lowest = mains.vrmsRange?.[0] ?? mains.vrms;
  const lowV = lowest === undefined
    ? ''
    : ` puts low line at ${displayNumber(lowest * (1 + mains.tolLow))} V (${displayNumber(lowest)} V × (1 − ${displayPercent(-mains.tolLow)}))`;
  return `tol=${written}${lowV}; the low side must stay above −100 %; the tolerance is ignored`;
}

/**
 * What is wrong with a load amount: a negative power or current would feed the output instead
 * of drawing from it, and a resistance of zero or below is a short or not a passive part. Zero
 * power or current is an explicit "no load".
 */
export function loadProblem(kind: 'power' | 'current' | 'resistance', amount: number): string | undefined {
  const ignored = '; the load is ignored';
  if (kind === 'power' && amount < 0) return `a load of ${displayNumber(amount)} W would feed power into the output; a load draws 0 W or more${ignored}`;
  if (kind === 'current' && amount < 0) return `a load of ${displayNumber(amount)} A would feed current into the output; a load draws 0 A or more${ignored}`;
  if (kind === 'resistance' && amount === 0) return `a load of 0 Ω is a short across the output${ignored}`;
  if (kind === 'resistance' && amount < 0) return `a load of ${displayNumber(amount)} Ω is not a passive part; a load resistance is above zero${ignored}`;
  return undefined;
}

/**
 * A surge rating's pulse, as plausible: above zero (the equal-I²t conversion divides by it) and
 * between 1 µs (the shortest pulses ratings are stated for) and 100 ms (five mains cycles; a
 * longer or repeated surge needs the part's surge curve, not one IFSM). Common practice; the
 * usual values are 8.3 ms and 10 ms, a half-cycle of 60 or 50 Hz. A bare number reads as
 * seconds, so `@10` (10 s) is caught here too.
 */
export const SURGE_DURATION_S = { min: 1e-6, max: 0.1 } as const;

export function surgeDurationProblem(written: string, durationS: number): string | undefined {
  if (durationS >= SURGE_DURATION_S.min && durationS <= SURGE_DURATION_S.max) return undefined;
  const reason = durationS <= 0 ? 'a surge lasts longer than zero' : 'a surge rating is stated for one pulse from 1 µs to 100 ms (usually 8.3 ms or 10 ms)';
  return `ifsm duration '${written}' reads as ${displayNumber(durationS)} s: ${reason}; this ifsm is ignored`;
}
