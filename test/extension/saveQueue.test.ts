/**
 * Overlapping saves of the sidecar document. The fake document follows what the in-host suite saw
 * in code-server 4.100.3 and the VS Code API docs: `TextDocument.save()` resolves false (or rejects
 * with "Document has been closed") when the document cannot be saved, and VS Code closes a saved
 * document that no editor shows, after which it is no longer among `workspace.textDocuments`.
 */
import { describe, expect, it } from 'vitest';
import { SaveQueue, type SavableDocument } from '../../src/extension/saveQueue';

class FakeDoc implements SavableDocument {
  text: string;
  saved: string;
  closed = false;
  saveCalls = 0;
  private inFlight: Promise<boolean> | null = null;
  private finish: (() => void) | null = null;

  constructor(saved: string, text: string) {
    this.saved = saved;
    this.text = text;
  }

  get isDirty(): boolean {
    return this.text !== this.saved;
  }

  getText(): string {
    return this.text;
  }

  /** The first save waits for `completeSave()`; a second one meanwhile fails once the first has closed the document. */
  save(): Promise<boolean> {
    this.saveCalls++;
    if (this.closed) return Promise.reject(new Error('Document has been closed'));
    if (this.inFlight) return this.inFlight.then(() => (this.closed ? Promise.reject(new Error('Document has been closed')) : false));
    const writing = this.text;
    this.inFlight = new Promise<boolean>((resolve) => {
      this.finish = () => {
        this.saved = writing;
        this.inFlight = null;
        // Not shown in any editor: VS Code drops the clean document.
        if (!this.isDirty) this.closed = true;
        resolve(true);
      };
    });
    return this.inFlight;
  }

  completeSave(): void {
    this.finish?.();
  }
}

const queueFor = (doc: FakeDoc): SaveQueue => new SaveQueue(() => (doc.closed ? undefined : doc), () => Promise.resolve(doc.saved));
const tick = (): Promise<void> => new Promise((r) => setTimeout(r, 0));

describe('SaveQueue', () => {
  it('a second save while the first is under way waits for it and succeeds without saving again', async () => {
    const doc = new FakeDoc('', 'picks: []\n');
    const q = queueFor(doc);
    const first = q.save();
    const second = q.save();
    await tick();
    doc.completeSave();
    expect(await first).toBe(true);
    expect(await second).toBe(true);
    expect(doc.saveCalls).toBe(1);
    expect(doc.saved).toBe('picks: []\n');
  });

  it('an edit made while a save runs is saved by the next save', async () => {
    const doc = new FakeDoc('', 'a\n');
    const q = queueFor(doc);
    const first = q.save();
    await tick();
    doc.text = 'a\nb\n';
    const second = q.save();
    doc.completeSave();
    expect(await first).toBe(true);
    await tick();
    doc.completeSave();
    expect(await second).toBe(true);
    expect(doc.saved).toBe('a\nb\n');
    expect(doc.saveCalls).toBe(2);
  });

  it('reports false when the save failed and the disk does not hold the text', async () => {
    const doc: SavableDocument = { isDirty: true, getText: () => 'new\n', save: () => Promise.resolve(false) };
    const q = new SaveQueue(() => doc, () => Promise.resolve('old\n'));
    expect(await q.save()).toBe(false);
  });

  it('a clean or closed document needs no save', async () => {
    let calls = 0;
    const clean: SavableDocument = { isDirty: false, getText: () => 'x', save: () => Promise.resolve(++calls > 0 && false) };
    expect(await new SaveQueue(() => clean, () => Promise.resolve(null)).save()).toBe(true);
    expect(await new SaveQueue(() => undefined, () => Promise.resolve(null)).save()).toBe(true);
    expect(calls).toBe(0);
  });

  it('a failed save does not block the saves after it', async () => {
    let fail = true;
    const doc: SavableDocument = { isDirty: true, getText: () => 'x', save: () => (fail ? Promise.reject(new Error('disk full')) : Promise.resolve(true)) };
    const q = new SaveQueue(() => doc, () => Promise.resolve(null));
    expect(await q.save()).toBe(false);
    fail = false;
    expect(await q.save()).toBe(true);
  });
});
