/**
 * MOSFET conduction for rectifier use: an on-resistance that rises with junction temperature,
 * in parallel with the body diode, and the gate rules of active and hybrid bridges.
 */
import { diodeSlopeOhm, diodeVoltageV, ZERO_CELSIUS_K, type DiodeAtTemp } from './diode-model.js';

/**
 * Default rdson temperature exponent, rdson(T) = rdson(25 °C)·(T/298.15 K)^2.3. Silicon
 * electron mobility falls roughly as T^−2.3…−2.5 (mobility exponent from memory, Baliga);
 * 2.3 gives 1.63× at 125 °C, inside the band REFERENCES.md §8 quotes from Park, Choi & Chung.
 */
export const DEFAULT_RDSON_TEMP_EXPONENT = 2.3;

/**
 * Controller minimum operating voltage when the netlist gives none: synchronous-bridge
 * controllers typically need around 9 V before they switch (common practice).
 */
export const DEFAULT_CONTROLLER_VMIN_V = 9;

/**
 * Gate-source voltage above which a self-driven channel counts as fully on: logic-level parts
 * are specified fully enhanced at 4.5 V and standard parts at 10 V (common practice); we take 5 V.
 */
export const DEFAULT_GATE_ON_V = 5;

/** On-resistance at a junction temperature: rdson25·(T/298.15 K)^exponent. */
export function rdsOnOhm(rdsOn25Ohm: number, exponent: number, tjC: number): number {
  return rdsOn25Ohm * Math.pow((tjC + ZERO_CELSIUS_K) / 298.15, exponent);
}

/**
 * A conducting element of a rectifier path at its present temperature and gate state: a diode
 * (rdsOhm = Infinity) or a MOSFET whose channel, when on, parallels its body diode.
 */
export interface ConductingDevice extends DiodeAtTemp {
  /** Channel on-resistance at Tj; Infinity for a diode. */
  rdsOhm: number;
  /** True while the gate is driven (always false for a diode). */
  channelOn: boolean;
}

/**
 * Forward voltage of a device carrying iA ≥ 0, and its slope dV/dI in slope[0]. With the
 * channel on, V solves I = V/rds + IS·(e^(V/N·Vt) − 1); the body diode's RS is neglected then
 * because the channel carries nearly all the current until V nears a diode drop.
 */
export function deviceVoltageV(d: ConductingDevice, iA: number, slope: number[]): number {
  if (!d.channelOn) {
    slope[0] = diodeSlopeOhm(iA, d);
    return diodeVoltageV(iA, d);
  }
  const g = 1 / d.rdsOhm;
  // Both branches carry at most I, so the smaller of their solo voltages bounds V from above;
  // Newton on a convex increasing function from the right then converges monotonically.
  let v = Math.min(iA * d.rdsOhm, d.nVtV * Math.log1p(Math.max(iA, 0) / d.isA));
  let dh = g;
  for (let k = 0; k < 40; k++) {
    const ex = Math.exp(v / d.nVtV);
    const h = v * g + d.isA * (ex - 1) - iA;
    dh = g + (d.isA * ex) / d.nVtV;
    const step = h / dh;
    v -= step;
    if (Math.abs(step) <= 1e-13 + 1e-11 * Math.abs(v)) break;
  }
  slope[0] = 1 / dh;
  return v;
}
