/**
 * `junction-temp` — fires when a device's junction temperature at the hottest corner (from the
 * electro-thermal loop Tj = Ta + P·RθJA, DESIGN.md §5) exceeds the policy's junction limit.
 *
 * Why: every wear-out mechanism of a semiconductor speeds up with temperature; Tjmax is the edge
 * of the maker's guarantee, and designs keep well below it.
 *
 * Threshold: `tj` of the policy via `junctionLimitC` — by default the lower of 125 °C and
 * Tjmax − 20 °C (IPC-9592B, from memory); a `*@ derate tj=` value is an absolute limit never
 * above the part's Tjmax. Error above Tjmax itself, warning above the derated limit only.
 * Devices without RθJA are skipped: their Tj is only the ambient (missing-rating says so). The
 * verdict is ratings/stress-checks.ts.
 */
import { withLazyFixes } from '../findings/index';
import { describePolicyOrigin } from '../ratings/index';
import type { Rule } from './registry';
import { diodeSwapFix } from './fixes/swap-diode';
import { fmt, placeOf, stressFindings } from './rule-context';

export const junctionTempRule: Rule = {
  code: 'junction-temp',
  check(input) {
    const tj = input.policy.tj;
    return stressFindings(input, 'junction-temperature', ({ analysis, index, device, worst }, failed) => {
      if (!worst?.tjC) return undefined;
      const max = failed.rating === undefined ? 'no Tjmax rated' : `Tjmax ${fmt(failed.rating)} °C`;
      return withLazyFixes({
        ...placeOf(device.ref.origin, device.ref.name), severity: failed.status, code: 'junction-temp',
        message: `${device.ref.name}: junction ${fmt(worst.tjC.value)} °C at ${worst.tjC.corner} (loss ${fmt(worst.lossW?.value ?? 0)} W); ` +
          `${max}; policy allows ${fmt(failed.limit!)} °C (${describePolicyOrigin(tj.origin)})`,
      }, () => [device.ratings.ratings.kind === 'diode' ? diodeSwapFix(input, analysis, index) : undefined]);
    });
  },
};
