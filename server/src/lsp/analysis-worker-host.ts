/**
 * The main thread's side of the analysis worker: posts requests, matches answers by id, keeps the
 * worker's copy of the open documents in step, and replaces a worker that dies. An analysis that
 * runs past the editor's patience is abandoned by ending the worker (the command line never does
 * this: it has no one waiting).
 */
import { Worker } from 'node:worker_threads';
import type { Fix, OfferSummary } from '../findings/index';
import type { AnalysisSettings } from '../analysis/settings';
import type { PartsFile } from '../ratings/index';
import type { DocumentUpdate, PostedAnswer, ResolveOutcome, WorkerAnswer, WorkerRequest, WorkerSetup } from './analysis-messages';
import type { ViewContent, ViewRequest } from '../protocol/custom-protocol';
import type { PostedAnalysis } from './posted-analysis';

/** One worker's heap; a file needing more is reported, not analysed, and the server carries on. */
export const DEFAULT_WORKER_HEAP_MB = 3072;

/**
 * The worker's young generation (both semi-spaces). Every edit builds a new analysis that stays
 * live, and each scavenge copies what is live: at the default (32 MB) an edit of the 5,000-line
 * benchmark netlist took 2.7 scavenges and 30–39 ms of collection, at 128 MB one scavenge and
 * 17 ms (measured in process, issue 18). It costs up to 96 MB more resident memory.
 */
export const WORKER_YOUNG_GENERATION_MB = 192;

export interface WorkerHostOptions {
  /** The bundled worker script. */
  script: string;
  /** Read when a worker starts (the trust policy is known only after the editor's first message). */
  setup: () => WorkerSetup;
  /** Heap of one worker; past it the worker dies and is replaced, the server carries on. */
  heapMb: number;
  log: (message: string) => void;
}

/** Why an analysis produced nothing: the editor ran out of patience, or the worker died. */
export interface AnalysisStop {
  cause: 'patience' | 'fault';
  reason: string;
}

export type AnalysisOutcome =
  | { kind: 'analysed'; file: PostedAnalysis | undefined; sequence: number }
  | ({ kind: 'stopped' } & AnalysisStop);

interface Waiting {
  settle: (answer: WorkerAnswer) => void;
  fail: (reason: string) => void;
}

export class AnalysisWorkerHost {
  private worker: Worker | undefined;
  private readonly waiting = new Map<number, Waiting>();
  private nextId = 1;
  /** What the current worker holds of each open document. */
  private readonly sent = new Map<string, string>();

  constructor(private readonly options: WorkerHostOptions) {}

  /** Analyses a root; `patienceMs` bounds how long the editor waits before abandoning it. */
  async analyse(uri: string, open: ReadonlyMap<string, string>, settings: AnalysisSettings, partsFiles: readonly PartsFile[], patienceMs: number, held?: number): Promise<AnalysisOutcome> {
    const request: WorkerRequest = { kind: 'analyse', uri, documents: this.updatesFor(open), settings, partsFiles, ...(held === undefined ? {} : { held }) };
    let timer: NodeJS.Timeout | undefined;
    const overdue = new Promise<AnalysisOutcome>((resolve) => {
      timer = setTimeout(() => {
        const reason = `the editor stopped it after ${patienceMs >= 1000 ? `${Math.round(patienceMs / 1000)} s` : `${patienceMs} ms`} to stay responsive`;
        resolve({ kind: 'stopped', cause: 'patience', reason });
        void this.stop(reason);
      }, patienceMs);
    });
    const answered = this.post(request).then(
      (answer): AnalysisOutcome => (answer.kind === 'analysed' ? answer : { kind: 'stopped', cause: 'fault', reason: failure(answer) }),
      (reason: string): AnalysisOutcome => ({ kind: 'stopped', cause: 'fault', reason }),
    );
    try {
      return await Promise.race([answered, overdue]);
    } finally {
      clearTimeout(timer);
    }
  }

  /** The quick fixes of the given findings of a posted analysis; none if the worker no longer has it. */
  async fixes(uri: string, sequence: number, findings: number[]): Promise<Fix[][]> {
    const answer = await this.post({ kind: 'fixes', uri, sequence, findings }).catch(() => undefined);
    return answer?.kind === 'fixes' ? answer.fixes : findings.map(() => []);
  }

  /** The offers of the given findings without their trial solves; none if the worker no longer has the analysis. */
  async plans(uri: string, sequence: number, findings: number[]): Promise<OfferSummary[][]> {
    const answer = await this.post({ kind: 'plans', uri, sequence, findings }).catch(() => undefined);
    return answer?.kind === 'plans' ? answer.plans : findings.map(() => []);
  }

  /** One offer of a posted analysis verified by its trial solves. */
  async resolve(uri: string, sequence: number, finding: number, offer: number): Promise<ResolveOutcome> {
    const answer = await this.post({ kind: 'resolve', uri, sequence, finding, offer }).catch(() => undefined);
    return answer?.kind === 'resolved' ? answer.outcome : { kind: 'gone' };
  }

  async view(uri: string, sequence: number, request: ViewRequest): Promise<ViewContent | null> {
    const answer = await this.post({ kind: 'view', uri, sequence, request }).catch(() => undefined);
    return answer?.kind === 'view' ? answer.view : null;
  }

  forget(uri: string): void {
    if (this.worker) void this.post({ kind: 'forget', uri }).catch(() => undefined);
  }

  async dispose(): Promise<void> {
    await this.stop('the server is shutting down');
  }

  /** Open documents the worker lacks or holds in an older text, and the ones closed since. */
  private updatesFor(open: ReadonlyMap<string, string>): DocumentUpdate[] {
    const updates: DocumentUpdate[] = [];
    for (const [uri, text] of open) {
      if (this.sent.get(uri) !== text) updates.push({ uri, text });
      this.sent.set(uri, text);
    }
    for (const uri of [...this.sent.keys()]) {
      if (open.has(uri)) continue;
      updates.push({ uri, text: null });
      this.sent.delete(uri);
    }
    return updates;
  }

  private post(request: WorkerRequest): Promise<WorkerAnswer> {
    const worker = this.worker ?? this.start();
    const id = this.nextId++;
    return new Promise((settle, fail) => {
      this.waiting.set(id, { settle, fail });
      worker.postMessage({ id, request });
    });
  }

  private start(): Worker {
    const worker = new Worker(this.options.script, {
      workerData: this.options.setup(),
      resourceLimits: { maxOldGenerationSizeMb: this.options.heapMb, maxYoungGenerationSizeMb: WORKER_YOUNG_GENERATION_MB },
      stdout: false,
      stderr: false,
    });
    worker.on('message', ({ id, answer }: PostedAnswer) => {
      const waiting = this.waiting.get(id);
      this.waiting.delete(id);
      waiting?.settle(answer);
    });
    worker.on('error', (error) => this.lost(worker, `the analysis worker failed: ${error.message}`));
    worker.on('exit', (code) => this.lost(worker, `the analysis worker stopped (exit code ${code})`));
    this.worker = worker;
    return worker;
  }

  /** Ends the worker; everything waiting on it fails with the reason, and the next request starts a new one. */
  private async stop(reason: string): Promise<void> {
    const worker = this.worker;
    if (!worker) return;
    this.lost(worker, reason);
    await worker.terminate();
  }

  private lost(worker: Worker, reason: string): void {
    if (this.worker !== worker) return;
    this.worker = undefined;
    this.sent.clear();
    this.options.log(`rectilens: ${reason}; a new worker starts with the next request`);
    const waiting = [...this.waiting.values()];
    this.waiting.clear();
    for (const w of waiting) w.fail(reason);
  }
}

function failure(answer: WorkerAnswer): string {
  return answer.kind === 'failed' ? `the analysis failed inside Rectilens: ${answer.message.split('\n')[0]}` : `unexpected answer ${answer.kind}`;
}
