/**
 * The language server: the only code that speaks the protocol. Each handler is
 * snapshot → core function → conversion; a handler that fails logs and answers empty.
 */
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import {
  CodeActionKind, CompletionItemKind, ErrorCodes, ResponseError, TextDocuments, TextDocumentSyncKind, type Connection, type InitializeParams,
  type InitializeResult,
} from 'vscode-languageserver/node';
import { TextDocument } from 'vscode-languageserver-textdocument';
import type { FileAnalysis } from '../analysis/analyze';
import { LineIndex, lineIndexOf } from '../analysis/line-index';
import { DEFAULT_SETTINGS, type AnalysisSettings } from '../analysis/settings';
import { completeAt, modelsOf } from '../features/completion';
import { findDefinition, findReferences, prepareRename, rename, type FileSet } from '../features/navigation';
import { foldingRangesOf, outlineOf } from '../features/outline';
import { AnalysisScheduler } from './analysis-scheduler';
import { toDiagnostic, toDocumentSymbol, toFoldingRange, toRange, toWorkspaceEdit } from './convert';
import { registerEditorFeatures } from './editor-features';
import { registerDocumentTextRequest } from './document-text-request';
import { isReadable, type TrustPolicy } from './trust';
import { readPartsFiles } from './parts-files';
import type { PartsFile } from '../ratings/index';

const COMPLETION_KIND = {
  keyword: CompletionItemKind.Keyword, property: CompletionItemKind.Property, model: CompletionItemKind.Class,
  subckt: CompletionItemKind.Module, node: CompletionItemKind.Variable, code: CompletionItemKind.EnumMember,
} as const;

export interface ServerContext {
  connection: Connection;
  documents: TextDocuments<TextDocument>;
  scheduler: AnalysisScheduler;
  /** The analysis of a root and of the files it includes, root first. */
  fileSet: (uri: string) => FileSet;
  linesOf: (uri: string) => LineIndex | undefined;
  settings: () => AnalysisSettings;
}

export function startServer(connection: Connection): void {
  const documents = new TextDocuments(TextDocument);
  let settings: AnalysisSettings = DEFAULT_SETTINGS;
  let trust: TrustPolicy = { trusted: true, folders: [] };
  let pullConfiguration = false;

  const readText = (uri: string): string | undefined => {
    const open = documents.get(uri);
    if (open) return open.getText();
    if (!uri.startsWith('file:') || !isReadable(uri, trust)) return undefined;
    try {
      return readFileSync(fileURLToPath(uri), 'utf8');
    } catch {
      return undefined;
    }
  };
  let partsFiles: PartsFile[] = [];
  const scheduler = new AnalysisScheduler({
    readText,
    settings: () => settings,
    partsFiles: () => partsFiles,
    onAnalysed: (file) => publish(file),
    onBusy: (busy, pending) => void connection.sendNotification('rectilens/busy', { busy, pending }),
  });
  const linesOf = (uri: string): LineIndex | undefined => {
    const analysed = scheduler.get(uri);
    if (analysed) return lineIndexOf(analysed);
    const text = readText(uri);
    return text === undefined ? undefined : new LineIndex(text);
  };
  const publish = (file: FileAnalysis) => {
    const lines = lineIndexOf(file);
    const diagnostics = file.findings.filter((f) => f.uri === file.uri).map((f) => toDiagnostic(lines, f, linesOf));
    void connection.sendDiagnostics({ uri: file.uri, diagnostics });
  };
  const fileSet = (uri: string): FileSet => {
    const root = scheduler.get(uri);
    return root ? [root] : [];
  };
  const context: ServerContext = { connection, documents, scheduler, fileSet, linesOf, settings: () => settings };

  connection.onInitialize((params: InitializeParams): InitializeResult => {
    const options = (params.initializationOptions ?? {}) as { trusted?: boolean; settings?: AnalysisSettings };
    trust = { trusted: options.trusted !== false, folders: (params.workspaceFolders ?? []).map((f) => f.uri) };
    if (options.settings) settings = { ...DEFAULT_SETTINGS, ...withoutEmpty(options.settings) };
    pullConfiguration = Boolean(params.capabilities.workspace?.configuration);
    return {
      capabilities: {
        textDocumentSync: TextDocumentSyncKind.Incremental,
        hoverProvider: true,
        inlayHintProvider: true,
        codeLensProvider: { resolveProvider: false },
        codeActionProvider: { codeActionKinds: [CodeActionKind.QuickFix] },
        documentSymbolProvider: true,
        definitionProvider: true,
        referencesProvider: true,
        renameProvider: { prepareProvider: true },
        foldingRangeProvider: true,
        completionProvider: { triggerCharacters: ['@', ' ', '='] },
      },
      serverInfo: { name: 'rectilens' },
    };
  });

  connection.onInitialized(() => void refreshConfiguration());
  connection.onDidChangeConfiguration((change) => {
    const pushed = (change.settings as { rectilens?: AnalysisSettings } | undefined)?.rectilens;
    if (pushed) applySettings(pushed);
    else void refreshConfiguration();
  });

  async function refreshConfiguration(): Promise<void> {
    if (!pullConfiguration) return;
    try {
      const pulled = (await connection.workspace.getConfiguration('rectilens')) as AnalysisSettings | null;
      if (pulled) applySettings(pulled);
    } catch (error) {
      connection.console.error(`rectilens: could not read settings: ${String(error)}`);
    }
  }

  function applySettings(next: AnalysisSettings & { partsFiles?: unknown }): void {
    const { partsFiles: paths, ...rest } = withoutEmpty(next);
    settings = { ...DEFAULT_SETTINGS, ...rest };
    partsFiles = readPartsFiles(Array.isArray(paths) ? paths.filter((p): p is string => typeof p === 'string') : [], trust, readText);
    scheduler.schedule(documents.all().map((d) => d.uri));
  }

  documents.onDidChangeContent((change) => scheduler.schedule(scheduler.dependentsOf(change.document.uri).concat(change.document.uri)));
  documents.onDidClose((event) => {
    scheduler.forget(event.document.uri);
    void connection.sendDiagnostics({ uri: event.document.uri, diagnostics: [] });
  });

  const offsetIn = (uri: string, position: { line: number; character: number }) => {
    const file = scheduler.get(uri);
    return file ? { file, offset: lineIndexOf(file).offsetAt(position) } : undefined;
  };

  connection.onDocumentSymbol(guard([], (params) => {
    const file = scheduler.get(params.textDocument.uri);
    if (!file) return [];
    const lines = lineIndexOf(file);
    return outlineOf(file.netlist).map((s) => toDocumentSymbol(lines, s));
  }));
  connection.onFoldingRanges(guard([], (params) => {
    const file = scheduler.get(params.textDocument.uri);
    if (!file) return [];
    const lines = lineIndexOf(file);
    return foldingRangesOf(file.netlist).map((f) => toFoldingRange(lines, f)).filter((f) => f.endLine > f.startLine);
  }));
  connection.onDefinition(guard([], (params) => {
    const at = offsetIn(params.textDocument.uri, params.position);
    if (!at) return [];
    return findDefinition(fileSet(at.file.uri), at.offset).flatMap((l) => locationOf(l.uri, l.span));
  }));
  connection.onReferences(guard([], (params) => {
    const at = offsetIn(params.textDocument.uri, params.position);
    if (!at) return [];
    return findReferences(fileSet(at.file.uri), at.offset, params.context.includeDeclaration).flatMap((l) => locationOf(l.uri, l.span));
  }));
  connection.onPrepareRename(guard(null, (params) => {
    const at = offsetIn(params.textDocument.uri, params.position);
    const span = at && prepareRename(fileSet(at.file.uri), at.offset);
    return span ? toRange(lineIndexOf(at.file), span) : null;
  }));
  connection.onRenameRequest(guard(null, (params) => {
    const at = offsetIn(params.textDocument.uri, params.position);
    if (!at) return null;
    const edits = rename(fileSet(at.file.uri), at.offset, params.newName);
    return 'error' in edits ? new ResponseError(ErrorCodes.InvalidRequest, edits.error) : toWorkspaceEdit(edits, linesOf);
  }));
  connection.onCompletion(guard([], (params) => {
    const document = documents.get(params.textDocument.uri);
    if (!document) return [];
    const file = scheduler.get(params.textDocument.uri);
    if (!file) return [];
    // Names come from the last analysis; the line being typed comes from the text as it is now,
    // since the analysis may be a keystroke behind.
    const models = fileSet(file.uri).flatMap((f) => modelsOf(f.netlist));
    const current = { ...file.netlist, text: document.getText() };
    return completeAt(current, document.offsetAt(params.position), models).map((item) => ({
      label: item.label, kind: COMPLETION_KIND[item.kind], detail: item.detail, insertText: item.insertText,
    }));
  }));

  function locationOf(uri: string, span: { start: number; end: number }) {
    const lines = linesOf(uri);
    return lines ? [{ uri, range: toRange(lines, span) }] : [];
  }

  /** Wraps a handler so that a fault in one feature answers empty instead of failing the request or the server. */
  function guard<P, R>(empty: R, handler: (params: P) => R): (params: P) => R {
    return (params) => {
      try {
        return handler(params);
      } catch (error) {
        connection.console.error(`rectilens: ${error instanceof Error ? error.stack : String(error)}`);
        return empty;
      }
    };
  }

  registerEditorFeatures(context, guard);
  registerDocumentTextRequest(connection, documents);
  documents.listen(connection);
  connection.listen();
}

/**
 * Drops null and non-finite entries: an editor reports a setting with no default as null, and
 * that must mean "use the default", never zero.
 */
function withoutEmpty<T>(value: T): T {
  if (Array.isArray(value)) return value;
  if (value === null || typeof value !== 'object') return value;
  const out: Record<string, unknown> = {};
  for (const [k, v] of Object.entries(value as Record<string, unknown>)) {
    if (v === null || v === undefined || (typeof v === 'number' && !Number.isFinite(v))) continue;
    out[k] = typeof v === 'object' ? withoutEmpty(v) : v;
  }
  return out as T;
}
