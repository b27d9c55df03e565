/**
 * A file as it was at a git revision, read with `git show REV:./path` (never by checking anything
 * out, so the working tree and the index stay as the user left them).
 */
import { spawnSync } from 'node:child_process';
import { basename, dirname } from 'node:path';
import { InputError } from './errors';

export type RevisionText =
  | { readonly kind: 'found'; readonly text: string }
  /** The revision exists but does not hold the file (it was added later). */
  | { readonly kind: 'absent' };

function git(cwd: string, args: readonly string[]): { status: number | null; stdout: string; stderr: string } {
  const r = spawnSync('git', args, { cwd, encoding: 'utf8', maxBuffer: 64 * 1024 * 1024 });
  if (r.error) throw new InputError(`git is not available (${r.error.message})`);
  return { status: r.status, stdout: r.stdout, stderr: r.stderr };
}

export function showAtRevision(file: string, rev: string): RevisionText {
  const cwd = dirname(file);
  if (rev.startsWith('-')) throw new InputError(`${rev}: not a revision`);
  const commit = git(cwd, ['rev-parse', '--verify', '--quiet', `${rev}^{commit}`]);
  if (commit.status !== 0) {
    const inRepo = git(cwd, ['rev-parse', '--is-inside-work-tree']).status === 0;
    throw new InputError(inRepo ? `${rev}: no such revision in the repository of ${file}` : `${file}: not inside a git repository`);
  }
  const r = git(cwd, ['show', `${commit.stdout.trim()}:./${basename(file)}`]);
  if (r.status === 0) return { kind: 'found', text: r.stdout };
  return { kind: 'absent' };
}
