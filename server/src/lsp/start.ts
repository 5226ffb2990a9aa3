/** Starts the server on the transport named on the command line (`--stdio`, `--node-ipc`, `--socket=`). */
import { createConnection, ProposedFeatures } from 'vscode-languageserver/node';
import { startServer } from './server';

export function startStdioOrIpcServer(): void {
  startServer(createConnection(ProposedFeatures.all));
}
