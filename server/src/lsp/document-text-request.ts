/**
 * `rectilens/documentText` — the server's own copy of an open document (`{ uri }` → `{ version,
 * text }`, or null when it is not open). A test and diagnostic aid: incremental sync bugs are
 * silent (the server analyses text the user does not see), so the edit-session fuzz suite compares
 * this copy with the client's after every batch of edits. It changes nothing and reads no file.
 */
import type { Connection, TextDocuments } from 'vscode-languageserver/node';
import type { TextDocument } from 'vscode-languageserver-textdocument';
import { DOCUMENT_TEXT_REQUEST } from '../protocol/custom-protocol';

export { DOCUMENT_TEXT_REQUEST };

export function registerDocumentTextRequest(connection: Connection, documents: TextDocuments<TextDocument>): void {
  connection.onRequest(DOCUMENT_TEXT_REQUEST, (params: { uri?: unknown }) => {
    const document = typeof params?.uri === 'string' ? documents.get(params.uri) : undefined;
    return document ? { version: document.version, text: document.getText() } : null;
  });
}
