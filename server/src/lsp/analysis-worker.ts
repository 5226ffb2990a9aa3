/**
 * The analysis worker (`dist/analysis-worker.js`): runs the pipeline off the server's main thread,
 * so that requests are answered while a heavy file is analysed, and so that a file that exhausts
 * memory or the stack takes down only this thread, which the server then replaces.
 *
 * It keeps what makes the next analysis cheap (the parse of each file, the solution cache) and the
 * last two analyses of each root, so that quick fixes and views are computed on the analysis the
 * main thread is showing even when a newer one has just been posted; the older of the two goes
 * when the next analysis of that root is asked for. What it posts is the compact form the main
 * thread answers from (posted-analysis.ts).
 */
import { parentPort, workerData } from 'node:worker_threads';
import { analyze, type FileAnalysis } from '../analysis/analyze';
import { offeredFixes, summariseOffer, verifyOffer, type Finding, type Verified } from '../findings/index';
import type { SolutionCache } from '../solve/index';
import { memoisedSolver } from '../solve/index';
import type { PostedAnswer, PostedRequest, ResolveOutcome, WorkerAnswer, WorkerRequest, WorkerSetup } from './analysis-messages';
import { postedBaseOf, postedWithBase, type PostedBase } from './posted-analysis';
import { renderView } from './views';
import { listOffsetsWhenIdle } from './offsets-ahead';
import { createWorkspaceReader } from './workspace-reader';

const setup = workerData as WorkerSetup;
const openDocuments = new Map<string, string>();
const readText = createWorkspaceReader({ openText: (uri) => openDocuments.get(uri), trust: () => setup.trust });
const solutionCache: SolutionCache = new Map();
/**
 * Per root: the latest analyses, newest first, each with its sequence number. An analysis whose
 * trees the next one consumed (its cards moved to the new text) is kept only to be named: nothing
 * is computed on it any more, so a request that raced an edit gets nothing rather than edits at
 * offsets of another text.
 */
const kept = new Map<string, { sequence: number; file: FileAnalysis; posted: PostedBase; consumed?: boolean }[]>();
let nextSequence = 1;

parentPort?.on('message', ({ id, request }: PostedRequest) => {
  let answer: WorkerAnswer;
  try {
    answer = handle(request);
  } catch (error) {
    answer = { kind: 'failed', message: error instanceof Error ? `${error.message}\n${error.stack ?? ''}` : String(error) };
  }
  parentPort?.postMessage({ id, answer } satisfies PostedAnswer);
});

function handle(request: WorkerRequest): WorkerAnswer {
  switch (request.kind) {
    case 'analyse': {
      for (const update of request.documents) {
        if (update.text === null) openDocuments.delete(update.uri);
        else openDocuments.set(update.uri, update.text);
      }
      // The main thread asks for the next analysis only once it has the last one, so from here it
      // asks about none older than that: the one before it is released before the new one is built.
      const previous = kept.get(request.uri)?.[0];
      if (previous) kept.set(request.uri, [previous]);
      const base = request.held === undefined ? undefined : kept.get(request.uri)?.find((k) => k.sequence === request.held)?.posted;
      // The previous trees are moved into the new parse rather than copied: at 5,000 lines copying
      // them was the largest single cost of an edit. From here on the previous analysis is only named.
      const reusable = previous && !previous.consumed ? previous : undefined;
      if (reusable) reusable.consumed = true;
      const file = analysisOf(request, reusable?.file, true);
      if (!file) return { kind: 'analysed', file: undefined, sequence: 0 };
      const sequence = nextSequence++;
      const { posted, next } = postedAnswerOf(request, file, base);
      const entry = { sequence, file, posted: next, consumed: false };
      kept.set(request.uri, [entry, ...(kept.get(request.uri) ?? []).slice(0, 1)]);
      const current = () => !entry.consumed && kept.get(request.uri)?.[0] === entry;
      listOffsetsWhenIdle(file.netlist, current);
      if (!previous) rehearseWhenIdle(request, entry, current);
      return { kind: 'analysed', file: posted, sequence };
    }
    case 'fixes': {
      const file = keptAnalysis(request.uri, request.sequence);
      return { kind: 'fixes', fixes: request.findings.map((index) => file?.findings[index]?.fixes ?? []) };
    }
    case 'plans': {
      const file = keptAnalysis(request.uri, request.sequence);
      const findings = request.findings.map((index) => file?.findings[index]);
      return { kind: 'plans', plans: findings.map((f) => (f ? offeredFixes(f).map(summariseOffer) : [])) };
    }
    case 'resolve': {
      const finding = keptAnalysis(request.uri, request.sequence)?.findings[request.finding];
      const offer = finding && offeredFixes(finding)[request.offer];
      return { kind: 'resolved', outcome: offer ? outcomeOf(verifyOffer(offer)) : { kind: 'gone' } };
    }
    case 'view':
      return { kind: 'view', view: renderView(keptAnalysis(request.uri, request.sequence), request.request, memoisedSolver(solutionCache)) };
    case 'forget':
      kept.delete(request.uri);
      return { kind: 'forgotten' };
  }
}

/** The root's analysis as the worker makes it, from the trees of `previous` (moved into it when `consume`). */
function analysisOf(request: AnalyseRequest, previous: FileAnalysis | undefined, consume: boolean): FileAnalysis | undefined {
  return analyze({
    roots: [request.uri], readText, settings: request.settings, partsFiles: request.partsFiles, solutionCache, compactFlat: true, waveforms: false,
    previousParse: (target) => previous?.parsed.get(target), consumePreviousParse: consume,
  }).files.get(request.uri);
}

function postedAnswerOf(request: AnalyseRequest, file: FileAnalysis, base: PostedBase | undefined): ReturnType<typeof postedWithBase> {
  return postedWithBase({ ...file, findings: file.findings.map(withoutFixes) }, openDocuments.get(request.uri), base);
}

type AnalyseRequest = Extract<WorkerRequest, { kind: 'analyse' }>;

/** A kept analysis that still describes its text (not consumed by the next one). */
function keptAnalysis(uri: string, sequence: number): FileAnalysis | undefined {
  const entry = kept.get(uri)?.find((k) => k.sequence === sequence);
  return entry && !entry.consumed ? entry.file : undefined;
}

function outcomeOf(verified: Verified): ResolveOutcome {
  return verified.fix ? { kind: 'fix', fix: verified.fix } : { kind: 'unverified', reason: verified.reason };
}

/** A copy of a finding without its lazily computed fixes (reading them would run the trial solves). */
function withoutFixes(finding: Finding): Finding {
  // Field by field, never through `fixes`: a rest pattern would read that getter. Plain assignment
  // is also several times cheaper than copying descriptors, for the hundreds of findings of each edit.
  const copy: Record<string, unknown> = {};
  for (const key of Object.keys(finding)) if (key !== 'fixes') copy[key] = (finding as unknown as Record<string, unknown>)[key];
  return copy as unknown as Finding;
}

/**
 * Rehearsals of a newly opened root's analysis, run in idle time and dropped. The code an edit
 * runs once per rectifier or device (ratings, rules, the posted form) ran only some fifty times
 * in the open's analysis, too few to be optimised, so the first ten edits after an open were
 * twice as slow as later ones (5,000 lines, 50 bridges: 75–90 ms against 35–45). Each rehearsal
 * re-analyses the same text from the same tree (no card is parsed or built again, every solution
 * is a cache hit) and proves its rectifiers against a copy of the posted base; it stops as soon
 * as the root is analysed again, and starts only once the reader has paused after the open.
 * Timing only: nothing it makes is kept or posted, so no answer changes. A large file's cards
 * already run hot, and a rehearsal of it costs more than it saves.
 */
const REHEARSALS = 10;
const REHEARSAL_MAX_CARDS = 20_000;
/** How long after the open's analysis the root must stay unedited before the first rehearsal. */
const REHEARSAL_QUIET_MS = 300;

function rehearseWhenIdle(request: AnalyseRequest, entry: { file: FileAnalysis }, current: () => boolean): void {
  if (entry.file.netlist.cards.length > REHEARSAL_MAX_CARDS) return;
  let left = REHEARSALS;
  const step = (): void => {
    if (left-- <= 0 || !current()) return;
    const file = analysisOf(request, entry.file, false);
    if (file) postedAnswerOf(request, file, postedBaseOf(entry.file));
    setImmediate(step);
  };
  // Not while the reader is typing: an edit that arrives during a rehearsal waits for it.
  setTimeout(step, REHEARSAL_QUIET_MS);
}
