/**
 * Keeps one analysis per open netlist, recomputed after edits: at once when idle, debounced while busy, newest edit first, a batch
 * abandoned between files when a newer edit arrives. The analyses themselves run in the worker
 * (analysis-worker-host.ts), so requests are answered from the last finished analysis of each
 * file while the next one runs.
 */
import type { FileAnalysis } from '../analysis/analyze';
import type { Fix } from '../findings/index';
import type { AnalysisSettings } from '../analysis/settings';
import type { PartsFile } from '../ratings/index';
import type { AnalysisStop, AnalysisWorkerHost } from './analysis-worker-host';
import type { ViewContent, ViewRequest } from '../protocol/custom-protocol';
import { mainThreadParse, restoredForm, takeMovableTree } from './posted-analysis';
import { listOffsetsWhenIdle } from './offsets-ahead';

/** How long the editor waits for one file's analysis before it stops it and says so. */
export const EDITOR_PATIENCE_MS = 60_000;

/**
 * How long after an analysis lands without a newer one the main thread makes its tree (for hovers,
 * completion, the outline, code actions; each makes it sooner if it comes first). A pause in typing,
 * not a keystroke's gap: within a burst no tree is made. Timing only, no answer changes.
 */
export const TREE_AFTER_QUIET_MS = 100;

/** What the scheduler needs of the worker host (a test passes a stand-in). */
export type AnalysisRunner = Pick<AnalysisWorkerHost, 'analyse' | 'fixes' | 'view' | 'forget'>;

export interface OpenDocument {
  uri: string;
  version: number;
  text: string;
}

export interface SchedulerHooks {
  /** The open documents as the editor has them now. */
  openDocuments: () => readonly OpenDocument[];
  /** The settings a root is analysed with (its workspace folder's). */
  settings: (uri: string) => AnalysisSettings;
  /** Validated parts files, read by the server. */
  partsFiles: () => readonly PartsFile[];
  /** Called with each finished analysis and the document version it was made from. */
  onAnalysed: (file: FileAnalysis, version: number | undefined) => void;
  /** Called when a file could not be analysed at all (the worker died or was stopped). */
  onStopped: (uri: string, version: number | undefined, stop: AnalysisStop) => void;
  /** Settles when analyses may start (the editor's settings are in); none start before. */
  ready?: () => Promise<void>;
  /** Called when a batch starts or ends, e.g. to show a busy indicator. */
  onBusy?: (busy: boolean, pending: number) => void;
}

export class AnalysisScheduler {
  private readonly results = new Map<string, { file: FileAnalysis; sequence: number; version: number | undefined }>();
  private readonly pending = new Set<string>();
  /** Requests waiting for a file's analysis to catch up with the editor's version. */
  private readonly waiters = new Map<string, { version: number; wake: () => void }[]>();
  private timer: NodeJS.Timeout | undefined;
  private generation = 0;
  private running: Promise<void> | undefined;
  private analysing: string | undefined;

  constructor(
    private readonly worker: AnalysisRunner,
    private readonly hooks: SchedulerHooks,
    private readonly debounceMs = 10,
    private readonly patienceMs = EDITOR_PATIENCE_MS,
  ) {}

  /** The last finished analysis of a root. */
  get(uri: string): FileAnalysis | undefined {
    return this.results.get(uri)?.file;
  }

  /** The document version the last finished analysis of a root was made from. */
  versionOf(uri: string): number | undefined {
    return this.results.get(uri)?.version;
  }

  /**
   * Resolves once the analysis of `uri` is made from `version` or later, the file could not be
   * analysed, or `maxWaitMs` has passed, so that a request just after an edit is answered from
   * the new analysis rather than the old one (and never waits without bound).
   */
  whenAnalysed(uri: string, version: number, maxWaitMs: number): Promise<void> {
    const have = this.results.get(uri)?.version;
    if ((have !== undefined && have >= version) || !this.isQueuedOrRunning(uri)) return Promise.resolve();
    return new Promise((resolve) => {
      const timer = setTimeout(resolve, maxWaitMs);
      const list = this.waiters.get(uri) ?? [];
      list.push({ version, wake: () => { clearTimeout(timer); resolve(); } });
      this.waiters.set(uri, list);
    });
  }

  all(): FileAnalysis[] {
    return [...this.results.values()].map((r) => r.file);
  }

  forget(uri: string): void {
    this.results.delete(uri);
    this.pending.delete(uri);
    this.worker.forget(uri);
  }

  /** Roots whose analysis read `uri` (itself included), so an edit to an include re-analyses its includers. */
  dependentsOf(uri: string): string[] {
    return this.all().filter((f) => f.uri === uri || f.dependencies.includes(uri)).map((f) => f.uri);
  }

  /** The quick fixes of some findings of a file's current analysis, computed by the worker. */
  fixesOf(file: FileAnalysis, findings: number[]): Promise<Fix[][]> {
    const current = this.results.get(file.uri);
    if (current?.file !== file) return Promise.resolve(findings.map(() => []));
    return this.worker.fixes(file.uri, current.sequence, findings);
  }

  /** The worker's number of a root's last finished analysis: code actions planned on it are resolved against it. */
  sequenceOf(uri: string): number | undefined {
    return this.results.get(uri)?.sequence;
  }

  viewOf(request: ViewRequest): Promise<ViewContent | null> {
    const current = this.results.get(request.uri);
    return current ? this.worker.view(request.uri, current.sequence, request) : Promise.resolve(null);
  }

  private isQueuedOrRunning(uri: string): boolean {
    return this.pending.has(uri) || this.analysing === uri;
  }

  /** Wakes the requests waiting for `uri` up to `version` (all of them when the file stopped). */
  private wake(uri: string, version: number | undefined): void {
    const list = this.waiters.get(uri);
    if (!list) return;
    const still = list.filter((w) => version !== undefined && w.version > version && this.isQueuedOrRunning(uri));
    for (const w of list) if (!still.includes(w)) w.wake();
    if (still.length) this.waiters.set(uri, still);
    else this.waiters.delete(uri);
  }

  /** Queues roots for analysis; the newest request cancels any batch still running. */
  schedule(uris: Iterable<string>): void {
    for (const uri of uris) this.pending.add(uri);
    this.generation++;
    clearTimeout(this.timer);
    // An idle worker starts at once (the edits that arrived together are merged by then); while one
    // runs, the debounce gathers the keystrokes of a burst into the next analysis.
    this.timer = setTimeout(() => void this.run(), this.running ? this.debounceMs : 0);
  }

  private async run(): Promise<void> {
    this.timer = undefined;
    await this.hooks.ready?.();
    if (this.running) await this.running;
    const generation = this.generation;
    this.running = this.analysePending(generation).finally(() => (this.running = undefined));
    await this.running;
  }

  private async analysePending(generation: number): Promise<void> {
    const batch = [...this.pending];
    this.hooks.onBusy?.(true, batch.length);
    try {
      for (const uri of batch) {
        if (generation !== this.generation) return; // a newer edit arrived: its run takes over
        this.pending.delete(uri);
        this.analysing = uri;
        try {
          await this.analyseOne(uri);
        } catch (error) {
          // A fault on this side (publishing, reading the documents) costs this file, never the server.
          this.hooks.onStopped(uri, undefined, { cause: 'fault', reason: `Rectilens failed while handling its analysis: ${error instanceof Error ? error.message : String(error)}` });
        } finally {
          this.analysing = undefined;
          this.wake(uri, this.results.get(uri)?.version);
        }
      }
    } finally {
      this.hooks.onBusy?.(false, this.pending.size);
    }
  }

  private async analyseOne(uri: string): Promise<void> {
    const documents = this.hooks.openDocuments();
    const version = documents.find((d) => d.uri === uri)?.version;
    const open = new Map(documents.map((d) => [d.uri, d.text]));
    // The answer may point into the analysis held now (posted-analysis.ts), so that one is kept for it.
    const held = this.results.get(uri);
    const answer = this.worker.analyse(uri, open, this.hooks.settings(uri), this.hooks.partsFiles(), this.patienceMs, held?.sequence);
    // A root analysed for the first time has no tree to move: its parse is made now, while the
    // worker analyses on the other core, rather than after the answer (before the first edit).
    const early = held === undefined ? mainThreadParse(open.get(uri), undefined) : undefined;
    const outcome = await answer;
    if (outcome.kind === 'stopped') {
      this.results.delete(uri);
      this.hooks.onStopped(uri, version, outcome);
    } else if (outcome.file) {
      // The root's parse is made here instead of crossing in the answer (posted-analysis.ts), from
      // the tree of the analysis this one replaces: its cards are moved, not copied, now that no
      // request can be answered from it any more (until here, one that ran out of patience was).
      // After an edit it is made once the reader pauses, or sooner if something reads it: the
      // diagnostics and hints need no tree, and a parse made at once (7–10 ms at 50,000 lines)
      // held up the next keystroke, which arrives while it runs.
      const text = open.get(uri);
      const replaced = this.results.get(uri) === held ? held?.file : undefined;
      const file = restoredForm(outcome.file, { text, movable: early ?? takeMovableTree(replaced), held: held?.file });
      this.results.set(uri, { file, sequence: outcome.sequence, version });
      this.hooks.onAnalysed(file, version);
      const current = () => this.results.get(uri)?.file === file;
      setTimeout(() => {
        if (current()) listOffsetsWhenIdle(file.netlist, current);
      }, TREE_AFTER_QUIET_MS).unref();
    }
  }
}
