/**
 * `mosfet-vds` — fires when a rectifier MOSFET's blocking voltage at its worst corner (the PIV
 * the solver reports for it) exceeds the policy's fraction of its VDS rating.
 *
 * Why: avalanche beyond VDS destroys the channel; synchronous bridges on mains see the full line
 * crest plus surges across the off switches.
 *
 * Threshold: `vds` of the policy (default 80 %, IPC-9592B from memory; NASA EEE-INST-002 gives
 * 75 %, from memory). Error above VDS itself, warning above the derated limit only.
 */
import type { Finding } from '../analysis/findings';
import type { Rule } from './registry';
import { allowsText, devicesOf, fmt, pct, placeOf, policyOf, severityOf } from './rule-context';

export const mosfetVdsRule: Rule = {
  code: 'mosfet-vds',
  check(input) {
    const vds = policyOf(input).vds;
    const findings: Finding[] = [];
    for (const { device, worst } of devicesOf(input)) {
      const r = device.ratings.ratings;
      if (r.kind !== 'mosfet' || !r.vdsV || !worst?.pivV) continue;
      const severity = severityOf(worst.pivV.value, r.vdsV.value, vds.value);
      if (!severity) continue;
      findings.push({
        ...placeOf(device.ref.origin, device.ref.name), severity, code: 'mosfet-vds',
        message: `${device.ref.name}: blocking voltage ${fmt(worst.pivV.value)} V at ${worst.pivV.corner} is ` +
          `${pct(worst.pivV.value / r.vdsV.value)} of VDS ${fmt(r.vdsV.value)} V; ${allowsText(vds)}`,
      });
    }
    return findings;
  },
};
