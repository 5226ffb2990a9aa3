/**
 * An include's diagnostics are sent again only when they change: an edit of the root that leaves
 * the include's findings alone sends the root's (with their version) and nothing for the include;
 * an edit that changes them sends them; closing a root sends its files' diagnostics again.
 */
import { mkdtempSync, realpathSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { afterAll, describe, expect, it } from 'vitest';
import { startTestClient } from './protocol-client';

const base = realpathSync(mkdtempSync(join(tmpdir(), 'rectilens-samediag-')));
afterAll(() => rmSync(base, { recursive: true, force: true }));
// The include's model card is cut short: a syntax error there, reported on the include.
writeFileSync(join(base, 'broken.inc'), '* models of our own\n.model DW D(IS=2.5n N=1.75 RS=0.04\n');
const ROOT_LINES = ['Root (our own)', '.include "broken.inc"', 'V1 a b SIN(0 17 50)', 'D1 a p DW', 'D2 b p DW', 'D3 n a DW', 'D4 n b DW', 'C1 p n 1000u', 'R1 p n 100', ''];
const rootUri = pathToFileURL(join(base, 'root.cir')).href;
const libUri = pathToFileURL(join(base, 'broken.inc')).href;
const endOf = (line: number) => ({ line, character: ROOT_LINES[line]!.length });

describe('diagnostics of an included file', () => {
  it('are not sent again when an edit of the root leaves them unchanged', async () => {
    const client = await startTestClient({ workspaceFolder: pathToFileURL(base).href });
    try {
      const sent: string[] = [];
      client.onDiagnostics((p) => sent.push(`${p.uri === libUri ? 'lib' : 'root'}:${p.version ?? '-'}:${p.diagnostics.length}`));
      const firstLib = client.nextDiagnostics(libUri);
      await client.open(rootUri, ROOT_LINES.join('\n'));
      expect((await firstLib).length).toBeGreaterThan(0);
      // A comment at the end of the root: the root's findings come again with the new version. The
      // include's would have been sent before them (one analysis publishes its files in one go).
      await client.change(rootUri, 2, [{ range: { start: endOf(8), end: endOf(8) }, text: ' ; a comment' }]);
      expect(sent.filter((s) => s.startsWith('lib'))).toHaveLength(1);
      expect(sent.at(-1)).toMatch(/^root:2:/);
      // Closing the root clears what it said of the include: that goes out.
      const cleared = client.nextDiagnostics(libUri);
      await client.connection.sendNotification('textDocument/didClose', { textDocument: { uri: rootUri } });
      expect(await cleared).toEqual([]);
    } finally {
      await client.close();
    }
  });

  it('are sent when the edit changes them', async () => {
    const client = await startTestClient({ workspaceFolder: pathToFileURL(base).href });
    try {
      const firstLib = client.nextDiagnostics(libUri);
      await client.open(rootUri, ROOT_LINES.join('\n'));
      expect((await firstLib).length).toBeGreaterThan(0);
      // The root stops including the file: its findings there are gone, and the empty list is sent.
      const nextLib = client.nextDiagnostics(libUri);
      await client.change(rootUri, 2, [{ range: { start: { line: 1, character: 0 }, end: { line: 1, character: 0 } }, text: '* ' }]);
      expect(await nextLib).toEqual([]);
    } finally {
      await client.close();
    }
  });
});
