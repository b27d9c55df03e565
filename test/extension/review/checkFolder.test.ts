import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { formatSidecar, type Sidecar } from '../../../src/core/sidecar';
import { checkFolder, LatestRuns, quickFixFor, type FolderReader } from '../../../src/extension/review/checkFolder';

const join = (a: string, b: string): string => `${a}/${b}`;
const DATA = 'bytes';
const sha = (s: string): string => createHash('sha256').update(s).digest('hex');

function folder(files: Record<string, string>): FolderReader {
  return {
    list: async () => Object.keys(files).map((k) => k.replace(/^c\//, '')),
    readText: async (p) => files[p] ?? null,
    sha256: async (p) => (files[p] === undefined ? null : sha(files[p] ?? '')),
  };
}

const sidecar = (label: string, flags: string[] = []): Sidecar => ({
  schema: 'couplet-sidecar/1', data: { file: 'cosy.jdx', sha256: sha(DATA) },
  picks: [{ id: 'p-1', f2Ppm: 4.12, f1Ppm: 2.34, label: [label, 'H-4'] }],
  couplings: [{ atoms: ['H-3', 'H-4'], jHz: 0.7, jSdHz: 0.4, method: 'fit', dimension: 'F2', picks: ['p-1'], flags }],
});
const NOTE = '# x\n\nH-3 and H-4.\n\n<!-- couplet:si H1 begin -->\nδ 4.12 (d, J = 0.7 Hz, 1H, H-3).\n<!-- couplet:si H1 end -->\n';

describe('checkFolder (the editor side of couplet check)', () => {
  it('finds nothing in a consistent folder', async () => {
    const r = folder({ 'c/cosy.jdx': DATA, 'c/cosy.jdx.couplet.yaml': formatSidecar(sidecar('H-3')), 'c/note.md': NOTE });
    expect(await checkFolder('c', r, join)).toEqual([]);
  });

  it('reports an unknown label on the sidecar and a flagged J on the note, with their lines', async () => {
    const r = folder({ 'c/cosy.jdx': DATA, 'c/cosy.jdx.couplet.yaml': formatSidecar(sidecar('H-9', ['unresolved'])), 'c/note.md': NOTE });
    const p = await checkFolder('c', r, join);
    expect(p.map((x) => [x.file, x.line, x.rule])).toEqual([
      ['c/cosy.jdx.couplet.yaml', 7, 'labels'], // the pick's `- id:` line (schema v1 layout: picks start at line 7)
      ['c/note.md', 6, 'hidden-flags'],
    ]);
    expect(quickFixFor('hidden-flags')?.command).toBe('couplet.insertSiData');
    expect(quickFixFor('labels')).toBeUndefined();
  });

  it('leaves schema and hash problems to the panel diagnostics (no duplicates)', async () => {
    const r = folder({ 'c/cosy.jdx': 'changed', 'c/cosy.jdx.couplet.yaml': formatSidecar(sidecar('H-3')), 'c/note.md': NOTE });
    expect(await checkFolder('c', r, join)).toEqual([]);
  });
});

describe('LatestRuns', () => {
  it('keeps only the newest run per folder: an older run that finishes last is not published', () => {
    const runs = new LatestRuns();
    const first = runs.start('c');
    const second = runs.start('c');
    const other = runs.start('d');
    expect(first()).toBe(false);
    expect(second()).toBe(true);
    expect(other()).toBe(true);
  });
});
