/**
 * The language-server bench's client: the real server process (`rectilens lsp --stdio`) driven over
 * the protocol, with diagnostics awaited by the document version they carry and inlay hints
 * checked against the text they must describe.
 */
import { spawn } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import {
  createProtocolConnection, DidChangeTextDocumentNotification, DidOpenTextDocumentNotification, InitializedNotification, InitializeRequest,
  InlayHintRequest, PublishDiagnosticsNotification, StreamMessageReader, StreamMessageWriter, type InlayHint, type ProtocolConnection,
  type TextDocumentContentChangeEvent,
} from 'vscode-languageserver-protocol/node';

export interface LspSession {
  readonly pid: number;
  open(uri: string, text: string): Promise<void>;
  change(uri: string, version: number, changes: TextDocumentContentChangeEvent[]): Promise<void>;
  /** Resolves once diagnostics for `version` (or a later one) of `uri` are published. */
  diagnosticsFor(uri: string, version: number): Promise<void>;
  hints(uri: string, fromLine: number, toLine: number): Promise<InlayHint[]>;
  /** Resident memory of the server process (its worker thread included), from /proc. */
  rssMb(): number;
  /** CPU time the server process has used so far, every thread (user + system), from /proc; 10 ms steps. */
  cpuMs(): number;
  stop(): Promise<void>;
}

export async function startSession(): Promise<LspSession> {
  // BENCH_SERVER_NODE_ARGS: options for the server's node, e.g. `--cpu-prof` to see where an edit's time goes.
  const nodeArgs = process.env.BENCH_SERVER_NODE_ARGS?.split(' ').filter(Boolean) ?? [];
  // BENCH_SERVER_DIR: another build's dist/ (e.g. a copy of the previous one) to compare against.
  const cli = resolve(process.env.BENCH_SERVER_DIR ?? __dirname, 'cli.js');
  const child = spawn(process.execPath, [...nodeArgs, cli, 'lsp', '--stdio'], { stdio: ['pipe', 'pipe', 'inherit'] });
  const connection: ProtocolConnection = createProtocolConnection(new StreamMessageReader(child.stdout!), new StreamMessageWriter(child.stdin!));
  const published = new Map<string, number>();
  const waiters: { uri: string; version: number; wake: () => void }[] = [];
  connection.onNotification(PublishDiagnosticsNotification.type, ({ uri, version }) => {
    if (version === undefined) return;
    published.set(uri, Math.max(version, published.get(uri) ?? 0));
    for (const w of waiters.filter((w) => w.uri === uri && w.version <= version)) {
      waiters.splice(waiters.indexOf(w), 1);
      w.wake();
    }
  });
  connection.listen();
  await connection.sendRequest(InitializeRequest.type, { processId: process.pid, rootUri: null, workspaceFolders: null, capabilities: {} });
  await connection.sendNotification(InitializedNotification.type, {});
  return {
    pid: child.pid!,
    open: (uri, text) => connection.sendNotification(DidOpenTextDocumentNotification.type, { textDocument: { uri, languageId: 'netlist', version: 1, text } }),
    change: (uri, version, contentChanges) => connection.sendNotification(DidChangeTextDocumentNotification.type, { textDocument: { uri, version }, contentChanges }),
    diagnosticsFor(uri, version) {
      if ((published.get(uri) ?? 0) >= version) return Promise.resolve();
      return new Promise((wake) => waiters.push({ uri, version, wake }));
    },
    async hints(uri, fromLine, toLine) {
      const range = { start: { line: fromLine, character: 0 }, end: { line: toLine, character: 0 } };
      return (await connection.sendRequest(InlayHintRequest.type, { textDocument: { uri }, range })) ?? [];
    },
    rssMb() {
      const status = readFileSync(`/proc/${child.pid}/status`, 'utf8');
      return Number(/VmRSS:\s+(\d+)/.exec(status)?.[1] ?? 0) / 1024;
    },
    cpuMs() {
      // Fields 14 and 15 of /proc/<pid>/stat, in clock ticks (100 per second on Linux), after the command name.
      const stat = readFileSync(`/proc/${child.pid}/stat`, 'utf8');
      const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
      return (Number(fields[11]) + Number(fields[12])) * 10;
    },
    async stop() {
      await connection.sendRequest('shutdown').catch(() => undefined);
      await connection.sendNotification('exit').catch(() => undefined);
      connection.dispose();
      if (child.exitCode === null) await new Promise((r) => child.once('exit', r));
    },
  };
}

/**
 * A text being edited, with the document versions the edits make. Edits insert or delete whole
 * comment lines above the watched range, so every hint below moves by a line: a hint answer made
 * from an older text puts its hints on the wrong lines, which is how freshness is checked.
 */
export class EditedText {
  lines: string[];
  version = 1;
  private inserted = 0;

  constructor(text: string, private readonly at: number) {
    this.lines = text.split('\n');
  }

  get text(): string {
    return this.lines.join('\n');
  }

  /** Alternately inserts a comment line at `at` and deletes it again. */
  shiftEdit(): TextDocumentContentChangeEvent {
    this.version++;
    if (this.inserted === 0) {
      this.lines.splice(this.at, 0, `* edit ${this.version}`);
      this.inserted = 1;
      return { range: { start: { line: this.at, character: 0 }, end: { line: this.at, character: 0 } }, text: `* edit ${this.version}\n` };
    }
    this.lines.splice(this.at, 1);
    this.inserted = 0;
    return { range: { start: { line: this.at, character: 0 }, end: { line: this.at + 1, character: 0 } }, text: '' };
  }

  /** Types one character at the end of the inserted comment line (one must be there). */
  typeEdit(ch: string): TextDocumentContentChangeEvent {
    this.version++;
    const line = this.lines[this.at]!;
    this.lines[this.at] = line + ch;
    return { range: { start: { line: this.at, character: line.length }, end: { line: this.at, character: line.length } }, text: ch };
  }

  /** Replaces the first match of `pattern` on line `line` with `by` (a value typed over another). */
  replaceOnLine(line: number, pattern: RegExp, by: string): TextDocumentContentChangeEvent {
    this.version++;
    const old = this.lines[line]!;
    const match = pattern.exec(old);
    if (!match) throw new Error(`line ${line} has no ${pattern}`);
    this.lines[line] = old.slice(0, match.index) + by + old.slice(match.index + match[0].length);
    return { range: { start: { line, character: match.index }, end: { line, character: match.index + match[0].length } }, text: by };
  }

  get hasInsertedLine(): boolean {
    return this.inserted === 1;
  }

  /** Where a fresh answer puts its hints: at the end of every rectifier diode card in the range. */
  expectedHints(fromLine: number, toLine: number): string[] {
    const at: string[] = [];
    for (let l = fromLine; l <= toLine && l < this.lines.length; l++) if (/^D\d+[a-d] /.test(this.lines[l]!)) at.push(`${l}:${this.lines[l]!.length}`);
    return at;
  }
}

/** Whether a hint answer is the one for the current text (every hint where the text puts it). */
export function hintsAreFresh(hints: readonly InlayHint[], expected: readonly string[]): boolean {
  const got = hints.map((h) => `${h.position.line}:${h.position.character}`).sort();
  const want = [...expected].sort();
  return got.length === want.length && got.every((g, i) => g === want[i]);
}
