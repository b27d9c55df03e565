import { describe, expect, it } from 'vitest';
import { panelHtml } from '../../webview/template';

const html = panelHtml({
  cspSource: 'https://file+.vscode-resource.test',
  nonce: 'abcDEF0123456789xyz',
  scriptUri: 'https://file+.vscode-resource.test/ext/dist/webview.js',
  styleUri: 'https://file+.vscode-resource.test/ext/media/couplet.css',
});

describe('panelHtml', () => {
  it('declares a CSP that denies by default and allows scripts only by nonce (VS Code webview guide)', () => {
    const csp = /<meta http-equiv="Content-Security-Policy" content="([^"]*)">/.exec(html)?.[1] ?? '';
    expect(csp).toContain("default-src 'none'");
    expect(csp).toContain("script-src 'nonce-abcDEF0123456789xyz'");
    expect(csp).toContain('style-src https://file+.vscode-resource.test');
    expect(csp).not.toContain('unsafe-inline');
    expect(csp).not.toContain('unsafe-eval');
  });

  it('puts the nonce on every script element', () => {
    const scripts = html.match(/<script\b[^>]*>/g) ?? [];
    expect(scripts.length).toBeGreaterThan(0);
    for (const s of scripts) expect(s).toContain('nonce="abcDEF0123456789xyz"');
  });

  it('has no inline event handlers, inline styles or inline script bodies', () => {
    expect(html).not.toMatch(/\son[a-z]+\s*=/i);
    expect(html).not.toMatch(/\sstyle\s*=/i);
    expect(html).not.toMatch(/<style\b/i);
    expect(html).not.toMatch(/<script\b[^>]*>[^<]+<\/script>/);
  });

  it('loads the stylesheet and script from the given URIs', () => {
    expect(html).toContain('<link rel="stylesheet" href="https://file+.vscode-resource.test/ext/media/couplet.css">');
    expect(html).toContain('src="https://file+.vscode-resource.test/ext/dist/webview.js"');
  });

  it('escapes URIs so a quote cannot end the attribute', () => {
    const h = panelHtml({ cspSource: 'x', nonce: 'abcDEF0123456789xyz', scriptUri: 'a"onload="b', styleUri: 's' });
    expect(h).toContain('src="a&quot;onload=&quot;b"');
  });

  it('refuses a short nonce', () => {
    expect(() => panelHtml({ cspSource: 'x', nonce: 'short', scriptUri: 'a', styleUri: 's' })).toThrow('nonce');
  });
});
