/**
 * "Couplet: Compare Picks With…": the sidecar at another revision, read with `git show` (nothing
 * is checked out), compared with the document as it is now (unsaved edits included), and sent to
 * the panel as overlay marks. A revision the repository does not have is said so, not guessed.
 */
import { spawnSync } from 'node:child_process';
import * as path from 'node:path';
import * as vscode from 'vscode';
import { showAtRevision } from '../../cli/gitShow';
import { compareSidecars } from '../../core/review/compare';
import { parseSidecar } from '../../core/sidecar';
import type { CompareMessage } from '../../protocol';
import type { OpenPanel } from '../spectrumEditor';
import { compareMarks } from './compareMarks';
import { revisionChoices } from './revisionChoices';

function git(cwd: string, args: readonly string[]): string | null {
  const r = spawnSync('git', args, { cwd, encoding: 'utf8' });
  return r.status === 0 ? r.stdout.trim() : null;
}

/** Panels with an overlay, so the command can offer to clear it. */
const overlaid = new WeakSet<vscode.WebviewPanel>();

export async function compareWith(p: OpenPanel): Promise<void> {
  const file = p.document.store.uri.fsPath;
  const cwd = path.dirname(file);
  const text = p.document.store.text();
  if (text === null) return void vscode.window.showInformationMessage(`Couplet: ${p.document.store.fileName} does not exist yet: there is nothing to compare.`);
  if (git(cwd, ['rev-parse', '--is-inside-work-tree']) !== 'true') {
    return void vscode.window.showInformationMessage(`Couplet: ${p.document.store.fileName} is not in a git repository.`);
  }
  const branches = (git(cwd, ['for-each-ref', '--format=%(refname:short)', 'refs/heads']) ?? '').split('\n').filter((b) => b !== '');
  const choice = await vscode.window.showQuickPick(revisionChoices(git(cwd, ['symbolic-ref', '--short', '-q', 'HEAD']), branches, overlaid.has(p.panel)),
    { placeHolder: `Compare the picks of ${p.document.store.fileName} with…` });
  if (choice === undefined) return;
  const post = (m: CompareMessage): void => void p.panel.webview.postMessage(m);
  if (choice.rev === null) {
    overlaid.delete(p.panel);
    return post({ type: 'compare', against: null, marks: [] });
  }
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
    const before = old.kind === 'found' ? parseSidecar(old.text, `${name}:${p.document.store.fileName}`).sidecar : null;
    if (old.kind === 'found' && before === null) {
      return void vscode.window.showWarningMessage(`Couplet: ${p.document.store.fileName} at ${name} cannot be read as a sidecar (conflict markers or a syntax error).`);
    }
    const now = parseSidecar(text, p.document.store.fileName).sidecar;
    if (now === null) return void vscode.window.showWarningMessage(`Couplet: ${p.document.store.fileName} cannot be read now; fix it before comparing.`);
    overlaid.add(p.panel);
    post({ type: 'compare', against: old.kind === 'found' ? name : `${name} (file not there yet)`, marks: compareMarks(compareSidecars(before, now), before, now) });
  } catch (e) {
    void vscode.window.showWarningMessage(`Couplet: ${e instanceof Error ? e.message : String(e)}`);
  }
}
