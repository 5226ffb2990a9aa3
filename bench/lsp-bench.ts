/**
 * Edit-to-diagnostics latency over the protocol: the real server process (`rectilens lsp --stdio`),
 * a generated 5,000-line netlist with 50 rectifiers, one-character edits, time from sending the
 * change to receiving the diagnostics published for it. Also the server's memory on 100,000 lines.
 */
import { spawn } from 'node:child_process';
import { resolve } from 'node:path';
import {
  createProtocolConnection, DidChangeTextDocumentNotification, DidOpenTextDocumentNotification, InitializedNotification, InitializeRequest,
  PublishDiagnosticsNotification, StreamMessageReader, StreamMessageWriter, type ProtocolConnection,
} from 'vscode-languageserver-protocol/node';
import { generateNetlist } from './generate-netlist';
import { percentile, type BenchFigure } from './measure';

interface Server {
  connection: ProtocolConnection;
  pid: number;
  nextPublish(): Promise<void>;
  stop(): Promise<void>;
}

async function startServer(): Promise<Server> {
  const child = spawn(process.execPath, [resolve(__dirname, 'cli.js'), 'lsp', '--stdio'], { stdio: ['pipe', 'pipe', 'inherit'] });
  const connection = createProtocolConnection(new StreamMessageReader(child.stdout!), new StreamMessageWriter(child.stdin!));
  let waiter: (() => void) | undefined;
  connection.onNotification(PublishDiagnosticsNotification.type, () => waiter?.());
  connection.listen();
  await connection.sendRequest(InitializeRequest.type, { processId: process.pid, rootUri: null, workspaceFolders: null, capabilities: {} });
  await connection.sendNotification(InitializedNotification.type, {});
  return {
    connection,
    pid: child.pid!,
    nextPublish: () => new Promise<void>((r) => (waiter = r)),
    async stop() {
      await connection.sendRequest('shutdown').catch(() => undefined);
      await connection.sendNotification('exit').catch(() => undefined);
      connection.dispose();
      if (child.exitCode === null) await new Promise((r) => child.once('exit', r));
    },
  };
}

/** Generates a netlist of about `lines` lines with `rectifiers` bridges spread through it. */
function netlistWith(lines: number, rectifiers: number): string {
  const blocks = Math.ceil(lines / 7);
  return generateNetlist(lines, Math.max(1, Math.floor(blocks / rectifiers)));
}

export async function runLspBench(edits = 60): Promise<BenchFigure[]> {
  const server = await startServer();
  const uri = 'file:///bench/large.cir';
  const text = netlistWith(5000, 50);
  const rectifierCount = (text.match(/^\* rectifier /gm) ?? []).length;
  const opened = server.nextPublish();
  const openStart = process.hrtime.bigint();
  await server.connection.sendNotification(DidOpenTextDocumentNotification.type, { textDocument: { uri, languageId: 'netlist', version: 1, text } });
  await opened;
  const firstMs = Number(process.hrtime.bigint() - openStart) / 1e6;
  const lines = text.split('\n');
  const fillerLine = lines.findIndex((l) => l.startsWith('R') && l.includes('4.7k'));
  const latencies: number[] = [];
  for (let v = 2; v < edits + 2; v++) {
    // Alternate a filler resistor's value; its line keeps its length so ranges stay simple.
    const value = v % 2 ? '4.7k' : '4.8k';
    const at = lines[fillerLine]!.indexOf('4.');
    const published = server.nextPublish();
    const start = process.hrtime.bigint();
    await server.connection.sendNotification(DidChangeTextDocumentNotification.type, {
      textDocument: { uri, version: v },
      contentChanges: [{ range: { start: { line: fillerLine, character: at }, end: { line: fillerLine, character: at + 4 } }, text: value }],
    });
    await published;
    latencies.push(Number(process.hrtime.bigint() - start) / 1e6);
  }
  await server.stop();
  const memory = await measureServerMemory();
  return [
    { name: 'netlist for latency', value: lines.length, unit: 'lines', note: `${rectifierCount} rectifiers` },
    { name: 'first analysis after open', value: firstMs, unit: 'ms' },
    { name: `edit → diagnostics p50 (${edits} edits)`, value: percentile(latencies, 50), unit: 'ms' },
    { name: `edit → diagnostics p95 (${edits} edits)`, value: percentile(latencies, 95), unit: 'ms', target: '≤ 50 ms', met: percentile(latencies, 95) <= 50 },
    { name: 'server RSS, 100,000-line netlist open', value: memory, unit: 'MB', target: '≤ 150 MB', met: memory <= 150 },
  ];
}

/** Resident memory of the server process after it has analysed a 100,000-line netlist, from /proc. */
async function measureServerMemory(): Promise<number> {
  const server = await startServer();
  const text = generateNetlist(100_000);
  const published = server.nextPublish();
  await server.connection.sendNotification(DidOpenTextDocumentNotification.type, { textDocument: { uri: 'file:///bench/huge.cir', languageId: 'netlist', version: 1, text } });
  await published;
  const { readFileSync } = await import('node:fs');
  const status = readFileSync(`/proc/${server.pid}/status`, 'utf8');
  const rssKb = Number(/VmRSS:\s+(\d+)/.exec(status)?.[1] ?? 0);
  await server.stop();
  return rssKb / 1024;
}
