/**
 * Random edit sessions against the real server process over incremental sync: thousands of inserts,
 * deletions and replacements at random ranges (multi-line ones, continuation lines, CRLF, surrogate
 * pairs included). After every batch the server's copy (`rectilens/documentText`) must equal the
 * client's, the process must be alive, and at the end its memory must not have run away.
 */
import { readFileSync } from 'node:fs';
import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DidChangeTextDocumentNotification } from 'vscode-languageserver-protocol/node';
import { startTestClient, type TestClient } from '../lsp/protocol-client';
import { FUZZ_SEED, runs, timeoutFor } from './fuzz-config';
import { netlistText } from './netlist-arbitrary';

const EDITS = runs(3000);
const CHECK_EVERY = 20;
const URI = 'file:///fuzz/session.cir';

/** An edit as fractions of the current text, so one sample serves whatever the text has become. */
const editArb = fc.record({
  at: fc.double({ min: 0, max: 1, noNaN: true }),
  // Mostly short ranges; sometimes long ones that span many lines.
  length: fc.oneof({ weight: 4, arbitrary: fc.nat(6) }, { weight: 1, arbitrary: fc.nat(400) }),
  insert: fc.oneof(
    fc.constantFrom('', '', 'x', ' ', '\n', '\r\n', '\n+ ', '\n+', 'D9 a b DM', '.subckt S a\n', '.ends\n', '*@ mains 230V 50Hz\n', '{1+', '}', '"', 'µ', '😀', '\t'),
    fc.string({ maxLength: 12 }),
  ),
});

/** Line and UTF-16 character of an offset, lines ending at \r\n, \r or \n (LSP's definition). */
function positionAt(text: string, offset: number): { line: number; character: number } {
  let line = 0;
  let start = 0;
  for (let k = 0; k < offset; k++) {
    const c = text.charCodeAt(k);
    if (c === 13 && text.charCodeAt(k + 1) === 10) k++;
    if (c === 10 || c === 13) { line++; start = k + 1; }
  }
  return { line, character: offset - start };
}

/** `offset`, or the offset just before a \r\n pair that it would split. */
function offPair(text: string, offset: number): number {
  return text.charCodeAt(offset - 1) === 13 && text.charCodeAt(offset) === 10 ? offset - 1 : offset;
}

function rssKiB(pid: number): number {
  const match = /VmRSS:\s+(\d+) kB/.exec(readFileSync(`/proc/${pid}/status`, 'utf8'));
  if (!match) throw new Error('no VmRSS');
  return Number(match[1]);
}

let client: TestClient;
beforeAll(async () => {
  client = await startTestClient();
});
afterAll(async () => {
  await client.close();
});

describe('random edit sessions over the protocol', () => {
  it(`${EDITS} incremental edits: the server's text equals the client's after every ${CHECK_EVERY}; no crash; bounded memory`, async () => {
    let text = fc.sample(netlistText, { seed: FUZZ_SEED, numRuns: 1 })[0]!;
    await client.open(URI, text);
    const pid = client.process.pid!;
    const rssStart = rssKiB(pid);
    const edits = fc.sample(editArb, { seed: FUZZ_SEED + 20, numRuns: EDITS });
    let version = 1;
    for (let k = 0; k < edits.length; k++) {
      const { at, length, insert } = edits[k]!;
      // A protocol position cannot point between \r and \n (a line ends before its line break), so
      // an editor never sends such a range; the offsets are moved off the middle of a pair.
      const start = offPair(text, Math.floor(at * (text.length + 1)));
      const end = offPair(text, Math.min(text.length, start + length));
      const range = { start: positionAt(text, start), end: positionAt(text, end) };
      text = text.slice(0, start) + insert + text.slice(end);
      await client.connection.sendNotification(DidChangeTextDocumentNotification.type, { textDocument: { uri: URI, version: ++version }, contentChanges: [{ range, text: insert }] });
      if (k % CHECK_EVERY === CHECK_EVERY - 1 || k === edits.length - 1) {
        const server = await client.connection.sendRequest<{ version: number; text: string } | null>('rectilens/documentText', { uri: URI });
        expect(server, `after edit ${k}`).toEqual({ version, text });
      }
      // Now and then wait for the analysis of the text as it stands, so the analyser runs on many
      // intermediate (mostly broken) states, not only on the last one.
      if (k % 100 === 99) await client.change(URI, ++version, [{ range: { start: positionAt(text, 0), end: positionAt(text, 0) }, text: '' }]);
      // Keep the document from growing without end, as a user would trim it.
      if (text.length > 20_000) {
        const range = { start: positionAt(text, 0), end: positionAt(text, text.length) };
        text = text.slice(0, 4_000);
        await client.connection.sendNotification(DidChangeTextDocumentNotification.type, { textDocument: { uri: URI, version: ++version }, contentChanges: [{ range, text }] });
      }
    }
    // The last analysis still arrives: the server is alive and answering.
    const diagnostics = await client.change(URI, ++version, [{ range: { start: positionAt(text, 0), end: positionAt(text, 0) }, text: '' }]);
    expect(Array.isArray(diagnostics)).toBe(true);
    expect(client.process.exitCode).toBeNull();
    const rssEnd = rssKiB(pid);
    console.info(`edit session: ${EDITS} edits, server RSS ${Math.round(rssStart / 1024)} MB at the start, ${Math.round(rssEnd / 1024)} MB at the end`);
    // Generous: a leak of the text or of every analysis would pass this within a few thousand edits.
    expect(rssEnd).toBeLessThan(rssStart + 200 * 1024);
  }, timeoutFor(EDITS, 60));
});
