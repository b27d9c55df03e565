/**
 * Review against real git (the outside reference for history and merges): a temporary repository,
 * a sidecar changed in each way a chemist changes it, the old version read with `git show`.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { showAtRevision } from '../../../src/cli/gitShow';
import { runCli } from '../../../src/cli/program';
import { compareSidecars, type SidecarChanges } from '../../../src/core/review';
import {
  addPick, applyEdits, formatSidecar, movePick, parseSidecar, relabelPick, removePick, setCoupling,
  type Sidecar, type TextEdit,
} from '../../../src/core/sidecar';

let repo = '';
const NAME = 'cosy.jdx.couplet.yaml';
const file = (): string => join(repo, NAME);

function git(...args: string[]): { status: number | null; out: string } {
  const r = spawnSync('git', args, { cwd: repo, encoding: 'utf8' });
  return { status: r.status, out: r.stdout + r.stderr };
}

function commit(text: string, message: string): void {
  writeFileSync(file(), text);
  expect(git('add', NAME).status).toBe(0);
  expect(git('commit', '-q', '-m', message).status).toBe(0);
}

const read = (text: string): Sidecar => {
  const s = parseSidecar(text, NAME).sidecar;
  if (s === null) throw new Error('fixture does not parse');
  return s;
};

/** Compare the working file with HEAD as read through `git show`. */
function changesSinceHead(): SidecarChanges {
  const old = showAtRevision(file(), 'HEAD');
  if (old.kind !== 'found') throw new Error('sidecar not in HEAD');
  return compareSidecars(read(old.text), read(readFileSync(file(), 'utf8')));
}

const base: Sidecar = {
  schema: 'couplet-sidecar/1', data: { file: 'cosy.jdx', sha256: 'c'.repeat(64) },
  picks: [
    { id: 'p-2.3400-4.1200', f2Ppm: 2.34, f1Ppm: 4.12, label: ['H-4a', 'H-3'], kind: 'cross' },
    { id: 'p-4.1200-2.3400', f2Ppm: 4.12, f1Ppm: 2.34, label: ['H-3', 'H-4a'], kind: 'cross' },
    { id: 'p-6.1000-5.6000', f2Ppm: 6.1, f1Ppm: 5.6, label: ['H-6', 'H-5'], kind: 'cross' },
  ],
  couplings: [{ atoms: ['H-3', 'H-4a'], jHz: 10.2, jSdHz: 0.15, method: 'fit', dimension: 'F2', picks: ['p-4.1200-2.3400'], flags: [] }],
};

beforeAll(() => {
  repo = mkdtempSync(join(tmpdir(), 'couplet-review-git-'));
  for (const args of [['init', '-q', '-b', 'main'], ['config', 'user.name', 'Test'], ['config', 'user.email', 'test@example.invalid'],
    ['config', 'commit.gpgsign', 'false'], ['config', 'merge.conflictStyle', 'merge']]) expect(git(...args).status).toBe(0);
  commit(formatSidecar(base), 'picks');
});
afterAll(() => rmSync(repo, { recursive: true, force: true }));

/** Applies one action to the committed text, checks compare against HEAD, then restores the file. */
function afterAction(action: (text: string) => TextEdit[]): SidecarChanges {
  const text = readFileSync(file(), 'utf8');
  writeFileSync(file(), applyEdits(text, action(text)));
  try {
    return changesSinceHead();
  } finally {
    writeFileSync(file(), text);
  }
}

describe('compare against a revision read with git show', () => {
  it('reports exactly an added pick', () => {
    const c = afterAction((t) => addPick(t, { f2Ppm: 5.6, f1Ppm: 6.1, label: ['H-5', 'H-6'], kind: 'cross' }).edits);
    expect(c).toMatchObject({ dataChanged: false, picks: [{ kind: 'added', id: 'p-5.6000-6.1000' }], couplings: [] });
    expect(c.picks).toHaveLength(1);
  });

  it('reports exactly a removed pick', () => {
    const c = afterAction((t) => removePick(t, 'p-6.1000-5.6000'));
    expect(c).toMatchObject({ picks: [{ kind: 'removed', id: 'p-6.1000-5.6000' }], couplings: [] });
    expect(c.picks).toHaveLength(1);
  });

  it('reports exactly a moved pick with old and new position', () => {
    const c = afterAction((t) => movePick(t, 'p-6.1000-5.6000', { f2Ppm: 6.1012, f1Ppm: 5.5987 }));
    expect(c.picks).toEqual([{ kind: 'moved', id: 'p-6.1000-5.6000', from: { f2Ppm: 6.1, f1Ppm: 5.6 }, to: { f2Ppm: 6.1012, f1Ppm: 5.5987 }, pick: expect.anything() as unknown }]);
    expect(c.couplings).toEqual([]);
  });

  it('reports exactly a relabelled pick with old and new labels', () => {
    const c = afterAction((t) => relabelPick(t, 'p-6.1000-5.6000', ['H-6', 'H-5b']));
    expect(c.picks).toMatchObject([{ kind: 'relabelled', id: 'p-6.1000-5.6000', from: ['H-6', 'H-5'], to: ['H-6', 'H-5b'] }]);
    expect(c.picks).toHaveLength(1);
    expect(c.couplings).toEqual([]);
  });

  it('reports exactly a re-measured coupling with old and new J and sigma', () => {
    const c = afterAction((t) => setCoupling(t, { ...base.couplings[0]!, jHz: 10.34, jSdHz: 0.11 }));
    expect(c.picks).toEqual([]);
    expect(c.couplings).toMatchObject([{ kind: 're-measured', from: { jHz: 10.2, jSdHz: 0.15 }, to: { jHz: 10.34, jSdHz: 0.11 } }]);
  });

  it('says so when the revision does not exist, and treats a file the revision lacks as absent', () => {
    expect(() => showAtRevision(file(), 'no-such-branch')).toThrow(/no-such-branch: no such revision/);
    writeFileSync(join(repo, 'other.couplet.yaml'), formatSidecar(base));
    expect(showAtRevision(join(repo, 'other.couplet.yaml'), 'HEAD')).toEqual({ kind: 'absent' });
    rmSync(join(repo, 'other.couplet.yaml'));
  });
});

describe('merging sidecars in git', () => {
  it('merges two branches that add different picks without conflict, keeping both', () => {
    const start = readFileSync(file(), 'utf8');
    expect(git('checkout', '-q', '-b', 'alice').status).toBe(0);
    commit(applyEdits(start, addPick(start, { f2Ppm: 1.25, f1Ppm: 2.34, label: [] }).edits), 'alice adds');
    expect(git('checkout', '-q', 'main').status).toBe(0);
    expect(git('checkout', '-q', '-b', 'bob').status).toBe(0);
    commit(applyEdits(start, addPick(start, { f2Ppm: 7.26, f1Ppm: 6.1, label: [] }).edits), 'bob adds');
    const m = git('merge', '-q', '--no-edit', 'alice');
    expect(m.status, m.out).toBe(0);
    const merged = parseSidecar(readFileSync(file(), 'utf8'), NAME);
    expect(merged.diagnostics.filter((d) => d.severity !== 'info')).toEqual([]);
    expect(merged.sidecar?.picks.map((p) => p.id)).toEqual(['p-1.2500-2.3400', 'p-2.3400-4.1200', 'p-4.1200-2.3400', 'p-6.1000-5.6000', 'p-7.2600-6.1000']);
    expect(git('checkout', '-q', 'main').status).toBe(0);
  });

  it('a conflicted merge is reported by check with the marker lines, and nothing rewrites the file', () => {
    const start = readFileSync(file(), 'utf8');
    expect(git('checkout', '-q', '-b', 'carol').status).toBe(0);
    commit(applyEdits(start, movePick(start, 'p-6.1000-5.6000', { f2Ppm: 6.11, f1Ppm: 5.6 })), 'carol moves');
    expect(git('checkout', '-q', 'main').status).toBe(0);
    commit(applyEdits(start, movePick(start, 'p-6.1000-5.6000', { f2Ppm: 6.09, f1Ppm: 5.6 })), 'main moves');
    expect(git('merge', '-q', '--no-edit', 'carol').status).not.toBe(0);
    const conflicted = readFileSync(file(), 'utf8');
    expect(conflicted).toMatch(/^<{7} /m);
    let out = '';
    const code = runCli(['check', file()], { out: (t) => (out += t), err: (t) => (out += t) });
    expect(code).toBe(1);
    const markerLine = conflicted.split('\n').findIndex((l) => l.startsWith('<<<<<<<')) + 1;
    expect(out).toContain(`${file()}:${markerLine}: error: git conflict marker "<<<<<<<"`);
    expect(() => movePick(conflicted, 'p-6.1000-5.6000', { f2Ppm: 6.1, f1Ppm: 5.6 }, NAME)).toThrow(/conflict marker/);
    expect(readFileSync(file(), 'utf8')).toBe(conflicted);
    git('merge', '--abort');
  });
});
