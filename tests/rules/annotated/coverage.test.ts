/**
 * Every registered rule has an annotated fixture here: some test file of this folder holds a
 * caret annotation of its code (tests/helpers/annotations.ts), so a new rule without one fails.
 */
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { ALL_RULES } from '../../../server/src/rules/all-rules';
import { readAnnotations } from '../../helpers/annotations';

const HERE = __dirname;

describe('annotated rule fixtures', () => {
  it('cover every rule of all-rules.ts', () => {
    const sources = readdirSync(HERE).filter((f) => f.endsWith('.test.ts')).map((f) => readFileSync(join(HERE, f), 'utf8'));
    const annotated = new Set(sources.flatMap((s) => readAnnotations(s).map((a) => a.code)));
    expect(ALL_RULES.map((r) => r.code).filter((code) => !annotated.has(code))).toEqual([]);
  });
});
