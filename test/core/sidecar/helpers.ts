/** Test helpers: golden files, and the real git (the outside reference for diffs and merges). */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { expect } from 'vitest';

export const GOLDEN_DIR = path.resolve(__dirname, 'golden');

export function golden(name: string): string {
  return readFileSync(path.join(GOLDEN_DIR, name), 'utf8');
}

/** Compares with a golden file; on mismatch writes `<name>-changed` beside it for review. */
export function expectGolden(name: string, actual: string): void {
  const expected = golden(name);
  const changed = path.join(GOLDEN_DIR, `${name}-changed`);
  if (actual !== expected) writeFileSync(changed, actual);
  else rmSync(changed, { force: true });
  expect(actual).toBe(expected);
}

function withTemp<T>(files: Record<string, string>, run: (dir: string) => T): T {
  const dir = mkdtempSync(path.join(tmpdir(), 'couplet-sidecar-'));
  try {
    for (const [name, text] of Object.entries(files)) writeFileSync(path.join(dir, name), text);
    return run(dir);
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

/** `git merge-file -p ours base theirs`: the merged text and the number of conflicts (git's exit code). */
export function gitMergeFile(ours: string, base: string, theirs: string): { text: string; conflicts: number } {
  return withTemp({ ours, base, theirs }, (dir) => {
    // Pin the marker style: a user's merge.conflictStyle (diff3, zdiff3) would add `|||||||` sections.
    const r = spawnSync('git', ['-c', 'merge.conflictStyle=merge', 'merge-file', '-p', 'ours', 'base', 'theirs'],
      { cwd: dir, encoding: 'utf8' });
    if (r.status === null || r.status < 0) throw new Error(`git merge-file failed: ${r.stderr}`);
    return { text: r.stdout, conflicts: r.status };
  });
}

export interface DiffHunk {
  /** 1-based first old line and count (count 0: insertion after line `oldStart`). */
  oldStart: number;
  oldCount: number;
  newStart: number;
  newCount: number;
}

/** Hunks of `git diff --no-index -U0` between two texts. */
export function gitDiffHunks(before: string, after: string): DiffHunk[] {
  return withTemp({ a: before, b: after }, (dir) => {
    // --no-ext-diff and the pinned algorithm keep a user's git config out of the result.
    const r = spawnSync('git', ['-c', 'diff.algorithm=myers', 'diff', '--no-index', '--no-color', '--no-ext-diff', '-U0', 'a', 'b'],
      { cwd: dir, encoding: 'utf8' });
    if (r.status !== 0 && r.status !== 1) throw new Error(`git diff failed: ${r.stderr}`);
    const hunks: DiffHunk[] = [];
    for (const m of r.stdout.matchAll(/^@@ -(\d+)(?:,(\d+))? \+(\d+)(?:,(\d+))? @@/gm)) {
      hunks.push({
        oldStart: Number(m[1]), oldCount: m[2] === undefined ? 1 : Number(m[2]),
        newStart: Number(m[3]), newCount: m[4] === undefined ? 1 : Number(m[4]),
      });
    }
    return hunks;
  });
}

/** Old line numbers (1-based) that a diff deletes or replaces. */
export function changedOldLines(hunks: readonly DiffHunk[]): number[] {
  return hunks.flatMap((h) => Array.from({ length: h.oldCount }, (_, i) => h.oldStart + i));
}

/** 1-based line numbers of the lines of `text` for which `test` holds. */
export function linesWhere(text: string, test: (line: string) => boolean): number[] {
  return text.split('\n').flatMap((l, i) => (test(l) ? [i + 1] : []));
}
