/**
 * The project configuration (ratings/project-config.ts): its keys are the editor settings, so its
 * JSON Schema is written from the manifest's settings (the one place their descriptions and ranges
 * live) and must equal the shipped file; what a configuration holds is validated as settings are.
 */
import { readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import Ajv from 'ajv';
import { describe, expect, it } from 'vitest';
import { CLIENT_SETTINGS, layerSettings, readProjectConfig } from '../../server/src/ratings/index';

const ROOT = join(__dirname, '..', '..');
const SCHEMA_PATH = join(ROOT, 'server', 'src', 'ratings', 'project-config.schema.json');
const manifest = JSON.parse(readFileSync(join(ROOT, 'package.json'), 'utf8'));

/** The schema from the manifest: `rectilens.a.b` becomes property `b` of object `a`. */
function schemaFromManifest(): object {
  const editorOnly = new Set<string>(Object.values(CLIENT_SETTINGS).map((s) => s.manifestKey));
  const properties: Record<string, any> = { $schema: { type: 'string' } };
  for (const [key, setting] of Object.entries(manifest.contributes.configuration.properties) as [string, any][]) {
    if (editorOnly.has(key)) continue;
    const path = key.replace(/^rectilens\./, '').split('.');
    const { scope: _scope, default: _default, ...rest } = setting;
    const leaf = { ...rest, type: Array.isArray(rest.type) ? rest.type.filter((t: string) => t !== 'null') : rest.type };
    if (leaf.type.length === 1) leaf.type = leaf.type[0];
    if (path.length === 1) properties[path[0]!] = leaf;
    else {
      properties[path[0]!] ??= { type: 'object', additionalProperties: false, properties: {} };
      properties[path[0]!].properties[path[1]!] = leaf;
    }
  }
  return {
    $schema: 'http://json-schema.org/draft-07/schema#',
    title: 'Rectilens project configuration (rectilens.json)',
    description: 'Settings shared by the command line and the editor; editor settings apply on top. Relative parts-file paths are relative to this file.',
    type: 'object', additionalProperties: false, properties,
  };
}

describe('the project configuration', () => {
  it('ships the JSON Schema the manifest settings give (npm run docs:rules rewrites it)', () => {
    const expected = `${JSON.stringify(schemaFromManifest(), null, 2)}\n`;
    if (process.env.RECTILENS_WRITE_DOCS === '1') writeFileSync(SCHEMA_PATH, expected);
    expect(readFileSync(SCHEMA_PATH, 'utf8')).toBe(expected);
    expect(manifest.contributes.jsonValidation).toContainEqual({ fileMatch: 'rectilens.json', url: './server/src/ratings/project-config.schema.json' });
  });

  it('a configuration the schema accepts is read whole; one it rejects has each rejected entry named', () => {
    const validate = new Ajv({ strict: false }).compile(schemaFromManifest());
    const good = { derating: { reverseVoltage: 0.7 }, corners: { ambientMaxC: 60 }, hintDetail: 'full', partsFiles: ['parts.json'] };
    expect(validate(good)).toBe(true);
    expect(readProjectConfig(JSON.stringify(good))).toEqual({
      settings: { derating: { reverseVoltage: 0.7 }, corners: { ambientMaxC: 60 }, hintDetail: 'full' }, partsFiles: ['parts.json'], problems: [],
    });
    const bad = { derating: { reverseVoltage: 1.5, typo: 1 }, colour: 'red' };
    expect(validate(bad)).toBe(false);
    const read = readProjectConfig(JSON.stringify(bad, null, 1));
    expect(read.settings).toEqual({});
    expect(read.problems.map((p) => p.message)).toEqual([
      "'colour' is not a setting (known: derating, corners, hintDetail, partsFiles); it is ignored",
      "'derating.reverseVoltage' must be a number within the setting's range; the default applies",
      "'derating.typo' is not a setting; it is ignored",
    ]);
    expect(readProjectConfig('{ "derating": ').problems[0]!.message).toMatch(/^the configuration is not valid JSON/);
  });

  it('layers editor settings on top, field by field', () => {
    expect(layerSettings({ derating: { reverseVoltage: 0.7, forwardCurrent: 0.5 }, hintDetail: 'full' }, { derating: { reverseVoltage: 0.6 } }))
      .toEqual({ derating: { reverseVoltage: 0.6, forwardCurrent: 0.5 }, hintDetail: 'full' });
  });
});
