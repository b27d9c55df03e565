/**
 * The palette and keyboard commands. Panel actions (next peak, measure, zoom...) are carried out
 * by the webview, which knows the selection: the host forwards them as `command` messages.
 */
import * as vscode from 'vscode';
import type { CommandMessage } from '../protocol';
import { registerMultipletCommands } from './multipletCommands';
import { compareWith } from './review/compareCommand';
import { readSettings } from './settings';
import { VIEW_TYPE, type OpenPanel, type SpectrumEditorProvider } from './spectrumEditor';
import { nearestPeakIndex } from './spectrumModel';

const PANEL_COMMANDS: readonly CommandMessage['command'][] = ['nextPeak', 'previousPeak', 'measure', 'accept', 'label', 'removePick', 'zoomToPeak', 'resetZoom'];
const SPECTRUM_FILE = /\.(jdx|dx|jcamp)$/i;

/** Arguments of the hidden `couplet.acceptAt` command (for in-host tests and scripts). */
export interface AcceptAtArgs {
  readonly f2Ppm: number;
  readonly f1Ppm?: number;
  readonly labels?: readonly string[];
  readonly method?: 'fit' | 'naive';
  readonly dimension?: 'F2' | 'F1';
}

function isAcceptAtArgs(v: unknown): v is AcceptAtArgs {
  if (typeof v !== 'object' || v === null) return false;
  const a = v as Record<string, unknown>;
  return typeof a.f2Ppm === 'number' && (a.f1Ppm === undefined || typeof a.f1Ppm === 'number')
    && (a.labels === undefined || (Array.isArray(a.labels) && a.labels.every((l) => typeof l === 'string')))
    && (a.method === undefined || a.method === 'fit' || a.method === 'naive')
    && (a.dimension === undefined || a.dimension === 'F2' || a.dimension === 'F1');
}

async function openSpectrum(uri?: vscode.Uri): Promise<void> {
  let target = uri instanceof vscode.Uri ? uri : undefined;
  const activeDoc = vscode.window.activeTextEditor?.document;
  if (!target && activeDoc && SPECTRUM_FILE.test(activeDoc.uri.path)) target = activeDoc.uri;
  if (!target) {
    const picked = await vscode.window.showOpenDialog({ canSelectMany: false, filters: { 'JCAMP-DX spectra': ['jdx', 'dx', 'jcamp'] }, openLabel: 'Open Spectrum' });
    target = picked?.[0];
  }
  if (!target) return;
  // Beside the structure note the chemist is reading, so both stay in view.
  const column = activeDoc?.languageId === 'markdown' ? vscode.ViewColumn.Beside : vscode.ViewColumn.Active;
  await vscode.commands.executeCommand('vscode.openWith', target, VIEW_TYPE, column);
}

export function registerCommands(provider: SpectrumEditorProvider, output: vscode.OutputChannel): vscode.Disposable[] {
  const withPanel = <T>(f: (p: OpenPanel) => T): T | undefined => {
    const p = provider.active();
    if (!p) {
      void vscode.window.showInformationMessage('Couplet: open a spectrum first (Couplet: Open Spectrum).');
      return undefined;
    }
    return f(p);
  };
  const settings = (): ReturnType<typeof readSettings> => readSettings((k) => vscode.workspace.getConfiguration().get(k));
  return [
    vscode.commands.registerCommand('couplet.openSpectrum', openSpectrum),
    ...PANEL_COMMANDS.map((command) => vscode.commands.registerCommand(`couplet.${command}`,
      () => withPanel((p) => void p.panel.webview.postMessage({ type: 'command', command } satisfies CommandMessage)))),
    vscode.commands.registerCommand('couplet.measureAll', () => withPanel(async (p) => {
      output.show(true);
      return p.session.measureAll(settings().defaultMethod);
    })),
    vscode.commands.registerCommand('couplet.openSidecarAsText', () => withPanel(async (p) => {
      if (p.document.store.text() === null) {
        void vscode.window.showInformationMessage(`Couplet: ${p.document.store.fileName} does not exist yet; it is created with the first accepted pick.`);
        return;
      }
      await vscode.window.showTextDocument(p.document.store.uri, { viewColumn: vscode.ViewColumn.Beside, preview: false });
    })),
    vscode.commands.registerCommand('couplet.recordDataHash', () => withPanel(async (p) => {
      const answer = await vscode.window.showWarningMessage(
        `${p.session.model.fileName} differs from the file its sidecar was made for. Record its new hash, keeping the picks and couplings as they are?`,
        { modal: true, detail: 'Do this only after checking that the picks still fit the changed data.' }, 'Record New Hash');
      if (answer === 'Record New Hash') await p.session.recordDataHash();
    })),
    vscode.commands.registerCommand('couplet.compareWith', () => withPanel((p) => compareWith(p))),
    ...registerMultipletCommands(withPanel),
    vscode.commands.registerCommand('couplet.acceptAt', (args: unknown) => withPanel(async (p) => {
      if (!isAcceptAtArgs(args)) throw new Error('couplet.acceptAt needs { f2Ppm, f1Ppm?, labels?, method?, dimension? }');
      const index = nearestPeakIndex(p.session.model, args.f2Ppm, args.f1Ppm);
      if (index === null) throw new Error(`no peak near F2 ${args.f2Ppm}${args.f1Ppm === undefined ? '' : ` / F1 ${args.f1Ppm}`} ppm`);
      return p.session.accept(index, args.method ?? settings().defaultMethod, args.dimension ?? 'F2', args.labels ?? []);
    })),
  ];
}
