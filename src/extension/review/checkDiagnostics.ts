/**
 * `couplet check` problems in the Problems panel, on the sidecars and the structure notes of a
 * compound folder, refreshed when one of its files is opened or saved; with a quick fix where
 * one is obvious (an SI region that no longer matches the sidecars: re-run the insert command).
 */
import { createHash } from 'node:crypto';
import * as path from 'node:path';
import * as vscode from 'vscode';
import type { Problem } from '../../core/review/check';
import { lineRange } from '../diagnostics';
import { checkFolder, LatestRuns, quickFixFor, type FolderReader } from './checkFolder';

const RELEVANT = /(\.couplet\.yaml|\.md|\.markdown|\.tex)$/i;
const SOURCE = 'couplet check';

const reader: FolderReader = {
  async list(folder) {
    try {
      return (await vscode.workspace.fs.readDirectory(vscode.Uri.file(folder))).filter(([, t]) => t === vscode.FileType.File).map(([n]) => n);
    } catch {
      return [];
    }
  },
  async readText(file) {
    try {
      return new TextDecoder().decode(await vscode.workspace.fs.readFile(vscode.Uri.file(file)));
    } catch {
      return null;
    }
  },
  async sha256(file) {
    try {
      return createHash('sha256').update(await vscode.workspace.fs.readFile(vscode.Uri.file(file))).digest('hex');
    } catch {
      return null;
    }
  },
};

function toDiagnostic(p: Problem): vscode.Diagnostic {
  const d = new vscode.Diagnostic(lineRange(p.line, p.column), p.message,
    p.severity === 'error' ? vscode.DiagnosticSeverity.Error : vscode.DiagnosticSeverity.Warning);
  d.source = SOURCE;
  d.code = p.rule;
  return d;
}

export function registerCheckDiagnostics(): vscode.Disposable[] {
  const collection = vscode.languages.createDiagnosticCollection('couplet-check');
  /** Files each folder's last run published to, so fixed problems disappear. */
  const published = new Map<string, string[]>();
  const runs = new LatestRuns();
  const refresh = async (doc: vscode.TextDocument): Promise<void> => {
    if (doc.uri.scheme !== 'file' || !RELEVANT.test(doc.uri.fsPath)) return;
    const folder = path.dirname(doc.uri.fsPath);
    const newest = runs.start(folder);
    const problems = await checkFolder(folder, reader, path.join);
    if (!newest()) return;
    for (const f of published.get(folder) ?? []) collection.delete(vscode.Uri.file(f));
    const byFile = new Map<string, Problem[]>();
    for (const p of problems) byFile.set(p.file, [...(byFile.get(p.file) ?? []), p]);
    for (const [f, list] of byFile) collection.set(vscode.Uri.file(f), list.map(toDiagnostic));
    published.set(folder, [...byFile.keys()]);
  };
  const fixes: vscode.CodeActionProvider = {
    provideCodeActions(_doc, _range, context) {
      return context.diagnostics.flatMap((d) => {
        const fix = d.source === SOURCE && typeof d.code === 'string' ? quickFixFor(d.code as Problem['rule']) : undefined;
        if (fix === undefined) return [];
        const a = new vscode.CodeAction(fix.title, vscode.CodeActionKind.QuickFix);
        a.command = { command: fix.command, title: fix.title };
        a.diagnostics = [d];
        return [a];
      });
    },
  };
  for (const doc of vscode.workspace.textDocuments) void refresh(doc);
  return [
    collection,
    vscode.workspace.onDidOpenTextDocument((d) => void refresh(d)),
    vscode.workspace.onDidSaveTextDocument((d) => void refresh(d)),
    vscode.languages.registerCodeActionsProvider([{ language: 'markdown' }, { language: 'latex' }], fixes,
      { providedCodeActionKinds: [vscode.CodeActionKind.QuickFix] }),
  ];
}
