/**
 * The VS Code side: starts the language server, hosts the waveform and comparison views and writes
 * the open file's report. It computes nothing; every figure comes from the server, and its busy
 * item is the server's standard progress, which the language client shows in the status bar.
 */
import * as vscode from 'vscode';
import { LanguageClient, TransportKind, type LanguageClientOptions, type ServerOptions } from 'vscode-languageclient/node';
import { COMMANDS, type ViewKind } from '../../server/src/protocol/custom-protocol';
import { showAnalysisView } from './analysis-view';
import { writeReport } from './write-report';

let client: LanguageClient | undefined;

export async function activate(context: vscode.ExtensionContext): Promise<void> {
  client = createClient(context);
  const openView = (kind: ViewKind) => async (uri?: string, rectifierId?: string) => {
    const target = uri ?? vscode.window.activeTextEditor?.document.uri.toString();
    if (!target || !client) return;
    await showAnalysisView(context, client, kind, target, rectifierId);
  };
  context.subscriptions.push(
    vscode.commands.registerCommand(COMMANDS.showWaveforms, openView('waveforms')),
    vscode.commands.registerCommand(COMMANDS.compareTopologies, openView('comparison')),
    vscode.commands.registerCommand(COMMANDS.writeReport, async (uri?: string) => {
      const target = uri ?? vscode.window.activeTextEditor?.document.uri.toString();
      if (target && client) await writeReport(context, client, target);
    }),
    // Trust changes what the server may read: restart it with the new policy.
    vscode.workspace.onDidGrantWorkspaceTrust(async () => {
      await client?.stop();
      client = createClient(context);
      await client.start();
    }),
  );
  await client.start();
}

export async function deactivate(): Promise<void> {
  await client?.stop();
}

function createClient(context: vscode.ExtensionContext): LanguageClient {
  const module = context.asAbsolutePath('dist/server.js');
  const serverOptions: ServerOptions = {
    run: { module, transport: TransportKind.ipc },
    debug: { module, transport: TransportKind.ipc, options: { execArgv: ['--nolazy', '--inspect=6019'] } },
  };
  const clientOptions: LanguageClientOptions = {
    // Files on disk and unsaved buffers only: a diff's 'git:' copy or a remote preview is not a design to check.
    documentSelector: [{ scheme: 'file', language: 'netlist' }, { scheme: 'untitled', language: 'netlist' }],
    synchronize: { configurationSection: 'rectilens' },
    initializationOptions: { trusted: vscode.workspace.isTrusted },
  };
  return new LanguageClient('rectilens', 'Rectilens', serverOptions, clientOptions);
}
