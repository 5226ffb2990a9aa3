/**
 * A protocol client for tests: starts the real server process (`rectilens lsp --stdio`) and talks
 * to it with vscode-languageserver-protocol over its standard streams.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { resolve } from 'node:path';
import {
  createProtocolConnection, DidChangeTextDocumentNotification, DidOpenTextDocumentNotification, InitializedNotification,
  InitializeRequest, PublishDiagnosticsNotification, StreamMessageReader, StreamMessageWriter, type Diagnostic,
  type ProtocolConnection, type PublishDiagnosticsParams,
} from 'vscode-languageserver-protocol/node';

export interface TestClient {
  connection: ProtocolConnection;
  process: ChildProcess;
  open(uri: string, text: string): Promise<Diagnostic[]>;
  change(uri: string, version: number, changes: { range?: { start: { line: number; character: number }; end: { line: number; character: number } }; text: string }[]): Promise<Diagnostic[]>;
  /** The next diagnostics published for a uri. */
  nextDiagnostics(uri: string): Promise<Diagnostic[]>;
  /** Every publication from now on, for tests that count them. */
  onDiagnostics(listener: (params: PublishDiagnosticsParams) => void): void;
  close(): Promise<void>;
}

export interface TestClientOptions {
  workspaceFolder?: string;
  /** Several workspace folders (instead of `workspaceFolder`). */
  workspaceFolders?: string[];
  /** Answers `workspace/configuration` (the client then announces the capability): one value per item asked. */
  configuration?: (item: { scopeUri?: string; section?: string }) => unknown;
  initializationOptions?: unknown;
  env?: Record<string, string>;
  /** A command the server runs under, e.g. `['strace', '-f', '-o', log]`; the node command line follows it. */
  wrap?: string[];
  /** Client capabilities beyond the defaults (e.g. `workspace.inlayHint.refreshSupport`). */
  capabilities?: Record<string, unknown>;
  /** Options for node before the script, e.g. `['--require', spy]`. */
  nodeArgs?: string[];
}

export async function startTestClient(options: TestClientOptions = {}): Promise<TestClient> {
  const cli = resolve(__dirname, '../../dist/cli.js');
  const command = [...(options.wrap ?? []), process.execPath, ...(options.nodeArgs ?? []), cli, 'lsp', '--stdio'];
  const child = spawn(command[0]!, command.slice(1), { stdio: ['pipe', 'pipe', 'inherit'], env: { ...process.env, ...options.env } });
  const connection = createProtocolConnection(new StreamMessageReader(child.stdout!), new StreamMessageWriter(child.stdin!));
  const waiting = new Map<string, ((d: Diagnostic[]) => void)[]>();
  const listeners: ((params: PublishDiagnosticsParams) => void)[] = [];
  connection.onNotification(PublishDiagnosticsNotification.type, (params: PublishDiagnosticsParams) => {
    listeners.forEach((listener) => listener(params));
    const queue = waiting.get(params.uri);
    queue?.shift()?.(params.diagnostics);
  });
  const answer = options.configuration;
  if (answer) connection.onRequest('workspace/configuration', (params: { items: { scopeUri?: string; section?: string }[] }) => params.items.map(answer));
  connection.listen();
  const folders = options.workspaceFolders ?? (options.workspaceFolder ? [options.workspaceFolder] : []);
  await connection.sendRequest(InitializeRequest.type, {
    processId: process.pid,
    rootUri: folders[0] ?? null,
    workspaceFolders: folders.length ? folders.map((uri, k) => ({ uri, name: `workspace${k}` })) : null,
    capabilities: {
      textDocument: { rename: { prepareSupport: true } }, ...options.capabilities,
      ...(answer ? { workspace: { configuration: true, ...(options.capabilities?.workspace as object | undefined) } } : {}),
    },
    initializationOptions: options.initializationOptions,
  });
  await connection.sendNotification(InitializedNotification.type, {});
  const nextDiagnostics = (uri: string) =>
    new Promise<Diagnostic[]>((resolveDiagnostics) => {
      const queue = waiting.get(uri) ?? [];
      queue.push(resolveDiagnostics);
      waiting.set(uri, queue);
    });
  return {
    connection,
    process: child,
    nextDiagnostics,
    onDiagnostics: (listener) => listeners.push(listener),
    async open(uri, text) {
      const next = nextDiagnostics(uri);
      await connection.sendNotification(DidOpenTextDocumentNotification.type, { textDocument: { uri, languageId: 'netlist', version: 1, text } });
      return next;
    },
    async change(uri, version, changes) {
      const next = nextDiagnostics(uri);
      await connection.sendNotification(DidChangeTextDocumentNotification.type, { textDocument: { uri, version }, contentChanges: changes as never });
      return next;
    },
    async close() {
      await connection.sendRequest('shutdown').catch(() => undefined);
      await connection.sendNotification('exit').catch(() => undefined);
      connection.dispose();
      if (child.exitCode === null) await new Promise((r) => child.once('exit', r));
    },
  };
}
