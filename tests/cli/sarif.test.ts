import { readFileSync, mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import Ajv from 'ajv-draft-04';
import { describe, expect, it } from 'vitest';
import { runCommandLine } from '../../server/src/cli/main';

// The published JSON Schema of SARIF 2.1.0 (OASIS SARIF TC, the 2.1.0-rtm.5 schema, draft-04), as
// shipped by the registry package @microsoft/jest-sarif (a dev dependency pinned for this file);
// validated with ajv-draft-04 from the registry. That schema's language-tag pattern is not a valid
// Unicode-mode regular expression, so patterns are compiled as plain ones; `uri` formats are not
// checked (ajv ships no format validators).
const SCHEMA_PATH = require.resolve('@microsoft/jest-sarif/lib/schemas/sarif-2.1.0-rtm.5.json');

function sarifOf(files: Record<string, string>): { code: number; log: Record<string, unknown> } {
  const dir = mkdtempSync(join(tmpdir(), 'rectilens-sarif-'));
  for (const [name, text] of Object.entries(files)) writeFileSync(join(dir, name), text);
  let stdout = '';
  const code = runCommandLine(['check', dir, '--format', 'sarif'], { stdout: (t) => (stdout += t), stderr: () => {}, stderrIsTty: false });
  return { code, log: JSON.parse(stdout) };
}

describe('check --format sarif', () => {
  it('is valid against the published SARIF 2.1.0 schema', () => {
    const schema = JSON.parse(readFileSync(SCHEMA_PATH, 'utf8'));
    const validate = new Ajv({ allErrors: true, strict: false, unicodeRegExp: false, logger: false }).compile(schema);
    const { code, log } = sarifOf({ 'a.cir': 'a\nR1 x 0 4k7\nD1 x\n', 'b.cir': 'b\nR1 x 0 1k\n' });
    expect(code).toBe(1);
    const valid = validate(log);
    expect(validate.errors ?? []).toEqual([]);
    expect(valid).toBe(true);
    // Control: the compiled schema does refuse a log that breaks it.
    expect(validate({ ...log, version: '9.9', runs: [{ results: [{ level: 'fatal' }] }] })).toBe(false);
  });

  it('lists each reported code as a rule with a description and help, and maps severities to levels', () => {
    const { log } = sarifOf({ 'a.cir': 'a\nR1 x 0 4k7\nD1 x\n' });
    const run = (log.runs as { tool: { driver: { rules: { id: string; shortDescription: { text: string }; help: { text: string } }[] } }; results: { ruleId: string; level: string; locations: { physicalLocation: { region: { startLine: number } } }[] }[] }[])[0]!;
    expect(run.tool.driver.rules.map((r) => r.id)).toEqual(['syntax-error', 'value-notation']);
    for (const rule of run.tool.driver.rules) {
      expect(rule.shortDescription.text.length).toBeGreaterThan(10);
      expect(rule.help.text.length).toBeGreaterThan(10);
    }
    expect(run.results.map((r) => [r.ruleId, r.level, r.locations[0]!.physicalLocation.region.startLine])).toEqual([
      ['value-notation', 'warning', 2], ['syntax-error', 'error', 3],
    ]);
  });
});
