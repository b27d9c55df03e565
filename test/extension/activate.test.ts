/**
 * The bundled extension activates against a minimal stand-in for the `vscode` module and registers
 * what package.json promises. What is recorded is only what activate() passes to the API; the
 * API's meaning (registerCustomEditorProvider options, registerCommand) is from VS Code's API
 * reference, https://code.visualstudio.com/api/references/vscode-api. Opening a sample in a real
 * VS Code is the end-to-end suite's job (issue 4).
 */
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import Module, { createRequire } from 'node:module';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { build } from 'esbuild';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';

const root = join(__dirname, '..', '..');
let dir = '';
let bundle = '';
beforeAll(async () => {
  dir = mkdtempSync(join(tmpdir(), 'couplet-host-'));
  bundle = join(dir, 'extension.js');
  await build({ entryPoints: [join(root, 'src', 'extension', 'extension.ts')], outfile: bundle, bundle: true, platform: 'node', format: 'cjs', external: ['vscode'], logLevel: 'error' });
});
afterAll(() => rmSync(dir, { recursive: true, force: true }));

interface Recorded {
  commands: string[];
  editors: { viewType: string; options: unknown }[];
  /** Language features: `completion:markdown`, `hover:markdown`. */
  providers: string[];
  disposed: number;
}

function fakeVscode(rec: Recorded): Record<string, unknown> {
  const disposable = { dispose: () => void rec.disposed++ };
  class EventEmitter {
    event = (): typeof disposable => disposable;
    fire(): void {}
    dispose(): void {}
  }
  const event = (): typeof disposable => disposable;
  const selectorLanguage = (s: unknown): string => (typeof s === 'object' && s !== null && 'language' in s ? String(s.language) : String(s));
  return {
    EventEmitter,
    Disposable: { from: () => disposable },
    DiagnosticSeverity: { Error: 0, Warning: 1, Information: 2, Hint: 3 },
    CodeActionKind: { QuickFix: 'quickfix' },
    window: {
      createOutputChannel: () => ({ appendLine: () => undefined, show: () => undefined, dispose: () => undefined }),
      registerCustomEditorProvider: (viewType: string, _p: unknown, options: unknown) => (rec.editors.push({ viewType, options }), disposable),
      tabGroups: { activeTabGroup: { activeTab: undefined }, onDidChangeTabs: event, onDidChangeTabGroups: event },
    },
    workspace: {
      textDocuments: [],
      createFileSystemWatcher: () => ({ onDidChange: event, onDidCreate: event, onDidDelete: event, dispose: () => undefined }),
      onDidOpenTextDocument: event, onDidChangeTextDocument: event, onDidCloseTextDocument: event, onDidSaveTextDocument: event,
    },
    languages: {
      createDiagnosticCollection: () => ({ set: () => undefined, delete: () => undefined, dispose: () => undefined }),
      registerCompletionItemProvider: (selector: unknown) => (rec.providers.push(`completion:${selectorLanguage(selector)}`), disposable),
      registerHoverProvider: (selector: unknown) => (rec.providers.push(`hover:${selectorLanguage(selector)}`), disposable),
      registerCodeActionsProvider: (selector: unknown) =>
        (rec.providers.push(`codeActions:${(Array.isArray(selector) ? selector : [selector]).map(selectorLanguage).join('+')}`), disposable),
    },
    commands: { registerCommand: (id: string) => (rec.commands.push(id), disposable) },
  };
}

/** Loads the bundle with `require('vscode')` answered by the stand-in (as the extension host does with the real one). */
function loadWithFake(rec: Recorded): { activate(ctx: unknown): void } {
  const loader = Module as unknown as { _load(request: string, parent: unknown, isMain: boolean): unknown };
  const original = loader._load;
  loader._load = (request, parent, isMain) => (request === 'vscode' ? fakeVscode(rec) : original(request, parent, isMain));
  try {
    return createRequire(bundle)(bundle) as { activate(ctx: unknown): void };
  } finally {
    loader._load = original;
  }
}

describe('activate', () => {
  it('registers the spectrum editor and every command package.json contributes', () => {
    const rec: Recorded = { commands: [], editors: [], providers: [], disposed: 0 };
    const subscriptions: { dispose(): void }[] = [];
    loadWithFake(rec).activate({ subscriptions, extensionPath: root, extensionUri: { fsPath: root } });
    const pkg = JSON.parse(readFileSync(join(root, 'package.json'), 'utf8')) as { contributes: { commands: { command: string }[] } };
    expect(rec.commands.sort()).toEqual(pkg.contributes.commands.map((c) => c.command).sort());
    // No webviewOptions.retainContextWhenHidden: the panel restores its view with getState/setState.
    expect(rec.editors).toEqual([{ viewType: 'couplet.spectrum', options: { supportsMultipleEditorsPerDocument: true } }]);
    // Structure notes: completion and hover for markdown (VS Code API: languages.register*Provider).
    expect(rec.providers.sort()).toEqual(['codeActions:markdown+latex', 'completion:markdown', 'hover:markdown']);
    // Everything registered is handed to VS Code for disposal on deactivate: the commands, the output
    // channel, the sidecar diagnostics, the editor, the tab watcher, and the notes' 10 (their
    // diagnostics, file watcher, two providers, three document and three watcher events), and the
    // check diagnostics' 4 (collection, open and save events, quick-fix provider), and the worker of
    // the notes' compound reports (1).
    expect(subscriptions.length).toBe(rec.commands.length + 4 + 10 + 4 + 1);
  });
});
