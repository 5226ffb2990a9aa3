/**
 * The "write report" command: asks the server for the open file's HTML report (the same page as
 * `rectilens report --html`), writes it beside the netlist as `<name>.report.html` (an unsaved
 * file's goes to the extension's storage) and opens it in the browser. It computes nothing.
 */
import * as vscode from 'vscode';
import type { LanguageClient } from 'vscode-languageclient/node';
import { VIEW_REQUEST, type ViewContent, type ViewRequest } from '../../server/src/protocol/custom-protocol';

export async function writeReport(context: vscode.ExtensionContext, client: LanguageClient, uri: string): Promise<vscode.Uri | undefined> {
  const content = await client.sendRequest<ViewContent | null>(VIEW_REQUEST, { kind: 'report', uri } satisfies ViewRequest);
  if (!content) {
    void vscode.window.showInformationMessage('Rectilens: this file has not been analysed yet.');
    return undefined;
  }
  const target = reportUri(context, vscode.Uri.parse(uri));
  await vscode.workspace.fs.createDirectory(vscode.Uri.joinPath(target, '..'));
  await vscode.workspace.fs.writeFile(target, new TextEncoder().encode(content.body));
  await vscode.env.openExternal(target);
  void vscode.window.showInformationMessage(`Rectilens: report written to ${target.scheme === 'file' ? target.fsPath : target.toString()}`);
  return target;
}

/** `<netlist without its extension>.report.html` beside a saved file; in the extension's storage for an unsaved one. */
function reportUri(context: vscode.ExtensionContext, netlist: vscode.Uri): vscode.Uri {
  const base = (netlist.path.split('/').pop() || 'netlist').replace(/\.[^.]*$/, '') || 'netlist';
  if (netlist.scheme === 'file') return vscode.Uri.joinPath(netlist, '..', `${base}.report.html`);
  return vscode.Uri.joinPath(context.globalStorageUri, `${base}.report.html`);
}
