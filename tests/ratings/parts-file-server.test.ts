/**
 * Over the protocol: the parts files named in the settings that cannot be used are reported on
 * the parts file itself (published diagnostics for its URI) and in the server's log; a file that
 * is fixed, or no longer named, has its diagnostics cleared.
 */
import { mkdtempSync, realpathSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { afterAll, describe, expect, it } from 'vitest';
import { LogMessageNotification, type LogMessageParams } from 'vscode-languageserver-protocol/node';
import { startTestClient } from '../lsp/protocol-client';

const base = realpathSync(mkdtempSync(join(tmpdir(), 'rectilens-parts-server-')));
const FILES: Record<string, string> = {
  'truncated.rectilens-parts.json': '{ "version": 1, "parts": [ { "name": "D',
  'v2.rectilens-parts.json': '{ "version": 2, "parts": [] }',
  'bom.rectilens-parts.json': '\uFEFF{ "version": 1, "parts": [ { "name": "DB", "kind": "diode", "ifavA": "1A" } ] }',
};
for (const [name, text] of Object.entries(FILES)) writeFileSync(join(base, name), text);
const uriOf = (name: string) => pathToFileURL(join(base, name)).href;
afterAll(() => rmSync(base, { recursive: true, force: true }));

describe('parts-file findings from the server', () => {
  it('publishes each problem on its parts file and logs it; clears a file no longer named', async () => {
    const client = await startTestClient({ workspaceFolder: pathToFileURL(base).href });
    const logs: string[] = [];
    client.connection.onNotification(LogMessageNotification.type, (params: LogMessageParams) => void logs.push(params.message));
    try {
      const names = [...Object.keys(FILES), 'missing.rectilens-parts.json'];
      const published = names.map((name) => client.nextDiagnostics(uriOf(name)));
      await client.connection.sendNotification('workspace/didChangeConfiguration', { settings: { rectilens: { partsFiles: names } } });
      const diagnostics = await Promise.all(published);
      expect(diagnostics.map((list) => list.map((d) => [d.code, d.range.start, d.message]))).toEqual([
        [['parts-file', { line: 0, character: 39 }, expect.stringMatching(/^the parts file is not valid JSON: the text ends before the JSON is complete/)]],
        [['parts-file', { line: 0, character: 2 }, 'version 2 is not supported (this Rectilens reads version 1); none of its ratings are used']],
        // The byte-order mark is one character of the line the editor shows, so the field starts at 61 (60 characters after it).
        [['parts-file', { line: 0, character: 61 }, '"ifavA" must be a number; left out of the ratings']],
        [['parts-file', { line: 0, character: 0 }, expect.stringMatching(/missing\.rectilens-parts\.json is not read: no such file; none of its ratings are used$/)]],
      ]);
      for (const name of names) expect(logs.some((line) => line.includes(uriOf(name)) && line.includes('parts-file')), name).toBe(true);

      const cleared = client.nextDiagnostics(uriOf('truncated.rectilens-parts.json'));
      await client.connection.sendNotification('workspace/didChangeConfiguration', { settings: { rectilens: { partsFiles: ['v2.rectilens-parts.json'] } } });
      expect(await cleared).toEqual([]);
    } finally {
      await client.close();
    }
  });
});
