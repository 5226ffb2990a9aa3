import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  CodeActionRequest, CodeLensRequest, HoverRequest, InlayHintRequest, type CodeAction, type Diagnostic, type MarkupContent,
  type TextEdit,
} from 'vscode-languageserver-protocol/node';
import { startTestClient, type TestClient } from './protocol-client';

// A 12 V bridge of our own invention, with one diode reversed (D3) for the quick-fix check.
const URI = 'file:///work/demo/features.cir';
const TEXT = `Features fixture (our own)
*@ mains 12V 50Hz tol=-10%,+10%
*@ rate DG vrrm=100V ifav=1A tjmax=150C rthja=80
V1 a b SIN(0 17 50)
D1 a p DG
D2 b p DG
D3 a n DG
D4 n b DG
C1 p n 2200u
R1 p n 24
.model DG D(IS=2.5n N=1.75 RS=0.04)
`;

let client: TestClient;
let diagnostics: Diagnostic[];
beforeAll(async () => {
  client = await startTestClient();
  diagnostics = await client.open(URI, TEXT);
});
afterAll(async () => {
  await client.close();
});

const at = (line: number, character: number) => ({ line, character });

describe('analysis features over the protocol', () => {
  it('reports the reversed device with its fix, and applying the fix makes it go', async () => {
    const reversed = diagnostics.find((d) => d.code === 'reversed-device');
    expect(reversed).toBeDefined();
    expect(reversed!.range.start.line).toBe(6);
    const actions = (await client.connection.sendRequest(CodeActionRequest.type, {
      textDocument: { uri: URI }, range: reversed!.range, context: { diagnostics: [reversed!] },
    })) as CodeAction[];
    const swap = actions.find((a) => /swap/i.test(a.title));
    expect(swap).toBeDefined();
    const edits = swap!.edit!.changes![URI]! as TextEdit[];
    const lines = TEXT.split('\n');
    // Apply the edits to line 6 from right to left.
    let line = lines[6]!;
    for (const e of [...edits].sort((x, y) => y.range.start.character - x.range.start.character)) {
      line = line.slice(0, e.range.start.character) + e.newText + line.slice(e.range.end.character);
    }
    expect(line).toBe('D3 n a DG');
    const after = await client.change(URI, 2, [{ range: { start: at(6, 0), end: at(6, lines[6]!.length) }, text: line }]);
    expect(after.some((d) => d.code === 'reversed-device')).toBe(false);
  });

  it('hovers a bridge diode with its stress table and the corner of each worst value', async () => {
    const hover = await client.connection.sendRequest(HoverRequest.type, { textDocument: { uri: URI }, position: at(4, 1) });
    const text = (hover!.contents as MarkupContent).value;
    expect(text).toContain('**D1**');
    expect(text).toMatch(/\| PIV \| [\d.]+ V \| [\d.]+ V \| high-line/);
    expect(text).toContain('VRRM 100 V');
    expect(text).toContain('diode bridge');
  });

  it('shows inlay hints with PIV against the rating and the loss at the end of each device card', async () => {
    const hints = await client.connection.sendRequest(InlayHintRequest.type, { textDocument: { uri: URI }, range: { start: at(0, 0), end: at(12, 0) } });
    expect(hints!.map((h) => h.position.line)).toEqual([4, 5, 6, 7]);
    for (const hint of hints!) expect(String(hint.label)).toMatch(/^PIV \d+(\.\d+)?\/100 V · [\d.]+ m?W · Tj \d+ °C$/);
  });

  it('puts a code lens above the rectifier with its kind, efficiency, ripple and power factor, and the two view commands', async () => {
    const lenses = await client.connection.sendRequest(CodeLensRequest.type, { textDocument: { uri: URI } });
    const titles = lenses!.map((l) => l.command!.title);
    expect(titles[0]).toMatch(/^diode bridge · η [\d.]+ % · ripple [\d.]+ V p-p · PF 0\.\d+ · inrush [\d.]+ A$/);
    expect(lenses!.map((l) => l.command!.command)).toEqual(['', 'rectilens.showWaveforms', 'rectilens.compareTopologies']);
    expect(lenses![1]!.range.start.line).toBe(4);
  });
});


describe('hover for an editor that reads plaintext only', () => {
  it('answers in plaintext, without Markdown marks (LSP 3.0 hover contentFormat)', async () => {
    const plain = await startTestClient({ capabilities: { textDocument: { hover: { contentFormat: ['plaintext'] } } } });
    try {
      await plain.open(URI, TEXT);
      const hover = await plain.connection.sendRequest(HoverRequest.type, { textDocument: { uri: URI }, position: at(4, 1) });
      const contents = hover!.contents as MarkupContent;
      expect(contents.kind).toBe('plaintext');
      expect(contents.value).toContain('D1');
      expect(contents.value).not.toMatch(/\*\*|`/);
    } finally {
      await plain.close();
    }
  });
});
