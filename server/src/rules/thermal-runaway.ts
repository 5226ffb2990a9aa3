/**
 * `thermal-runaway` — fires when the electro-thermal loop of a device does not settle at some
 * corner: loss raises Tj, which raises loss, without a fixed point (DESIGN.md §5).
 *
 * Why: the part cannot shed its heat at that ambient; in the circuit it would overheat and fail.
 *
 * Threshold: none to choose — the solver reports the loop as diverged (Tj iterated to 0.1 K).
 * Always an error.
 */
import { withLazyFixes, type Finding } from '../findings/index';
import type { Rule } from './registry';
import { diodeSwapFix } from './fixes/swap-diode';
import { devicesOf, fmt, placeOf } from './rule-context';

export const thermalRunawayRule: Rule = {
  code: 'thermal-runaway',
  check(input) {
    const findings: Finding[] = [];
    for (const { analysis, index, device, worst } of devicesOf(input)) {
      if (!worst?.thermalRunaway) continue;
      const corners = device.figures.corners.filter((c) => c.figures?.thermalRunaway).map((c) => c.corner);
      const rthja = device.figures.rthjaKPerW;
      findings.push(withLazyFixes({
        ...placeOf(device.ref.origin, device.ref.name), severity: 'error', code: 'thermal-runaway',
        message: `${device.ref.name}: loss and junction temperature do not settle at ${corners.join(', ')}` +
          `${rthja === undefined ? '' : ` with RθJA ${fmt(rthja)} K/W`}: thermal runaway; the part cannot shed its heat there`,
      }, () => [device.ref.type === 'diode' ? diodeSwapFix(input, analysis, index) : undefined]));
    }
    return findings;
  },
};
