/**
 * Quick fixes over the protocol: one action per distinct edit (the four diodes of a packaged
 * bridge offer one part swap, not four), at most one preferred, the `only` filter honoured; every
 * diagnostic links its rule's page (LSP 3.16 `codeDescription`).
 */
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CodeActionRequest, type CodeAction, type Diagnostic } from 'vscode-languageserver-protocol/node';
import { startTestClient, type TestClient } from './protocol-client';
import { PACKAGED_BRIDGE } from './packaged-bridge';

const URI = 'file:///w/packaged.cir';
const TEXT = PACKAGED_BRIDGE;

let client: TestClient;
let diagnostics: Diagnostic[];
beforeAll(async () => {
  client = await startTestClient();
  diagnostics = await client.open(URI, TEXT);
});
afterAll(async () => {
  await client.close();
});

describe('code actions', () => {
  it('offers the part swap the four diodes share once, preferred once', async () => {
    const piv = diagnostics.filter((d) => d.code === 'piv-margin');
    expect(piv).toHaveLength(4);
    const actions = (await client.connection.sendRequest(CodeActionRequest.type, {
      textDocument: { uri: URI }, range: piv[0]!.range, context: { diagnostics: piv },
    })) as CodeAction[];
    const titles = actions.map((a) => a.title);
    expect(new Set(titles).size).toBe(titles.length);
    expect(titles.filter((t) => t.startsWith('Use 1N5405'))).toHaveLength(1);
    expect(actions.filter((a) => a.isPreferred).length).toBeLessThanOrEqual(1);
    const swap = actions.find((a) => a.title.startsWith('Use 1N5405'))!;
    expect(swap.diagnostics?.length).toBe(4);
  });

  it('honours `only`: a request for source actions gets none, one for quick fixes gets them', async () => {
    const piv = diagnostics.find((d) => d.code === 'piv-margin')!;
    const ask = (only: string[]) => client.connection.sendRequest(CodeActionRequest.type, {
      textDocument: { uri: URI }, range: piv.range, context: { diagnostics: [piv], only },
    }) as Promise<CodeAction[]>;
    expect(await ask(['source'])).toEqual([]);
    expect(await ask(['refactor.rewrite'])).toEqual([]);
    expect((await ask(['quickfix'])).length).toBeGreaterThan(0);
  });

  it('links every diagnostic to its rule page, a file shipped with the extension', () => {
    for (const d of diagnostics) {
      expect(d.codeDescription?.href, String(d.code)).toMatch(new RegExp(`^file://.*/docs/rules/${d.code}\\.md$`));
      expect(existsSync(fileURLToPath(d.codeDescription!.href))).toBe(true);
    }
  });
});
