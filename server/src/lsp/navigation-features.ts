/** Outline, folding, definition, references, rename, links and completion: the features that read the netlist's names (those that answer about a place wait for the current version). */
import { CompletionItemKind, ErrorCodes, ResponseError } from 'vscode-languageserver/node';
import { completeAt, modelsOf } from '../editor/completion';
import { allowedCodesOf, findDefinition, findReferences, includeLinksOf, prepareRename, rename } from '../editor/navigation';
import { rulePageUri } from './rule-pages';
import { foldingRangesOf, outlineOf } from '../editor/outline';
import { toDocumentSymbol, toFoldingRange, toRange, toWorkspaceEdit } from './convert';
import type { Guard } from './request-guard';
import type { ServerState } from './server-state';

const COMPLETION_KIND = {
  keyword: CompletionItemKind.Keyword, property: CompletionItemKind.Property, model: CompletionItemKind.Class,
  subckt: CompletionItemKind.Module, node: CompletionItemKind.Variable, code: CompletionItemKind.EnumMember,
} as const;

export function registerNavigationFeatures(state: ServerState, guard: Guard): void {
  const { connection } = state;
  const locationOf = (uri: string, span: { start: number; end: number }) => {
    const lines = state.linesOf(uri);
    return lines ? [{ uri, range: toRange(lines, span) }] : [];
  };

  connection.onDocumentSymbol(guard([], (params) => {
    const place = state.placeIn(params.textDocument.uri);
    return place ? outlineOf(place.file.netlist).map((s) => toDocumentSymbol(place.lines, s)) : [];
  }));
  connection.onFoldingRanges(guard([], (params) => {
    const place = state.placeIn(params.textDocument.uri);
    if (!place) return [];
    return foldingRangesOf(place.file.netlist).map((f) => toFoldingRange(place.lines, f)).filter((f) => f.endLine > f.startLine);
  }));
  connection.onDefinition(guard([], async (params) => {
    const place = await state.freshPlaceIn(params.textDocument.uri, params.position);
    return place ? findDefinition(state.fileSet(place.file.uri), place.offset).flatMap((l) => locationOf(l.uri, l.span)) : [];
  }));
  connection.onReferences(guard([], async (params) => {
    const place = await state.freshPlaceIn(params.textDocument.uri, params.position);
    if (!place) return [];
    return findReferences(state.fileSet(place.file.uri), place.offset, params.context.includeDeclaration).flatMap((l) => locationOf(l.uri, l.span));
  }));
  connection.onPrepareRename(guard(null, async (params) => {
    const place = await state.freshPlaceIn(params.textDocument.uri, params.position);
    const span = place && prepareRename(state.fileSet(place.file.uri), place.offset);
    return span ? toRange(place.lines, span) : null;
  }));
  connection.onRenameRequest(guard(null, async (params) => {
    const place = await state.freshPlaceIn(params.textDocument.uri, params.position);
    if (!place) return null;
    const edits = rename(state.fileSet(place.file.uri), place.offset, params.newName);
    return 'error' in edits ? new ResponseError(ErrorCodes.InvalidRequest, edits.error) : toWorkspaceEdit(edits, state.linesOf);
  }));
  connection.onDocumentLinks(guard([], async (params) => {
    const place = await state.freshPlaceIn(params.textDocument.uri);
    if (!place) return [];
    const includes = includeLinksOf(place.file.uri, place.file.netlist);
    // Each code an `*@ allow` line names links to the page of the rule it accepts.
    const codes = allowedCodesOf(place.file.netlist).flatMap((c) => {
      const page = rulePageUri(c.code);
      return page ? [{ span: c.span, target: page }] : [];
    });
    return [...includes, ...codes].map((l) => ({ range: toRange(place.lines, l.span), target: l.target }));
  }));
  connection.onCompletion(guard([], (params) => {
    const current = state.currentParse(params.textDocument.uri);
    if (!current) return [];
    // Models defined in the other files of the netlist come from the last analyses; everything else from the text as it is now.
    const included = state.fileSet(params.textDocument.uri).slice(1).map((f) => f.netlist);
    const models = [current.netlist, ...included].flatMap(modelsOf);
    return completeAt(current.netlist, current.document.offsetAt(params.position), models).map((item) => ({
      label: item.label, kind: COMPLETION_KIND[item.kind], detail: item.detail, insertText: item.insertText,
    }));
  }));
}
