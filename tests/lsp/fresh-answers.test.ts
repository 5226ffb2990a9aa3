/**
 * Freshness: a request that arrives just after an edit is answered from that edit's analysis,
 * never from the previous one, and after each analysis the server asks the editor to refresh its
 * inlay hints and code lenses.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DidChangeTextDocumentNotification, InlayHintRefreshRequest, InlayHintRequest } from 'vscode-languageserver-protocol/node';
import { startTestClient, type TestClient } from './protocol-client';

const URI = 'file:///w/fresh.cir';
const TEXT = `Freshness (a fixture of our own)
*@ mains 230V 50Hz
*@ rate DLOW vrrm=600V ifav=1A ifsm=30A
*@ rate DHIGH vrrm=1000V ifav=1A ifsm=30A
V1 a b SIN(0 325 50)
D1 a p DLOW
D2 b p DLOW
D3 n a DLOW
D4 n b DLOW
C1 p n 100u
R1 p n 4.7k
.model DLOW D(IS=1n N=1.8)
.model DHIGH D(IS=1n N=1.8)
`;

let client: TestClient;
let refreshed: () => void = () => {};
beforeAll(async () => {
  client = await startTestClient({ capabilities: { workspace: { inlayHint: { refreshSupport: true }, codeLens: { refreshSupport: true } } } });
  client.connection.onRequest(InlayHintRefreshRequest.type, () => refreshed());
  client.connection.onRequest('workspace/codeLens/refresh', () => null);
  await client.open(URI, TEXT);
});
afterAll(async () => {
  await client.close();
});

const wholeFile = { start: { line: 0, character: 0 }, end: { line: 20, character: 0 } };

describe('answers after an edit', () => {
  it('the next inlay-hint request shows the new part, and the server asked for a refresh', async () => {
    const before = await client.connection.sendRequest(InlayHintRequest.type, { textDocument: { uri: URI }, range: wholeFile });
    expect(JSON.stringify(before)).toMatch(/\/600 V/);
    const refreshRequested = new Promise<void>((resolve) => (refreshed = resolve));
    // D1's model DLOW → DHIGH (line 5, characters 7–11), then ask at once.
    await client.connection.sendNotification(DidChangeTextDocumentNotification.type, {
      textDocument: { uri: URI, version: 2 },
      contentChanges: [{ range: { start: { line: 5, character: 7 }, end: { line: 5, character: 11 } }, text: 'DHIGH' }],
    });
    const hints = await client.connection.sendRequest(InlayHintRequest.type, { textDocument: { uri: URI }, range: wholeFile });
    const d1 = (hints ?? []).find((h) => h.position.line === 5);
    expect(JSON.stringify(d1?.label)).toMatch(/\/1000 V|\/1 kV/);
    // Resolves only when the server asks for a refresh after the new analysis (else the test times out).
    await refreshRequested;
  });
});
