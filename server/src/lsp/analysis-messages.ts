/**
 * The messages between the language server's main thread and its analysis worker. Everything in
 * them is plain data (structured clone); a finding's quick fixes are computed in the worker on
 * request, since they run trial solves and cannot cross as functions. An editor that resolves
 * code actions gets the fixes in two steps: `plans` (no trial solve: finished cheap fixes, and the
 * titles of the expensive ones) and `resolve` (one offer's trial solves, when it is chosen).
 */
import type { AnalysisSettings } from '../analysis/settings';
import type { Fix, OfferSummary } from '../findings/index';
import type { PartsFile } from '../ratings/index';
import type { ViewContent, ViewRequest } from '../protocol/custom-protocol';
import type { PostedAnalysis } from './posted-analysis';
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
  /** `held`: the sequence of the analysis of `uri` the main thread holds, which the answer may point into (posted-analysis.ts). */
  | { kind: 'analyse'; uri: string; documents: DocumentUpdate[]; settings: AnalysisSettings; partsFiles: readonly PartsFile[]; held?: number }
  | { kind: 'fixes'; uri: string; sequence: number; findings: number[] }
  | { kind: 'plans'; uri: string; sequence: number; findings: number[] }
  /** `offer` indexes the finding's `plans` answer. */
  | { kind: 'resolve'; uri: string; sequence: number; finding: number; offer: number }
  | { kind: 'view'; uri: string; sequence: number; request: ViewRequest }
  | { kind: 'forget'; uri: string };

export type WorkerAnswer =
  | { kind: 'analysed'; file: PostedAnalysis | undefined; sequence: number }
  | { kind: 'fixes'; fixes: Fix[][] }
  | { kind: 'plans'; plans: OfferSummary[][] }
  | { kind: 'resolved'; outcome: ResolveOutcome }
  | { kind: 'view'; view: ViewContent | null }
  | { kind: 'forgotten' }
  | { kind: 'failed'; message: string };

/** One offer verified: its fix, why its trial solves found none, or that the worker no longer has it. */
export type ResolveOutcome =
  | { kind: 'fix'; fix: Fix }
  | { kind: 'unverified'; reason: string }
  | { kind: 'gone' };

/** A request as posted, with the id its answer carries back. */
export interface PostedRequest {
  id: number;
  request: WorkerRequest;
}

export interface PostedAnswer {
  id: number;
  answer: WorkerAnswer;
}
