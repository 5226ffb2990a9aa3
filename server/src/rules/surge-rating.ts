/**
 * `surge-rating` — fires when a rectifier diode's switch-on inrush (first half-cycle at the
 * crest, capacitor empty, high line; DESIGN.md §5) exceeds its surge rating IFSM compared over
 * the same duration.
 *
 * Why: the empty bulk capacitor is a short circuit at switch-on; the inrush can be many times
 * the running current and is what kills rectifiers in the field, once, at power-up.
 *
 * Threshold: IFSM is rated for one half-sine of 8.3 ms unless the part says 10 ms; it is
 * converted to the half-cycle t = 1/(2f) at equal I²t (I_eq = IFSM·√(t_rated/t), REFERENCES.md
 * §5, D) and compared with the larger of the measured peak and √(2·I²t/t) (solve/device-figures.ts),
 * times `ifsm` of the policy (default 100 %, common practice). Severity: error when the I²t
 * itself exceeds the rating's I²t over the half-cycle (energy beyond the rating); warning when
 * only the peak exceeds the converted IFSM (a short spike: holding its peak to IFSM is the
 * conservative common practice, since the half-sine rating says nothing of shorter pulses) or
 * when only the derated limit is exceeded. Fixes: an E12 series inrush resistor, or a part with
 * more IFSM. The verdict is ratings/stress-checks.ts.
 */
import { withLazyFixes } from '../findings/index';
import type { Rule } from './registry';
import { diodeSwapFix } from './fixes/swap-diode';
import { inrushResistorFix } from './fixes/inrush-resistor';
import { surgeCapability } from '../ratings/index';
import { allowsText, fmt, pct, placeOf, stressFindings } from './rule-context';

export const surgeRatingRule: Rule = {
  code: 'surge-rating',
  check(input) {
    const limit = input.policy.ifsm;
    return stressFindings(input, 'surge', ({ analysis, index, device }, failed) => {
      const r = device.ratings.ratings;
      const stress = device.figures.surge;
      const capability = r.kind === 'diode' && stress ? surgeCapability(r, stress.durationS) : undefined;
      if (!stress || !capability) return undefined;
      const figureA = stress.figureA;
      const ms = (s: number) => `${fmt(s * 1000)} ms`;
      return withLazyFixes({
        ...placeOf(device.ref.origin, device.ref.name), severity: failed.status, code: 'surge-rating',
        message: `${device.ref.name}: switch-on surge at ${stress.corner}: peak ${fmt(stress.peakA)} A, I²t ${fmt(stress.i2tA2s)} A²s ` +
          `over the ${ms(stress.durationS)} half-cycle; IFSM ${fmt(capability.ifsmA)} A for ${ms(capability.ratedS)} is ` +
          `${fmt(capability.equivalentA)} A over ${ms(stress.durationS)} at equal I²t (${fmt(capability.i2tA2s)} A²s): the surge is ` +
          `${pct(figureA / capability.equivalentA)} of it (I²t ${pct(stress.i2tA2s / capability.i2tA2s)}); ${allowsText(limit)}`,
      }, () => [inrushResistorFix(input, analysis), diodeSwapFix(input, analysis, index)]);
    });
  },
};
