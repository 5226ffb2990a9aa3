/**
 * `mosfet-vds` — fires when a rectifier MOSFET's blocking voltage at its worst corner (the PIV
 * the solver reports for it) exceeds the policy's fraction of its VDS rating.
 *
 * Why: avalanche beyond VDS destroys the channel; synchronous bridges on mains see the full line
 * crest plus surges across the off switches.
 *
 * Threshold: `vds` of the policy (`*@ derate vds=`, then the setting `rectilens.derating.reverseVoltage`,
 * documented as "VRRM or VDS", then the default 80 %, IPC-9592B from memory; NASA EEE-INST-002
 * gives 75 %, from memory). Error above VDS itself, warning above the derated limit only
 * (ratings/stress-checks.ts).
 */
import type { Rule } from './registry';
import { allowsText, fmt, pct, placeOf, stressFindings } from './rule-context';

export const mosfetVdsRule: Rule = {
  code: 'mosfet-vds',
  check(input) {
    const vds = input.policy.vds;
    return stressFindings(input, 'vds', ({ device, worst }, failed) => {
      const r = device.ratings.ratings;
      if (r.kind !== 'mosfet' || !r.vdsV || !worst?.pivV) return undefined;
      return {
        ...placeOf(device.ref.origin, device.ref.name), severity: failed.status, code: 'mosfet-vds',
        message: `${device.ref.name}: blocking voltage ${fmt(worst.pivV.value)} V at ${worst.pivV.corner} is ` +
          `${pct(worst.pivV.value / r.vdsV.value)} of VDS ${fmt(r.vdsV.value)} V; ${allowsText(vds)}`,
      };
    });
  },
};
