/**
 * Navigation across files over the protocol: renaming a model from the include that defines it
 * edits the root that uses it (the server finds the includers), and every `.include` path is a
 * document link to the file it names.
 */
import { mkdtempSync, realpathSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { afterAll, describe, expect, it } from 'vitest';
import { DocumentLinkRequest, RenameRequest, type WorkspaceEdit } from 'vscode-languageserver-protocol/node';
import { startTestClient } from './protocol-client';

const base = realpathSync(mkdtempSync(join(tmpdir(), 'rectilens-xfile-')));
afterAll(() => rmSync(base, { recursive: true, force: true }));
const LIB_TEXT = '.model DW D(IS=2.5n N=1.75 RS=0.04)\n';
const ROOT_TEXT = ['Two files (our own)', '*@ rate DW vrrm=100V', '.include "models.inc"', 'V1 a b SIN(0 17 50)',
  'D1 a p DW', 'D2 b p DW', 'D3 n a DW', 'D4 n b DW', 'C1 p n 1000u', 'R1 p n 100', ''].join('\n');
writeFileSync(join(base, 'models.inc'), LIB_TEXT);
writeFileSync(join(base, 'root.cir'), ROOT_TEXT);
const rootUri = pathToFileURL(join(base, 'root.cir')).href;
const libUri = pathToFileURL(join(base, 'models.inc')).href;

describe('across files', () => {
  it('renames a model from its include: the include, the devices and the rate line of the root', async () => {
    const client = await startTestClient({ workspaceFolder: pathToFileURL(base).href });
    try {
      await client.open(rootUri, ROOT_TEXT);
      await client.open(libUri, LIB_TEXT);
      const edit = (await client.connection.sendRequest(RenameRequest.type, {
        textDocument: { uri: libUri }, position: { line: 0, character: 8 }, newName: 'DNEW',
      })) as WorkspaceEdit;
      const changes = edit.changes!;
      expect(changes[libUri]!.map((e) => [e.range.start.line, e.newText])).toEqual([[0, 'DNEW']]);
      expect(changes[rootUri]!.map((e) => e.range.start.line).sort((a, b) => a - b)).toEqual([1, 4, 5, 6, 7]);

      const links = await client.connection.sendRequest(DocumentLinkRequest.type, { textDocument: { uri: rootUri } });
      expect(links!.map((l) => [l.range.start.line, l.target])).toEqual([[2, libUri]]);
      // An `*@ allow` code links to its rule's page.
      const allowing = `${ROOT_TEXT}*@ allow missing-rating\n`;
      await client.change(rootUri, 2, [{ text: allowing }]);
      const more = await client.connection.sendRequest(DocumentLinkRequest.type, { textDocument: { uri: rootUri } });
      expect(String(more!.find((l) => l.range.start.line === 10)?.target)).toMatch(/\/docs\/rules\/missing-rating\.md$/);
    } finally {
      await client.close();
    }
  });
});
