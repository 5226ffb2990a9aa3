import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  CompletionRequest, DefinitionRequest, DidChangeTextDocumentNotification, DocumentSymbolRequest, FoldingRangeRequest, PrepareRenameRequest, ReferencesRequest,
  RenameRequest, type DocumentSymbol, type Location,
} from 'vscode-languageserver-protocol/node';
import { startTestClient, type TestClient } from './protocol-client';

const URI = 'file:///work/demo/bridge.cir';
const TEXT = `Bridge over the protocol (a fixture of our own)
*@ mains 230V 50Hz
.subckt BR a b p n
D1 a p DX
D2 b p DX
D3 n a DX
D4 n b DX
.ends BR
V1 ac1 ac2 SIN(0 325 50)
X1 ac1 ac2 out 0 BR
C1 out 0 100u
R1 out 0 4k7
.model DX D(IS=1n N=1.8)
`;

let client: TestClient;
beforeAll(async () => {
  client = await startTestClient();
});
afterAll(async () => {
  await client.close();
});

const at = (line: number, character: number) => ({ line, character });

describe('language server over stdio', () => {
  it('publishes diagnostics on open, with code and source', async () => {
    const diagnostics = await client.open(URI, TEXT);
    const rkm = diagnostics.find((d) => d.code === 'value-notation');
    expect(rkm).toMatchObject({ source: 'rectilens', range: { start: at(11, 9), end: at(11, 12) }, severity: 2 });
  });

  it('updates diagnostics after an incremental edit', async () => {
    // Replace "4k7" by "4.7k": the warning goes.
    const after = await client.change(URI, 2, [{ range: { start: at(11, 9), end: at(11, 12) }, text: '4.7k' }]);
    expect(after.some((d) => d.code === 'value-notation')).toBe(false);
    // Break a card: one error on the broken token.
    const broken = await client.change(URI, 3, [{ range: { start: at(10, 0), end: at(10, 14) }, text: 'C1 out 0 )' }]);
    expect(broken.filter((d) => d.severity === 1)).toMatchObject([{ range: { start: at(10, 9), end: at(10, 10) } }]);
    const fixed = await client.change(URI, 4, [{ range: { start: at(10, 0), end: at(10, 10) }, text: 'C1 out 0 100u' }]);
    expect(fixed.filter((d) => d.severity === 1)).toEqual([]);
  });

  it('answers document symbols with the subcircuit and its parts', async () => {
    const symbols = (await client.connection.sendRequest(DocumentSymbolRequest.type, { textDocument: { uri: URI } })) as DocumentSymbol[];
    const br = symbols.find((s) => s.name === 'BR')!;
    expect(br.children!.map((c) => c.name)).toEqual(['D1', 'D2', 'D3', 'D4']);
    expect(symbols.map((s) => s.name)).toEqual(expect.arrayContaining(['V1', 'DX']));
  });

  it('goes to the definition of a model and a subcircuit, and finds references', async () => {
    const model = (await client.connection.sendRequest(DefinitionRequest.type, { textDocument: { uri: URI }, position: at(3, 7) })) as Location[];
    expect(model).toMatchObject([{ uri: URI, range: { start: at(12, 7), end: at(12, 9) } }]);
    const sub = (await client.connection.sendRequest(DefinitionRequest.type, { textDocument: { uri: URI }, position: at(9, 18) })) as Location[];
    expect(sub[0]!.range.start).toEqual(at(2, 8));
    const refs = await client.connection.sendRequest(ReferencesRequest.type, {
      textDocument: { uri: URI }, position: at(12, 8), context: { includeDeclaration: false },
    });
    expect(refs!.map((r) => r.range.start.line)).toEqual([3, 4, 5, 6]);
  });

  it('renames a node everywhere in its scope and refuses ground', async () => {
    const edit = await client.connection.sendRequest(RenameRequest.type, { textDocument: { uri: URI }, position: at(9, 12), newName: 'vbus' });
    expect(edit!.changes![URI]!.map((e) => e.range.start.line)).toEqual([9, 10, 11]);
    const ground = await client.connection.sendRequest(PrepareRenameRequest.type, { textDocument: { uri: URI }, position: at(10, 7) });
    expect(ground).toBeNull();
    await expect(client.connection.sendRequest(RenameRequest.type, { textDocument: { uri: URI }, position: at(9, 12), newName: 'two words' }))
      .rejects.toThrow(/not a valid netlist name/);
  });

  it('completes directive keywords, rating keys and model names', async () => {
    const uri = 'file:///work/demo/complete.cir';
    await client.open(uri, 't\n*@ \n*@ rate DX v\nD9 a b \n.model DX D\n');
    const directives = await client.connection.sendRequest(CompletionRequest.type, { textDocument: { uri }, position: at(1, 3) });
    expect((directives as { label: string }[]).map((i) => i.label)).toEqual(['mains', 'ambient', 'load', 'rate', 'derate', 'allow', 'profile']);
    const keys = (await client.connection.sendRequest(CompletionRequest.type, { textDocument: { uri }, position: at(2, 12) })) as { label: string }[];
    expect(keys.map((i) => i.label)).toContain('vrrm');
    const models = (await client.connection.sendRequest(CompletionRequest.type, { textDocument: { uri }, position: at(3, 7) })) as { label: string }[];
    expect(models.map((i) => i.label)).toEqual(['DX']);
  });

  it('folds the subcircuit block', async () => {
    const folds = await client.connection.sendRequest(FoldingRangeRequest.type, { textDocument: { uri: URI } });
    expect(folds).toContainEqual(expect.objectContaining({ startLine: 2, endLine: 7 }));
  });

  it('coalesces a burst of edits: newer edits cancel older analyses, the last text wins', async () => {
    const uri = 'file:///work/demo/burst.cir';
    await client.open(uri, 't\nR1 a 0 1\n');
    const seen: string[] = [];
    const final = new Promise<void>((resolveFinal) =>
      client.onDiagnostics((p) => {
        if (p.uri !== uri) return;
        seen.push(p.diagnostics.map((d) => String(d.message)).join('|'));
        if (p.diagnostics.some((d) => String(d.message).includes('read as 2.2'))) resolveFinal();
      }),
    );
    for (let v = 2; v <= 40; v++) {
      const value = v === 40 ? '2R2' : v % 2 ? '1k' : '4k7';
      await client.connection.sendNotification(DidChangeTextDocumentNotification.type, {
        textDocument: { uri, version: v }, contentChanges: [{ text: `t\nR1 a 0 ${value}\n` }],
      });
    }
    await final;
    expect(seen.length).toBeLessThan(39);
    expect(seen[seen.length - 1]).toMatch(/read as 2\.2/);
  });

});
