/**
 * "Couplet: Insert ¹H NMR Data": writes the compound's SI line at the cursor inside a marked region
 * (siRegion.ts), or updates the region where it already is, as one WorkspaceEdit (one undo step).
 * Works in a structure note (markdown, compound from its front matter) and in a LaTeX file (the
 * compound id asked for once, the note found beside it by its front matter).
 */
import * as vscode from 'vscode';
import type { NoteLanguage } from './siRegion';
import { upsertRegion } from './siRegion';

export interface SiText {
  /** The SI line, in the note's format. */
  readonly line: string;
  /** What the line did with flagged values, shown in the output channel (never silently). */
  readonly notes: readonly string[];
}

/** Builds the SI line of a compound for the document it goes into. */
export type SiLineFor = (doc: vscode.TextDocument, compound: string, format: NoteLanguage) => Promise<SiText>;

function languageOf(doc: vscode.TextDocument): NoteLanguage | null {
  if (doc.languageId === 'markdown') return 'markdown';
  if (doc.languageId === 'latex' || doc.languageId === 'tex' || /\.tex$/i.test(doc.uri.path)) return 'latex';
  return null;
}

export function registerInsertSi(siLineFor: SiLineFor, compoundOf: (doc: vscode.TextDocument) => string | null, output: vscode.OutputChannel): vscode.Disposable {
  return vscode.commands.registerCommand('couplet.insertSiData', async () => {
    const editor = vscode.window.activeTextEditor;
    const lang = editor ? languageOf(editor.document) : null;
    if (!editor || lang === null) {
      void vscode.window.showInformationMessage('Couplet: open a structure note (markdown) or a LaTeX file to insert ¹H NMR data.');
      return;
    }
    const doc = editor.document;
    const name = doc.uri.path.split('/').pop() ?? doc.uri.path;
    let compound = lang === 'markdown' ? compoundOf(doc) : null;
    if (compound === null) {
      compound = (await vscode.window.showInputBox({ prompt: `Compound id for ${name} (as in a structure note's front matter "compound:")`, ignoreFocusOut: true }))?.trim() || null;
      if (compound === null) return;
    }
    let si: SiText;
    try {
      si = await siLineFor(doc, compound, lang);
    } catch (e) {
      void vscode.window.showWarningMessage(`Couplet: no ¹H NMR data for ${compound}: ${e instanceof Error ? e.message : String(e)}`);
      return;
    }
    const text = doc.getText();
    let region;
    try {
      region = upsertRegion(text, doc.offsetAt(editor.selection.active), lang, 'H1', si.line, name);
    } catch (e) {
      void vscode.window.showWarningMessage(`Couplet: ${e instanceof Error ? e.message : String(e)}`);
      return;
    }
    const edit = new vscode.WorkspaceEdit();
    edit.replace(doc.uri, new vscode.Range(doc.positionAt(region.offset), doc.positionAt(region.offset + region.length)), region.text);
    if (!(await vscode.workspace.applyEdit(edit))) {
      void vscode.window.showWarningMessage(`Couplet: VS Code did not apply the ¹H NMR data to ${name}.`);
      return;
    }
    for (const n of si.notes) output.appendLine(`${name} (${compound}): ${n}`);
    const what = region.replaced ? 'updated' : 'inserted';
    void vscode.window.setStatusBarMessage(`Couplet: ¹H NMR data ${what}${si.notes.length ? ` (${si.notes.length} notes in the Couplet output)` : ''}`, 5000);
  });
}
