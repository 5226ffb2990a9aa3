/**
 * The equivalent circuit as one corner sees it: its line frequency, its load level and its part
 * vertex applied to the nominal circuit. A corner that overrides nothing gets the circuit itself,
 * so a file without ranges or spreads is solved exactly as before.
 *
 * A forward-voltage shift ΔV is applied as IS·exp(−ΔV/(N·Vt(TNOM))): in the Shockley law
 * V = N·Vt·ln(1 + I/IS) + I·RS that moves the whole curve by ΔV at TNOM, at every current
 * (at other temperatures the shift scales with T/TNOM, through the same law).
 */
import type { Corner, EquivalentCircuit, FilterCapacitor, PartVertex, RectifierDevice } from './equivalent-circuit';
import { thermalVoltageV } from './diode-model';

/** True when any part carries a spread for the corners' part vertices to pick from. */
export function hasPartSpread(c: EquivalentCircuit): boolean {
  return c.capacitors.some((cap) => cap.cMinF !== undefined || cap.cMaxF !== undefined || cap.esrAgedOhm !== undefined)
    || c.devices.some((d) => d.kind === 'diode' && d.vfSpreadV !== undefined);
}

/** The circuit at `corner` (the same object when the corner overrides nothing). */
export function circuitAtCorner(c: EquivalentCircuit, corner: Corner): EquivalentCircuit {
  if (corner.freqHz === undefined && corner.load === undefined && corner.parts === undefined) return c;
  const out: EquivalentCircuit = { ...c };
  if (corner.freqHz !== undefined) out.source = { ...c.source, freqHz: corner.freqHz };
  if (corner.load !== undefined) out.load = corner.load;
  const parts = corner.parts;
  if (parts) {
    out.capacitors = c.capacitors.map((cap) => capacitorAt(cap, parts));
    out.devices = c.devices.map((d) => deviceAt(d, parts));
  }
  return out;
}

function capacitorAt(cap: FilterCapacitor, v: PartVertex): FilterCapacitor {
  const cF = v.capacitance === 'min' ? cap.cMinF ?? cap.cF : cap.cMaxF ?? cap.cF;
  const esrOhm = v.esr === 'aged' ? cap.esrAgedOhm ?? cap.esrOhm : cap.esrOhm;
  return { name: cap.name, cF, esrOhm };
}

/** ln of the smallest saturation current a shifted diode keeps (1e-300 A). */
const MIN_LN_IS = Math.log(1e-300);

function deviceAt(d: RectifierDevice, v: PartVertex): RectifierDevice {
  if (d.kind !== 'diode' || !d.vfSpreadV) return d;
  const shiftV = v.vf === 'high' ? d.vfSpreadV[1] : d.vfSpreadV[0];
  if (shiftV === 0) return d;
  const nVt = d.params.n * thermalVoltageV(d.params.tnomC);
  // In logs, and kept above the smallest IS the diode law stays finite with (a near-ideal diode's tiny N·Vt would underflow it).
  const isA = Math.exp(Math.max(Math.log(d.params.isA) - shiftV / nVt, MIN_LN_IS));
  return { ...d, params: { ...d.params, isA } };
}
