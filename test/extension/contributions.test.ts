/**
 * package.json contributions against the code that relies on them. Source for the field meanings:
 * VS Code's extension manifest reference (contributes.customEditors, commands, menus, keybindings,
 * configuration) — https://code.visualstudio.com/api/references/contribution-points.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { METHOD_SETTING, NUMBER_SETTINGS, readSettings } from '../../src/extension/settings';

interface Prop { type: string; default: unknown; minimum?: number; maximum?: number; enum?: string[] }
interface Manifest {
  main: string;
  activationEvents: string[];
  engines: { vscode: string };
  contributes: {
    customEditors: { viewType: string; selector: { filenamePattern: string }[]; priority: string }[];
    commands: { command: string; title: string }[];
    menus: Record<string, { command: string; when?: string }[]>;
    keybindings: { command: string; key: string; when: string }[];
    configuration: { properties: Record<string, Prop> };
  };
}

const root = join(__dirname, '..', '..');
const pkg = JSON.parse(readFileSync(join(root, 'package.json'), 'utf8')) as Manifest;
const props = pkg.contributes.configuration.properties;
const source = (f: string): string => readFileSync(join(root, 'src', 'extension', f), 'utf8');

describe('settings declared in package.json', () => {
  it.each(Object.values(NUMBER_SETTINGS))('$key has the default and bounds the code clamps to', (s) => {
    const p = props[s.key];
    expect(p).toBeDefined();
    expect(p?.type).toBe(s.integer ? 'integer' : 'number');
    expect(p?.default).toBe(s.default);
    expect(p?.minimum).toBe(s.minimum);
    expect(p?.maximum).toBe(s.maximum);
    expect(s.default).toBeGreaterThanOrEqual(s.minimum);
    expect(s.default).toBeLessThanOrEqual(s.maximum);
  });

  it('declares the method setting as an enum with the same default', () => {
    expect(props[METHOD_SETTING.key]?.enum).toEqual([...METHOD_SETTING.values]);
    expect(props[METHOD_SETTING.key]?.default).toBe(METHOD_SETTING.default);
  });

  it('declares no couplet setting the code does not read', () => {
    const known = [...Object.values(NUMBER_SETTINGS).map((s) => s.key), METHOD_SETTING.key].sort();
    expect(Object.keys(props).sort()).toEqual(known);
  });
});

describe('readSettings', () => {
  it('gives the declared defaults when nothing is set', () => {
    expect(readSettings(() => undefined)).toEqual({
      contours: { lowestLevel: 8, levels: 10, spacing: 1.4 }, defaultMethod: 'fit', jDecimals: 2,
    });
  });

  it('clamps values outside the bounds (VS Code only warns about them) and rounds integers', () => {
    const user: Record<string, unknown> = {
      'couplet.contours.lowestLevel': 0.2, 'couplet.contours.levels': 99, 'couplet.contours.spacing': 1.7,
      'couplet.display.jDecimals': 2.6, 'couplet.measure.defaultMethod': 'naive',
    };
    expect(readSettings((k) => user[k])).toEqual({
      contours: { lowestLevel: 1, levels: 40, spacing: 1.7 }, defaultMethod: 'naive', jDecimals: 3,
    });
  });

  it('falls back to the default for a value of the wrong type', () => {
    const user: Record<string, unknown> = { 'couplet.contours.levels': '12', 'couplet.measure.defaultMethod': 'guess', 'couplet.contours.spacing': Number.NaN };
    const s = readSettings((k) => user[k]);
    expect(s.contours.levels).toBe(10);
    expect(s.contours.spacing).toBe(1.4);
    expect(s.defaultMethod).toBe('fit');
  });
});

describe('editor contributions', () => {
  it('bundles the host to the main entry, with activation inferred from contributions plus markdown', () => {
    expect(pkg.main).toBe('./dist/extension.js');
    // VS Code infers activation from contributed commands and custom editors, not for hover and
    // completion providers registered in code on a language we do not contribute: structure notes
    // need onLanguage:markdown (VS Code API docs, "Activation Events").
    expect(pkg.activationEvents).toEqual(['onLanguage:markdown']);
    expect(pkg.engines.vscode).toBe('^1.100.0');
  });

  it('opens every JCAMP-DX ending with the spectrum editor the code registers', () => {
    const [editor] = pkg.contributes.customEditors;
    expect(editor?.viewType).toBe('couplet.spectrum');
    expect(source('spectrumEditor.ts')).toContain(`VIEW_TYPE = '${editor?.viewType}'`);
    expect(editor?.selector.map((s) => s.filenamePattern).sort()).toEqual(['*.dx', '*.jcamp', '*.jdx']);
  });

  it('has every contributed command registered by the code, and no registered command left undeclared', () => {
    const declared = pkg.contributes.commands.map((c) => c.command).sort();
    const code = source('commands.ts') + source('notes/insertSiCommand.ts') + source('multipletCommands.ts');
    const panel = [...code.matchAll(/'(nextPeak|previousPeak|measure|accept|label|removePick|zoomToPeak|resetZoom)'/g)].map((m) => `couplet.${m[1]}`);
    const direct = [...code.matchAll(/registerCommand\('(couplet\.\w+)'/g)].map((m) => m[1]);
    expect([...new Set([...panel, ...direct])].sort()).toEqual(declared);
  });

  it('offers a command for every pick action of the plot: removing a pick (Delete there) too', () => {
    const declared = pkg.contributes.commands.map((c) => c.command);
    for (const c of ['measure', 'accept', 'label', 'removePick']) expect(declared).toContain(`couplet.${c}`);
    expect(pkg.contributes.menus.commandPalette?.find((m) => m.command === 'couplet.removePick')?.when).toBe('activeCustomEditorId == couplet.spectrum');
  });

  it('scopes every keybinding to the spectrum editor (1D-only commands to a 1D spectrum)', () => {
    expect(pkg.contributes.keybindings.length).toBeGreaterThanOrEqual(7);
    for (const k of pkg.contributes.keybindings) expect(k.when).toMatch(/^activeCustomEditorId == couplet\.spectrum( && couplet\.spectrum1D)?$/);
  });

  it('offers the region and reference commands only on a 1D spectrum, a context key the editor sets', () => {
    const oneD = ['setMultipletRegion', 'clearMultipletRegion', 'setIntegralReference', 'clearIntegralReference'];
    for (const c of oneD) {
      expect(pkg.contributes.menus.commandPalette?.find((m) => m.command === `couplet.${c}`)?.when).toBe('activeCustomEditorId == couplet.spectrum && couplet.spectrum1D');
    }
    expect(source('spectrumEditor.ts')).toContain(`'setContext', 'couplet.spectrum1D'`);
  });

  it('hides the test-only acceptAt command from the palette', () => {
    expect(pkg.contributes.menus.commandPalette?.find((m) => m.command === 'couplet.acceptAt')?.when).toBe('false');
  });
});
