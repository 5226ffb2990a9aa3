/**
 * Quick fixes: the fixes of the findings in the editor's range, one action per distinct edit.
 * For an editor that resolves code actions, a fix that needs trial solves is offered by its plan's
 * title alone, with `data` naming the analysis, the finding and the offer; `codeAction/resolve`
 * runs the trial solves in the worker when the fix is chosen. Any other editor gets every fix
 * computed in the request, as the command line does.
 */
import { CodeActionKind, MessageType, ShowMessageNotification, type CodeAction, type CodeActionParams } from 'vscode-languageserver/node';
import type { FileAnalysis } from '../analysis/analyze';
import { distinctFixes, editsKey, findingsInRange, type Fix } from '../findings/index';
import { toWorkspaceEdit } from './convert';
import type { Guard } from './request-guard';
import type { ServerState } from './server-state';

/** What a planned action carries to its resolve: the analysis it was planned on and the offer in it. */
interface PlannedData {
  uri: string;
  /** The document version the analysis was made from. */
  version: number | undefined;
  /** The worker's number of that analysis. */
  sequence: number;
  finding: number;
  code: string;
  offer: number;
}

export function registerCodeActions(state: ServerState, guard: Guard): void {
  state.connection.onCodeAction(guard([], (params) => codeActionsFor(state, params)));
  // resolveCodeAction answers a fault as a refusal (never silently without its edit); the guard adds cancellation.
  state.connection.onCodeActionResolve((action, token) => guard<CodeAction, Promise<CodeAction>>(action, (a) => resolveCodeAction(state, a))(action, token));
}

/** Whether a code-action request's `only` filter admits a kind (a requested kind covers its sub-kinds). */
export function wantsKind(only: readonly string[] | undefined, kind: string): boolean {
  return !only || only.some((k) => k === kind || kind.startsWith(`${k}.`));
}

async function codeActionsFor(state: ServerState, params: CodeActionParams): Promise<CodeAction[]> {
  // Every action we offer is a quick fix; a request for other kinds only (source actions, refactors) gets none.
  if (!wantsKind(params.context.only, CodeActionKind.QuickFix)) return [];
  const place = await state.freshPlaceIn(params.textDocument.uri, params.range.start);
  if (!place) return [];
  const { file, lines } = place;
  const inRange = findingsInRange(file.findings, file.uri, place.offset, lines.offsetAt(params.range.end));
  const sequence = state.scheduler.sequenceOf(file.uri);
  const action = (title: string, preferred: boolean | undefined, offeredBy: number[]): CodeAction => {
    const codes = new Set(offeredBy.map((index) => file.findings[index]!.code));
    const diagnostics = params.context.diagnostics.filter((d) => codes.has(String(d.code)));
    return { title, kind: CodeActionKind.QuickFix, ...(preferred ? { isPreferred: true } : {}), diagnostics };
  };
  const withEdit = (fix: Fix, offeredBy: number[]): CodeAction => ({ ...action(fix.title, fix.preferred, offeredBy), edit: toWorkspaceEdit(fix.edits, state.linesOf) });
  if (!state.codeActionResolve.edit || sequence === undefined) {
    // The fixes run trial solves, so the worker computes them on its copy of this analysis.
    const fixes = await state.scheduler.fixesOf(file, inRange);
    return distinctFixes(inRange, fixes, editsKey).map(({ fix, offeredBy }) => withEdit(fix, offeredBy));
  }
  const version = state.scheduler.versionOf(file.uri);
  const plans = await state.worker.plans(file.uri, sequence, inRange);
  return distinctFixes(inRange, plans, (o) => o.key).map(({ fix: offer, offeredBy }) => {
    if (offer.fix) return withEdit({ ...offer.fix, preferred: offer.preferred }, offeredBy);
    const finding = offeredBy[0]!;
    const data: PlannedData = {
      uri: file.uri, version, sequence, finding, code: file.findings[finding]!.code,
      offer: plans[inRange.indexOf(finding)]!.findIndex((o) => o.key === offer.key),
    };
    return { ...action(offer.title, offer.preferred, offeredBy), data };
  });
}

async function resolveCodeAction(state: ServerState, action: CodeAction): Promise<CodeAction> {
  const data = plannedData(action.data);
  if (!data || action.edit) return action;
  try {
    const stale = staleness(state, data);
    if (stale) return refused(state, action, stale);
    const outcome = await state.worker.resolve(data.uri, data.sequence, data.finding, data.offer);
    if (outcome.kind === 'gone') return refused(state, action, 'the analysis it was planned on is gone; ask for quick fixes again');
    if (outcome.kind === 'unverified') return refused(state, action, outcome.reason);
    // The trial solves take a while; an edit typed meanwhile makes the fix's offsets wrong.
    const after = staleness(state, data);
    if (after) return refused(state, action, after);
    const { data: _planned, ...rest } = action;
    // The title says what the trial solves verified, which the plan could only name as a candidate.
    return { ...rest, title: outcome.fix.title, edit: toWorkspaceEdit(outcome.fix.edits, state.linesOf) };
  } catch (error) {
    state.connection.console.error(`rectilens: ${error instanceof Error ? error.stack : String(error)}`);
    return refused(state, action, 'Rectilens failed while verifying it');
  }
}

/** Why a planned action can no longer be resolved against the file as it is, or undefined. */
function staleness(state: ServerState, data: PlannedData): string | undefined {
  const document = state.documents.get(data.uri);
  if (!document) return 'the file was closed since the fix was offered';
  if (document.version !== data.version) return 'the file changed since the fix was offered; ask for quick fixes again';
  if (state.scheduler.sequenceOf(data.uri) !== data.sequence || findingCode(state.scheduler.get(data.uri), data.finding) !== data.code) {
    return 'the file was analysed again since the fix was offered (its settings, parts files or includes changed); ask for quick fixes again';
  }
  return undefined;
}

function findingCode(file: FileAnalysis | undefined, index: number): string | undefined {
  return file?.findings[index]?.code;
}

/**
 * The action without an edit, saying why in its title and (where the editor shows it) `disabled`.
 * An editor applies a resolved action without showing its title again, so the reason is also
 * shown as a message: otherwise choosing the fix would seem to do nothing.
 */
function refused(state: ServerState, action: CodeAction, reason: string): CodeAction {
  const { edit: _none, data: _planned, ...rest } = action;
  // A notification, not `showWarningMessage` (a request): an editor that answers no requests must not fail it.
  void state.connection.sendNotification(ShowMessageNotification.type, { type: MessageType.Warning, message: `Rectilens did not apply "${action.title}": ${reason}.` })
    .catch(() => undefined);
  return { ...rest, title: `${action.title}: not applied, ${reason}`, ...(state.codeActionResolve.disabled ? { disabled: { reason } } : {}) };
}

function plannedData(data: unknown): PlannedData | undefined {
  const d = data as Partial<PlannedData> | undefined;
  const ok = typeof d?.uri === 'string' && typeof d.sequence === 'number' && typeof d.finding === 'number' && typeof d.offer === 'number' && typeof d.code === 'string';
  return ok ? (d as PlannedData) : undefined;
}
