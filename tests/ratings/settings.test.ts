/**
 * One name per setting: the manifest (package.json `contributes.configuration`), the settings
 * type and the `*@ derate` keys agree through the one table of ratings/settings.ts; and
 * `validateSettings`, the adapters' one cleaning step, drops what must not reach the analysis.
 */
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { DERATE_KEYS } from '../../grammar/src/index';
import { analyze } from '../../server/src/analysis/analyze';
import {
  CLIENT_SETTINGS, CORNER_SETTINGS, DERATING_SETTINGS, DIRECTIVE_ONLY_DERATE_KEYS, HINT_DETAILS, OTHER_SETTINGS, resolvePolicy, validateSettings,
  type CornerSettingValues, type DeratingSettingValues, type NumericSetting,
} from '../../server/src/ratings/index';

const manifest = JSON.parse(readFileSync(resolve(__dirname, '../../package.json'), 'utf8'));
const properties: Record<string, { minimum?: number; maximum?: number; enum?: string[]; type: unknown }> = manifest.contributes.configuration.properties;

describe('the settings table', () => {
  const numeric: [string, NumericSetting][] = [...Object.entries(DERATING_SETTINGS), ...Object.entries(CORNER_SETTINGS)];

  it('lists every manifest setting once, and nothing else', () => {
    const keys = [...numeric.map(([, s]) => s.manifestKey), ...[...Object.values(OTHER_SETTINGS), ...Object.values(CLIENT_SETTINGS)].map((s) => s.manifestKey)];
    expect(new Set(keys).size).toBe(keys.length);
    expect([...keys].sort()).toEqual(Object.keys(properties).sort());
  });

  it('names each field as the manifest does (rectilens.<group>.<field>)', () => {
    for (const [name, s] of Object.entries(DERATING_SETTINGS)) expect(s.manifestKey).toBe(`rectilens.derating.${name}`);
    for (const [name, s] of Object.entries(CORNER_SETTINGS)) expect(s.manifestKey).toBe(`rectilens.corners.${name}`);
    for (const [name, s] of Object.entries(OTHER_SETTINGS)) expect(s.manifestKey).toBe(`rectilens.${name}`);
  });

  it('has the ranges and choices the manifest declares', () => {
    for (const [, s] of numeric) {
      expect({ min: s.min, max: s.max }, s.manifestKey).toEqual({ min: properties[s.manifestKey]!.minimum, max: properties[s.manifestKey]!.maximum });
    }
    expect(properties[OTHER_SETTINGS.hintDetail.manifestKey]!.enum).toEqual([...HINT_DETAILS]);
    expect(properties[CLIENT_SETTINGS.traceServer.manifestKey]!.enum).toEqual([...CLIENT_SETTINGS.traceServer.values]);
  });

  it('covers the fields of the settings type (the compiler makes these literals complete)', () => {
    const derating: Required<DeratingSettingValues> = { reverseVoltage: 0, forwardCurrent: 0, surgeCurrent: 0, junctionTempC: 0, capacitorVoltage: 0 };
    const corners: Required<CornerSettingValues> = { lineLow: 0, lineHigh: 0, ambientNominalC: 0, ambientMaxC: 0 };
    expect(Object.keys(DERATING_SETTINGS).sort()).toEqual(Object.keys(derating).sort());
    expect(Object.keys(CORNER_SETTINGS).sort()).toEqual(Object.keys(corners).sort());
  });

  it('maps every derate key to one setting or marks it directive-only; reverseVoltage is vr and vds', () => {
    const bySetting = Object.values(DERATING_SETTINGS).flatMap((s) => s.derateKeys);
    expect([...bySetting, ...DIRECTIVE_ONLY_DERATE_KEYS].sort()).toEqual([...DERATE_KEYS].sort());
    expect(DERATING_SETTINGS.reverseVoltage.derateKeys).toEqual(['vr', 'vds']);
    const { policy } = resolvePolicy([], { derating: { reverseVoltage: 0.6 } });
    expect([policy.vr.value, policy.vds.value]).toEqual([0.6, 0.6]);
    expect(policy.vds.origin).toEqual({ kind: 'setting', key: 'vr' });
  });
});

describe('validateSettings', () => {
  it('keeps finite numbers within the manifest range, and the valid choices', () => {
    const valid = { derating: { reverseVoltage: 0.7, junctionTempC: 110 }, corners: { lineLow: -0.15, ambientMaxC: 60 }, hintDetail: 'full', partsFiles: ['p.json'] };
    expect(validateSettings(valid)).toEqual(valid);
  });

  it('drops null, NaN, Infinity, text and values outside the range', () => {
    const raw = {
      derating: { reverseVoltage: null, forwardCurrent: Number.NaN, surgeCurrent: 'x', junctionTempC: 900, capacitorVoltage: 0 },
      corners: { lineLow: -1, lineHigh: Number.POSITIVE_INFINITY, ambientNominalC: -300, ambientMaxC: '50' },
      hintDetail: 'everything', partsFiles: ['a.json', 3, null],
    };
    expect(validateSettings(raw)).toEqual({ partsFiles: ['a.json'] });
  });

  it('never passes a line tolerance at or below −100 % (it would zero the source)', () => {
    for (const lineLow of [-1, -1.5, -100]) expect(validateSettings({ corners: { lineLow } }).corners?.lineLow).toBeUndefined();
  });

  it('answers anything that is not a settings object with no settings', () => {
    for (const raw of [undefined, null, 7, 'rectilens', [1, 2], { derating: [0.5] }]) expect(validateSettings(raw)).toEqual({});
  });

  it('leaves the analysis as it is without the dropped values', () => {
    const text = 'bridge\n*@ mains 12V 50Hz\nV1 a b SIN(0 17 50)\nD1 a p DG\nD2 b p DG\nD3 n a DG\nD4 n b DG\nC1 p n 2200u\nR1 p n 24\n.model DG D(IS=2.5n N=1.75 RS=0.04)\n';
    const figures = (settings: unknown) => {
      const file = analyze({ roots: ['file:///v.cir'], readText: () => text, settings: validateSettings(settings) }).files.get('file:///v.cir')!;
      return file.rectifiers[0]!.solution.worst;
    };
    expect(figures({ corners: { lineLow: -1, lineHigh: null, ambientMaxC: Number.NaN } })).toEqual(figures({}));
  });
});
