/**
 * Checks a parsed parts file against its format by hand, so the core needs no schema library at
 * run time. It says what the JSON Schema says (a test runs both over the same files), keeps every
 * entry and field that is sound, and reports the rest with a JSON pointer: one bad field never
 * costs the whole file.
 */
import { DIODE_TECHNOLOGIES, PART_KINDS } from './rating-records';
import type { DiodeTechnology, ForwardPoint, PartKind } from './rating-records';
import {
  COMMON_FIELDS, DIODE_EXTRA_FIELDS, NUMERIC_FIELDS, PARTS_FILE_VERSION, VF_POINTS_MAX, VF_POINTS_MIN,
} from './parts-file-format';
import type { NumericFieldSpec, PartsFile, PartsFileEntry } from './parts-file-format';

/** A finding about a parts file. `error` is what the schema rejects; `warning` is ours alone. */
export interface PartsFileProblem {
  /** JSON pointer to the offending value (`""` for the whole document). */
  pointer: string;
  severity: 'error' | 'warning';
  message: string;
}

export interface PartsFileValidation {
  file: PartsFile;
  problems: PartsFileProblem[];
}

/**
 * Validates parsed JSON as a parts file. `data` is whatever `JSON.parse` returned; the adapter
 * reports a JSON syntax error itself. Duplicate names (and aliases) are a warning — the schema
 * cannot say it — and the first entry wins.
 */
export function validatePartsFile(data: unknown, uri: string): PartsFileValidation {
  const problems: PartsFileProblem[] = [];
  const file: PartsFile = { uri, entries: [] };
  const error = (pointer: string, message: string): void => void problems.push({ pointer, severity: 'error', message });
  if (!isObject(data)) {
    error('', 'a parts file is a JSON object with "version" and "parts"');
    return { file, problems };
  }
  for (const key of Object.keys(data)) {
    if (key !== '$schema' && key !== 'version' && key !== 'parts') error(`/${escape(key)}`, `unknown field "${key}"`);
  }
  if (data.$schema !== undefined && typeof data.$schema !== 'string') error('/$schema', '"$schema" must be a string');
  if (data.version !== PARTS_FILE_VERSION) error('/version', `"version" must be ${PARTS_FILE_VERSION}`);
  if (!Array.isArray(data.parts)) {
    error(data.parts === undefined ? '' : '/parts', '"parts" must be an array of parts');
    return { file, problems };
  }
  const seen = new Map<string, number>();
  data.parts.forEach((raw, index) => {
    const entry = readEntry(raw, index, error);
    if (!entry) return;
    const clash = [entry.name, ...entry.aliases].find((name) => seen.has(name.toLowerCase()));
    if (clash !== undefined) {
      problems.push({ pointer: `/parts/${index}/name`, severity: 'warning', message: `"${clash}" is already described by /parts/${seen.get(clash.toLowerCase())}; that entry wins` });
      return;
    }
    for (const name of [entry.name, ...entry.aliases]) seen.set(name.toLowerCase(), index);
    file.entries.push(entry);
  });
  return { file, problems };
}

type Report = (pointer: string, message: string) => void;

function readEntry(raw: unknown, index: number, error: Report): PartsFileEntry | undefined {
  const at = `/parts/${index}`;
  if (!isObject(raw)) return void error(at, 'a part is an object with "name" and "kind"');
  const kind = raw.kind;
  if (!(PART_KINDS as readonly unknown[]).includes(kind)) return void error(`${at}/kind`, `"kind" must be one of ${PART_KINDS.join(', ')}`);
  if (!isName(raw.name)) return void error(raw.name === undefined ? at : `${at}/name`, '"name" must be a non-empty name without spaces');
  const entry: PartsFileEntry = { kind: kind as PartKind, name: raw.name, aliases: [], index, values: {} };
  const numeric = new Map(NUMERIC_FIELDS[entry.kind].map((f) => [f.name, f]));
  const values: Record<string, number> = {};
  for (const [key, value] of Object.entries(raw)) {
    const pointer = `${at}/${escape(key)}`;
    const spec = numeric.get(key);
    if (spec) {
      const complaint = checkNumber(value, spec);
      if (complaint) error(pointer, `"${key}" ${complaint}`);
      else values[key] = value as number;
    } else if (!readOther(entry, key, value, pointer, error)) {
      error(pointer, `unknown field "${key}" for a ${entry.kind}`);
    }
  }
  entry.values = values;
  return entry;
}

/** Reads a non-numeric field into the entry; false when the field is not one of this kind's. */
function readOther(entry: PartsFileEntry, key: string, value: unknown, pointer: string, error: Report): boolean {
  const known = (COMMON_FIELDS as readonly string[]).includes(key) || (entry.kind === 'diode' && (DIODE_EXTRA_FIELDS as readonly string[]).includes(key));
  if (!known) return false;
  if (key === 'name' || key === 'kind') return true;
  if (key === 'source' || key === 'note') {
    if (typeof value === 'string') entry[key] = value;
    else error(pointer, `"${key}" must be a string`);
  } else if (key === 'aliases') {
    const ok = Array.isArray(value) && value.every(isName) && new Set(value).size === value.length;
    if (ok) entry.aliases = value as string[];
    else error(pointer, '"aliases" must be a list of distinct names without spaces');
  } else if (key === 'technology') {
    if ((DIODE_TECHNOLOGIES as readonly unknown[]).includes(value)) entry.technology = value as DiodeTechnology;
    else error(pointer, `"technology" must be one of ${DIODE_TECHNOLOGIES.join(', ')}`);
  } else {
    const points = readPoints(value);
    if (points) entry.vfPoints = points;
    else error(pointer, `"vfPoints" must hold ${VF_POINTS_MIN} or ${VF_POINTS_MAX} points {"vV": volts, "iA": amps}, both positive`);
  }
  return true;
}

function readPoints(value: unknown): ForwardPoint[] | undefined {
  if (!Array.isArray(value) || value.length < VF_POINTS_MIN || value.length > VF_POINTS_MAX) return undefined;
  const points: ForwardPoint[] = [];
  for (const p of value) {
    if (!isObject(p) || Object.keys(p).some((k) => k !== 'vV' && k !== 'iA')) return undefined;
    if (!isPositive(p.vV) || !isPositive(p.iA)) return undefined;
    points.push({ vV: p.vV, iA: p.iA });
  }
  return points;
}

/** The complaint about a number against its bounds, or undefined when it is fine. */
function checkNumber(value: unknown, spec: NumericFieldSpec): string | undefined {
  if (typeof value !== 'number' || !Number.isFinite(value)) return 'must be a number';
  if (spec.exclusiveMinimum !== undefined && !(value > spec.exclusiveMinimum)) return `must be greater than ${spec.exclusiveMinimum}`;
  if (spec.minimum !== undefined && value < spec.minimum) return `must be at least ${spec.minimum}`;
  if (spec.maximum !== undefined && value > spec.maximum) return `must be at most ${spec.maximum}`;
  return undefined;
}

function isObject(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

function isName(value: unknown): value is string {
  return typeof value === 'string' && /^\S+$/.test(value);
}

function isPositive(value: unknown): value is number {
  return typeof value === 'number' && Number.isFinite(value) && value > 0;
}

/** JSON pointer escaping (RFC 6901): `~` → `~0`, `/` → `~1`. */
function escape(key: string): string {
  return key.replace(/~/g, '~0').replace(/\//g, '~1');
}
