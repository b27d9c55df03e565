/**
 * Palette commands of a 1D spectrum: set or clear the selected multiplet's region, set or clear the
 * integral reference. The input boxes validate as the chemist types (multipletRegion.ts). An
 * argument `{ f2Ppm?, value? }` selects the multiplet at a shift and answers the box (in-host tests, scripts).
 */
import * as vscode from 'vscode';
import { parseProtonsInput, parseRegionInput } from './multipletRegion';
import type { MultipletSession } from './multipletSession';
import type { OpenPanel } from './spectrumEditor';
import { nearestPeakIndex } from './spectrumModel';

interface Args {
  readonly f2Ppm?: number;
  readonly value?: string;
}

function readArgs(v: unknown): Args {
  if (typeof v !== 'object' || v === null) return {};
  const a = v as Record<string, unknown>;
  return { ...(typeof a.f2Ppm === 'number' && { f2Ppm: a.f2Ppm }), ...(typeof a.value === 'string' && { value: a.value }) };
}

/** The panel's 1D session with the multiplet the command acts on selected; undefined (and a message) otherwise. */
function target(p: OpenPanel, args: Args): MultipletSession | undefined {
  const m = p.session.multiplet;
  if (!m) {
    void vscode.window.showInformationMessage('Couplet: multiplet regions and integral references belong to 1D ¹H spectra.');
    return undefined;
  }
  if (args.f2Ppm !== undefined) m.selected = nearestPeakIndex(p.session.model, args.f2Ppm);
  return m;
}

/** The answer: the argument's value when given (validated the same way), else an input box. */
async function ask<T>(args: Args, box: vscode.InputBoxOptions, parse: (text: string) => T | string): Promise<T | undefined> {
  const text = args.value ?? await vscode.window.showInputBox({ ...box, validateInput: (t) => { const r = parse(t); return typeof r === 'string' ? r : null; } });
  if (text === undefined) return undefined;
  const r = parse(text);
  if (typeof r === 'string') {
    void vscode.window.showWarningMessage(`Couplet: ${r}`);
    return undefined;
  }
  return r;
}

const fixed = (v: number): string => v.toFixed(4);

export function registerMultipletCommands(withPanel: <T>(f: (p: OpenPanel) => T) => T | undefined): vscode.Disposable[] {
  const selectFirst = (): void => void vscode.window.showInformationMessage('Couplet: select a multiplet first (click it, or N / P).');
  return [
    vscode.commands.registerCommand('couplet.setMultipletRegion', (raw: unknown) => withPanel(async (p) => {
      const args = readArgs(raw);
      const m = target(p, args);
      if (!m) return false;
      if (m.selected === null) return selectFirst();
      const now = await m.currentRegion();
      const s = p.session.model.spectrum;
      const axis = s.dims === 1 ? s.axis : s.f2;
      const limits = [axis.firstHz / axis.observeMhz, axis.lastHz / axis.observeMhz] as const;
      const region = await ask(args, {
        title: 'Multiplet region', prompt: 'Two shifts in ppm, e.g. "3.86 3.78" or "3.86-3.78"',
        ...(now && { value: `${fixed(now.fromPpm)} ${fixed(now.toPpm)}` }),
      }, (t) => parseRegionInput(t, limits));
      return region ? m.setRegion(m.selected, region) : false;
    })),
    vscode.commands.registerCommand('couplet.clearMultipletRegion', (raw: unknown) => withPanel(async (p) => {
      const m = target(p, readArgs(raw));
      if (!m) return false;
      if (m.selected === null) return selectFirst();
      return m.setRegion(m.selected, null);
    })),
    vscode.commands.registerCommand('couplet.setIntegralReference', (raw: unknown) => withPanel(async (p) => {
      const args = readArgs(raw);
      const m = target(p, args);
      if (!m) return false;
      if (m.selected === null) return selectFirst();
      const protons = await ask(args, { title: 'Integral reference', prompt: 'Protons in the selected multiplet (1-99), e.g. 3 for a CH3' }, parseProtonsInput);
      return protons === undefined ? false : m.setReference(protons);
    })),
    vscode.commands.registerCommand('couplet.clearIntegralReference', () => withPanel(async (p) => {
      const m = target(p, {});
      return m ? m.setReference(null) : false;
    })),
  ];
}
