/**
 * In-host steps for structure notes (issue 5, editor half): hover, completion, diagnostics and the
 * insert-SI command on a small compound folder the step writes itself (a note, a sidecar, and a
 * header-only data file for the observe frequency), and a spectrum opened over the active note
 * moving beside it. Only the public VS Code API and built-in commands such as
 * vscode.executeHoverProvider / vscode.executeCompletionItemProvider (VS Code "Built-in Commands").
 */
import { createHash } from 'node:crypto';
import * as fs from 'node:fs/promises';
import * as vscode from 'vscode';
import { assert, assertEqual, waitFor, type Step } from './harness';

/** A header-only data file: enough for the observe frequency; the sidecar records its real hash. */
const DATA = '##TITLE= header only\n##.OBSERVE FREQUENCY= 600.13\n##END=\n';
const HASH = createHash('sha256').update(DATA).digest('hex');
const NOTE = '---\ncompound: demo\nsolvent: CDCl3\n---\n\n# Demo\n\nH-3 couples to H-4a. H-9 is not picked.\n\nData: \n';
const SIDECAR = `schema: couplet-sidecar/1
data:
  file: x.jdx
  sha256: ${HASH}

picks:
  - id: p-2.3400-4.1200
    f2_ppm: 2.3400
    f1_ppm: 4.1200
    label: [H-4a, H-3]
    kind: cross

  - id: p-4.1200-2.3400
    f2_ppm: 4.1200
    f1_ppm: 2.3400
    label: [H-3, H-4a]
    kind: cross

couplings:
  - atoms: [H-3, H-4a]
    j_hz: 10.20
    j_sd_hz: 0.15
    method: fit
    dimension: F2
    picks: [p-4.1200-2.3400]
    flags: []
`;

function root(): vscode.Uri {
  const f = vscode.workspace.workspaceFolders?.[0];
  if (!f) throw new Error('the tests need a workspace folder');
  return f.uri;
}

const demo = (name: string): vscode.Uri => vscode.Uri.joinPath(root(), 'notes-demo', name);

async function openNote(): Promise<vscode.TextEditor> {
  const doc = await vscode.workspace.openTextDocument(demo('demo.md'));
  return vscode.window.showTextDocument(doc, vscode.ViewColumn.One);
}

function hoverText(h: vscode.Hover[]): string {
  return h.flatMap((x) => x.contents).map((c) => (typeof c === 'string' ? c : 'value' in c ? c.value : '')).join('\n');
}

export function noteSteps(): Step[] {
  return [
    {
      name: 'notes: hover on an atom label shows the shift and J with sigma and source',
      run: async () => {
        await fs.mkdir(demo('').fsPath, { recursive: true });
        await fs.writeFile(demo('demo.md').fsPath, NOTE);
        await fs.writeFile(demo('x.jdx.couplet.yaml').fsPath, SIDECAR);
        await fs.writeFile(demo('x.jdx').fsPath, DATA);
        const editor = await openNote();
        const at = editor.document.positionAt(NOTE.indexOf('H-3 couples'));
        const text = await waitFor('a hover on H-3', async () => {
          const t = hoverText(await vscode.commands.executeCommand<vscode.Hover[]>('vscode.executeHoverProvider', editor.document.uri, at.translate(0, 1)));
          return t.includes('H-3') && t.includes('δ') ? t : undefined;
        });
        assert(text.includes('δ 4.12 ppm'), `no shift in the hover:\n${text}`);
        assert(text.includes('| H-4a | 10.20 | 0.15 | fit F2 |'), `no J row in the hover:\n${text}`);
        assert(text.includes('x.jdx.couplet.yaml `p-4.1200-2.3400`'), `no source in the hover:\n${text}`);
      },
    },
    {
      name: 'notes: completion after "H-" offers the sidecar labels',
      run: async () => {
        const editor = await openNote();
        const end = editor.document.positionAt(editor.document.getText().length);
        await editor.edit((e) => e.insert(end, 'H-'));
        const pos = editor.document.positionAt(editor.document.getText().length);
        const list = await vscode.commands.executeCommand<vscode.CompletionList>('vscode.executeCompletionItemProvider', editor.document.uri, pos, '-');
        const labels = list.items.map((i) => (typeof i.label === 'string' ? i.label : i.label.label));
        assert(labels.includes('H-3') && labels.includes('H-4a') && labels.includes('H-9'), `completion items: ${labels.join(', ')}`);
        await vscode.commands.executeCommand('undo');
      },
    },
    {
      name: 'notes: a label no spectrum assigns gets a diagnostic',
      run: async () => {
        await openNote();
        const d = await waitFor('a diagnostic on H-9', () => {
          const list = vscode.languages.getDiagnostics(demo('demo.md')).filter((x) => x.source === 'couplet');
          return list.length > 0 ? list : undefined;
        });
        assertEqual(d.map((x) => x.message).join(' | '), "H-9 is not assigned: no pick or coupling in this folder's sidecars names it", 'diagnostics');
      },
    },
    {
      name: 'notes: Insert 1H NMR Data writes a marked region, a second run updates it, one undo removes it',
      run: async () => {
        const editor = await openNote();
        const before = editor.document.getText();
        const end = editor.document.positionAt(before.length);
        editor.selection = new vscode.Selection(end, end);
        await vscode.commands.executeCommand('couplet.insertSiData');
        const once = await waitFor('the SI region', () => (editor.document.getText().includes('couplet:si H1 end') ? editor.document.getText() : undefined));
        const line = '¹H NMR (600 MHz, CDCl₃) δ 4.12 (d, J = 10.2 Hz, 1H, H-3), 2.34 (d, J = 10.2 Hz, 1H, H-4a).';
        assert(once.includes(`<!-- couplet:si H1 begin -->\n${line}\n<!-- couplet:si H1 end -->`), `region:\n${once}`);
        editor.selection = new vscode.Selection(0, 0, 0, 0);
        await vscode.commands.executeCommand('couplet.insertSiData');
        assertEqual(editor.document.getText(), once, 'text after the second run');
        await vscode.commands.executeCommand('undo');
        await waitFor('the undo', () => (editor.document.getText() === before ? true : undefined));
      },
    },
    {
      name: 'notes: a spectrum opened over the active note moves beside it',
      timeoutMs: 90_000,
      run: async () => {
        await vscode.commands.executeCommand('workbench.action.closeAllEditors');
        const note = await vscode.window.showTextDocument(vscode.Uri.joinPath(root(), 'brisquarene', 'brisquarene.md'), { viewColumn: vscode.ViewColumn.One, preview: false });
        assertEqual(note.viewColumn, vscode.ViewColumn.One, 'note column');
        // As a double click in the explorer does: the default editor, in the active group.
        await vscode.commands.executeCommand('vscode.open', vscode.Uri.joinPath(root(), 'brisquarene', '1h.jdx'));
        const column = await waitFor('the spectrum beside the note', () => {
          for (const g of vscode.window.tabGroups.all) {
            if (g.tabs.some((t) => t.input instanceof vscode.TabInputCustom && t.input.uri.path.endsWith('brisquarene/1h.jdx'))) return g.viewColumn === vscode.ViewColumn.One ? undefined : g.viewColumn;
          }
          return undefined;
        });
        assertEqual(column, vscode.ViewColumn.Two, 'spectrum column');
        const noteStill = vscode.window.tabGroups.all.find((g) => g.viewColumn === vscode.ViewColumn.One)?.tabs.some((t) => t.input instanceof vscode.TabInputText && t.input.uri.path.endsWith('brisquarene.md'));
        assert(noteStill, 'the note is no longer open in column one');
      },
    },
  ];
}
