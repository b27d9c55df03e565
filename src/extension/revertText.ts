/**
 * Revert of the sidecar document to the file on disk (custom editor Revert, and closing the
 * spectrum editor with edits nobody can see). VS Code offers no "revert this TextDocument" API, so
 * the document is replaced by the disk text and saved, which writes the file. Reading the disk once
 * and saving later could put an older text back over a change made on disk in between (a checkout,
 * a pull): the disk is read again before saving, and the newer text is taken until it stands
 * still; a file that keeps changing is left alone. Kept free of the vscode module so the ordering
 * is tested in Node.
 */

/** The part of a vscode.TextDocument a revert needs. */
export interface RevertableDocument {
  readonly isDirty: boolean;
  getText(): string;
  /** Replaces the whole text (one WorkspaceEdit); false when VS Code refused it. */
  replaceAll(text: string): PromiseLike<boolean>;
  save(): PromiseLike<boolean>;
}

/** Attempts before giving up on a file that changes under every read. */
const MAX_ATTEMPTS = 5;

/** `readDisk` gives the file's text, null when there is no file (then the document is emptied). */
export async function revertToDisk(doc: RevertableDocument, readDisk: () => Promise<string | null>, fileName: string): Promise<void> {
  for (let attempt = 0; attempt < MAX_ATTEMPTS; attempt++) {
    const disk = (await readDisk()) ?? '';
    if (!doc.isDirty && doc.getText() === disk) return;
    if (doc.getText() !== disk && !(await doc.replaceAll(disk))) throw new Error(`${fileName}: VS Code did not apply the revert; the unsaved text is still in the editor`);
    // Saving writes the file: only while it still holds what the document now holds.
    if (((await readDisk()) ?? '') !== disk) continue;
    if (!doc.isDirty || (await doc.save())) return;
    throw new Error(`${fileName}: the reverted text could not be saved`);
  }
  throw new Error(`${fileName} kept changing on disk while reverting; nothing was saved. Revert again once it is quiet.`);
}
