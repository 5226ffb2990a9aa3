/**
 * The language server: the only code that speaks the protocol. It puts together the state
 * (server-state.ts) and the handler groups, each handler being lookup → core function →
 * conversion behind one guard (request-guard.ts) that answers cancelled requests as cancelled
 * and turns a fault into an empty answer and a log line.
 */
import type { Connection } from 'vscode-languageserver/node';
import { registerConfiguration } from './configuration';
import { registerDocumentTextRequest } from './document-text-request';
import { registerEditorFeatures } from './editor-features';
import { registerNavigationFeatures } from './navigation-features';
import { createGuard } from './request-guard';
import { ServerState } from './server-state';

export function startServer(connection: Connection): void {
  const state = new ServerState(connection);
  const { documents, scheduler } = state;
  const guard = createGuard((message) => connection.console.error(message));

  registerConfiguration(state);
  documents.onDidChangeContent((change) => scheduler.schedule(scheduler.dependentsOf(change.document.uri).concat(change.document.uri)));
  documents.onDidClose((event) => state.forgetRoot(event.document.uri));
  registerNavigationFeatures(state, guard);
  registerEditorFeatures(state, guard);
  registerDocumentTextRequest(connection, documents);
  connection.onShutdown(() => state.worker.dispose());
  documents.listen(connection);
  connection.listen();
}
