/**
 * `controller-overvoltage` — fires (error) when, at some corner, the crest of the input an active
 * bridge's controller sees exceeds the controller's maximum supply voltage (`*@ rate <controller>
 * vmax=`).
 *
 * Why: the controller of a synchronous bridge is supplied from the rectified input; above its
 * maximum input voltage it is overstressed and may fail, and with it the gate drive of all four
 * MOSFETs.
 *
 * Threshold: the `vmax` rating itself (a maximum, not a stress to derate); the crest is √2 times
 * the highest corner's RMS on the rectifier side (a sinusoidal source, D). Nothing fires when no
 * `vmax` is rated: the controller's limit is then unknown, not assumed.
 */
import type { Finding } from '../findings/index';
import { anchorOf } from '../circuit/index';
import type { Rule } from './registry';
import { circuitIndexOf, fmt } from './rule-context';

export const controllerOvervoltageRule: Rule = {
  code: 'controller-overvoltage',
  check(input) {
    const findings: Finding[] = [];
    for (const analysis of input.rectifiers) {
      const vmaxV = analysis.controller?.vmaxV?.value;
      if (vmaxV === undefined || analysis.circuit.controllerVminV === undefined) continue;
      const high = [...analysis.solution.corners].sort((a, b) => b.lineVrms - a.lineVrms)[0];
      if (!high) continue;
      const crestV = controllerCrestV(high.lineVrms);
      if (crestV <= vmaxV) continue;
      const ref = analysis.rectifier.devices.flatMap((d) => d.controllers ?? [])[0];
      const instance = ref && circuitIndexOf(input).instancesByKey.get(ref.name.toLowerCase());
      const place = instance ? anchorOf(instance.origin) : analysis.rectifier.anchor;
      findings.push({
        ...place, severity: 'error', code: 'controller-overvoltage',
        message: `input crest ${fmt(crestV)} V at ${high.name} exceeds the controller${ref ? ` ${ref.name}` : ''}'s rated vmax ${fmt(vmaxV)} V ` +
          `(${fmt((crestV / vmaxV) * 100)} % of it): choose a controller rated above the crest, or lower the input`,
      });
    }
    return findings;
  },
};

/** The crest of a sinusoidal input of this RMS (D). */
export function controllerCrestV(lineVrms: number): number {
  return lineVrms * Math.SQRT2;
}
