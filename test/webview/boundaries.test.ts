import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';

const dir = join(__dirname, '..', '..', 'webview');
const sources = readdirSync(dir).filter((f) => f.endsWith('.ts')).map((f) => ({ f, text: readFileSync(join(dir, f), 'utf8') }));

describe('webview module boundaries', () => {
  it('imports the webview toolkit (no longer maintained) from toolkit.ts only, so it can be replaced', () => {
    const users = sources.filter((s) => s.text.includes('@vscode/webview-ui-toolkit')).map((s) => s.f);
    expect(users).toEqual(['toolkit.ts']);
  });
  it('keeps the page free of inline handlers: events are wired with addEventListener', () => {
    for (const s of sources) expect(s.text, s.f).not.toMatch(/\.on(click|change|keydown|input)\s*=/);
  });
});
