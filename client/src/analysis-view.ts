/**
 * Webviews for the waveforms and the topology comparison. The server renders the SVG and tables;
 * the page runs no script and loads nothing remote (strict content security policy).
 */
import * as vscode from 'vscode';
import type { LanguageClient } from 'vscode-languageclient/node';

export type ViewKind = 'waveforms' | 'comparison';

interface ViewContent {
  title: string;
  /** Self-contained HTML body (SVG and tables) rendered by the server. */
  body: string;
}

export async function showAnalysisView(
  context: vscode.ExtensionContext, client: LanguageClient, kind: ViewKind, uri: string, rectifierId?: string,
): Promise<void> {
  const content = await client.sendRequest<ViewContent | null>('rectilens/view', { kind, uri, rectifierId });
  if (!content) {
    void vscode.window.showInformationMessage('Rectilens: no rectifier found in this file.');
    return;
  }
  const panel = vscode.window.createWebviewPanel(`rectilens.${kind}`, content.title, vscode.ViewColumn.Beside, {
    enableScripts: false,
    localResourceRoots: [],
  });
  context.subscriptions.push(panel);
  panel.webview.html = pageOf(content, panel.webview.cspSource);
}

function pageOf(content: ViewContent, cspSource: string): string {
  return `<!DOCTYPE html>
<html lang="en"><head><meta charset="utf-8">
<meta http-equiv="Content-Security-Policy" content="default-src 'none'; img-src ${cspSource} data:; style-src 'unsafe-inline';">
<title>${escapeHtml(content.title)}</title></head>
<body>${content.body}</body></html>`;
}

function escapeHtml(text: string): string {
  return text.replace(/[&<>"]/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;' })[c]!);
}
