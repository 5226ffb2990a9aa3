/**
 * Regression: completion answered from the text of one version and the tree of another. Typing
 * `XYZ ` before a node name and asking for completion before the re-analysis offered slices such
 * as `XYZal` or `R2 ga` instead of node names. Completion now answers from one version.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CompletionRequest, DidChangeTextDocumentNotification } from 'vscode-languageserver-protocol/node';
import { startTestClient, type TestClient } from './protocol-client';

const URI = 'file:///w/completion.cir';
const TEXT = `Completion while typing (a fixture of our own)
V1 signal 0 SIN(0 10 50)
R1 signal gate 10
R2 gate 0 1k
R3 `;

let client: TestClient;
beforeAll(async () => {
  client = await startTestClient();
  await client.open(URI, TEXT);
});
afterAll(async () => {
  await client.close();
});

describe('completion while the analysis is a keystroke behind', () => {
  it('offers the node names of the text as it is now', async () => {
    // Insert `XYZ ` in front of `signal` on line 2, then ask at once, before any re-analysis.
    await client.connection.sendNotification(DidChangeTextDocumentNotification.type, {
      textDocument: { uri: URI, version: 2 },
      contentChanges: [{ range: { start: { line: 2, character: 3 }, end: { line: 2, character: 3 } }, text: 'XYZ ' }],
    });
    const items = await client.connection.sendRequest(CompletionRequest.type, { textDocument: { uri: URI }, position: { line: 4, character: 3 } });
    const labels = (Array.isArray(items) ? items : items?.items ?? []).map((i) => i.label).sort();
    expect(labels).toEqual(['0', 'XYZ', 'gate', 'signal']);
  });
});
