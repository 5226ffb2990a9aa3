/**
 * Everything the language server holds, in one object: the open documents, the settings and trust
 * the editor gave, the parts files, the analysis worker and scheduler, and the lookups every
 * handler shares. Handlers read it; only the configuration handlers change its settings.
 */
import { join } from 'node:path';
import { TextDocuments, type Connection } from 'vscode-languageserver/node';
import { TextDocument } from 'vscode-languageserver-textdocument';
import { parseNetlist, type Netlist } from '../../../grammar/src/index';
import type { FileAnalysis } from '../analysis/analyze';
import type { Finding } from '../findings/index';
import { findingsByFile, findingsOfFile } from '../analysis/findings-by-file';
import { LineIndex, lineIndexOf } from '../../../grammar/src/index';
import { DEFAULT_SETTINGS, type AnalysisSettings } from '../analysis/settings';
import type { FileText } from '../circuit/index';
import type { FileSet } from '../editor/navigation';
import type { PartsFile } from '../ratings/index';
import { AnalysisProgress } from './analysis-progress';
import { AnalysisScheduler } from './analysis-scheduler';
import { filesParsedBy } from './posted-analysis';
import { AnalysisWorkerHost, DEFAULT_WORKER_HEAP_MB, type AnalysisStop } from './analysis-worker-host';
import { toDiagnostic } from './convert';
import { stoppedFinding } from './stopped-finding';
import type { TrustPolicy } from './trust';
import { createWorkspaceReader } from './workspace-reader';

/** A file's analysis and a position in it as an offset, for handlers that answer about a place. */
export interface PlaceInFile {
  file: FileAnalysis;
  lines: LineIndex;
  offset: number;
}

/** How long a request just after an edit waits for that edit's analysis before answering from the last one. */
export const FRESHNESS_WAIT_MS = 2_000;

export class ServerState {
  readonly documents = new TextDocuments(TextDocument);
  settings: AnalysisSettings = DEFAULT_SETTINGS;
  trust: TrustPolicy = { trusted: true, folders: [] };
  /** Whether the editor answers `workspace/configuration`. */
  pullConfiguration = false;
  /** Whether the editor can be asked to re-request its inlay hints and code lenses. */
  refreshSupport = { inlayHints: false, codeLenses: false };
  /** Whether the editor reads Markdown hovers (it does unless its hover contentFormat leaves Markdown out). */
  hoverMarkdown = true;
  /** Whether the editor shows server-created progress (`window.workDoneProgress`). */
  progressSupport = false;
  /** Whether the editor resolves a code action's edit later (`codeAction/resolve`) and can mark one disabled. */
  codeActionResolve = { edit: false, disabled: false };
  /** Whether the editor registers file watchers the server asks for. */
  watchSupport = false;
  /** The settings the editor gave (before the project configuration is layered under them). */
  editorSettings: AnalysisSettings & { partsFiles?: unknown } = {};
  /** The editor's settings per workspace folder, where it gave them (pulled with the folder as scope). */
  editorFolderSettings: ReadonlyMap<string, AnalysisSettings & { partsFiles?: unknown }> = new Map();
  /** The settings of each workspace folder: its project configuration with the editor's on top. */
  folderSettings: ReadonlyMap<string, AnalysisSettings> = new Map();
  /** The project configurations' URIs, for watching them. */
  configUris: ReadonlySet<string> = new Set();
  /** The parts-file paths the settings name, and the URIs they were read from. */
  partsFilePaths: string[] = [];
  partsFileUris: ReadonlySet<string> = new Set();
  partsFiles: PartsFile[] = [];
  /** Parts files with diagnostics published, so that fixed ones are cleared. */
  partsFilesWithFindings: ReadonlySet<string> = new Set();
  /**
   * Settles when the editor's settings have first been pulled (or could not be): no analysis starts
   * before, so the first diagnostics of a file are never those of the wrong settings.
   */
  settingsReady: Promise<void> = Promise.resolve();
  readonly readText: (uri: string) => FileText;
  readonly worker: AnalysisWorkerHost;
  readonly scheduler: AnalysisScheduler;
  private readonly progress: AnalysisProgress;

  constructor(readonly connection: Connection, env: NodeJS.ProcessEnv = process.env) {
    this.readText = createWorkspaceReader({ openText: (uri) => this.documents.get(uri)?.getText(), trust: () => this.trust });
    this.worker = new AnalysisWorkerHost({
      script: join(__dirname, 'analysis-worker.js'),
      setup: () => ({ trust: this.trust }),
      heapMb: positiveNumber(env.RECTILENS_WORKER_HEAP_MB) ?? DEFAULT_WORKER_HEAP_MB,
      log: (message) => connection.console.error(message),
    });
    // RECTILENS_PROGRESS_DELAY_MS (tests): how long a batch runs before progress is shown.
    this.progress = new AnalysisProgress(connection, () => this.progressSupport, positiveNumber(env.RECTILENS_PROGRESS_DELAY_MS));
    this.scheduler = new AnalysisScheduler(this.worker, {
      openDocuments: () => this.documents.all().map((d) => ({ uri: d.uri, version: d.version, text: d.getText() })),
      settings: (uri) => this.settingsFor(uri),
      partsFiles: () => this.partsFiles,
      onAnalysed: (file, version) => this.publish(file, version),
      onStopped: (uri, version, stop) => this.publishStopped(uri, version, stop),
      onBusy: (busy, pending) => this.progress.update(busy, pending),
      ready: () => this.settingsReady,
    }, 10, positiveNumber(env.RECTILENS_EDITOR_PATIENCE_MS));
  }

  /** The settings of the workspace folder holding a file (the innermost), else the window's. */
  settingsFor(uri: string): AnalysisSettings {
    let best: string | undefined;
    for (const folder of this.folderSettings.keys()) {
      const prefix = folder.endsWith('/') ? folder : `${folder}/`;
      if (uri.startsWith(prefix) && (!best || folder.length > best.length)) best = folder;
    }
    return (best && this.folderSettings.get(best)) || this.settings;
  }

  /** The line index of a file: its analysis's, else its text's (an include not open). */
  readonly linesOf = (uri: string): LineIndex | undefined => {
    const analysed = this.scheduler.get(uri);
    if (analysed) return lineIndexOf(analysed);
    const text = this.readText(uri);
    return typeof text === 'string' ? new LineIndex(text) : undefined;
  };

  /**
   * The files of the netlist a file belongs to, it first: the files its analysis read and those of
   * every root that reads it. For the file itself its parse as an include is preferred when the text
   * is the same (an include's first line is a card, not a title).
   */
  fileSet(uri: string): FileSet {
    const own = this.scheduler.get(uri);
    const analyses = [own, ...this.scheduler.dependentsOf(uri).filter((u) => u !== uri).map((u) => this.scheduler.get(u))]
      .filter((a): a is FileAnalysis => a !== undefined);
    const files = new Map<string, Netlist>();
    const asInclude = analyses.slice(1).map((a) => a.parsed.get(uri)).find((n) => n && (!own || n.text === own.text));
    const self = asInclude ?? own?.netlist;
    if (!self) return [];
    files.set(uri, self);
    for (const a of analyses) for (const [u, n] of a.parsed) if (!files.has(u)) files.set(u, n);
    return [...files].map(([u, netlist]) => ({ uri: u, netlist }));
  }

  /** A file's last analysis with its line index, and the offset of a position in it (0 without one). */
  placeIn(uri: string, position?: { line: number; character: number }): PlaceInFile | undefined {
    const file = this.scheduler.get(uri);
    if (!file) return undefined;
    const lines = lineIndexOf(file);
    return { file, lines, offset: position ? lines.offsetAt(position) : 0 };
  }

  /**
   * `placeIn` once the document's analysis has caught up with the version the editor has (or the
   * wait is over), so that hints, lenses, hovers and fixes describe the text as it is.
   */
  async freshPlaceIn(uri: string, position?: { line: number; character: number }): Promise<PlaceInFile | undefined> {
    const document = this.documents.get(uri);
    if (document) await this.scheduler.whenAnalysed(uri, document.version, FRESHNESS_WAIT_MS);
    return this.placeIn(uri, position);
  }

  /**
   * The parse of a document's text as the editor has it now: the analysis's own when it was made
   * from this version, else a fresh parse (re-using the old one's unchanged cards). Completion
   * answers from this, so text and tree always belong to one version.
   */
  currentParse(uri: string): { netlist: Netlist; document: TextDocument } | undefined {
    const document = this.documents.get(uri);
    const file = this.scheduler.get(uri);
    if (!document) return undefined;
    if (file && this.scheduler.versionOf(uri) === document.version) return { netlist: file.netlist, document };
    return { netlist: parseNetlist(document.getText(), { previous: file?.netlist }), document };
  }

  /**
   * Each root's findings by the file they are about: a file's diagnostics are the union over the
   * roots that read it, so an include's own errors show on the include, open or not.
   */
  private readonly findingsByFile = new Map<string, Map<string, Finding[]>>();

  private publish(file: FileAnalysis, version: number | undefined): void {
    const touched = this.dropContributions(file.uri);
    touched.add(file.uri);
    for (const [uri, list] of findingsByFile(file, filesParsedBy(file))) {
      let roots = this.findingsByFile.get(uri);
      if (!roots) this.findingsByFile.set(uri, (roots = new Map()));
      roots.set(file.uri, list);
      if (list.length) touched.add(uri);
    }
    for (const uri of touched) this.publishFile(uri, uri === file.uri ? version : undefined);
    // An editor that asked for hints or lenses before this analysis asks again.
    if (this.refreshSupport.inlayHints) void this.connection.languages.inlayHint.refresh().catch(() => undefined);
    if (this.refreshSupport.codeLenses) void this.connection.sendRequest('workspace/codeLens/refresh').catch(() => undefined);
  }

  /** A closed root's findings leave the files they were about; what other roots say of them stays published. */
  forgetRoot(uri: string): void {
    this.scheduler.forget(uri);
    // A closed document's diagnostics go out again even when unchanged: an editor may drop them on close.
    this.lastSent.delete(uri);
    for (const touched of this.dropContributions(uri)) this.publishFile(touched, undefined);
  }

  private dropContributions(root: string): Set<string> {
    const touched = new Set<string>();
    for (const [uri, roots] of this.findingsByFile) {
      if (roots.delete(root)) touched.add(uri);
      if (roots.size === 0) this.findingsByFile.delete(uri);
    }
    return touched;
  }

  /**
   * The diagnostics of one file from every root that read it. A file that another root includes is
   * shown as that root reads it (an include's first line is a card): its own analysis as a root,
   * which reads the first line as a title, is left out then.
   */
  private publishFile(uri: string, version: number | undefined): void {
    const findings = findingsOfFile(uri, this.findingsByFile.get(uri) ?? new Map());
    const lines = findings.length ? this.linesOf(uri) : undefined;
    if (findings.length && !lines) return;
    const diagnostics = lines ? findings.map((f) => toDiagnostic(lines, f, this.linesOf)) : [];
    // An include's diagnostics go out again after every analysis of each root that reads it; the
    // same list again (no version to carry) is left unsent. A root's always goes: its version is
    // how the editor knows the analysis caught up.
    const sent = JSON.stringify(diagnostics);
    if (version === undefined && this.lastSent.get(uri) === sent) return;
    this.lastSent.set(uri, sent);
    void this.connection.sendDiagnostics(version === undefined ? { uri, diagnostics } : { uri, version, diagnostics });
  }

  /** The diagnostics last sent for each file, as JSON, so that an unchanged list is not sent again. */
  private readonly lastSent = new Map<string, string>();

  private publishStopped(uri: string, version: number | undefined, stop: AnalysisStop): void {
    const text = this.documents.get(uri)?.getText() ?? '';
    this.connection.console.error(`rectilens: ${uri} was not analysed: ${stop.reason}`);
    const diagnostic = toDiagnostic(new LineIndex(text), stoppedFinding(uri, text, stop), this.linesOf);
    this.lastSent.set(uri, JSON.stringify([diagnostic]));
    void this.connection.sendDiagnostics({ uri, version, diagnostics: [diagnostic] });
  }
}

function positiveNumber(text: string | undefined): number | undefined {
  const value = Number(text);
  return text && Number.isFinite(value) && value > 0 ? value : undefined;
}
