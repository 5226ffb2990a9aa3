/**
 * `surge-rating` — fires when a rectifier diode's switch-on inrush exceeds its surge rating. The
 * inrush check's cases (solve/inrush-cases.ts): switch-on at the positive and at the negative
 * crest with the capacitor empty, at every corner; with an NTC limiter (`*@ rate R… hot=`) a cold
 * start and a hot restart. Each device is judged in its own worst case.
 *
 * Why: the empty bulk capacitor is a short circuit at switch-on; the inrush can be many times
 * the running current and is what kills rectifiers in the field, once, at power-up — or at the
 * quick off-on restart, when an NTC limiter is still hot and limits almost nothing.
 *
 * Threshold: the peak against IFSM and the ∫i²dt against the rated I²t, IFSM²·t_rated/2 for the
 * half-sine IFSM is rated with (8.3 ms unless the part says 10 ms; REFERENCES.md §5, D), times
 * `ifsm` of the policy (default 100 %, common practice) on the current. The message says which
 * comparison binds and by how much. Severity (ratings/stress-checks.ts): error when the I²t itself
 * exceeds the rated I²t; warning when only the peak exceeds IFSM (a short spike: holding its peak
 * to IFSM is the conservative common practice) or only the derated limit is exceeded. Fixes: an
 * E12 series inrush resistor, or a part with more IFSM.
 */
import { clipText } from '../../../grammar/src/index';
import { withLazyFixes } from '../findings/index';
import type { RectifierAnalysis } from '../equivalent/index';
import type { SurgeJudgement } from '../ratings/index';
import type { SurgeStress } from '../solve/index';
import type { Rule } from './registry';
import { diodeSwapFix } from './fixes/swap-diode';
import { inrushResistorFix } from './fixes/inrush-resistor';
import { allowsText, fmt, pct, placeOf, stressFindings } from './rule-context';

export const surgeRatingRule: Rule = {
  code: 'surge-rating',
  check(input) {
    const limit = input.policy.ifsm;
    return stressFindings(input, 'surge', ({ analysis, index, device }, failed) => {
      const stress = device.figures.surge;
      const judged = failed.surge;
      if (!stress || !judged) return undefined;
      return withLazyFixes({
        ...placeOf(device.ref.origin, device.ref.name), severity: failed.status, code: 'surge-rating',
        message: `${device.ref.name}: ${surgeWhen(stress, analysis)}: ${surgeComparison(judged)}; ${allowsText(limit)}`,
      }, () => [inrushResistorFix(input, analysis), diodeSwapFix(input, analysis, index)]);
    });
  },
};

/** Where and how the surge arose: the corner and the inrush case, with the NTC's state on a restart. */
export function surgeWhen(stress: SurgeStress, analysis: RectifierAnalysis): string {
  const lim = analysis.circuit.inrushLimiter;
  const names = lim?.names.map((n) => clipText(n)).join(', ');
  const state = lim && stress.case?.startsWith('hot restart') ? ` (${names} still hot, capacitor empty)`
    : lim && stress.case?.startsWith('cold start') ? ` (${names} cold)` : '';
  return `${stress.case ? 'surge' : 'switch-on surge'} at ${stress.corner}${stress.case ? `, ${stress.case}` : ''}${state}`;
}

/**
 * The two comparisons in words, the binding one named with its excess or its room:
 * "peak 152 A against IFSM 150 A, I²t 60.1 A²s against the rated 93.4 A²s (IFSM²·8.3 ms/2);
 * the peak binds: 1 % above IFSM (the I²t is 64 % of its rating)".
 */
export function surgeComparison(j: SurgeJudgement): string {
  const ms = `${fmt(j.ratedS * 1000)} ms`;
  const head = `peak ${fmt(j.peakA)} A against IFSM ${fmt(j.ifsmA)} A (${ms}), I²t ${fmt(j.i2tA2s)} A²s against the rated ` +
    `${fmt(j.ratedI2tA2s)} A²s (IFSM²·${ms}/2)`;
  const peak = shareText(j.peakShare, 'IFSM');
  const i2t = shareText(j.i2tShare, 'its rating');
  return j.binding === 'peak' ? `${head}; the peak binds: ${peak} (the I²t is ${i2t})` : `${head}; the I²t binds: ${i2t} (the peak is ${peak})`;
}

/** "64 % of IFSM", "12 % above IFSM", "4.4 times IFSM" (or "far beyond" past the number range). */
function shareText(share: number, of: string): string {
  if (!Number.isFinite(share)) return `far beyond ${of}`;
  if (share >= 2) return `${fmt(share, 2)} times ${of}`;
  return share > 1 ? `${pct(share - 1)} above ${of}` : `${pct(share)} of ${of}`;
}
