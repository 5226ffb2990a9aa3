/**
 * `bypassed-device` — a resistor straight across a rectifier device (anode to cathode, or drain
 * to source).
 *
 * Why: the resistor conducts in both directions, so it bypasses the device's blocking; the
 * solver models the rectifier without it (recognition takes resistors only as loads, ESR or
 * source resistance), so the figures describe another circuit unless its current is negligible.
 *
 * Threshold: the resistor's current at the device's worst PIV, PIV/R (Ohm's law), against the
 * device's own currents. Under 1 % of its average current the figures are off by under 1 %
 * (the bypass current adds to what they describe; common practice for a negligible effect):
 * info. From 1 %: warning. At or above its peak forward current, or at 0 Ω, the resistor is in
 * effect a short across the device and the rectifier cannot be analysed as drawn: error.
 */
import type { Severity } from '../../../grammar/src/index';
import type { Finding } from '../findings/index';
import type { FlatElement } from '../circuit/index';
import type { Rule } from './registry';
import { circuitIndexOf, devicesOf, fmt, pct, placeOf, type DeviceView } from './rule-context';

/** Below this share of the device's average current the bypass is negligible. */
export const NEGLIGIBLE_BYPASS_SHARE = 0.01;

export const bypassedDeviceRule: Rule = {
  code: 'bypassed-device',
  check(input) {
    const index = circuitIndexOf(input);
    return devicesOf(input).flatMap((view) => {
      const { anode, cathode } = view.device.ref;
      return anode === cathode ? [] : index.resistorsAcross(anode, cathode).map((r) => bypassFinding(r, view));
    });
  },
};

/** Resistors of a known, non-negative value by the pair of nodes they join (a negative one is implausible-value's). */
function bypassFinding(r: FlatElement, view: DeviceView): Finding {
  const ohm = (r as { value: number }).value;
  const { severity, message } = judge(r.name, ohm, view);
  const place = placeOf(r.origin, r.name);
  const device = view.device.ref;
  const related = [...(place.related ?? []), { uri: device.origin.uri, span: device.origin.nameSpan, message: `${device.name} is the device it bypasses` }];
  return { ...place, related, severity, code: 'bypassed-device', message };
}

function judge(name: string, ohm: number, view: DeviceView): { severity: Severity; message: string } {
  const device = view.device.ref.name;
  const across = `${name} (${fmt(ohm)} Ω) is across ${device} of the ${view.analysis.rectifier.kind.replace(/-/g, ' ')} and conducts both ways`;
  const asDrawn = `the rectifier could not be analysed as drawn: its figures are for it without ${name}`;
  if (ohm === 0) return { severity: 'error', message: `${across}: at 0 Ω it shorts ${device}; ${asDrawn}` };
  const piv = view.worst?.pivV;
  const average = view.worst?.iavgA?.value;
  const peak = view.worst?.ipkA?.value;
  if (!piv || average === undefined || peak === undefined) {
    return { severity: 'warning', message: `${across}; the analysis leaves it out and its effect was not computed` };
  }
  const reverseA = piv.value / ohm;
  const atPiv = `at ${device}'s PIV of ${fmt(piv.value)} V (${piv.corner}) it passes ${fmt(reverseA)} A in reverse`;
  if (reverseA >= peak) {
    return { severity: 'error', message: `${across}: ${atPiv}, at least ${device}'s peak forward current of ${fmt(peak)} A, so it shorts ${device}; ${asDrawn}` };
  }
  if (!(average > 0)) return { severity: 'warning', message: `${across}: ${atPiv}, which the figures leave out` };
  const share = reverseA / average;
  if (share >= NEGLIGIBLE_BYPASS_SHARE) {
    return { severity: 'warning', message: `${across}: ${atPiv}, ${pct(share)} of its average current of ${fmt(average)} A, which the figures leave out` };
  }
  return { severity: 'info', message: `${across}: ${atPiv}, under 1 % of its average current of ${fmt(average)} A; the figures leave it out, which changes them by less than that` };
}
