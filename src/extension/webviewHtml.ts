/** The panel's page: the webview's own template with a fresh nonce, and a script-free page for files that cannot be read. */
import { randomBytes } from 'node:crypto';
import * as vscode from 'vscode';
import { escapeAttr, panelHtml } from '../../webview/template';

/** Resources the panel may load: the bundles and the stylesheet of this extension, nothing else. */
export function localRoots(extensionUri: vscode.Uri): vscode.Uri[] {
  return [vscode.Uri.joinPath(extensionUri, 'dist'), vscode.Uri.joinPath(extensionUri, 'media')];
}

export function spectrumHtml(webview: vscode.Webview, extensionUri: vscode.Uri): string {
  return panelHtml({
    cspSource: webview.cspSource,
    nonce: randomBytes(18).toString('base64url'),
    scriptUri: webview.asWebviewUri(vscode.Uri.joinPath(extensionUri, 'dist', 'webview.js')).toString(),
    styleUri: webview.asWebviewUri(vscode.Uri.joinPath(extensionUri, 'media', 'couplet.css')).toString(),
  });
}

/** Shown instead of the plot when the spectrum cannot be read; no script at all. */
export function errorHtml(message: string): string {
  return `<!DOCTYPE html>
<html lang="en"><head><meta charset="UTF-8">
<meta http-equiv="Content-Security-Policy" content="default-src 'none'">
<title>Couplet: cannot open spectrum</title></head>
<body><h2>This spectrum cannot be opened</h2><pre>${escapeAttr(message)}</pre></body></html>
`;
}
