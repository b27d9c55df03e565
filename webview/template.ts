/**
 * The panel's HTML, as a pure string builder (no DOM) so the host can import it and a test can
 * read it. Strict CSP: nothing loads unless it comes from the extension (cspSource) or carries the
 * per-load nonce; no inline handlers or inline styles anywhere (the script wires all events).
 */

export interface PanelHtmlOptions {
  /** `webview.cspSource` of the panel. */
  readonly cspSource: string;
  /** A fresh random nonce per load (letters and digits). */
  readonly nonce: string;
  /** `webview.asWebviewUri` of dist/webview.js (the toolkit is bundled into it). */
  readonly scriptUri: string;
  /** `webview.asWebviewUri` of media/couplet.css. */
  readonly styleUri: string;
}

/** Escapes text for an HTML attribute value in double quotes. */
export function escapeAttr(s: string): string {
  return s.replace(/&/g, '&amp;').replace(/"/g, '&quot;').replace(/</g, '&lt;').replace(/>/g, '&gt;');
}

export function cspContent(cspSource: string, nonce: string): string {
  return [
    "default-src 'none'",
    `img-src ${cspSource} data:`,
    `style-src ${cspSource}`,
    `script-src 'nonce-${nonce}'`,
  ].join('; ');
}

export function panelHtml(o: PanelHtmlOptions): string {
  if (!/^[A-Za-z0-9+/=_-]{16,}$/.test(o.nonce)) {
    throw new RangeError('panelHtml: nonce must be at least 16 letters, digits or base64 characters');
  }
  const nonce = escapeAttr(o.nonce);
  return `<!DOCTYPE html>
<html lang="en">
<head>
<meta charset="UTF-8">
<meta http-equiv="Content-Security-Policy" content="${escapeAttr(cspContent(o.cspSource, o.nonce))}">
<meta name="viewport" content="width=device-width, initial-scale=1.0">
<link rel="stylesheet" href="${escapeAttr(o.styleUri)}">
<title>Couplet spectrum</title>
</head>
<body>
<div id="toolbar" class="toolbar" role="toolbar" aria-label="Spectrum tools"></div>
<div id="status" class="status" role="status" aria-live="polite"></div>
<div id="plotWrap" class="plot-wrap">
<canvas id="plot" class="plot" tabindex="0" aria-label="Spectrum plot. Arrow keys pan, plus and minus zoom, N and P move between peaks, M measures, A accepts, L labels, Delete removes the pick, Z zooms to the peak, 0 resets, C and Shift+C step through compared changes. In a 1D spectrum, Shift+drag sets the multiplet region; Alt+R types it, Alt+I sets the integral reference."></canvas>
<div id="readout" class="readout" aria-live="off"></div>
<ol id="changes" class="changes" hidden aria-label="Changes since another revision: C and Shift+C step through them"></ol>
</div>
<div id="trace" class="trace" hidden>
<canvas id="traceCanvas" class="trace-canvas" aria-label="Traces of the measured cross peak"></canvas>
<pre id="traceText" class="trace-text"></pre>
</div>
<script nonce="${nonce}" src="${escapeAttr(o.scriptUri)}"></script>
</body>
</html>
`;
}
