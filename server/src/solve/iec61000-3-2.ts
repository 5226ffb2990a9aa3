/**
 * Harmonic current limits of IEC 61000-3-2:2018 (edition 5.0) for equipment with input current
 * ≤ 16 A per phase: Class A (Table 1, absolute limits) and Class D (Table 3, per watt and
 * absolute). Limits apply on public low-voltage networks of 220 V line-to-neutral and above
 * (scope, clause 1); no limits apply to equipment of 75 W or less other than lighting (clause 7).
 * Class D covers equipment of 600 W or less (clause 5). We apply them for 220–240 V mains only.
 */

/** Class A limit for harmonic order n (2…40), A rms — IEC 61000-3-2:2018 Table 1. */
export function classALimitA(n: number): number | undefined {
  if (!Number.isInteger(n) || n < 2 || n > 40) return undefined;
  const odd: Record<number, number> = { 3: 2.3, 5: 1.14, 7: 0.77, 9: 0.4, 11: 0.33, 13: 0.21 };
  const even: Record<number, number> = { 2: 1.08, 4: 0.43, 6: 0.3 };
  if (n % 2 === 1) return odd[n] ?? (0.15 * 15) / n;
  return even[n] ?? (0.23 * 8) / n;
}

/**
 * Class D limit for odd order n (3…39) at an active input power, A rms — IEC 61000-3-2:2018
 * Table 3: the lower of the per-watt column (3.4, 1.9, 1.0, 0.5, 0.35 mA/W, then 3.85/n) times
 * the power, and the absolute column (the Class A values). Even orders have no Class D limit.
 */
export function classDLimitA(n: number, powerW: number): number | undefined {
  if (!Number.isInteger(n) || n < 3 || n > 39 || n % 2 === 0) return undefined;
  const perWattMa: Record<number, number> = { 3: 3.4, 5: 1.9, 7: 1.0, 9: 0.5, 11: 0.35 };
  const maPerW = perWattMa[n] ?? 3.85 / n;
  return Math.min((maPerW * powerW) / 1000, classALimitA(n)!);
}

export type HarmonicClass = 'A' | 'D';

export interface HarmonicRow {
  n: number;
  currentA: number;
  limitA: number;
  pass: boolean;
}

export interface HarmonicCompliance {
  harmonicClass: HarmonicClass;
  applicable: boolean;
  /** Why the limits do not apply (when applicable is false). */
  reason?: string;
  rows: HarmonicRow[];
  pass?: boolean;
  /** Largest current/limit ratio over the orders with a limit. */
  worstRatio?: number;
  worstOrder?: number;
}

/**
 * Compares mains-side harmonic currents (index n − 1 holds order n) with Class A or Class D
 * limits. An estimate only: the standard's measurement conditions (clause 6, Annex C) are not
 * reproduced.
 */
export function checkHarmonicLimits(
  harmonicsA: readonly number[], harmonicClass: HarmonicClass, mainsVrms: number, freqHz: number, inputPowerW: number,
): HarmonicCompliance {
  const base = { harmonicClass, rows: [] as HarmonicRow[] };
  if (!(mainsVrms >= 220 && mainsVrms <= 240)) return { ...base, applicable: false, reason: `limits applied for 220–240 V mains only (this source: ${round(mainsVrms)} V)` };
  if (freqHz !== 50 && freqHz !== 60) return { ...base, applicable: false, reason: 'limits are for 50 Hz or 60 Hz mains' };
  if (!(inputPowerW > 75)) return { ...base, applicable: false, reason: 'no limits at 75 W input power or less (IEC 61000-3-2:2018 clause 7)' };
  if (harmonicClass === 'D' && inputPowerW > 600) return { ...base, applicable: false, reason: 'Class D covers equipment of 600 W or less' };
  const rows: HarmonicRow[] = [];
  for (let n = 2; n <= 40; n++) {
    const limitA = harmonicClass === 'A' ? classALimitA(n) : classDLimitA(n, inputPowerW);
    const currentA = harmonicsA[n - 1];
    if (limitA === undefined || currentA === undefined) continue;
    rows.push({ n, currentA, limitA, pass: currentA <= limitA });
  }
  let worstRatio = 0;
  let worstOrder = 0;
  for (const r of rows) if (r.currentA / r.limitA > worstRatio) { worstRatio = r.currentA / r.limitA; worstOrder = r.n; }
  return { ...base, applicable: true, rows, pass: rows.every((r) => r.pass), worstRatio, worstOrder };
}

function round(x: number): number {
  return Math.round(x * 10) / 10;
}
