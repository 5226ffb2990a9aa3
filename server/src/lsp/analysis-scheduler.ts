/**
 * Keeps one analysis per open netlist, recomputed after edits: debounced, newest edit first, and
 * abandoned when a newer edit arrives (checked between files). Requests are answered from the last
 * finished analysis of each file, never blocked on a running one.
 */
import { analyze, type AnalysisInput, type FileAnalysis } from '../analysis/analyze';
import type { SolutionCache } from '../analysis/rectifier-analysis';
import type { PartsFile } from '../ratings/index';
import type { AnalysisSettings } from '../analysis/settings';

export interface SchedulerHooks {
  /** Reads a file's text: an open document, or the disk where allowed. */
  readText: (uri: string) => string | undefined;
  settings: () => AnalysisSettings;
  /** Validated parts files, read by the server. */
  partsFiles: () => readonly PartsFile[];
  /** Called with each finished analysis, e.g. to publish diagnostics. */
  onAnalysed: (file: FileAnalysis) => void;
  /** Called when a batch starts or ends, e.g. to show a busy indicator. */
  onBusy?: (busy: boolean, pending: number) => void;
}

export class AnalysisScheduler {
  private readonly results = new Map<string, FileAnalysis>();
  private readonly pending = new Set<string>();
  private timer: NodeJS.Timeout | undefined;
  private generation = 0;
  private running: Promise<void> | undefined;
  /** Solutions survive between analyses: an edit re-solves only the rectifiers whose inputs changed. */
  private readonly solutionCache: SolutionCache = new Map();

  constructor(private readonly hooks: SchedulerHooks, private readonly debounceMs = 10) {}

  /** The last finished analysis of a root. */
  get(uri: string): FileAnalysis | undefined {
    return this.results.get(uri);
  }

  all(): FileAnalysis[] {
    return [...this.results.values()];
  }

  forget(uri: string): void {
    this.results.delete(uri);
    this.pending.delete(uri);
  }

  /** Roots whose analysis read `uri` (itself included), so an edit to an include re-analyses its includers. */
  dependentsOf(uri: string): string[] {
    return [...this.results.values()].filter((f) => f.uri === uri || f.dependencies.includes(uri)).map((f) => f.uri);
  }

  /** Queues roots for analysis; the newest request cancels any batch still running. */
  schedule(uris: Iterable<string>): void {
    for (const uri of uris) this.pending.add(uri);
    this.generation++;
    clearTimeout(this.timer);
    this.timer = setTimeout(() => void this.run(), this.debounceMs);
  }

  private async run(): Promise<void> {
    this.timer = undefined;
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
        const input: AnalysisInput = {
          roots: [uri], readText: this.hooks.readText, settings: this.hooks.settings(), partsFiles: this.hooks.partsFiles(), solutionCache: this.solutionCache,
          now: () => performance.now(),
          previousParse: (target) => this.results.get(uri)?.parsed.get(target),
        };
        const file = analyze(input).files.get(uri);
        if (file) {
          this.results.set(uri, file);
          this.hooks.onAnalysed(file);
        }
        await new Promise((r) => setImmediate(r));
      }
    } finally {
      this.hooks.onBusy?.(false, this.pending.size);
    }
  }
}
