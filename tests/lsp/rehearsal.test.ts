/**
 * The worker rehearses a newly opened root's analysis in idle time (lsp/analysis-worker.ts
 * `rehearseWhenIdle`) so that the first edits run warm code. Timing only: an edit made after the
 * rehearsals gets the answers a server that never rehearsed gives for the same text.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { InlayHintRequest } from 'vscode-languageserver-protocol/node';
import { startTestClient, type TestClient } from './protocol-client';

const URI = 'file:///w/rehearsed.cir';
const TEXT = readFileSync(join(__dirname, '../../examples/led-driver-230v.cir'), 'utf8');
const COMMENT = '* a comment above every card: each offset moves\n';
const EDITED = TEXT.replace('\n', `\n${COMMENT}`);
const wholeFile = { start: { line: 0, character: 0 }, end: { line: 10_000, character: 0 } };

const clients: TestClient[] = [];
afterAll(async () => {
  await Promise.all(clients.map((c) => c.close()));
});

async function answers(client: TestClient, diagnostics: Promise<unknown>) {
  return { diagnostics: await diagnostics, hints: await client.connection.sendRequest(InlayHintRequest.type, { textDocument: { uri: URI }, range: wholeFile }) };
}

describe('rehearsals after an open', () => {
  it('leave the answers to the next edit as they are', async () => {
    const rehearsed = await startTestClient();
    const fresh = await startTestClient();
    clients.push(rehearsed, fresh);
    await rehearsed.open(URI, TEXT);
    // Past the quiet time and long enough for the rehearsals of this small file.
    await new Promise((r) => setTimeout(r, 1500));
    const edited = await answers(rehearsed, rehearsed.change(URI, 2, [{ range: { start: { line: 1, character: 0 }, end: { line: 1, character: 0 } }, text: COMMENT }]));
    const expected = await answers(fresh, fresh.open(URI, EDITED));
    expect((edited.hints ?? []).length).toBeGreaterThan(0);
    expect(edited).toEqual(expected);
  });
});
