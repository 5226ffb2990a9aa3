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
 * Devices without RθJA are skipped: their Tj is only the ambient (missing-rating says so).
 */
import { withLazyFixes, type Finding } from '../analysis/findings';
import { describePolicyOrigin, junctionLimitC } from '../ratings/index';
import type { Rule } from './registry';
import { diodeSwapFix } from './fixes/swap-diode';
import { devicesOf, fmt, placeOf, policyOf } from './rule-context';

export const junctionTempRule: Rule = {
  code: 'junction-temp',
  check(input) {
    const tj = policyOf(input).tj;
    const findings: Finding[] = [];
    for (const { analysis, index, device, worst } of devicesOf(input)) {
      const r = device.ratings.ratings;
      if ((r.kind !== 'diode' && r.kind !== 'mosfet') || !worst?.tjC || worst.thermalRunaway) continue;
      if (analysis.circuit.devices[index]?.rthjaKPerW === undefined) continue;
      const tjmaxC = r.tjmaxC?.value;
      const limitC = junctionLimitC(tj.value, tjmaxC);
      const beyondMax = tjmaxC !== undefined && worst.tjC.value > tjmaxC;
      if (!beyondMax && worst.tjC.value <= limitC) continue;
      const max = tjmaxC === undefined ? 'no Tjmax rated' : `Tjmax ${fmt(tjmaxC)} °C`;
      findings.push(withLazyFixes({
        ...placeOf(device.ref.origin, device.ref.name), severity: beyondMax ? 'error' : 'warning', code: 'junction-temp',
        message: `${device.ref.name}: junction ${fmt(worst.tjC.value)} °C at ${worst.tjC.corner} (loss ${fmt(worst.lossW?.value ?? 0)} W); ` +
          `${max}; policy allows ${fmt(limitC)} °C (${describePolicyOrigin(tj.origin)})`,
      }, () => [r.kind === 'diode' ? diodeSwapFix(input, analysis, index) : undefined]));
    }
    return findings;
  },
};
