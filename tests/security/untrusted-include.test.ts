/**
 * Over the protocol, with real files: in an untrusted workspace an include that leaves the
 * workspace folder — by `..`, by an absolute path, by an encoded or backslashed `..` — is not read
 * and is reported as untrusted on its card; the same includes are read when the workspace is trusted.
 */
import { mkdtempSync, mkdirSync, realpathSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { afterAll, describe, expect, it } from 'vitest';
import { startTestClient } from '../lsp/protocol-client';

const base = realpathSync(mkdtempSync(join(tmpdir(), 'rectilens-trust-')));
const workspace = join(base, 'ws');
mkdirSync(join(workspace, 'sub'), { recursive: true });
const outside = join(base, 'outside.cir');
writeFileSync(outside, 'ROUT x 0 1\n');
writeFileSync(join(workspace, 'sub', 'inside.cir'), 'RIN y 0 1\n');

const INCLUDES = ['../outside.cir', outside, 'sub/../../outside.cir', '%2e%2e/outside.cir', '..\\outside.cir', pathToFileURL(outside).href];
const main = ['includes', ...INCLUDES.map((p) => `.include "${p}"`), '.include "sub/inside.cir"', ''].join('\n');
const mainUri = pathToFileURL(join(workspace, 'main.cir')).href;
const workspaceFolder = pathToFileURL(workspace).href;

afterAll(() => rmSync(base, { recursive: true, force: true }));

/** The include paths the server refused or could not find, in order. */
async function missingIncludes(trusted: boolean): Promise<string[]> {
  const client = await startTestClient({ workspaceFolder, initializationOptions: { trusted } });
  try {
    const diagnostics = await client.open(mainUri, main);
    const lines = main.split('\n');
    return diagnostics.filter((d) => d.code === 'untrusted-file' || d.code === 'missing-include').map((d) => lines[d.range.start.line]!.slice(d.range.start.character + 1, d.range.end.character - 1));
  } finally {
    await client.close();
  }
}

describe('includes in an untrusted workspace', () => {
  it('every include that leaves the folder is refused; the one inside is read', async () => {
    expect(await missingIncludes(false)).toEqual(INCLUDES);
  });

  it('a trusted workspace reads the outside file through every spelling that leads there (control)', async () => {
    // A netlist path is a path, not a URL: `%2e%2e` is a folder of that name (the resolver encodes
    // the `%`), so it leads nowhere even when trusted; every other spelling reaches the file.
    expect(await missingIncludes(true)).toEqual(['%2e%2e/outside.cir']);
  });
});
