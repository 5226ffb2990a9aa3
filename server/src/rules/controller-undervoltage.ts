/**
 * `controller-undervoltage` — fires (warning) when, at some corner, the crest of the input an
 * active bridge's controller sees never reaches the controller's minimum operating voltage.
 *
 * Why: below `vmin` the controller never drives the gates, so the "synchronous" bridge runs on
 * its MOSFETs' body diodes, with their drop and loss, and the efficiency it was chosen for is gone.
 *
 * Threshold: the controller's `vmin` rating (`*@ rate <instance or subckt> vmin=`), else the
 * common-practice default the equivalent circuit assumed (equivalent/to-equivalent-circuit.ts); the crest is
 * √2 times the corner's RMS on the rectifier side (a sinusoidal source, D).
 */
import type { Finding } from '../findings/index';
import { anchorOf } from '../circuit/index';
import type { Rule } from './registry';
import { circuitIndexOf, fmt } from './rule-context';

export const controllerUndervoltageRule: Rule = {
  code: 'controller-undervoltage',
  check(input) {
    const findings: Finding[] = [];
    for (const analysis of input.rectifiers) {
      const vminV = analysis.circuit.controllerVminV;
      if (vminV === undefined) continue;
      const low = [...analysis.solution.corners].sort((a, b) => a.lineVrms - b.lineVrms)[0];
      if (!low) continue;
      const crestV = low.lineVrms * Math.SQRT2;
      if (crestV >= vminV) continue;
      const ref = analysis.rectifier.devices.flatMap((d) => d.controllers ?? [])[0];
      const instance = ref && circuitIndexOf(input).instancesByKey.get(ref.name.toLowerCase());
      const place = instance ? anchorOf(instance.origin) : analysis.rectifier.anchor;
      const rated = analysis.controller?.vminV ? 'rated' : 'assumed, none rated';
      const always = analysis.solution.corners.every((c) => c.lineVrms * Math.SQRT2 < vminV);
      findings.push({
        ...place, severity: 'warning', code: 'controller-undervoltage',
        message: `input crest ${fmt(crestV)} V at ${low.name} never reaches the controller${ref ? ` ${ref.name}` : ''}'s vmin ` +
          `${fmt(vminV)} V (${rated}): the bridge runs on its body diodes ${always ? 'at every corner' : 'at that corner'}`,
      });
    }
    return findings;
  },
};
