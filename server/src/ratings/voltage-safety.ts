/**
 * Extra-low voltage, for the `hazardous-voltage` rule: a source above it gets the caution.
 *
 * ELV band: at most 50 V a.c. rms or 120 V ripple-free d.c. (IEC 61140:2016 via the IEC
 * Electropedia, IEC 62257-7-1 §3.55; REFERENCES.md §6, C). "Ripple-free" means an rms ripple of
 * at most 10 % of the d.c. value, and then a peak of at most 140 V for a 120 V system
 * (IEC 61558-1:2005 §3.7.16 via the IEV; REFERENCES.md §6, C).
 */

/** ELV limit for a.c., rms volts (IEC 61140 via IEV; C). */
export const ELV_AC_RMS_V = 50;
/** ELV limit for ripple-free d.c., volts (IEC 61140 via IEV; C). */
export const ELV_DC_V = 120;
/** Ripple-free: rms ripple at most this fraction of the d.c. value (IEC 61558-1 §3.7.16; C). */
export const RIPPLE_FREE_FRACTION = 0.1;
/** Peak of a 120 V ripple-free d.c. system (IEC 61558-1 §3.7.16; C). */
export const ELV_DC_PEAK_V = 140;

/** The standard a finding cites for the threshold. */
export const ELV_SOURCE = 'IEC 61140:2016 extra-low voltage band (≤ 50 V a.c. rms, ≤ 120 V ripple-free d.c.), via IEC 60050 (IEV)';

/** The caution every output about a source above extra-low voltage carries (DESIGN.md §1). */
export const MAINS_CAUTION =
  'Mains-connected circuits can kill. These figures are estimates only, not a safety or compliance test; ' +
  'follow local codes and licensed practice.';

/** A voltage to classify: a.c. rms, d.c. mean, and optionally the d.c. ripple and peak. */
export interface VoltageLevel {
  acRmsV?: number;
  dcV?: number;
  /** RMS ripple on the d.c., to decide whether it is ripple-free. */
  dcRippleRmsV?: number;
  /** Highest instantaneous d.c. voltage, when known. */
  dcPeakV?: number;
}

/**
 * Crest of the a.c. band, 50·√2 ≈ 70.7 V (D). D.c. that is not ripple-free is not covered by the
 * 120 V d.c. figure, so we hold it to the a.c. band's crest: our conservative reading, not a
 * clause of the standard.
 */
export const ELV_AC_PEAK_V = ELV_AC_RMS_V * Math.SQRT2;

/**
 * Whether a voltage is above the ELV band. A.c. above 50 V rms is. Ripple-free d.c. above 120 V
 * is, and so is ripple-free d.c. whose peak exceeds 140 V. D.c. with more ripple than that is
 * held to {@link ELV_AC_PEAK_V}; without a known peak, the peak is estimated as
 * mean + √3·ripple rms, the crest of a sawtooth ripple (rms = half-amplitude/√3, the sawtooth
 * model of REFERENCES.md §2; D).
 */
export function isAboveExtraLowVoltage(level: VoltageLevel): boolean {
  const ac = level.acRmsV !== undefined && Math.abs(level.acRmsV) > ELV_AC_RMS_V;
  if (ac || level.dcV === undefined) return ac;
  const dcV = Math.abs(level.dcV);
  if (dcV > ELV_DC_V) return true;
  const rippleV = level.dcRippleRmsV ?? 0;
  const peakV = Math.abs(level.dcPeakV ?? dcV + Math.sqrt(3) * rippleV);
  if (rippleV <= RIPPLE_FREE_FRACTION * dcV) return peakV > ELV_DC_PEAK_V;
  return peakV > ELV_AC_PEAK_V;
}
