/** Hover, inlay hints, code lens and code actions: the features that show analysis results. */
import { CodeActionKind, MarkupKind, type CodeAction } from 'vscode-languageserver/node';
import { hoverAt } from '../features/hover';
import { LineIndex } from '../analysis/line-index';
import { toRange, toWorkspaceEdit } from './convert';
import type { ServerContext } from './server';

type Guard = <P, R>(empty: R, handler: (params: P) => R) => (params: P) => R;

export function registerEditorFeatures(context: ServerContext, guard: Guard): void {
  const { connection, scheduler, linesOf } = context;

  connection.onCodeAction(guard([], (params) => {
    const file = scheduler.get(params.textDocument.uri);
    if (!file) return [];
    const lines = new LineIndex(file.text);
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
    const lines = new LineIndex(file.text);
    const found = hoverAt(file.netlist, lines.offsetAt(params.position));
    return found ? { contents: { kind: MarkupKind.Markdown, value: found.markdown }, range: toRange(lines, found.span) } : null;
  }));
  connection.languages.inlayHint.on(guard([], () => []));
  connection.onCodeLens(guard([], () => []));
}
