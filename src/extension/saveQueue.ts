/**
 * Saving the sidecar document when VS Code asks the custom editor to save. VS Code can start a
 * second save of the custom editor while the first is still in the document's save participants
 * (seen in code-server 4.100: two `saveCustomDocument` calls 0.7 s apart for one Save). It then
 * keeps only the last call's outcome for the editor's dirty marker. Saving the text document twice
 * at once made the second `TextDocument.save()` fail (the first save had just finished and VS Code
 * had closed the clean document), so the Couplet tab stayed dirty although the disk had the text.
 * Saves are therefore run one after another, and a save that finds nothing left to save succeeds.
 * Kept free of the vscode module so the ordering is tested in Node.
 */

/** The part of a vscode.TextDocument a save needs. */
export interface SavableDocument {
  readonly isDirty: boolean;
  getText(): string;
  save(): PromiseLike<boolean>;
}

export class SaveQueue {
  private last: Promise<unknown> = Promise.resolve();

  constructor(
    /** The open document, or undefined when VS Code has none (it only closes clean ones). */
    private readonly find: () => SavableDocument | undefined,
    /** The file's text on disk, or null when it cannot be read. */
    private readonly readDisk: () => Promise<string | null>,
  ) {}

  /** Resolves true when the document's text is on disk (nothing unsaved is left from this call's view). */
  save(): Promise<boolean> {
    const run = this.last.then(() => this.saveOnce(), () => this.saveOnce());
    this.last = run.catch(() => undefined);
    return run;
  }

  private async saveOnce(): Promise<boolean> {
    const doc = this.find();
    // Nothing to do when not open (VS Code drops only clean documents) or not dirty. Saving a clean
    // document may report false although nothing is wrong (e.g. after undoing to the saved text).
    if (!doc?.isDirty) return true;
    const text = doc.getText();
    let saved = false;
    try {
      saved = await doc.save();
    } catch {
      // "Document has been closed": judged below like a save that reported false.
    }
    if (saved) return true;
    // Someone else's save (another window, a save-all) may have written exactly this text meanwhile.
    const now = this.find();
    return (now === undefined || !now.isDirty) && (await this.readDisk()) === text;
  }
}
