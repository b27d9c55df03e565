/**
 * The sidecar text after a file-watcher event. The order of events is the one the in-host suite
 * recorded in code-server 4.100.3 for the first pick: the watcher reports the file created empty by
 * WorkspaceEdit.createFile, VS Code then opens the document and inserts the pick, and only then
 * does the disk read (started before the document was open) come back with the empty file.
 */
import { describe, expect, it } from 'vitest';
import { LatestText } from '../../src/extension/latestText';

/** A disk read that resolves when the test says so. */
function slowRead(): { read: () => Promise<string | null>; finish: (text: string | null) => void } {
  const pending: ((t: string | null) => void)[] = [];
  return {
    read: () => new Promise((r) => pending.push(r)),
    finish: (text) => pending.shift()?.(text),
  };
}

describe('LatestText', () => {
  it('a document opened while the disk read was under way wins over the (older) disk text', async () => {
    const doc: { text?: string } = {};
    const disk = slowRead();
    const reads = new LatestText(() => doc.text, disk.read);
    const pending = reads.read();
    doc.text = 'schema: couplet-sidecar/1\npicks: []\n';
    disk.finish('');
    expect(await pending).toBe('schema: couplet-sidecar/1\npicks: []\n');
  });

  it('an open document is used without reading the disk', async () => {
    let diskReads = 0;
    const reads = new LatestText(() => 'unsaved\n', () => Promise.resolve(`disk ${++diskReads}`));
    expect(await reads.read()).toBe('unsaved\n');
    expect(diskReads).toBe(0);
  });

  it('with no document open the disk text (or null for no file) is the answer', async () => {
    expect(await new LatestText(() => undefined, () => Promise.resolve('on disk\n')).read()).toBe('on disk\n');
    expect(await new LatestText(() => undefined, () => Promise.resolve(null)).read()).toBeNull();
  });

  it('a read overtaken by a later one gives no answer, whatever order the disk answers in', async () => {
    const disk = slowRead();
    const reads = new LatestText(() => undefined, disk.read);
    const first = reads.read();
    const second = reads.read();
    disk.finish('older\n');
    disk.finish('newer\n');
    expect(await first).toBeUndefined();
    expect(await second).toBe('newer\n');
  });
});
