/**
 * Files changed on disk behind the editor: the server registers file watchers (LSP 3.17
 * `workspace/didChangeWatchedFiles`, dynamic registration) and, on the notification an editor
 * sends, re-reads a changed parts file or re-analyses the roots that include a changed file.
 */
import { mkdtempSync, realpathSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { afterAll, afterEach, describe, expect, it } from 'vitest';
import { DidChangeWatchedFilesNotification, FileChangeType, HoverRequest, type MarkupContent } from 'vscode-languageserver-protocol/node';
import { startTestClient, type TestClient } from './protocol-client';

const base = realpathSync(mkdtempSync(join(tmpdir(), 'rectilens-watch-')));
afterAll(() => rmSync(base, { recursive: true, force: true }));
const uriOf = (name: string) => pathToFileURL(join(base, name)).href;
const parts = (vrrmV: number) => JSON.stringify({ version: 1, parts: [{ name: 'DW', kind: 'diode', vrrmV, ifavA: 1 }] });

// A 24 V bridge of our own whose diode model DW is rated by the parts file only.
const ROOT = ['Watched parts (our own)', '*@ mains 24V 50Hz', '.include "models.inc"', 'V1 a b SIN(0 34 50)',
  'D1 a p DW', 'D2 b p DW', 'D3 n a DW', 'D4 n b DW', 'C1 p n 1000u', 'R1 p n 100', ''].join('\n');

let client: TestClient | undefined;
afterEach(async () => {
  await client?.close();
  client = undefined;
});

async function start(): Promise<{ registered: unknown[] }> {
  const registered: unknown[] = [];
  client = await startTestClient({
    workspaceFolder: pathToFileURL(base).href,
    capabilities: { workspace: { didChangeWatchedFiles: { dynamicRegistration: true } } },
  });
  client.connection.onRequest('client/registerCapability', (p: { registrations: unknown[] }) => { registered.push(...p.registrations); return null; });
  return { registered };
}

const hoverOfD1 = async () => {
  const hover = await client!.connection.sendRequest(HoverRequest.type, { textDocument: { uri: uriOf('root.cir') }, position: { line: 4, character: 1 } });
  return (hover!.contents as MarkupContent).value;
};

describe('watching files on disk', () => {
  it('shows a parts file\'s new rating after the editor reports its change', async () => {
    writeFileSync(join(base, 'parts.json'), parts(100));
    writeFileSync(join(base, 'models.inc'), '.model DW D(IS=2.5n N=1.75 RS=0.04)\n');
    await start();
    await client!.open(uriOf('root.cir'), ROOT);
    const applied = client!.nextDiagnostics(uriOf('root.cir'));
    await client!.connection.sendNotification('workspace/didChangeConfiguration', { settings: { rectilens: { partsFiles: ['parts.json'] } } });
    await applied;
    expect(await hoverOfD1()).toContain('VRRM 100 V');
    writeFileSync(join(base, 'parts.json'), parts(30));
    const again = client!.nextDiagnostics(uriOf('root.cir'));
    await client!.connection.sendNotification(DidChangeWatchedFilesNotification.type, { changes: [{ uri: uriOf('parts.json'), type: FileChangeType.Changed }] });
    const after = await again;
    expect(await hoverOfD1()).toContain('VRRM 30 V');
    // 34 V of crest on a 30 V part: piv-margin says so now.
    expect(after.some((d) => d.code === 'piv-margin')).toBe(true);
  });

  it('re-analyses a root when an include it reads changes on disk, and registers its watchers', async () => {
    writeFileSync(join(base, 'models.inc'), '.model DW D(IS=2.5n N=1.75 RS=0.04)\n');
    const { registered } = await start();
    const first = await client!.open(uriOf('root.cir'), ROOT);
    expect(first.some((d) => d.code === 'syntax-error')).toBe(false);
    expect(JSON.stringify(registered)).toContain('workspace/didChangeWatchedFiles');
    writeFileSync(join(base, 'models.inc'), '.model DW D(IS=2.5n N=1.75 RS=0.04\n');
    const again = client!.nextDiagnostics(uriOf('root.cir'));
    await client!.connection.sendNotification(DidChangeWatchedFilesNotification.type, { changes: [{ uri: uriOf('models.inc'), type: FileChangeType.Changed }] });
    expect((await again).some((d) => d.code === 'include-error')).toBe(true);
  });
});
