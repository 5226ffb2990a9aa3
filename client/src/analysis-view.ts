/**
 * Webviews for the waveforms and the topology comparison. The server renders the SVG and tables;
 * the page runs no script and loads nothing remote (strict content security policy).
 */
import * as vscode from 'vscode';
import type { LanguageClient } from 'vscode-languageclient/node';
import { VIEW_REQUEST, type ViewContent, type ViewKind, type ViewRequest } from '../../server/src/protocol/custom-protocol';
import { viewPage } from './view-page';

export async function showAnalysisView(
  context: vscode.ExtensionContext, client: LanguageClient, kind: ViewKind, uri: string, rectifierId?: string,
): Promise<void> {
  const content = await client.sendRequest<ViewContent | null>(VIEW_REQUEST, { kind, uri, rectifierId } satisfies ViewRequest);
  if (!content) {
    void vscode.window.showInformationMessage('Rectilens: no rectifier found in this file.');
    return;
  }
  const panel = vscode.window.createWebviewPanel(`rectilens.${kind}`, content.title, vscode.ViewColumn.Beside, {
    enableScripts: false,
    localResourceRoots: [],
  });
  context.subscriptions.push(panel);
  panel.webview.html = viewPage(content, panel.webview.cspSource);
}
