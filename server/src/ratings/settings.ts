/**
 * The user's settings, named once. `AnalysisSettings` is what the adapters pass to the analysis;
 * `SETTINGS` is the one table that ties each field to its manifest key (package.json
 * `contributes.configuration`), the `*@ derate` keys it stands for and its range. The table's
 * mapped types make the compiler check it against `AnalysisSettings`, and
 * tests/ratings/settings.test.ts checks it against the manifest.
 */
import type { DerateKey } from '../../../grammar/src/index';

/** Settings the derating policy reads: fractions (0.8 for 80 %) and `junctionTempC` in °C. */
export interface DeratingSettingValues {
  reverseVoltage?: number;
  forwardCurrent?: number;
  surgeCurrent?: number;
  junctionTempC?: number;
  capacitorVoltage?: number;
}

/** Settings the corners read when the file has no `*@ mains tol=` or `*@ ambient`. */
export interface CornerSettingValues {
  lineLow?: number;
  lineHigh?: number;
  ambientNominalC?: number;
  ambientMaxC?: number;
}

export const HINT_DETAILS = ['off', 'brief', 'full'] as const;
export type HintDetail = (typeof HINT_DETAILS)[number];

/**
 * Settings the adapters pass into the analysis, after `validateSettings`. Every field is optional;
 * the core applies its own defaults (each with its origin) where a field is absent.
 */
export interface AnalysisSettings {
  derating?: DeratingSettingValues;
  corners?: CornerSettingValues;
  /** How much the inlay hints say. */
  hintDetail?: HintDetail;
  /** Workspace-relative paths of parts files; the adapter reads them, the analysis takes their contents. */
  partsFiles?: readonly string[];
}

export const DEFAULT_SETTINGS: AnalysisSettings = { hintDetail: 'brief' };

/** A numeric setting: its manifest key and the range the manifest declares (inclusive). */
export interface NumericSetting {
  manifestKey: string;
  min?: number;
  max?: number;
}

/** A derating setting also names the `*@ derate` keys it sets; the first names it in messages. */
export interface DeratingSetting extends NumericSetting {
  derateKeys: readonly [DerateKey, ...DerateKey[]];
}

/**
 * The derating settings. `reverseVoltage` is documented as "VRRM or VDS", so it sets both `vr`
 * and `vds`; a `*@ derate vr=` or `vds=` directive still wins for its own key.
 */
export const DERATING_SETTINGS: { readonly [K in keyof Required<DeratingSettingValues>]: DeratingSetting } = {
  reverseVoltage: { manifestKey: 'rectilens.derating.reverseVoltage', derateKeys: ['vr', 'vds'], min: 0.1, max: 1 },
  forwardCurrent: { manifestKey: 'rectilens.derating.forwardCurrent', derateKeys: ['if'], min: 0.1, max: 1 },
  surgeCurrent: { manifestKey: 'rectilens.derating.surgeCurrent', derateKeys: ['ifsm'], min: 0.1, max: 1 },
  junctionTempC: { manifestKey: 'rectilens.derating.junctionTempC', derateKeys: ['tj'], min: 25, max: 250 },
  capacitorVoltage: { manifestKey: 'rectilens.derating.capacitorVoltage', derateKeys: ['cap'], min: 0.1, max: 1 },
};

/**
 * The corner settings. Ambient bounds: −55 °C to 125 °C spans the usual component temperature
 * grades from military low to automotive high (common practice).
 */
export const CORNER_SETTINGS: { readonly [K in keyof Required<CornerSettingValues>]: NumericSetting } = {
  lineLow: { manifestKey: 'rectilens.corners.lineLow', min: -0.5, max: 0 },
  lineHigh: { manifestKey: 'rectilens.corners.lineHigh', min: 0, max: 0.5 },
  ambientNominalC: { manifestKey: 'rectilens.corners.ambientNominalC', min: -55, max: 125 },
  ambientMaxC: { manifestKey: 'rectilens.corners.ambientMaxC', min: -55, max: 125 },
};

/** The other settings' manifest keys. */
export const OTHER_SETTINGS = {
  hintDetail: { manifestKey: 'rectilens.hintDetail', values: HINT_DETAILS },
  partsFiles: { manifestKey: 'rectilens.partsFiles' },
} as const;

/**
 * Settings the editor's language client reads itself and the analysis never sees: the protocol
 * trace (`<client id>.trace.server`, read by vscode-languageclient).
 */
export const CLIENT_SETTINGS = {
  traceServer: { manifestKey: 'rectilens.trace.server', values: ['off', 'messages', 'verbose'] },
} as const;

/** `*@ derate` keys no setting sets: they are given in the file or left at their default. */
export const DIRECTIVE_ONLY_DERATE_KEYS: readonly DerateKey[] = ['ripple', 'id', 'life'];
