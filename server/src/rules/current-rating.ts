/**
 * `current-rating` — fires when a rectifier diode's average forward current at its worst corner
 * exceeds the policy's fraction of IF(AV), or a MOSFET's RMS drain current exceeds the policy's
 * fraction of its ID rating.
 *
 * Why: a capacitor-input filter draws its current in short peaks; the average rating is the
 * maker's thermal budget for the part, and running at it leaves no room for ambient or mounting.
 *
 * Threshold: `if` of the derating policy for diodes (default 70 %, common practice — see
 * derating-policy.ts), `id` for MOSFETs (default 80 %, MIL-DTL-917 Table XIX). A MOSFET's ID is
 * a continuous rating, so its RMS current (what heats the channel) is compared: our reading,
 * common practice. Error above the rating itself, warning above the derated limit only.
 */
import { withLazyFixes, type Finding } from '../findings/index';
import type { Rule } from './registry';
import { diodeSwapFix } from './fixes/swap-diode';
import { allowsText, fmt, pct, placeOf, ratingTag, stressFindings, type DeviceView, type FailedStress } from './rule-context';
import type { DeviceAnalysis } from '../equivalent/index';
import type { RuleInput } from './registry';

export const currentRatingRule: Rule = {
  code: 'current-rating',
  check(input) {
    const stress = (d: DeviceAnalysis) => (d.ratings.ratings.kind === 'diode' ? 'average-current' : 'drain-current');
    return stressFindings(input, stress, (view, failed) =>
      view.device.ratings.ratings.kind === 'diode' ? diodeFinding(input, view, failed) : mosfetFinding(input, view, failed));
  },
};

function diodeFinding(input: RuleInput, { analysis, index, device, worst }: DeviceView, failed: FailedStress): Finding | undefined {
  const r = device.ratings.ratings;
  const limit = input.policy.if;
  if (r.kind !== 'diode' || !r.ifavA || !worst?.iavgA) return undefined;
  return withLazyFixes({
    ...placeOf(device.ref.origin, device.ref.name), severity: failed.status, code: 'current-rating',
    message: `${device.ref.name}: average current ${fmt(worst.iavgA.value)} A at ${worst.iavgA.corner} is ` +
      `${pct(worst.iavgA.value / r.ifavA.value)} of IF(AV) ${fmt(r.ifavA.value)} A${ratingTag(r.ifavA)}; ${allowsText(limit)}`,
  }, () => [diodeSwapFix(input, analysis, index)]);
}

function mosfetFinding(input: RuleInput, { device, worst }: DeviceView, failed: FailedStress): Finding | undefined {
  const r = device.ratings.ratings;
  const limit = input.policy.id;
  if (r.kind !== 'mosfet' || !r.idA || !worst?.irmsA) return undefined;
  return {
    ...placeOf(device.ref.origin, device.ref.name), severity: failed.status, code: 'current-rating',
    message: `${device.ref.name}: RMS drain current ${fmt(worst.irmsA.value)} A at ${worst.irmsA.corner} is ` +
      `${pct(worst.irmsA.value / r.idA.value)} of ID ${fmt(r.idA.value)} A; ${allowsText(limit)}`,
  };
}
