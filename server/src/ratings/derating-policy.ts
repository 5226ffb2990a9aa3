/**
 * The derating policy: how much of each rating a design may use. A `*@ derate` directive wins,
 * then the user's settings, then the defaults below, each with the guideline it comes from and
 * how sure that attribution is (REFERENCES.md §4). `resolvePolicy` runs once per analysis and the
 * rules read the result from their input; the thresholds themselves are applied in stress-checks.ts.
 */
import type { DerateKey, Directive, Span } from '../../../grammar/src/index';
import { DERATING_SETTINGS, type AnalysisSettings, type DeratingSetting, type DeratingSettingValues } from './settings';

/** How a default is known: confirmed in a published source, recalled, or a trade habit. */
export type DefaultBasis = 'confirmed' | 'from-memory' | 'common-practice';

export type PolicyOrigin =
  | { kind: 'directive'; uri: string; span: Span }
  | { kind: 'setting'; key: DerateKey }
  | { kind: 'default'; source: string; basis: DefaultBasis };

/**
 * The junction-temperature limit: an absolute temperature (as `*@ derate tj=125C` writes it) or
 * "the lower of a ceiling and Tjmax minus a margin".
 */
export type JunctionLimit = { kind: 'absolute'; tjC: number } | { kind: 'below-max'; ceilingC: number; marginC: number };

export interface PolicyEntry<T> {
  value: T;
  origin: PolicyOrigin;
}

/**
 * Fractions of the rating that the worst corner may reach, by the `derate` keys of DESIGN.md §3:
 * `vr` diode reverse voltage (PIV / VRRM), `if` diode average current, `ifsm` surge current,
 * `tj` junction limit, `cap` capacitor voltage, `ripple` capacitor ripple current, `vds` MOSFET
 * drain-source voltage, `id` MOSFET drain current. `life` is no fraction: the capacitor life in
 * hours the file asks for; it has no default, so without it no life is judged.
 */
export type DeratingPolicy = { [K in Exclude<DerateKey, 'tj' | 'life'>]: PolicyEntry<number> } & {
  tj: PolicyEntry<JunctionLimit>;
  life?: PolicyEntry<number>;
};

/** Settings as the adapter passes them: fractions (0.8 for 80 %) and `tj` in °C. */
export type DeratingSettings = Partial<Record<DerateKey, number>>;

/** A directive entry or setting that was not used, and why. */
export interface IgnoredDerating {
  key: DerateKey;
  origin: PolicyOrigin;
  reason: string;
}

const IPC_9592B = 'IPC-9592B (from memory, low confidence)';

/** The defaults, each citing its origin with the confidence REFERENCES.md §4 gives it. */
export const DEFAULT_DERATING: DeratingPolicy = {
  vr: fallback(0.8, `${IPC_9592B}: power diodes at about 80 % of rated reverse voltage`, 'from-memory'),
  if: fallback(
    0.7,
    'common practice for commercial designs: between NASA EEE-INST-002 (50 %, from memory; a space-grade rule) ' +
      'and no current derating where the junction-temperature limit governs',
    'common-practice',
  ),
  ifsm: fallback(
    1,
    'common practice: IFSM is already a single-event limit at stated conditions; the peak is held to it and the I²t to IFSM²·t/2 ' +
      '(NASA EEE-INST-002 would allow 50 %, from memory)',
    'common-practice',
  ),
  tj: {
    value: { kind: 'below-max', ceilingC: 125, marginC: 20 },
    origin: { kind: 'default', source: `${IPC_9592B}: Tj at most 125 °C or Tjmax − 20 °C, whichever is lower`, basis: 'from-memory' },
  },
  cap: fallback(0.8, 'Reliability Analysis Center / System Reliability Center, "Part Derating Parameters": aluminium electrolytic, 80 % of rated voltage in a benign environment', 'confirmed'),
  ripple: fallback(1, `${IPC_9592B}: electrolytics within their rated ripple current`, 'from-memory'),
  vds: fallback(0.8, `${IPC_9592B}: power MOSFETs at about 80 % of rated voltage (NASA EEE-INST-002 gives 75 %, from memory)`, 'from-memory'),
  id: fallback(0.8, 'MIL-DTL-917, Table XIX: average drain current at most 0.8 of ID(on) (maximum; 0.6 nominal), applied at the worst corner', 'confirmed'),
};

/**
 * The file's policy, resolved once per analysis: for each key the last `*@ derate` entry (files
 * in reading order), then the setting that stands for it (ratings/settings.ts), then the cited
 * default. `reverseVoltage` sets `vr` and `vds` alike; a setting's origin names its first key.
 * Values outside their range are skipped and listed in `ignored`.
 */
export function resolvePolicy(
  directives: readonly { uri: string; directive: Directive }[] | undefined,
  settings: AnalysisSettings | undefined,
): { policy: DeratingPolicy; ignored: IgnoredDerating[] } {
  const given = settings?.derating ?? {};
  const entries: SettingEntry[] = [];
  for (const [name, setting] of Object.entries(DERATING_SETTINGS) as [keyof DeratingSettingValues, DeratingSetting][]) {
    const value = given[name];
    if (value === undefined || value === null) continue;
    for (const key of setting.derateKeys) entries.push({ key, value, origin: { kind: 'setting', key: setting.derateKeys[0] } });
  }
  return resolveEntries(directives, entries, DEFAULT_DERATING);
}

/**
 * Resolves the policy key by key from settings given by `derate` key: the last `derate` directive
 * entry for a key wins (files in reading order), then the setting, then `defaults`. Values
 * outside their range (a fraction not in (0, 1], a temperature outside −55…400 °C) are skipped
 * and listed in `ignored`.
 */
export function resolveDeratingPolicy(
  directives: readonly { uri: string; directive: Directive }[] | undefined,
  settings: DeratingSettings | undefined,
  defaults: DeratingPolicy = DEFAULT_DERATING,
): { policy: DeratingPolicy; ignored: IgnoredDerating[] } {
  const entries = (Object.entries(settings ?? {}) as [DerateKey, number | undefined][])
    .filter((e): e is [DerateKey, number] => e[1] !== undefined)
    .map(([key, value]): SettingEntry => ({ key, value, origin: { kind: 'setting', key } }));
  return resolveEntries(directives, entries, defaults);
}

interface SettingEntry {
  key: DerateKey;
  value: number;
  origin: PolicyOrigin;
}

function resolveEntries(
  directives: readonly { uri: string; directive: Directive }[] | undefined, settings: readonly SettingEntry[], defaults: DeratingPolicy,
): { policy: DeratingPolicy; ignored: IgnoredDerating[] } {
  const policy: DeratingPolicy = { ...defaults };
  const ignored: IgnoredDerating[] = [];
  const apply = (key: DerateKey, value: number, origin: PolicyOrigin): void => {
    const reason = rangeProblem(key, value);
    if (reason) ignored.push({ key, origin, reason });
    else if (key === 'tj') policy.tj = { value: { kind: 'absolute', tjC: value }, origin };
    else policy[key] = { value, origin };
  };
  for (const entry of settings) if (entry.key in defaults || entry.key === 'life') apply(entry.key, entry.value, entry.origin);
  for (const placed of directives ?? []) {
    if (placed.directive.keyword !== 'derate') continue;
    for (const entry of placed.directive.entries) apply(entry.key, entry.value, { kind: 'directive', uri: placed.uri, span: entry.span });
  }
  return { policy, ignored };
}

/**
 * The junction temperature a part may reach under a limit. An absolute limit never exceeds the
 * part's own Tjmax; without a Tjmax, `below-max` falls back to its ceiling.
 */
export function junctionLimitC(limit: JunctionLimit, tjmaxC?: number): number {
  const partMax = tjmaxC ?? Number.POSITIVE_INFINITY;
  if (limit.kind === 'absolute') return Math.min(limit.tjC, partMax);
  return Math.min(limit.ceilingC, partMax - limit.marginC);
}

/** The origin of a policy value in words, for finding messages ("policy allows 80 % (…)"). */
export function describePolicyOrigin(origin: PolicyOrigin): string {
  switch (origin.kind) {
    case 'directive':
      return 'derate directive';
    case 'setting':
      return `setting derating.${origin.key}`;
    case 'default':
      return `default: ${origin.source}`;
  }
}

function fallback(value: number, source: string, basis: DefaultBasis): PolicyEntry<number> {
  return { value, origin: { kind: 'default', source, basis } };
}

function rangeProblem(key: DerateKey, value: number): string | undefined {
  if (!Number.isFinite(value)) return 'not a number';
  if (key === 'tj') return value < -55 || value > 400 ? 'a junction limit lies between −55 °C and 400 °C' : undefined;
  if (key === 'life') return value > 0 ? undefined : 'a capacitor life is a number of hours above zero';
  return value <= 0 || value > 1 ? 'a derating fraction lies between 0 and 100 %' : undefined;
}
