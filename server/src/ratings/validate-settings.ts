/**
 * Settings as an editor sends them, made safe once at the adapter boundary: an editor reports a
 * setting with no default as null, a hand-edited settings file can hold text or an out-of-range
 * number, and none of that may reach the solver (a line tolerance of −100 % would zero the
 * source). A value that is not a finite number within the manifest's range is dropped, so the
 * core's own default (with its origin) applies instead — never zero, never a clamped guess.
 */
import {
  CORNER_SETTINGS, DERATING_SETTINGS, HINT_DETAILS,
  type AnalysisSettings, type HintDetail, type NumericSetting,
} from './settings';

export function validateSettings(raw: unknown): AnalysisSettings {
  const given = asRecord(raw);
  const out: AnalysisSettings = {};
  const derating = numbersWithin(asRecord(given.derating), DERATING_SETTINGS);
  if (derating) out.derating = derating;
  const corners = numbersWithin(asRecord(given.corners), CORNER_SETTINGS);
  if (corners) out.corners = corners;
  if ((HINT_DETAILS as readonly unknown[]).includes(given.hintDetail)) out.hintDetail = given.hintDetail as HintDetail;
  if (Array.isArray(given.partsFiles)) out.partsFiles = given.partsFiles.filter((p): p is string => typeof p === 'string');
  return out;
}

/** Whether a value is a finite number inside the setting's range. */
export function withinSetting(value: unknown, setting: NumericSetting): value is number {
  if (typeof value !== 'number' || !Number.isFinite(value)) return false;
  return (setting.min === undefined || value >= setting.min) && (setting.max === undefined || value <= setting.max);
}

function numbersWithin<K extends string>(given: Record<string, unknown>, table: { readonly [P in K]: NumericSetting }): Partial<Record<K, number>> | undefined {
  const out: Partial<Record<K, number>> = {};
  let any = false;
  for (const key of Object.keys(table) as K[]) {
    const value = given[key];
    if (!withinSetting(value, table[key])) continue;
    out[key] = value;
    any = true;
  }
  return any ? out : undefined;
}

function asRecord(value: unknown): Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value) ? (value as Record<string, unknown>) : {};
}
