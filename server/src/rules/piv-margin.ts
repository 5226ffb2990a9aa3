/**
 * `piv-margin` — fires when a rectifier diode's peak inverse voltage at its worst corner exceeds
 * the policy's fraction of its repetitive reverse rating VRRM (DESIGN.md §6).
 *
 * Why: reverse voltage beyond VRRM breaks the junction down; mains surges and line swell eat any
 * margin left at high line, so designs keep PIV to a fraction of VRRM.
 *
 * Threshold: `vr` of the derating policy (`*@ derate vr=`, then the setting, then the default
 * 80 %, IPC-9592B from memory — see derating-policy.ts). Severity: error when PIV exceeds VRRM
 * itself (outside the part's rating), warning when it only exceeds the derated limit. Fix: the
 * lowest-rated part that passes every stress rule (fixes/swap-diode.ts).
 */
import { withLazyFixes } from '../findings/index';
import type { Rule } from './registry';
import { diodeSwapFix } from './fixes/swap-diode';
import { allowsText, fmt, pct, placeOf, ratingTag, stressFindings } from './rule-context';

export const pivMarginRule: Rule = {
  code: 'piv-margin',
  check(input) {
    const vr = input.policy.vr;
    return stressFindings(input, 'reverse-voltage', ({ analysis, index, device, worst }, failed) => {
      const rating = device.ratings.ratings;
      if (rating.kind !== 'diode' || !rating.vrrmV || !worst?.pivV) return undefined;
      const piv = worst.pivV;
      return withLazyFixes({
        ...placeOf(device.ref.origin, device.ref.name), severity: failed.status, code: 'piv-margin',
        message: `${device.ref.name}: PIV ${fmt(piv.value)} V at ${piv.corner} is ${pct(piv.value / rating.vrrmV.value)} of VRRM ` +
          `${fmt(rating.vrrmV.value)} V${ratingTag(rating.vrrmV)}; ${allowsText(vr)}`,
      }, () => [diodeSwapFix(input, analysis, index)]);
    });
  },
};
