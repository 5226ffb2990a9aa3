/**
 * The workspace parts file: our own JSON format for ratings shared by every netlist in a
 * workspace, named `*.rectilens-parts.json`. One table of fields drives the JSON Schema (saved as
 * `parts-file.schema.json`, contributed to the editor), the validator and the conversion into
 * rating records, so the three cannot drift apart.
 *
 * ```json
 * { "version": 1,
 *   "parts": [ { "name": "DMAIN", "kind": "diode", "technology": "silicon", "vrrmV": 600,
 *                "ifavA": 1, "ifsmA": 30, "ifsmDurationS": 0.01, "tjmaxC": 150,
 *                "vfPoints": [ { "vV": 0.93, "iA": 1 }, { "vV": 0.78, "iA": 0.1 } ],
 *                "source": "incoming inspection report 2024-17" } ] }
 * ```
 */
import { DIODE_TECHNOLOGIES, PART_KINDS } from './rating-records';
import type { DiodeTechnology, ForwardPoint, PartKind } from './rating-records';

/** Glob the extension associates with the schema. */
export const PARTS_FILE_GLOB = '*.rectilens-parts.json';
/** The one version of the format so far. */
export const PARTS_FILE_VERSION = 1;

/** A numeric field: its JSON name (also the rating record's field), bounds and meaning. */
export interface NumericFieldSpec {
  name: string;
  description: string;
  /** The value must be greater than this. */
  exclusiveMinimum?: number;
  minimum?: number;
  maximum?: number;
}

const positive = (name: string, description: string): NumericFieldSpec => ({ name, description, exclusiveMinimum: 0 });
const COST: NumericFieldSpec = { name: 'cost', description: 'Unit cost in any one currency, for comparisons', minimum: 0 };
const TJMAX: NumericFieldSpec = { name: 'tjmaxC', description: 'Maximum junction temperature, °C', minimum: 0, maximum: 400 };

/** The numeric fields of each kind. */
export const NUMERIC_FIELDS: Readonly<Record<PartKind, readonly NumericFieldSpec[]>> = {
  diode: [
    positive('vrrmV', 'Repetitive peak reverse voltage VRRM, V'),
    positive('ifavA', 'Average forward current IF(AV), A'),
    positive('ifsmA', 'Non-repetitive surge current IFSM (one half-sine), A'),
    { name: 'ifsmDurationS', description: 'Half-sine duration IFSM is rated for, s (0.0083 or 0.01); 0.0083 when absent', exclusiveMinimum: 0, maximum: 1 },
    TJMAX,
    positive('rthjaKPerW', 'Junction-to-ambient thermal resistance RthJA, K/W'),
    COST,
  ],
  mosfet: [
    positive('vdsV', 'Drain-source voltage rating VDS, V'),
    positive('idA', 'Continuous drain current ID, A'),
    positive('rdsonOhm', 'On-resistance RDS(on) at 25 °C, Ω'),
    TJMAX,
    positive('rthjaKPerW', 'Junction-to-ambient thermal resistance RthJA, K/W'),
    positive('vsdV', 'Body-diode forward voltage VSD, V'),
    COST,
  ],
  capacitor: [
    positive('vratedV', 'Rated voltage, V'),
    positive('iRippleA', 'Rated ripple current (RMS), A'),
    positive('esrOhm', 'Equivalent series resistance, Ω'),
    COST,
  ],
  controller: [
    { name: 'vminV', description: 'Minimum supply voltage at which the gates are driven, V', minimum: 0 },
    { name: 'iqA', description: 'Quiescent current, A', minimum: 0 },
    COST,
  ],
};

/** Fields every entry may carry besides its numbers. */
export const COMMON_FIELDS = ['name', 'kind', 'aliases', 'source', 'note'] as const;
/** Diode-only fields that are not numbers. */
export const DIODE_EXTRA_FIELDS = ['technology', 'vfPoints'] as const;
/** `vfPoints` holds two or three points: enough to fit IS and N, or IS, N and RS. */
export const VF_POINTS_MIN = 2;
export const VF_POINTS_MAX = 3;
/** A name as a netlist would write it: no white space. */
export const PART_NAME_PATTERN = '^\\S+$';

/** One validated entry of a parts file. */
export interface PartsFileEntry {
  kind: PartKind;
  name: string;
  aliases: string[];
  source?: string;
  note?: string;
  /** Position in `parts`, for JSON pointers in origins and problems. */
  index: number;
  /** The numeric fields present, by their JSON (= rating record) names. */
  values: Readonly<Record<string, number>>;
  technology?: DiodeTechnology;
  vfPoints?: ForwardPoint[];
}

/** A validated parts file. */
export interface PartsFile {
  uri: string;
  entries: PartsFileEntry[];
}

/**
 * Builds the JSON Schema (draft-07) of the parts file from the field tables. The saved
 * `parts-file.schema.json` is this value; a test keeps the two equal.
 */
export function buildPartsFileSchema(): Record<string, unknown> {
  const definitions: Record<string, unknown> = {
    name: { type: 'string', pattern: PART_NAME_PATTERN, description: 'Model or part name as the netlist writes it' },
    forwardPoint: {
      type: 'object',
      required: ['vV', 'iA'],
      additionalProperties: false,
      properties: { vV: { type: 'number', exclusiveMinimum: 0, description: 'Forward voltage, V' }, iA: { type: 'number', exclusiveMinimum: 0, description: 'Forward current, A' } },
    },
  };
  for (const kind of PART_KINDS) definitions[kind] = kindSchema(kind);
  return {
    $schema: 'http://json-schema.org/draft-07/schema#',
    $id: 'urn:rectilens:parts-file:1',
    title: 'Rectilens parts file',
    description: `Ratings of parts shared by the netlists of a workspace (${PARTS_FILE_GLOB}).`,
    type: 'object',
    required: ['version', 'parts'],
    additionalProperties: false,
    properties: {
      $schema: { type: 'string' },
      version: { const: PARTS_FILE_VERSION, description: 'Format version' },
      parts: {
        type: 'array',
        items: {
          type: 'object',
          required: ['name', 'kind'],
          properties: { name: { $ref: '#/definitions/name' }, kind: { enum: [...PART_KINDS] } },
          allOf: PART_KINDS.map((kind) => ({ if: { required: ['kind'], properties: { kind: { const: kind } } }, then: { $ref: `#/definitions/${kind}` } })),
        },
      },
    },
    definitions,
  };
}

function kindSchema(kind: PartKind): Record<string, unknown> {
  const properties: Record<string, unknown> = {
    name: { $ref: '#/definitions/name' },
    kind: { const: kind },
    aliases: { type: 'array', items: { $ref: '#/definitions/name' }, uniqueItems: true, description: 'Other model names for the same part' },
    source: { type: 'string', description: 'Where these numbers come from' },
    note: { type: 'string' },
  };
  if (kind === 'diode') {
    properties.technology = { enum: [...DIODE_TECHNOLOGIES], description: 'Construction; decides the forward model and the reverse-voltage class' };
    properties.vfPoints = { type: 'array', items: { $ref: '#/definitions/forwardPoint' }, minItems: VF_POINTS_MIN, maxItems: VF_POINTS_MAX, description: 'Forward points at 25 °C from which a model is fitted' };
  }
  for (const field of NUMERIC_FIELDS[kind]) {
    const { name, ...bounds } = field;
    properties[name] = { type: 'number', ...bounds };
  }
  return { type: 'object', additionalProperties: false, properties };
}
