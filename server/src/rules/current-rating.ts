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
import { withLazyFixes, type Finding } from '../analysis/findings';
import type { Rule } from './registry';
import { diodeSwapFix } from './fixes/swap-diode';
import { allowsText, devicesOf, fmt, pct, placeOf, policyOf, ratingTag, severityOf, type DeviceView } from './rule-context';
import type { RuleInput } from './registry';

export const currentRatingRule: Rule = {
  code: 'current-rating',
  check(input) {
    return devicesOf(input).flatMap((view) => {
      const finding = view.device.ratings.ratings.kind === 'diode' ? diodeFinding(input, view) : mosfetFinding(input, view);
      return finding ? [finding] : [];
    });
  },
};

function diodeFinding(input: RuleInput, { analysis, index, device, worst }: DeviceView): Finding | undefined {
  const r = device.ratings.ratings;
  const limit = policyOf(input).if;
  if (r.kind !== 'diode' || !r.ifavA || !worst?.iavgA) return undefined;
  const severity = severityOf(worst.iavgA.value, r.ifavA.value, limit.value);
  if (!severity) return undefined;
  return withLazyFixes({
    ...placeOf(device.ref.origin, device.ref.name), severity, code: 'current-rating',
    message: `${device.ref.name}: average current ${fmt(worst.iavgA.value)} A at ${worst.iavgA.corner} is ` +
      `${pct(worst.iavgA.value / r.ifavA.value)} of IF(AV) ${fmt(r.ifavA.value)} A${ratingTag(r.ifavA)}; ${allowsText(limit)}`,
  }, () => [diodeSwapFix(input, analysis, index)]);
}

function mosfetFinding(input: RuleInput, { device, worst }: DeviceView): Finding | undefined {
  const r = device.ratings.ratings;
  const limit = policyOf(input).id;
  if (r.kind !== 'mosfet' || !r.idA || !worst?.irmsA) return undefined;
  const severity = severityOf(worst.irmsA.value, r.idA.value, limit.value);
  if (!severity) return undefined;
  return {
    ...placeOf(device.ref.origin, device.ref.name), severity, code: 'current-rating',
    message: `${device.ref.name}: RMS drain current ${fmt(worst.irmsA.value)} A at ${worst.irmsA.corner} is ` +
      `${pct(worst.irmsA.value / r.idA.value)} of ID ${fmt(r.idA.value)} A; ${allowsText(limit)}`,
  };
}
