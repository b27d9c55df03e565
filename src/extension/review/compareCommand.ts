/**
 * "Couplet: Compare Picks With…": the sidecar at another revision, read with `git show` (nothing
 * is checked out), compared with the document as it is now (unsaved edits included), and sent to
 * the panel as overlay marks (compareOverlay.ts keeps them current while the sidecar is edited).
 * A revision the repository does not have is said so, not guessed.
 */
import { spawnSync } from 'node:child_process';
import * as path from 'node:path';
import * as vscode from 'vscode';
import { showAtRevision } from '../../cli/gitShow';
import type { OpenPanel } from '../spectrumEditor';
import { revisionChoices } from './revisionChoices';

function git(cwd: string, args: readonly string[]): string | null {
  const r = spawnSync('git', args, { cwd, encoding: 'utf8' });
  return r.status === 0 ? r.stdout.trim() : null;
}

export async function compareWith(p: OpenPanel): Promise<void> {
  const file = p.document.store.uri.fsPath;
  const cwd = path.dirname(file);
  const text = p.document.store.text();
  if (text === null) return void vscode.window.showInformationMessage(`Couplet: ${p.document.store.fileName} does not exist yet: there is nothing to compare.`);
  if (git(cwd, ['rev-parse', '--is-inside-work-tree']) !== 'true') {
    return void vscode.window.showInformationMessage(`Couplet: ${p.document.store.fileName} is not in a git repository.`);
  }
  const branches = (git(cwd, ['for-each-ref', '--format=%(refname:short)', 'refs/heads']) ?? '').split('\n').filter((b) => b !== '');
  const choice = await vscode.window.showQuickPick(revisionChoices(git(cwd, ['symbolic-ref', '--short', '-q', 'HEAD']), branches, p.overlay.active),
    { placeHolder: `Compare the picks of ${p.document.store.fileName} with…` });
  if (choice === undefined) return;
  if (choice.rev === null) return p.overlay.clear();
  let rev = choice.rev;
  let name = choice.name;
  if (rev === 'ask') {
    const typed = await vscode.window.showInputBox({ prompt: 'Revision (commit hash, tag, branch, HEAD~2, …)', ignoreFocusOut: true });
    if (!typed) return;
    rev = typed.trim();
    name = rev;
  }
  if (rev.startsWith('merge-base:')) {
    const base = git(cwd, ['merge-base', 'HEAD', rev.slice('merge-base:'.length)]);
    if (base === null) return void vscode.window.showWarningMessage(`Couplet: HEAD and ${rev.slice('merge-base:'.length)} have no merge base.`);
    rev = base;
  }
  try {
    const old = showAtRevision(file, rev);
    // The panel's overlay keeps the old text and follows later edits of the sidecar.
    const refused = p.overlay.show(name, old.kind === 'found' ? old.text : null);
    if (refused !== null) void vscode.window.showWarningMessage(`Couplet: ${refused}`);
  } catch (e) {
    void vscode.window.showWarningMessage(`Couplet: ${e instanceof Error ? e.message : String(e)}`);
  }
}
