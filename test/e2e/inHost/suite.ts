/**
 * In-host integration steps: run inside a real VS Code extension host (code-server's, or the desktop
 * one under @vscode/test-electron) against a temporary copy of samples/. They use only the public
 * VS Code API and the extension's contributed commands, as a user's actions would.
 */
import * as fs from 'node:fs/promises';
import * as vscode from 'vscode';
import { formatSidecar, parseSidecar } from '../../../src/core/sidecar';
import { assert, assertEqual, sleep, waitFor, type Step } from './harness';

const EXTENSION_ID = 'couplet-dev.couplet';
const VIEW_TYPE = 'couplet.spectrum';
/** samples/brisquarene/truth.json: H-5/H-6 at 7.21/6.86 ppm, J = 8.5 Hz; H-3/H-5 at 7.38/7.21 ppm. */
const BRIS = { f2Ppm: 6.86, f1Ppm: 7.21, labels: ['H-6', 'H-5'], jHz: 8.5 };
const BRIS_SYMMETRIC = { f2Ppm: 7.21, f1Ppm: 6.86, labels: ['H-5', 'H-6'] };

function workspaceRoot(): vscode.Uri {
  const f = vscode.workspace.workspaceFolders?.[0];
  if (!f) throw new Error('the tests need a workspace folder (a copy of samples/)');
  return f.uri;
}

const sample = (rel: string): vscode.Uri => vscode.Uri.joinPath(workspaceRoot(), rel);
const sidecarOf = (u: vscode.Uri): vscode.Uri => u.with({ path: `${u.path}.couplet.yaml` });

function activeCustomUri(): vscode.Uri | undefined {
  const input = vscode.window.tabGroups.activeTabGroup.activeTab?.input;
  return input instanceof vscode.TabInputCustom && input.viewType === VIEW_TYPE ? input.uri : undefined;
}

async function openSpectrum(u: vscode.Uri): Promise<void> {
  await vscode.commands.executeCommand('vscode.openWith', u, VIEW_TYPE, vscode.ViewColumn.One);
  await waitFor(`${u.path} as the active Couplet editor`, () => (activeCustomUri()?.toString() === u.toString() ? true : undefined));
}

function openDoc(u: vscode.Uri): vscode.TextDocument | undefined {
  return vscode.workspace.textDocuments.find((d) => d.uri.toString() === u.toString());
}

const docText = (u: vscode.Uri): string | undefined => openDoc(u)?.getText();

/**
 * The sidecar as VS Code sees it: the open document (unsaved edits included) or, when VS Code has
 * dropped a clean document nobody shows, the file on disk; undefined when neither exists.
 */
async function sidecarText(u: vscode.Uri): Promise<string | undefined> {
  return docText(u) ?? (await diskText(u)) ?? undefined;
}

async function diskText(u: vscode.Uri): Promise<string | null> {
  try {
    return await fs.readFile(u.fsPath, 'utf8');
  } catch {
    return null;
  }
}

function canonical(text: string, fileName: string): boolean {
  const { sidecar } = parseSidecar(text, fileName);
  return sidecar !== null && formatSidecar(sidecar) === text;
}

/** A pick within 0.01 ppm of the point (the pick snaps to the peak's centroid, e.g. 7.2099 for 7.21). */
function hasPickNear(text: string, at: { f2Ppm: number; f1Ppm: number }): boolean {
  const picks = parseSidecar(text, 'cosy.jdx.couplet.yaml').sidecar?.picks ?? [];
  return picks.some((p) => Math.abs(p.f2Ppm - at.f2Ppm) < 0.01 && p.f1Ppm !== undefined && Math.abs(p.f1Ppm - at.f1Ppm) < 0.01);
}

async function acceptAt(args: object): Promise<boolean | undefined> {
  return vscode.commands.executeCommand<boolean | undefined>('couplet.acceptAt', args);
}

/** State shared between steps (they run in order on one workspace). */
const state = { savedText: '' };

export function steps(): Step[] {
  const cosy = (): vscode.Uri => sample('brisquarene/cosy.jdx');
  return [
    {
      name: 'the extension activates',
      run: async () => {
        const ext = vscode.extensions.getExtension(EXTENSION_ID);
        assert(ext, `extension ${EXTENSION_ID} is not loaded`);
        await ext.activate();
        assert(ext.isActive, 'extension did not become active');
      },
    },
    {
      name: 'every contributed command is registered',
      run: async () => {
        const ext = vscode.extensions.getExtension(EXTENSION_ID);
        const contributed = ((ext?.packageJSON as { contributes?: { commands?: { command: string }[] } }).contributes?.commands ?? []).map((c) => c.command);
        assert(contributed.length >= 10, `package.json contributes only ${contributed.length} commands`);
        const all = new Set(await vscode.commands.getCommands(true));
        const missing = contributed.filter((c) => !all.has(c));
        assertEqual(missing.join(', '), '', 'contributed commands without a registration');
      },
    },
    {
      name: 'every sample spectrum opens in the Couplet editor',
      timeoutMs: 90_000,
      run: async () => {
        const files = await vscode.workspace.findFiles('**/*.{jdx,dx,jcamp}');
        assert(files.length >= 6, `expected the 6 sample spectra, found ${files.length}`);
        for (const f of files.sort((a, b) => a.path.localeCompare(b.path))) await openSpectrum(f);
        // Still one Couplet tab per spectrum afterwards: none was closed by an error.
        const tabs = vscode.window.tabGroups.all.flatMap((g) => g.tabs).filter((t) => t.input instanceof vscode.TabInputCustom && t.input.viewType === VIEW_TYPE);
        assertEqual(tabs.length, files.length, 'open Couplet tabs');
      },
    },
    {
      name: 'accepting a measured cross peak writes its pick and coupling to the sidecar document',
      timeoutMs: 90_000,
      run: async () => {
        const side = sidecarOf(cosy());
        assertEqual(await diskText(side), null, 'sidecar on disk before the first pick');
        await openSpectrum(cosy());
        assertEqual(await acceptAt(BRIS), true, 'couplet.acceptAt result');
        const text = await waitFor('the sidecar document', () => docText(side));
        assert(openDoc(side)?.isDirty, 'the sidecar document should be dirty (unsaved) after the pick');
        assert(text.startsWith('schema: couplet-sidecar/1\n'), `unexpected sidecar start: ${text.slice(0, 60)}`);
        assert(hasPickNear(text, BRIS), `no pick at 6.86/7.21 ppm in:\n${text}`);
        assert(/^ {2}- atoms: \[H-5, H-6\]$/m.test(text), `no coupling of H-5 and H-6 in:\n${text}`);
        const j = /^ {4}j_hz: (-?\d+\.\d\d)$/m.exec(text);
        assert(j?.[1] && Math.abs(Number(j[1]) - BRIS.jHz) < 0.1, `j_hz ${j?.[1]} is not within 0.1 Hz of the simulated ${BRIS.jHz}`);
        assert(canonical(text, 'cosy.jdx.couplet.yaml'), 'the written sidecar is not in canonical form');
      },
    },
    {
      name: 'undo removes the pick, redo brings it back',
      run: async () => {
        const side = sidecarOf(cosy());
        const withPick = docText(side) ?? '';
        await openSpectrum(cosy());
        // With the webview focused, the workbench hands `undo` to the webview's own document (its text
        // fields), not to the custom editor's edit stack; move focus off it, keeping the editor active.
        await vscode.commands.executeCommand('workbench.action.focusStatusBar');
        await vscode.commands.executeCommand('undo');
        await waitFor('the sidecar to be empty after undo', async () => ((await sidecarText(side))?.trim() === '' ? true : undefined)).catch(async (e: unknown) => {
          // Tell a refused undo (the extension's idea of the sidecar text is stale: a further write is refused too) from a lost one.
          const again = await acceptAt(BRIS).catch((x: unknown) => `threw ${String(x)}`);
          throw new Error(`${e instanceof Error ? e.message : String(e)}; sidecar document dirty=${openDoc(side)?.isDirty}; on disk ${JSON.stringify((await diskText(side))?.slice(0, 80))}; a second couplet.acceptAt returned ${String(again)}`);
        });
        await vscode.commands.executeCommand('redo');
        await waitFor('the pick back after redo', async () => ((await sidecarText(side)) === withPick ? true : undefined));
      },
    },
    {
      name: 'save writes the sidecar to disk in canonical form',
      run: async () => {
        const side = sidecarOf(cosy());
        const expected = await sidecarText(side);
        assert(expected && openDoc(side)?.isDirty, 'test setup: no unsaved sidecar document with the pick');
        await openSpectrum(cosy());
        await vscode.commands.executeCommand('workbench.action.files.save');
        // VS Code may close the text document once it is saved and no editor shows it.
        await waitFor('the Couplet tab and the sidecar document to be clean', () => {
          const tabDirty = vscode.window.tabGroups.activeTabGroup.activeTab?.isDirty;
          return tabDirty === false && openDoc(side)?.isDirty !== true ? true : undefined;
        }).catch(async (e: unknown) => {
          const tab = vscode.window.tabGroups.activeTabGroup.activeTab;
          const disk = await diskText(side);
          throw new Error(`${e instanceof Error ? e.message : String(e)} (active tab ${tab?.label} dirty=${tab?.isDirty}; sidecar document dirty=${openDoc(side)?.isDirty}; disk ${disk === expected ? 'has' : 'lacks'} the pick)`);
        });
        const disk = await diskText(side);
        assertEqual(disk, expected, 'sidecar on disk vs the document before saving');
        assert(disk && canonical(disk, 'cosy.jdx.couplet.yaml'), 'saved sidecar is not canonical');
        state.savedText = disk;
      },
    },
    {
      name: 'an external edit of the sidecar on disk reaches the editor',
      timeoutMs: 90_000,
      run: async () => {
        const side = sidecarOf(cosy());
        // As a checkout would: a comment added above the picks, written behind VS Code's back.
        const external = state.savedText.replace('\npicks:\n', '\n# checked against the 1D spectrum\npicks:\n');
        assert(external !== state.savedText, 'test setup: no "picks:" line to annotate');
        await fs.writeFile(side.fsPath, external);
        if (openDoc(side)) await waitFor('the open sidecar document to show the external edit', () => (docText(side) === external ? true : undefined), 20_000);
        // The panel's next action must start from the edited text: the extension refuses to write
        // (acceptAt returns false) while it still holds the old one, so retry until it has caught up.
        await openSpectrum(cosy());
        await waitFor('couplet.acceptAt to write after the external edit', async () => ((await acceptAt(BRIS_SYMMETRIC)) === true ? true : undefined), 20_000);
        const text = docText(side) ?? '';
        assert(text.includes('# checked against the 1D spectrum\n'), `the external comment was lost:\n${text}`);
        assert(hasPickNear(text, BRIS_SYMMETRIC), `no pick for the symmetric peak in:\n${text}`);
        await vscode.commands.executeCommand('workbench.action.files.save');
        await waitFor('the second pick to be saved', async () => ((await diskText(side)) === text ? true : undefined));
      },
    },
    {
      name: '1D multiplet: the region and integral-reference commands write the sidecar; revert restores the sample',
      timeoutMs: 90_000,
      run: async () => {
        // samples/quellopyranol: H-4 multiplet at 3.82 ppm (pick p-3.8203), H-7 CH3 doublet at 1.17 ppm (pick p-1.1700).
        const spec = sample('quellopyranol/1h.jdx');
        const side = sidecarOf(spec);
        const original = await diskText(side);
        assert(original, 'test setup: the sample 1h.jdx sidecar is missing');
        await openSpectrum(spec);
        const run = (command: string, args: object): Thenable<unknown> => vscode.commands.executeCommand(command, args);
        assertEqual(await run('couplet.setMultipletRegion', { f2Ppm: 3.82, value: '3.86-3.78' }), true, 'couplet.setMultipletRegion result');
        assertEqual(await run('couplet.setIntegralReference', { f2Ppm: 1.17, value: '3' }), true, 'couplet.setIntegralReference result');
        const text = await waitFor('both edits in the sidecar document', () => {
          const t = docText(side);
          return t?.includes('protons: 3') && t.includes('from_ppm: 3.8600') ? t : undefined;
        });
        const picks = parseSidecar(text, '1h.jdx.couplet.yaml').sidecar?.picks ?? [];
        const h4 = picks.find((p) => p.id === 'p-3.8203');
        assertEqual(`${h4?.fromPpm} ${h4?.toPpm}`, '3.86 3.78', 'region of p-3.8203');
        assertEqual(picks.find((p) => p.id === 'p-1.1700')?.protons, 3, 'protons of p-1.1700');
        assertEqual(picks.filter((p) => p.protons !== undefined).length, 1, 'integral references');
        assert(canonical(text, '1h.jdx.couplet.yaml'), 'the edited sidecar is not canonical');
        // Three lines added, nothing else touched: the change reads as what the chemist did.
        assertEqual(text.split('\n').length - original.split('\n').length, 3, 'lines added');
        // A region typed wrongly changes nothing.
        assert((await run('couplet.setMultipletRegion', { f2Ppm: 3.82, value: '3.86' })) !== true, 'a one-number region was accepted');
        assertEqual(docText(side), text, 'sidecar after a refused region');
        await openSpectrum(spec);
        await vscode.commands.executeCommand('workbench.action.files.revert');
        await waitFor('the sample sidecar as it was', async () => ((await sidecarText(side)) === original ? true : undefined));
        assertEqual(await diskText(side), original, 'sample sidecar on disk');
      },
    },
    {
      name: 'a broken sidecar gives a diagnostic at its line and is never overwritten',
      timeoutMs: 90_000,
      run: async () => {
        const spec = sample('quellopyranol/cosy.jdx');
        const side = sidecarOf(spec);
        const broken = [
          'schema: couplet-sidecar/1',
          '<<<<<<< HEAD',
          'data:',
          '  file: cosy.jdx',
          '=======',
          'data:',
          '  file: other.jdx',
          '>>>>>>> theirs',
          '',
        ].join('\n');
        await fs.writeFile(side.fsPath, broken);
        await openSpectrum(spec);
        const diags = await waitFor('a Couplet diagnostic on the broken sidecar', () => {
          const d = vscode.languages.getDiagnostics(side).filter((x) => x.source === 'couplet');
          return d.length > 0 ? d : undefined;
        }, 20_000);
        const err = diags.find((d) => d.severity === vscode.DiagnosticSeverity.Error);
        assert(err, `no error among: ${diags.map((d) => d.message).join(' | ')}`);
        assertEqual(err.range.start.line, 1, `line of "${err.message}" (0-based; the first conflict marker)`);
        const result = await acceptAt({ f2Ppm: 1.26, f1Ppm: 3.48, labels: ['H-3a', 'H-2'] }).catch((e: unknown) => `threw: ${String(e)}`);
        assert(result !== true, 'couplet.acceptAt reported a write into a broken sidecar');
        await vscode.commands.executeCommand('workbench.action.files.saveAll');
        await sleep(500);
        assertEqual(await diskText(side), broken, 'broken sidecar on disk');
        const doc = openDoc(side);
        assert(!doc || doc.getText() === broken, 'the sidecar document differs from the broken file');
      },
    },
  ];
}
