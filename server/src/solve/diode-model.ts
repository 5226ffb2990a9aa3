/**
 * The SPICE diode equation and its temperature law (Berkeley SPICE3 user's manual, diode
 * model), in the forms the solver needs: voltage from current (explicit), current from voltage
 * through the series resistance (Lambert W, so no Newton on an exponential), and a two-point fit.
 */
import type { DiodeParams } from './equivalent-circuit.js';

/** Boltzmann constant, J/K — exact since the 2019 SI redefinition. */
export const BOLTZMANN_J_PER_K = 1.380649e-23;
/** Elementary charge, C — exact since the 2019 SI redefinition. */
export const ELEMENTARY_CHARGE_C = 1.602176634e-19;
/** 0 °C in kelvin. */
export const ZERO_CELSIUS_K = 273.15;

/** A diode (or body diode) with its parameters already scaled to one junction temperature. */
export interface DiodeAtTemp {
  isA: number;
  /** N·Vt, the slope of V against ln(I). */
  nVtV: number;
  rsOhm: number;
}

/** Thermal voltage kT/q at a temperature in °C. */
export function thermalVoltageV(tC: number): number {
  return (BOLTZMANN_J_PER_K * (tC + ZERO_CELSIUS_K)) / ELEMENTARY_CHARGE_C;
}

/**
 * Scales IS to a junction temperature with the SPICE3 law
 * IS(T) = IS·exp{[EG/Vt(Tnom) − EG/Vt(T) + XTI·ln(T/Tnom)]/N}. RS has no temperature
 * coefficient in that model, so it is kept.
 */
export function scaleDiodeToTemp(p: DiodeParams, tC: number): DiodeAtTemp {
  const tK = tC + ZERO_CELSIUS_K;
  const tnomK = p.tnomC + ZERO_CELSIUS_K;
  const vt = thermalVoltageV(tC);
  const vtNom = thermalVoltageV(p.tnomC);
  const exponent = (p.egEv / vtNom - p.egEv / vt + p.xti * Math.log(tK / tnomK)) / p.n;
  return { isA: p.isA * Math.exp(exponent), nVtV: p.n * vt, rsOhm: p.rsOhm };
}

/**
 * Forward voltage (anode to cathode, including RS) at a current. The equation is explicit in
 * this direction. Currents at or below −IS are outside the model's range; they are clamped just
 * above it so the result stays finite.
 */
export function diodeVoltageV(iA: number, d: DiodeAtTemp): number {
  const x = Math.max(iA / d.isA, -1 + 1e-15);
  return d.nVtV * Math.log1p(x) + d.rsOhm * iA;
}

/** Incremental resistance dV/dI at a current. */
export function diodeSlopeOhm(iA: number, d: DiodeAtTemp): number {
  return d.nVtV / Math.max(d.isA + iA, d.isA * 1e-15) + d.rsOhm;
}

/**
 * Current at a terminal voltage, RS included. With RS the equation
 * V = N·Vt·ln(1 + I/IS) + I·RS is solved exactly by I + IS = (N·Vt/RS)·W(z),
 * z = (IS·RS/N·Vt)·exp((V + IS·RS)/N·Vt); W is evaluated from ln z so large V cannot overflow.
 */
export function diodeCurrentA(vV: number, d: DiodeAtTemp): number {
  if (d.rsOhm <= 0) return d.isA * Math.expm1(vV / d.nVtV);
  const lnZ = Math.log((d.isA * d.rsOhm) / d.nVtV) + (vV + d.isA * d.rsOhm) / d.nVtV;
  return (d.nVtV / d.rsOhm) * lambertWOfExp(lnZ) - d.isA;
}

/**
 * Principal branch of Lambert W at z = e^lnZ, for z ≥ 0. Newton on w + ln w = ln z is well
 * scaled for any size of z; for tiny z the series W ≈ z − z² is exact to rounding.
 */
export function lambertWOfExp(lnZ: number): number {
  if (lnZ < -30) {
    const z = Math.exp(lnZ);
    return z - z * z;
  }
  let w = lnZ > 1 ? lnZ - Math.log(lnZ) : Math.log1p(Math.exp(lnZ));
  for (let k = 0; k < 50; k++) {
    const step = ((w + Math.log(w) - lnZ) * w) / (w + 1);
    w -= step;
    if (w <= 0) w = 1e-300;
    if (Math.abs(step) <= 1e-15 * w) break;
  }
  return w;
}

/** One forward point: a voltage at a current. */
export interface ForwardPoint {
  vV: number;
  iA: number;
}

/**
 * Fits IS and N to two forward points (as in a `vf=0.93V@1A,0.78V@0.1A` rating), RS = 0.
 * Two points fix two parameters; we choose IS and N rather than RS because the two-point slope
 * is then reproduced exactly and the curve stays a pure exponential between and around the
 * points. The "−1" of the diode equation is neglected in the fit (it changes the current by
 * e^(−V/N·Vt), under 1e-5 for any forward point above 0.3 V). EG and XTI take the silicon
 * defaults of the SPICE3 model; TNOM is the temperature the points were given at.
 * Returns undefined when the points do not describe a forward diode.
 */
export function fitDiodeFromTwoPoints(a: ForwardPoint, b: ForwardPoint, atC = 25): DiodeParams | undefined {
  const [hi, lo] = a.iA >= b.iA ? [a, b] : [b, a];
  if (!(lo.iA > 0) || !(hi.iA > lo.iA) || !(hi.vV > lo.vV) || !(lo.vV > 0)) return undefined;
  const vt = thermalVoltageV(atC);
  const n = (hi.vV - lo.vV) / (vt * Math.log(hi.iA / lo.iA));
  const isA = hi.iA / Math.exp(hi.vV / (n * vt));
  if (!Number.isFinite(n) || !Number.isFinite(isA) || isA <= 0) return undefined;
  return { isA, n, rsOhm: 0, egEv: 1.11, xti: 3, tnomC: atC };
}
