/**
 * Reading the sidecar's current text when the file changes on disk. The file watcher's event for a
 * new sidecar arrives while the first pick's WorkspaceEdit is still being applied: the disk read
 * started before VS Code opened the document and finished after the pick was in it, so the empty
 * file overwrote the panel's idea of the text, and the next undo was refused as "changed since"
 * (seen in code-server 4.100.3). An open document wins over the disk (it may hold unsaved edits),
 * checked again once the disk read is back, and a read that a later one has overtaken is dropped.
 * Kept free of the vscode module so the ordering is tested in Node.
 */

export class LatestText {
  private generation = 0;

  constructor(
    /** The open document's text, undefined when VS Code has none open. */
    private readonly openText: () => string | undefined,
    /** The file's text, null when there is no file. */
    private readonly readFile: () => Promise<string | null>,
  ) {}

  /** The sidecar's text now; undefined when a later read started meanwhile (its answer counts, not this one's). */
  async read(): Promise<string | null | undefined> {
    const generation = ++this.generation;
    const open = this.openText();
    if (open !== undefined) return open;
    const disk = await this.readFile();
    if (generation !== this.generation) return undefined;
    return this.openText() ?? disk;
  }
}
