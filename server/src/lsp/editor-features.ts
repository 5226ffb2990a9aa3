/** Hover, inlay hints, code lenses, quick fixes (code-actions.ts) and the views: the features that show analysis results. */
import { InlayHintKind, MarkupKind, type CodeLens, type InlayHint } from 'vscode-languageserver/node';
import { codeLensesOf } from '../editor/code-lens';
import { inlayHintsIn } from '../editor/inlay-hints';
import { hoverInFile } from '../editor/stress-hover';
import { markdownToPlainText } from '../presentation/markup';
import { VIEW_REQUEST, type ViewRequest } from '../protocol/custom-protocol';
import { registerCodeActions } from './code-actions';
import { toRange } from './convert';
import type { Guard } from './request-guard';
import type { ServerState } from './server-state';

export function registerEditorFeatures(state: ServerState, guard: Guard): void {
  const { connection, scheduler } = state;

  registerCodeActions(state, guard);

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
