/**
 * The project configuration: one JSON file at the root of a design's folder (`rectilens.json`),
 * read by the command line and the language server alike, so that both reach the same findings.
 * Its keys are the editor settings without their `rectilens.` prefix, in the same nesting
 * (`{ "derating": { "reverseVoltage": 0.7 }, "partsFiles": ["parts.json"] }`), and they pass the
 * same validation (validate-settings.ts). Editor settings, where the user set one, apply on top.
 */
import type { Span } from '../../../grammar/src/index';
import { CORNER_SETTINGS, DERATING_SETTINGS, OTHER_SETTINGS, type AnalysisSettings } from './settings';
import { validateSettings } from './validate-settings';

/** The file name looked for, from a netlist's folder upwards. */
export const PROJECT_CONFIG_FILE = 'rectilens.json';

export interface ProjectConfig {
  settings: AnalysisSettings;
  /** Parts files as written (relative paths are relative to the configuration's folder). */
  partsFiles: string[];
  /** What was left out, and why: the file's findings. */
  problems: { span: Span; message: string }[];
}

const KNOWN_GROUPS: Readonly<Record<string, readonly string[]>> = {
  derating: Object.keys(DERATING_SETTINGS),
  corners: Object.keys(CORNER_SETTINGS),
};
const KNOWN_TOP = [...Object.keys(KNOWN_GROUPS), ...Object.keys(OTHER_SETTINGS)];

/** Reads a configuration's text: valid entries kept, every other one named in a problem. */
export function readProjectConfig(text: string): ProjectConfig {
  const at = { start: 0, end: 0 };
  let raw: unknown;
  try {
    raw = JSON.parse(text.replace(/^\uFEFF/, ''));
  } catch (error) {
    return { settings: {}, partsFiles: [], problems: [{ span: at, message: `the configuration is not valid JSON (${(error as Error).message}); none of it applies` }] };
  }
  if (typeof raw !== 'object' || raw === null || Array.isArray(raw)) {
    return { settings: {}, partsFiles: [], problems: [{ span: at, message: 'the configuration must be a JSON object; none of it applies' }] };
  }
  const given = raw as Record<string, unknown>;
  const problems: ProjectConfig['problems'] = [];
  const place = (key: string): Span => spanOfKey(text, key) ?? at;
  for (const key of Object.keys(given)) {
    if (key === '$schema') continue;
    if (!KNOWN_TOP.includes(key)) problems.push({ span: place(key), message: `'${key}' is not a setting (known: ${KNOWN_TOP.join(', ')}); it is ignored` });
  }
  const { partsFiles, ...settings } = validateSettings(given);
  for (const [group, keys] of Object.entries(KNOWN_GROUPS)) {
    const values = given[group];
    if (values === undefined) continue;
    const kept = (settings as Record<string, Record<string, unknown> | undefined>)[group] ?? {};
    for (const key of Object.keys(typeof values === 'object' && values ? values : {})) {
      if (!keys.includes(key)) problems.push({ span: place(key), message: `'${group}.${key}' is not a setting; it is ignored` });
      else if (!(key in kept)) problems.push({ span: place(key), message: `'${group}.${key}' must be a number within the setting's range; the default applies` });
    }
  }
  if (given.hintDetail !== undefined && settings.hintDetail === undefined) problems.push({ span: place('hintDetail'), message: `'hintDetail' must be one of ${OTHER_SETTINGS.hintDetail.values.join(', ')}; the default applies` });
  if (given.partsFiles !== undefined && !Array.isArray(given.partsFiles)) problems.push({ span: place('partsFiles'), message: "'partsFiles' must be a list of paths; it is ignored" });
  return { settings, partsFiles: [...(partsFiles ?? [])], problems };
}

/** Settings of the configuration with the editor's on top: a value the editor gives wins, one it leaves unset does not erase. */
export function layerSettings(base: AnalysisSettings, over: AnalysisSettings): AnalysisSettings {
  const out: AnalysisSettings = { ...base, ...over };
  if (base.derating || over.derating) out.derating = { ...base.derating, ...over.derating };
  if (base.corners || over.corners) out.corners = { ...base.corners, ...over.corners };
  return out;
}

/** The span of the first `"key"` in the text, for a finding on it. */
function spanOfKey(text: string, key: string): Span | undefined {
  const index = text.indexOf(JSON.stringify(key));
  return index < 0 ? undefined : { start: index, end: index + key.length + 2 };
}
