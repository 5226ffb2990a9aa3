/**
 * Findings about an included file are published for that file, open in the editor or not, with
 * the root's include card as related information; the root still carries `include-error`.
 */
import { mkdtempSync, realpathSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { afterAll, describe, expect, it } from 'vitest';
import { startTestClient } from './protocol-client';

const base = realpathSync(mkdtempSync(join(tmpdir(), 'rectilens-incfind-')));
afterAll(() => rmSync(base, { recursive: true, force: true }));
// The include's model card is cut short: a syntax error on its line 2.
const LIB_TEXT = '* models of our own\n.model DW D(IS=2.5n N=1.75 RS=0.04\n';
const ROOT_TEXT = ['Root (our own)', '.include "broken.inc"', 'V1 a b SIN(0 17 50)', 'D1 a p DW', 'D2 b p DW', 'D3 n a DW', 'D4 n b DW', 'C1 p n 1000u', 'R1 p n 100', ''].join('\n');
writeFileSync(join(base, 'broken.inc'), LIB_TEXT);
const rootUri = pathToFileURL(join(base, 'root.cir')).href;
const libUri = pathToFileURL(join(base, 'broken.inc')).href;

describe('findings in an included file', () => {
  it('are published for the include, which is not open, pointing back to the including card', async () => {
    const client = await startTestClient({ workspaceFolder: pathToFileURL(base).href });
    try {
      const onLib = client.nextDiagnostics(libUri);
      const onRoot = await client.open(rootUri, ROOT_TEXT);
      expect(onRoot.map((d) => d.code)).toContain('include-error');
      const lib = await onLib;
      const error = lib.find((d) => d.code === 'syntax-error')!;
      expect(error.range.start.line).toBe(1);
      expect(error.relatedInformation?.[0]?.location.uri).toBe(rootUri);
      expect(error.relatedInformation?.[0]?.location.range.start.line).toBe(1);
      // Opened, the include keeps the findings its includer reads in it (its first line is not a title then).
      const opened = await client.open(libUri, LIB_TEXT);
      expect(opened.map((d) => d.code)).toContain('syntax-error');
      // Closed again, the includer's findings stay published for it.
      const afterClose = client.nextDiagnostics(libUri);
      await client.connection.sendNotification('textDocument/didClose', { textDocument: { uri: libUri } });
      expect((await afterClose).map((d) => d.code)).toContain('syntax-error');
    } finally {
      await client.close();
    }
  });
});
