import { readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import Ajv from 'ajv';
import { describe, expect, it } from 'vitest';
import { buildPartsFileSchema, diodePartsFromFiles, validatePartsFile } from '../../server/src/ratings/index';

const SCHEMA_PATH = join(__dirname, '../../server/src/ratings/parts-file.schema.json');
// `UPDATE_PARTS_SCHEMA=1 npx vitest run tests/ratings/parts-file` rewrites the saved schema.
if (process.env.UPDATE_PARTS_SCHEMA) writeFileSync(SCHEMA_PATH, `${JSON.stringify(buildPartsFileSchema(), null, 2)}\n`);
const saved = JSON.parse(readFileSync(SCHEMA_PATH, 'utf8')) as Record<string, unknown>;
const ajv = new Ajv({ allErrors: true, strict: true });
const schemaAccepts = ajv.compile(saved);

/** A complete file of every kind; the numbers are test data of our own, not any part's ratings. */
const GOOD = {
  $schema: './parts-file.schema.json',
  version: 1,
  parts: [
    {
      name: 'DMAIN', kind: 'diode', aliases: ['DMAIN_ALT'], technology: 'silicon', vrrmV: 600, ifavA: 1, ifsmA: 30,
      ifsmDurationS: 0.01, tjmaxC: 150, rthjaKPerW: 60, vfPoints: [{ vV: 0.93, iA: 1 }, { vV: 0.78, iA: 0.1 }], cost: 0.02,
      source: 'incoming inspection', note: 'bridge diodes',
    },
    { name: 'QSYNC', kind: 'mosfet', vdsV: 100, idA: 20, rdsonOhm: 0.008, tjmaxC: 175, rthjaKPerW: 40, vsdV: 0.9 },
    { name: 'CBULK', kind: 'capacitor', vratedV: 400, iRippleA: 1.2, esrOhm: 0.3, cost: 0.4 },
    { name: 'UCTL', kind: 'controller', vminV: 4.5, iqA: 0.002 },
  ],
};

const withPart = (part: unknown): unknown => ({ version: 1, parts: [part] });

/** Files the schema must reject, each with the pointer the validator must name. */
const BAD: [label: string, data: unknown, pointer: string][] = [
  ['not an object', [], ''],
  ['no parts', { version: 1 }, ''],
  ['wrong version', { version: 2, parts: [] }, '/version'],
  ['unknown top-level field', { version: 1, parts: [], extra: true }, '/extra'],
  ['part without kind', withPart({ name: 'D' }), '/parts/0/kind'],
  ['unknown kind', withPart({ name: 'D', kind: 'triac' }), '/parts/0/kind'],
  ['name with a space', withPart({ name: 'D 1', kind: 'diode' }), '/parts/0/name'],
  ['missing name', withPart({ kind: 'diode' }), '/parts/0'],
  ['negative VRRM', withPart({ name: 'D', kind: 'diode', vrrmV: -5 }), '/parts/0/vrrmV'],
  ['zero IFSM', withPart({ name: 'D', kind: 'diode', ifsmA: 0 }), '/parts/0/ifsmA'],
  ['string where a number goes', withPart({ name: 'D', kind: 'diode', ifavA: '1A' }), '/parts/0/ifavA'],
  ['field of another kind', withPart({ name: 'D', kind: 'diode', vdsV: 100 }), '/parts/0/vdsV'],
  ['unit-less typo', withPart({ name: 'D', kind: 'diode', vrrm: 600 }), '/parts/0/vrrm'],
  ['unknown technology', withPart({ name: 'D', kind: 'diode', technology: 'germanium' }), '/parts/0/technology'],
  ['one vf point', withPart({ name: 'D', kind: 'diode', vfPoints: [{ vV: 0.9, iA: 1 }] }), '/parts/0/vfPoints'],
  ['vf point with a stray field', withPart({ name: 'D', kind: 'diode', vfPoints: [{ vV: 0.9, iA: 1, t: 25 }, { vV: 0.7, iA: 0.1 }] }), '/parts/0/vfPoints'],
  ['technology on a capacitor', withPart({ name: 'C', kind: 'capacitor', technology: 'silicon' }), '/parts/0/technology'],
  ['Tjmax beyond 400 °C', withPart({ name: 'Q', kind: 'mosfet', tjmaxC: 500 }), '/parts/0/tjmaxC'],
  ['negative cost', withPart({ name: 'U', kind: 'controller', cost: -1 }), '/parts/0/cost'],
  ['repeated alias', withPart({ name: 'D', kind: 'diode', aliases: ['A', 'A'] }), '/parts/0/aliases'],
];

describe('parts-file JSON Schema', () => {
  it('is the schema the field tables build (saved file up to date)', () => {
    expect(saved).toEqual(buildPartsFileSchema());
  });

  it('is a draft-07 schema that ajv compiles in strict mode', () => {
    expect(saved.$schema).toBe('http://json-schema.org/draft-07/schema#');
    expect(typeof schemaAccepts).toBe('function');
  });

  it('accepts a complete file, and so does the validator', () => {
    expect(schemaAccepts(GOOD), JSON.stringify(schemaAccepts.errors)).toBe(true);
    const { file, problems } = validatePartsFile(GOOD, 'file:///w/a.rectilens-parts.json');
    expect(problems).toEqual([]);
    expect(file.entries.map((e) => e.name)).toEqual(['DMAIN', 'QSYNC', 'CBULK', 'UCTL']);
    expect(file.entries[0]!.values).toMatchObject({ vrrmV: 600, ifsmDurationS: 0.01 });
  });

  it.each(BAD)('rejects %s, and the validator names the place', (_label, data, pointer) => {
    expect(schemaAccepts(data)).toBe(false);
    const { problems } = validatePartsFile(data, 'file:///w/bad.rectilens-parts.json');
    const errors = problems.filter((p) => p.severity === 'error');
    expect(errors.length).toBeGreaterThan(0);
    expect(errors.map((p) => p.pointer)).toContain(pointer);
  });
});

describe('validatePartsFile', () => {
  it('keeps the sound parts and fields of a broken file', () => {
    const data = { version: 1, parts: [{ name: 'D1', kind: 'diode', vrrmV: 600, ifavA: 'lots' }, 42, { name: 'D2', kind: 'diode', vrrmV: 200 }] };
    const { file, problems } = validatePartsFile(data, 'u');
    expect(file.entries.map((e) => [e.name, e.values])).toEqual([['D1', { vrrmV: 600 }], ['D2', { vrrmV: 200 }]]);
    expect(problems.map((p) => p.pointer)).toEqual(['/parts/0/ifavA', '/parts/1']);
  });

  it('warns on a name described twice (the schema cannot), the first entry winning', () => {
    const data = { version: 1, parts: [{ name: 'DX', kind: 'diode', vrrmV: 600 }, { name: 'Q', aliases: ['dx'], kind: 'mosfet' }] };
    expect(schemaAccepts(data)).toBe(true);
    const { file, problems } = validatePartsFile(data, 'u');
    expect(problems).toEqual([{ pointer: '/parts/1/name', severity: 'warning', message: expect.stringMatching(/already described by \/parts\/0/) }]);
    expect(file.entries).toHaveLength(1);
  });

  it('turns diode entries into candidate parts with a fitted model', () => {
    const { file } = validatePartsFile(GOOD, 'file:///w/a.rectilens-parts.json');
    const [part] = diodePartsFromFiles([file]);
    expect(part?.name).toBe('DMAIN');
    expect(part?.ratings.vrrmV).toEqual({ value: 600, origin: { kind: 'parts-file', uri: 'file:///w/a.rectilens-parts.json', partName: 'DMAIN', pointer: '/parts/0/vrrmV' } });
    // Two points, RS = 0: the fit passes through both (D).
    const m = part!.forwardModel!;
    const vt = (1.380649e-23 * 298.15) / 1.602176634e-19;
    expect(m.n * vt * Math.log(1 + 1 / m.isA)).toBeCloseTo(0.93, 6);
  });
});
