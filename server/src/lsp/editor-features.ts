/** Hover, inlay hints, code lenses, quick fixes and the views: the features that show analysis results. */
import { CodeActionKind, InlayHintKind, MarkupKind, type CodeAction, type CodeLens, type InlayHint } from 'vscode-languageserver/node';
import { distinctFixes, findingsInRange } from '../findings/index';
import { codeLensesOf } from '../editor/code-lens';
import { inlayHintsIn } from '../editor/inlay-hints';
import { hoverInFile } from '../editor/stress-hover';
import { markdownToPlainText } from '../presentation/markup';
import { VIEW_REQUEST, type ViewRequest } from '../protocol/custom-protocol';
import { toRange, toWorkspaceEdit } from './convert';
import type { Guard } from './request-guard';
import type { ServerState } from './server-state';

export function registerEditorFeatures(state: ServerState, guard: Guard): void {
  const { connection, scheduler } = state;

  connection.onCodeAction(guard([], async (params) => {
    // Every action we offer is a quick fix; a request for other kinds only (source actions, refactors) gets none.
    if (!wantsKind(params.context.only, CodeActionKind.QuickFix)) return [];
    const place = await state.freshPlaceIn(params.textDocument.uri, params.range.start);
    if (!place) return [];
    const { file, lines } = place;
    const inRange = findingsInRange(file.findings, file.uri, place.offset, lines.offsetAt(params.range.end));
    // The fixes run trial solves, so the worker computes them on its copy of this analysis.
    const fixes = await scheduler.fixesOf(file, inRange);
    return distinctFixes(inRange, fixes).map(({ fix, offeredBy }): CodeAction => {
      const codes = new Set(offeredBy.map((index) => file.findings[index]!.code));
      return {
        title: fix.title,
        kind: CodeActionKind.QuickFix,
        isPreferred: fix.preferred,
        diagnostics: params.context.diagnostics.filter((d) => codes.has(String(d.code))),
        edit: toWorkspaceEdit(fix.edits, state.linesOf),
      };
    });
  }));

  connection.onHover(guard(null, async (params) => {
    const place = await state.freshPlaceIn(params.textDocument.uri, params.position);
    const found = place && hoverInFile(place.file, place.offset);
    if (!found) return null;
    // An editor that reads plaintext only (it says so in its hover contentFormat) gets the text without Markdown marks.
    const contents = state.hoverMarkdown ? { kind: MarkupKind.Markdown, value: found.markdown } : { kind: MarkupKind.PlainText, value: markdownToPlainText(found.markdown) };
    return { contents, range: toRange(place.lines, found.span) };
  }));

  connection.languages.inlayHint.on(guard([], async (params) => {
    const place = await state.freshPlaceIn(params.textDocument.uri, params.range.start);
    if (!place) return [];
    const hints = inlayHintsIn(place.file, state.settingsFor(place.file.uri).hintDetail ?? 'brief', place.offset, place.lines.offsetAt(params.range.end));
    return hints.map((h): InlayHint => ({ position: place.lines.positionAt(h.offset), label: h.label, tooltip: h.tooltip, kind: InlayHintKind.Type, paddingLeft: true }));
  }));

  connection.onCodeLens(guard([], async (params) => {
    const place = await state.freshPlaceIn(params.textDocument.uri);
    if (!place) return [];
    return codeLensesOf(place.file).map((lens): CodeLens => {
      const position = place.lines.positionAt(lens.offset);
      return { range: { start: position, end: position }, command: { title: lens.title, command: lens.command?.id ?? '', arguments: lens.command?.args } };
    });
  }));

  connection.onRequest(VIEW_REQUEST, guard(null, (params: ViewRequest) => scheduler.viewOf(params)));
}

/** Whether a code-action request's `only` filter admits a kind (a requested kind covers its sub-kinds). */
export function wantsKind(only: readonly string[] | undefined, kind: string): boolean {
  return !only || only.some((k) => k === kind || kind.startsWith(`${k}.`));
}
