/**
 * Gate rules of active and hybrid bridges. Each rule is "on while any of these sinusoids is at
 * or above its threshold", which makes every switching instant known in advance: the integrator
 * lands steps on them instead of discovering the discontinuity by rejecting steps.
 */
import type { NetDevice, NetLine } from './network';
import { DEFAULT_GATE_ON_V } from './mosfet-model';

/** On while any a·sin ωt + b·cos ωt ≥ thresholdV. */
export interface GateRule {
  terms: { a: number; b: number; thresholdV: number }[];
}

/**
 * Gives each MOSFET its gate rule and returns the switching instants of one period.
 * controller: driven while |e(t)| ≥ vmin, e being the EMF between this device's line and another
 * (a controller below its minimum voltage leaves only the body diodes). self-driven: the gate is
 * tied to the opposite AC line, so Vgs ≈ e_other − e_own, which is high exactly in the half-cycle
 * in which the body diode would conduct (taking the drops as negligible beside the gate threshold).
 */
export function buildGates(devices: NetDevice[], lines: NetLine[], controllerVminV: number, omega: number): number[] {
  const times: number[] = [];
  const period = (2 * Math.PI) / omega;
  for (const d of devices) {
    const src = d.source;
    if (src.kind !== 'mosfet' || src.gate === 'undriven') continue;
    const own = lines[d.line]!;
    const terms: GateRule['terms'] = [];
    lines.forEach((other, k) => {
      if (k === d.line) return;
      const a = other.a - own.a;
      const b = other.b - own.b;
      if (src.gate === 'controller') {
        terms.push({ a, b, thresholdV: controllerVminV }, { a: -a, b: -b, thresholdV: controllerVminV });
      } else {
        terms.push({ a, b, thresholdV: src.gateOnV ?? DEFAULT_GATE_ON_V });
      }
    });
    d.gate = { terms };
    for (const t of terms) times.push(...crossingTimes(t.a, t.b, t.thresholdV, omega, period));
  }
  times.sort((x, y) => x - y);
  return times.filter((t, i) => i === 0 || t - times[i - 1]! > 1e-12 * period);
}

/** Instants in [0, T) where a·sin ωt + b·cos ωt = v. */
function crossingTimes(a: number, b: number, v: number, omega: number, period: number): number[] {
  const amp = Math.hypot(a, b);
  if (!(amp > Math.abs(v))) return [];
  const phi = Math.atan2(b, a);
  const base = Math.asin(v / amp);
  const wrap = (x: number) => ((x % period) + period) % period;
  return [wrap((base - phi) / omega), wrap((Math.PI - base - phi) / omega)];
}

/** Sets each device's channel state for the instant t (call at a step's midpoint). */
export function applyGates(devices: NetDevice[], omega: number, t: number): void {
  const s = Math.sin(omega * t);
  const c = Math.cos(omega * t);
  for (const d of devices) {
    if (!d.gate) continue;
    let on = false;
    for (const term of d.gate.terms) if (term.a * s + term.b * c >= term.thresholdV) on = true;
    d.channelOn = on;
  }
}
