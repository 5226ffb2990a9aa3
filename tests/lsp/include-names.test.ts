/**
 * Include names as people write them: a `#`, spaces and letters beyond ASCII. The editor names
 * files by URI (RFC 3986: `#` starts a fragment, a space is not allowed, so both are
 * percent-encoded) and the command line by path; both must find the same file.
 */
import { mkdtempSync, realpathSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { afterAll, describe, expect, it } from 'vitest';
import { runCommandLine } from '../../server/src/cli/main';
import { startTestClient } from './protocol-client';

const base = realpathSync(mkdtempSync(join(tmpdir(), 'rectilens-names-')));
afterAll(() => rmSync(base, { recursive: true, force: true }));
const INCLUDE = 'models #2 für Ω.inc';
writeFileSync(join(base, INCLUDE), '.model DN D(IS=2.5n N=1.75 RS=0.04)\n');
// A 12 V bridge of our own whose diode model lives in the oddly named include.
const ROOT = ['Odd include names (our own)', '*@ mains 12V 50Hz', `.include "${INCLUDE}"`, 'V1 a b SIN(0 17 50)',
  'D1 a p DN', 'D2 b p DN', 'D3 n a DN', 'D4 n b DN', 'C1 p n 1000u', 'R1 p n 100', ''].join('\n');
writeFileSync(join(base, 'root.cir'), ROOT);

describe('an include named with #, spaces and non-ASCII letters', () => {
  it('is found by the editor (over the protocol, by URI)', async () => {
    const client = await startTestClient({ workspaceFolder: pathToFileURL(base).href });
    try {
      const diagnostics = await client.open(pathToFileURL(join(base, 'root.cir')).href, ROOT);
      expect(diagnostics.filter((d) => d.code === 'missing-include' || d.code === 'default-model')).toEqual([]);
    } finally {
      await client.close();
    }
  });

  it('is found by the command line (by path)', () => {
    let stdout = '';
    runCommandLine(['check', '--format', 'json', join(base, 'root.cir')], { stdout: (t) => (stdout += t), stderr: () => {}, stderrIsTty: false });
    const codes = JSON.stringify(JSON.parse(stdout));
    expect(codes).not.toContain('missing-include');
    expect(codes).not.toContain('default-model');
  });
});
