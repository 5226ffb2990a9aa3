/**
 * `harmonic-limit` — fires when the solver's estimate of the mains current harmonics exceeds the
 * limits of IEC 61000-3-2:2018 (edition 5.0): Class A (Table 1, absolute limits) as a warning,
 * and Class D (Table 3, per watt, for 75–600 W equipment) as information, since only personal
 * computers, monitors and television receivers (and a few others) are Class D (clause 5).
 *
 * Why: equipment sold for public low-voltage networks must meet these limits; a plain
 * capacitor-input bridge above 75 W often does not, and power-factor correction is then needed.
 *
 * Threshold: the standard's tables as the solver applies them (solve/iec61000-3-2.ts): only for
 * 220–240 V, 50/60 Hz mains, above 75 W input (clause 7) and, for Class D, up to 600 W. An
 * estimate, not a compliance test: the standard's measurement conditions are not reproduced.
 */
import type { Finding } from '../findings/index';
import type { RectifierAnalysis } from '../equivalent/index';
import type { HarmonicClass, HarmonicCompliance } from '../solve/index';
import type { Rule } from './registry';
import { fmt, pct } from './rule-context';

const TABLE: Readonly<Record<HarmonicClass, string>> = { A: 'Table 1', D: 'Table 3' };

export const harmonicLimitRule: Rule = {
  code: 'harmonic-limit',
  check(input) {
    return input.rectifiers.flatMap((analysis) => (['A', 'D'] as const).flatMap((cls) => {
      const finding = classFinding(analysis, cls);
      return finding ? [finding] : [];
    }));
  },
};

function classFinding(analysis: RectifierAnalysis, cls: HarmonicClass): Finding | undefined {
  let worst: { corner: string; compliance: HarmonicCompliance; inputW?: number } | undefined;
  for (const corner of analysis.solution.corners) {
    const c = cls === 'A' ? corner.iecClassA : corner.iecClassD;
    if (!c?.applicable || c.pass !== false) continue;
    if (!worst || (c.worstRatio ?? 0) > (worst.compliance.worstRatio ?? 0)) worst = { corner: corner.name, compliance: c, inputW: corner.inputPowerW };
  }
  const row = worst?.compliance.rows.find((r) => r.n === worst.compliance.worstOrder);
  if (!worst || !row) return undefined;
  const failing = worst.compliance.rows.filter((r) => !r.pass).map((r) => r.n);
  const power = cls === 'D' && worst.inputW !== undefined ? ` at ${fmt(worst.inputW)} W input` : '';
  return {
    ...analysis.rectifier.anchor, severity: cls === 'A' ? 'warning' : 'info', code: 'harmonic-limit',
    message: `harmonic ${row.n} of the mains current is ${fmt(row.currentA)} A at ${worst.corner}, ${pct(row.currentA / row.limitA)} of the ` +
      `IEC 61000-3-2:2018 Class ${cls} limit ${fmt(row.limitA)} A (${TABLE[cls]}${power}); orders over the limit: ${failing.join(', ')}` +
      `${cls === 'D' ? ' (applies if the equipment is Class D: PCs, monitors, TV receivers)' : ''}; an estimate, not a compliance test`,
  };
}
