/**
 * The HTML page around a view body, kept apart from analysis-view.ts (which needs `vscode`) so a
 * test can check its content security policy: nothing may load or run but the inline style and
 * images from the webview itself.
 */

import type { ViewContent } from '../../server/src/protocol/custom-protocol';

export type { ViewContent };

/** The policy of every view page: no script at all, no remote host, styles inline only. */
export function contentSecurityPolicy(cspSource: string): string {
  return `default-src 'none'; img-src ${cspSource} data:; style-src 'unsafe-inline';`;
}

/** The whole page for a view; `cspSource` is the webview's own origin (`webview.cspSource`). */
export function viewPage(content: ViewContent, cspSource: string): string {
  return `<!DOCTYPE html>
<html lang="en"><head><meta charset="utf-8">
<meta http-equiv="Content-Security-Policy" content="${escapeHtml(contentSecurityPolicy(cspSource))}">
<title>${escapeHtml(content.title)}</title></head>
<body>${content.body}</body></html>`;
}

function escapeHtml(text: string): string {
  return text.replace(/[&<>"]/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;' })[c]!);
}
