/**
 * The messages between the language server's main thread and its analysis worker. Everything in
 * them is plain data (structured clone); a finding's quick fixes are computed in the worker on
 * request, since they run trial solves and cannot cross as functions.
 */
import type { FileAnalysis } from '../analysis/analyze';
import type { AnalysisSettings } from '../analysis/settings';
import type { Fix } from '../findings/index';
import type { PartsFile } from '../ratings/index';
import type { ViewContent, ViewRequest } from '../protocol/custom-protocol';
import type { TrustPolicy } from './trust';

/** Sent once when a worker starts. */
export interface WorkerSetup {
  trust: TrustPolicy;
}

/** The text of open documents as the editor has them; `text: null` means closed. */
export interface DocumentUpdate {
  uri: string;
  text: string | null;
}

export type WorkerRequest =
  | { kind: 'analyse'; uri: string; documents: DocumentUpdate[]; settings: AnalysisSettings; partsFiles: readonly PartsFile[] }
  | { kind: 'fixes'; uri: string; sequence: number; findings: number[] }
  | { kind: 'view'; uri: string; sequence: number; request: ViewRequest }
  | { kind: 'forget'; uri: string };

export type WorkerAnswer =
  | { kind: 'analysed'; file: FileAnalysis | undefined; sequence: number }
  | { kind: 'fixes'; fixes: Fix[][] }
  | { kind: 'view'; view: ViewContent | null }
  | { kind: 'forgotten' }
  | { kind: 'failed'; message: string };

/** A request as posted, with the id its answer carries back. */
export interface PostedRequest {
  id: number;
  request: WorkerRequest;
}

export interface PostedAnswer {
  id: number;
  answer: WorkerAnswer;
}
