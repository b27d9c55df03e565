/**
 * Revert of the sidecar document to the file on disk. The old code read the disk, replaced the
 * document and saved it without looking again: a change on disk in between (a checkout, a pull,
 * another program) was then overwritten with the older text. Fakes stand in for the document and
 * the disk; each read of the disk returns the next value of a list.
 */
import { describe, expect, it } from 'vitest';
import { revertToDisk, type RevertableDocument } from '../../src/extension/revertText';

function fakes(text: string, dirty: boolean, diskReads: (string | null)[]) {
  const saved: string[] = [];
  let replaced = 0;
  let refuse = false;
  const doc: RevertableDocument & { text: string; dirty: boolean } = {
    text, dirty,
    get isDirty() { return this.dirty; },
    getText() { return this.text; },
    replaceAll: async (t) => {
      if (refuse) return false;
      replaced++;
      doc.text = t;
      doc.dirty = true;
      return true;
    },
    save: async () => {
      saved.push(doc.text);
      doc.dirty = false;
      return true;
    },
  };
  let i = 0;
  const disk = async (): Promise<string | null> => diskReads[Math.min(i++, diskReads.length - 1)] ?? null;
  return { doc, disk, saved, replaced: () => replaced, refuseEdits: () => void (refuse = true), reads: () => i };
}

describe('revertToDisk', () => {
  it('replaces unsaved text by the disk text and saves it, so the document is clean', async () => {
    const f = fakes('picks: [edited]\n', true, ['picks: []\n']);
    await revertToDisk(f.doc, f.disk, 'a.couplet.yaml');
    expect(f.doc.text).toBe('picks: []\n');
    expect(f.saved).toEqual(['picks: []\n']);
  });

  it('takes the newer text when the file changes on disk during the revert, never saving the older one', async () => {
    const f = fakes('mine\n', true, ['disk v1\n', 'disk v2 (checkout)\n', 'disk v2 (checkout)\n', 'disk v2 (checkout)\n']);
    await revertToDisk(f.doc, f.disk, 'a.couplet.yaml');
    expect(f.doc.text).toBe('disk v2 (checkout)\n');
    expect(f.saved).toEqual(['disk v2 (checkout)\n']);
  });

  it('gives up without saving when the file keeps changing, and says so', async () => {
    const f = fakes('mine\n', true, Array.from({ length: 20 }, (_, k) => `disk v${k}\n`));
    await expect(revertToDisk(f.doc, f.disk, 'a.couplet.yaml')).rejects.toThrow(/a\.couplet\.yaml kept changing on disk/);
    expect(f.saved).toEqual([]);
  });

  it('does not touch a clean document that already has the disk text', async () => {
    const f = fakes('same\n', false, ['same\n']);
    await revertToDisk(f.doc, f.disk, 'a.couplet.yaml');
    expect(f.replaced()).toBe(0);
    expect(f.saved).toEqual([]);
  });

  it('reports a refused edit instead of saving', async () => {
    const f = fakes('mine\n', true, ['disk\n']);
    f.refuseEdits();
    await expect(revertToDisk(f.doc, f.disk, 'a.couplet.yaml')).rejects.toThrow(/a\.couplet\.yaml: VS Code did not apply the revert/);
    expect(f.saved).toEqual([]);
    expect(f.doc.text).toBe('mine\n');
  });
});
