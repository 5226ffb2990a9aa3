/**
 * The soak: a random edit session against the real server process over incremental sync —
 * thousands of inserts, deletions and replacements at random ranges (multi-line ones, continuation
 * lines, CRLF, surrogate pairs included), with editor requests (hover, hints, lenses, symbols,
 * quick fixes) sent as an editor would while typing, some cancelled at once. After every batch the
 * server's copy (`rectilens/documentText`) must equal the client's; at the end every request must
 * have been answered (a cancelled one as cancelled or with its result), the process must be alive,
 * and its memory must not have run away. `npm test` runs 2,000 edits; `npm run soak` runs 10,000.
 */
import { readFileSync } from 'node:fs';
import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  CancellationTokenSource, CodeActionRequest, CodeLensRequest, DidChangeTextDocumentNotification, DocumentSymbolRequest, HoverRequest,
  InlayHintRequest, LSPErrorCodes, ResponseError,
} from 'vscode-languageserver-protocol/node';
import { startTestClient, type TestClient } from '../lsp/protocol-client';
import { FUZZ_SEED, runs, timeoutFor } from './fuzz-config';
import { netlistText } from './netlist-arbitrary';

const EDITS = process.env.RECTILENS_SOAK ? 10_000 : runs(2000);
/** One editor request after every this many edits; every fifth of them is cancelled at once. */
const REQUEST_EVERY = 5;
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

interface RequestLog {
  latenciesMs: number[];
  cancelledAsked: number;
  cancelledAnswered: number;
  failures: string[];
  pending: Set<Promise<void>>;
}

/** Sends one of the editor's requests at an offset, and logs how and how fast it was answered. */
function sendRequest(log: RequestLog, index: number, text: string, offset: number): void {
  const textDocument = { uri: URI };
  const position = positionAt(text, offset);
  const range = { start: position, end: positionAt(text, Math.min(text.length, offset + 200)) };
  const cancel = index % 5 === 4 ? new CancellationTokenSource() : undefined;
  const connection = client.connection;
  const requests = [
    () => connection.sendRequest(HoverRequest.type, { textDocument, position }, cancel?.token),
    () => connection.sendRequest(InlayHintRequest.type, { textDocument, range }, cancel?.token),
    () => connection.sendRequest(CodeLensRequest.type, { textDocument }, cancel?.token),
    () => connection.sendRequest(DocumentSymbolRequest.type, { textDocument }, cancel?.token),
    () => connection.sendRequest(CodeActionRequest.type, { textDocument, range, context: { diagnostics: [] } }, cancel?.token),
  ];
  const sent = performance.now();
  const answer = requests[index % requests.length]!();
  if (cancel) {
    log.cancelledAsked++;
    cancel.cancel();
  }
  const done = answer.then(
    () => { log.latenciesMs.push(performance.now() - sent); },
    (error: unknown) => {
      if (cancel && error instanceof ResponseError && error.code === LSPErrorCodes.RequestCancelled) log.cancelledAnswered++;
      else log.failures.push(String(error));
    },
  ).finally(() => log.pending.delete(done));
  log.pending.add(done);
}

function percentile(values: number[], p: number): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.min(sorted.length - 1, Math.floor(p * sorted.length))] ?? Number.NaN;
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
    let rssMiddle = rssStart;
    const log: RequestLog = { latenciesMs: [], cancelledAsked: 0, cancelledAnswered: 0, failures: [], pending: new Set() };
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
      if (k % REQUEST_EVERY === 0) sendRequest(log, k / REQUEST_EVERY, text, Math.floor(at * text.length));
      if (k === Math.floor(edits.length / 2)) rssMiddle = rssKiB(pid);
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
    // Every request is answered once the last analysis is out: none is dropped or left hanging.
    await Promise.all([...log.pending]);
    expect(log.failures).toEqual([]);
    expect(log.latenciesMs.length + log.cancelledAnswered).toBe(Math.ceil(edits.length / REQUEST_EVERY));
    // Cancellation is honoured: requests cancelled at once come back as cancelled (the rest of
    // them may have been answered before the cancellation arrived, which is also correct).
    expect(log.cancelledAnswered).toBeGreaterThan(0);
    const rssEnd = rssKiB(pid);
    const mb = (kib: number) => Math.round(kib / 1024);
    console.info(`soak: ${EDITS} edits, ${log.latenciesMs.length} requests answered (p50 ${percentile(log.latenciesMs, 0.5).toFixed(1)} ms, ` +
      `p95 ${percentile(log.latenciesMs, 0.95).toFixed(1)} ms, max ${Math.max(...log.latenciesMs).toFixed(1)} ms), ` +
      `${log.cancelledAnswered} of ${log.cancelledAsked} cancelled ones answered as cancelled; ` +
      `server RSS ${mb(rssStart)} MB at the start, ${mb(rssMiddle)} MB in the middle, ${mb(rssEnd)} MB at the end`);
    // Generous: a leak of the text or of every analysis would pass this within a few thousand edits.
    expect(rssEnd).toBeLessThan(rssStart + 200 * 1024);
  }, timeoutFor(EDITS, 60));
});
