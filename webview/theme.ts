/**
 * Colours from the VS Code theme (the webview body carries the theme's CSS variables and a
 * `vscode-light` / `vscode-dark` / `vscode-high-contrast` class). Our palette: positive levels in
 * the theme's chart blue, negative in its chart orange (distinct also for red-green colour vision);
 * in high-contrast themes all lines are opaque and negative levels are dashed as well.
 */
export interface Palette {
  readonly positive: string;
  readonly negative: string;
  readonly foreground: string;
  readonly muted: string;
  readonly grid: string;
  readonly background: string;
  readonly pick: string;
  readonly focus: string;
  readonly fit: string;
  readonly residual: string;
  readonly highContrast: boolean;
  readonly font: string;
}

function cssVar(style: CSSStyleDeclaration, name: string, fallback: string): string {
  const v = style.getPropertyValue(name).trim();
  return v || fallback;
}

export function readPalette(): Palette {
  const style = getComputedStyle(document.body);
  const highContrast = document.body.classList.contains('vscode-high-contrast') || document.body.classList.contains('vscode-high-contrast-light');
  const foreground = cssVar(style, '--vscode-editor-foreground', '#888');
  return {
    positive: cssVar(style, '--vscode-charts-blue', '#3a7bd5'),
    negative: cssVar(style, '--vscode-charts-orange', '#d9822b'),
    foreground,
    muted: cssVar(style, '--vscode-descriptionForeground', foreground),
    grid: cssVar(style, '--vscode-editorWidget-border', 'rgba(128,128,128,0.35)'),
    background: cssVar(style, '--vscode-editor-background', 'transparent'),
    pick: cssVar(style, '--vscode-charts-purple', '#9a5fd0'),
    focus: cssVar(style, '--vscode-focusBorder', '#0078d4'),
    fit: cssVar(style, '--vscode-charts-green', '#3c9d5d'),
    residual: cssVar(style, '--vscode-charts-red', '#c74e39'),
    highContrast,
    font: `${cssVar(style, '--vscode-font-size', '12px')} ${cssVar(style, '--vscode-font-family', 'sans-serif')}`,
  };
}

/** Lower levels drawn fainter so the eye finds the peak tops; opaque in high contrast. */
export function levelAlpha(k: number, count: number, p: Palette): number {
  if (p.highContrast) return 1;
  return count <= 1 ? 1 : 0.45 + (0.55 * k) / (count - 1);
}
