/**
 * The analysis worker (`dist/analysis-worker.js`): runs the pipeline off the server's main thread,
 * so that requests are answered while a heavy file is analysed, and so that a file that exhausts
 * memory or the stack takes down only this thread, which the server then replaces.
 *
 * It keeps what makes the next analysis cheap (the parse of each file, the solution cache) and the
 * last two analyses of each root, so that quick fixes and views are computed on the analysis the
 * main thread is showing even when a newer one has just been posted.
 */
import { parentPort, workerData } from 'node:worker_threads';
import { analyze, type FileAnalysis } from '../analysis/analyze';
import type { Finding } from '../findings/index';
import type { SolutionCache } from '../solve/index';
import { memoisedSolver } from '../solve/index';
import type { PostedAnswer, PostedRequest, WorkerAnswer, WorkerRequest, WorkerSetup } from './analysis-messages';
import { renderView } from './views';
import { createWorkspaceReader } from './workspace-reader';

const setup = workerData as WorkerSetup;
const openDocuments = new Map<string, string>();
const readText = createWorkspaceReader({ openText: (uri) => openDocuments.get(uri), trust: () => setup.trust });
const solutionCache: SolutionCache = new Map();
/** Per root: the latest analyses, newest first, each with its sequence number. */
const kept = new Map<string, { sequence: number; file: FileAnalysis }[]>();
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
      const previous = kept.get(request.uri)?.[0]?.file;
      const file = analyze({
        roots: [request.uri], readText, settings: request.settings, partsFiles: request.partsFiles, solutionCache,
        previousParse: (target) => previous?.parsed.get(target),
      }).files.get(request.uri);
      if (!file) return { kind: 'analysed', file: undefined, sequence: 0 };
      const sequence = nextSequence++;
      kept.set(request.uri, [{ sequence, file }, ...(kept.get(request.uri) ?? []).slice(0, 1)]);
      return { kind: 'analysed', file: { ...file, findings: file.findings.map(withoutFixes) }, sequence };
    }
    case 'fixes': {
      const file = keptAnalysis(request.uri, request.sequence);
      return { kind: 'fixes', fixes: request.findings.map((index) => file?.findings[index]?.fixes ?? []) };
    }
    case 'view':
      return { kind: 'view', view: renderView(keptAnalysis(request.uri, request.sequence), request.request, memoisedSolver(solutionCache)) };
    case 'forget':
      kept.delete(request.uri);
      return { kind: 'forgotten' };
  }
}

function keptAnalysis(uri: string, sequence: number): FileAnalysis | undefined {
  return kept.get(uri)?.find((k) => k.sequence === sequence)?.file;
}

/** A copy of a finding without its lazily computed fixes (reading them would run the trial solves). */
function withoutFixes(finding: Finding): Finding {
  const { fixes: _lazy, ...fields } = Object.getOwnPropertyDescriptors(finding);
  return Object.defineProperties({}, fields) as Finding;
}
