/**
 * A parts file from its text: every broken form ends in a finding placed on the offending text,
 * never in a throw or in ratings that silently vanish; a byte-order mark is accepted; only the
 * supported version is read, as the JSON Schema says.
 */
import { mkdirSync, mkdtempSync, realpathSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import Ajv from 'ajv';
import { afterAll, describe, expect, it } from 'vitest';
import { partsFileFindings } from '../../server/src/analysis/parts-file-findings';
import { createWorkspaceReader } from '../../server/src/lsp/workspace-reader';
import { readPartsFiles } from '../../server/src/lsp/parts-files';
import { buildPartsFileSchema, readPartsFileText } from '../../server/src/ratings/index';

const URI = 'file:///w/a.rectilens-parts.json';
const GOOD = '{ "version": 1, "parts": [ { "name": "DMAIN", "kind": "diode", "vrrmV": 600 } ] }';
const schemaAccepts = new Ajv({ allErrors: true, strict: true }).compile(buildPartsFileSchema());

/** The findings as [text they cover, severity, message]; and the names of the usable entries. */
function read(text: string) {
  const { file, findings } = partsFileFindings(URI, text);
  return {
    names: file?.entries.map((e) => e.name),
    findings: findings.map((f) => [text.slice(f.span.start, f.span.end), f.severity, f.code, f.message]),
  };
}

describe('parts file text', () => {
  it('reads a sound file with no finding', () => {
    expect(read(GOOD)).toEqual({ names: ['DMAIN'], findings: [] });
  });

  it('accepts a UTF-8 byte-order mark and places findings on the text as given', () => {
    const text = `\uFEFF{ "version": 1, "parts": [ { "name": "D1", "kind": "diode", "vrrmV": -5 } ] }`;
    expect(read(text)).toEqual({
      names: ['D1'],
      findings: [['"vrrmV": -5', 'error', 'parts-file', '"vrrmV" must be greater than 0; left out of the ratings']],
    });
  });

  it.each([
    ['empty', '', ['', 'the parts file is empty; none of its ratings are used']],
    ['white space only', ' \n\t\n', [' \n\t\n', 'the parts file is empty; none of its ratings are used']],
    ['a byte-order mark only', '\uFEFF', ['\uFEFF', 'the parts file is empty; none of its ratings are used']],
    ['truncated', GOOD.slice(0, 40), ['', 'the parts file is not valid JSON: the text ends before the JSON is complete (is the file truncated?); none of its ratings are used']],
    ['a trailing comma', '{ "version": 1, "parts": [ { "name": "D", "kind": "diode" }, ] }', [',', "the parts file is not valid JSON: a trailing comma: JSON allows no comma before ']'; none of its ratings are used"]],
    ['a comment', '{ // ours\n "version": 1, "parts": [] }', ['/', "the parts file is not valid JSON: expected a property name in double quotes, found '/'; none of its ratings are used"]],
    ['version 2', '{ "version": 2, "parts": [ { "name": "D", "kind": "diode" } ] }', ['"version": 2', 'version 2 is not supported (this Rectilens reads version 1); none of its ratings are used']],
    ['no version', '{ "parts": [ { "name": "D", "kind": "diode" } ] }', ['{ "parts": [ { "name": "D", "kind": "diode" } ] }', 'the parts file states no "version" (this Rectilens reads version 1); none of its ratings are used']],
    ['version as a string', '{ "version": "1", "parts": [] }', ['"version": "1"', 'version "1" is not supported (this Rectilens reads version 1); none of its ratings are used']],
    ['parts that is not a list', '{ "version": 1, "parts": { "name": "D" } }', ['"parts": { "name": "D" }', '"parts" must be an array of parts; none of its ratings are used']],
    ['not an object', '[1, 2]', ['[1, 2]', 'a parts file is a JSON object with "version" and "parts"; none of its ratings are used']],
  ])('%s: no ratings, one finding on the text that is wrong', (_what, text, [covered, message]) => {
    const { names, findings } = read(text);
    expect(names).toBeUndefined();
    expect(findings[0]).toEqual([covered, 'error', 'parts-file', expect.stringContaining(message!)]);
  });

  it('wrong-typed fields: each a finding on its field, the sound rest still used', () => {
    const text = '{ "version": 1, "parts": [ { "name": "DA", "kind": "diode", "vrrmV": "600V", "ifavA": 1, "aliases": "DB" }, { "name": 7, "kind": "diode" }, 3 ] }';
    const { names, findings } = read(text);
    expect(names).toEqual(['DA']);
    expect(findings.map(([covered, severity]) => [covered, severity])).toEqual([
      ['"vrrmV": "600V"', 'error'], ['"aliases": "DB"', 'error'], ['"name": 7', 'error'], ['3', 'error'],
    ]);
  });

  it('the JSON Schema rejects the same versions (only version 1 is accepted)', () => {
    expect(schemaAccepts({ version: 1, parts: [] })).toBe(true);
    for (const version of [2, 0, '1', null]) expect(schemaAccepts({ version, parts: [] }), String(version)).toBe(false);
  });

  it('deep nesting and a long file end in a finding, not a stack overflow', () => {
    const deep = `{ "version": 1, "parts": [ ${'['.repeat(200_000)}`;
    expect(() => readPartsFileText(deep, URI)).not.toThrow();
    expect(read(deep).findings[0]![3]).toMatch(/not valid JSON: the text ends/);
    const closed = `{ "version": 1, "parts": [ ${'['.repeat(200_000)}${']'.repeat(200_000)} ] }`;
    expect(read(closed).findings[0]![3]).toMatch(/a part is an object/);
  });
});

describe('parts files named in the settings', () => {
  const base = realpathSync(mkdtempSync(join(tmpdir(), 'rectilens-parts-')));
  mkdirSync(join(base, 'folder.rectilens-parts.json'));
  writeFileSync(join(base, 'good.rectilens-parts.json'), GOOD);
  afterAll(() => rmSync(base, { recursive: true, force: true }));
  const folders = [pathToFileURL(base).href];

  it('a missing path and a folder path are each a finding on that file; the good one is used', () => {
    const readText = createWorkspaceReader({ openText: () => undefined, trust: () => ({ trusted: true, folders }) });
    const reading = readPartsFiles(['missing.rectilens-parts.json', 'folder.rectilens-parts.json', 'good.rectilens-parts.json'], { trusted: true, folders }, readText);
    expect(reading.files.map((f) => f.entries.map((e) => e.name))).toEqual([['DMAIN']]);
    expect(reading.results.map((r) => [r.uri.slice(folders[0]!.length + 1), r.findings.map((f) => [f.code, f.message.replace(folders[0]!, '…')])])).toEqual([
      ['missing.rectilens-parts.json', [['parts-file', 'the parts file …/missing.rectilens-parts.json is not read: no such file; none of its ratings are used']]],
      ['folder.rectilens-parts.json', [['unreadable-file', 'the parts file …/folder.rectilens-parts.json is not read: it is a folder, not a regular file; none of its ratings are used']]],
      ['good.rectilens-parts.json', []],
    ]);
  });

  it('a relative path with no workspace folder names no file, and says so', () => {
    const reading = readPartsFiles(['parts.json'], { trusted: true, folders: [] }, () => undefined);
    expect(reading).toEqual({ files: [], results: [], unplaced: ['parts.json'] });
  });
});
