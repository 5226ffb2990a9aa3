/** Hover, inlay hints, code lens, code actions and the views: the features that show analysis results. */
import { CodeActionKind, InlayHintKind, MarkupKind, type CodeAction, type CodeLens, type InlayHint } from 'vscode-languageserver/node';
import { lineIndexOf } from '../analysis/line-index';
import { codeLensesOf } from '../features/code-lens';
import { hoverAt } from '../features/hover';
import { inlayHintsOf } from '../features/inlay-hints';
import { devicesAtCard } from '../features/rectifier-lookup';
import { stressHover } from '../features/stress-hover';
import { renderView, type ViewRequest } from './views';
import { toRange, toWorkspaceEdit } from './convert';
import type { ServerContext } from './server';

type Guard = <P, R>(empty: R, handler: (params: P) => R) => (params: P) => R;

export function registerEditorFeatures(context: ServerContext, guard: Guard): void {
  const { connection, scheduler, linesOf } = context;

  connection.onCodeAction(guard([], (params) => {
    const file = scheduler.get(params.textDocument.uri);
    if (!file) return [];
    const lines = lineIndexOf(file);
    const start = lines.offsetAt(params.range.start);
    const end = lines.offsetAt(params.range.end);
    const actions: CodeAction[] = [];
    for (const finding of file.findings) {
      if (finding.uri !== file.uri || !finding.fixes?.length || finding.span.end < start || finding.span.start > end) continue;
      for (const fix of finding.fixes) {
        actions.push({
          title: fix.title,
          kind: CodeActionKind.QuickFix,
          isPreferred: fix.preferred,
          diagnostics: params.context.diagnostics.filter((d) => d.code === finding.code),
          edit: toWorkspaceEdit(fix.edits, linesOf),
        });
      }
    }
    return actions;
  }));

  connection.onHover(guard(null, (params) => {
    const file = scheduler.get(params.textDocument.uri);
    if (!file) return null;
    const lines = lineIndexOf(file);
    const found = hoverAt(file.netlist, lines.offsetAt(params.position), (card) => {
      const hits = devicesAtCard(file, card.span);
      return hits.length ? stressHover(file, hits) : undefined;
    });
    return found ? { contents: { kind: MarkupKind.Markdown, value: found.markdown }, range: toRange(lines, found.span) } : null;
  }));

  connection.languages.inlayHint.on(guard([], (params) => {
    const file = scheduler.get(params.textDocument.uri);
    if (!file) return [];
    const lines = lineIndexOf(file);
    const from = lines.offsetAt(params.range.start);
    const to = lines.offsetAt(params.range.end);
    return inlayHintsOf(file, context.settings().hintDetail ?? 'brief')
      .filter((h) => h.offset >= from && h.offset <= to)
      .map((h): InlayHint => ({ position: lines.positionAt(h.offset), label: h.label, tooltip: h.tooltip, kind: InlayHintKind.Type, paddingLeft: true }));
  }));

  connection.onCodeLens(guard([], (params) => {
    const file = scheduler.get(params.textDocument.uri);
    if (!file) return [];
    const lines = lineIndexOf(file);
    return codeLensesOf(file).map((lens): CodeLens => {
      const position = lines.positionAt(lens.offset);
      const range = { start: position, end: position };
      return { range, command: { title: lens.title, command: lens.command?.id ?? '', arguments: lens.command?.args } };
    });
  }));

  connection.onRequest('rectilens/view', guard(null, (params: ViewRequest) => renderView(scheduler.get(params.uri), params)));
}
