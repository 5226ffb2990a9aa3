/** Conversions between core values (offsets, findings) and protocol values (positions, diagnostics). */
import {
  DiagnosticSeverity, DocumentSymbol, FoldingRangeKind, SymbolKind, type Diagnostic, type FoldingRange, type Range, type TextEdit,
  type WorkspaceEdit,
} from 'vscode-languageserver/node';
import type { Span } from '../../../grammar/src/index';
import type { Finding, TextEdit as CoreEdit } from '../findings/index';
import { LineIndex } from '../../../grammar/src/index';
import type { FoldRange, OutlineSymbol } from '../editor/outline';
import { rulePageUri } from './rule-pages';

const SEVERITY: Readonly<Record<Finding['severity'], DiagnosticSeverity>> = {
  error: DiagnosticSeverity.Error,
  warning: DiagnosticSeverity.Warning,
  info: DiagnosticSeverity.Information,
  hint: DiagnosticSeverity.Hint,
};

export function toRange(lines: LineIndex, span: Span): Range {
  return { start: lines.positionAt(span.start), end: lines.positionAt(span.end) };
}

export function toDiagnostic(lines: LineIndex, finding: Finding, linesOf: (uri: string) => LineIndex | undefined): Diagnostic {
  const diagnostic: Diagnostic = {
    range: toRange(lines, finding.span),
    severity: SEVERITY[finding.severity],
    code: finding.code,
    source: 'rectilens',
    message: finding.message,
  };
  const page = rulePageUri(finding.code);
  if (page) diagnostic.codeDescription = { href: page };
  const related = finding.related?.flatMap((r) => {
    const index = linesOf(r.uri);
    return index ? [{ location: { uri: r.uri, range: toRange(index, r.span) }, message: r.message }] : [];
  });
  if (related?.length) diagnostic.relatedInformation = related;
  return diagnostic;
}

export function toWorkspaceEdit(edits: readonly CoreEdit[], linesOf: (uri: string) => LineIndex | undefined): WorkspaceEdit {
  const changes: Record<string, TextEdit[]> = {};
  for (const edit of edits) {
    const lines = linesOf(edit.uri);
    if (!lines) continue;
    (changes[edit.uri] ??= []).push({ range: toRange(lines, edit.span), newText: edit.newText });
  }
  return { changes };
}

const SYMBOL_KIND: Readonly<Record<OutlineSymbol['kind'], SymbolKind>> = {
  subckt: SymbolKind.Module,
  model: SymbolKind.Class,
  source: SymbolKind.Event,
  rectifier: SymbolKind.Struct,
  part: SymbolKind.Field,
};

export function toDocumentSymbol(lines: LineIndex, symbol: OutlineSymbol): DocumentSymbol {
  return DocumentSymbol.create(
    symbol.name, symbol.detail, SYMBOL_KIND[symbol.kind], toRange(lines, symbol.span), toRange(lines, symbol.selection),
    symbol.children.map((c) => toDocumentSymbol(lines, c)),
  );
}

export function toFoldingRange(lines: LineIndex, fold: FoldRange): FoldingRange {
  return {
    startLine: lines.positionAt(fold.start).line,
    endLine: lines.positionAt(fold.end).line,
    kind: fold.kind === 'comment' ? FoldingRangeKind.Comment : FoldingRangeKind.Region,
  };
}
