/**
 * The sidecar `<data>.couplet.yaml` as a VS Code TextDocument: the panel edits it only through
 * WorkspaceEdit (so dirty state, save, hot exit and the text editor's own undo work as usual) and
 * follows every change of it: edits, undo, revert, and changes on disk such as a git checkout.
 */
import * as vscode from 'vscode';
import { lineDiffEdits } from '../core/sidecar';
import type { SidecarStore } from './panelSession';
import { LatestText } from './latestText';
import { revertToDisk } from './revertText';
import { SaveQueue } from './saveQueue';

export class VsSidecarStore implements SidecarStore, vscode.Disposable {
  readonly fileName: string;
  private cached: string | null = null;
  private readonly subscriptions: vscode.Disposable[] = [];
  private readonly changed = new vscode.EventEmitter<void>();
  private readonly saves = new SaveQueue(() => this.openDocument(), () => this.diskText());
  private readonly reads = new LatestText(() => this.openDocument()?.getText(), () => this.readFile());
  /** Fires after the text changed, for whatever reason. */
  readonly onDidChange = this.changed.event;

  private constructor(readonly uri: vscode.Uri, log: (message: string) => void) {
    this.fileName = uri.path.split('/').pop() ?? uri.path;
    const same = (u: vscode.Uri): boolean => u.toString() === uri.toString();
    this.subscriptions.push(
      this.changed,
      vscode.workspace.onDidChangeTextDocument((e) => {
        if (same(e.document.uri)) this.update(e.document.getText());
      }),
      vscode.workspace.onDidOpenTextDocument((d) => {
        if (same(d.uri)) this.update(d.getText());
      }),
    );
    // When no TextDocument is open for it, VS Code does not read the file: watch the disk ourselves.
    const folder = vscode.Uri.joinPath(uri, '..');
    const watcher = vscode.workspace.createFileSystemWatcher(new vscode.RelativePattern(folder, this.fileName));
    // A read that fails (permissions, a folder in its place) keeps the last text and says why.
    const fromDisk = (): void => void this.readDisk().catch((e: unknown) => log(`${this.fileName}: could not read the change on disk: ${e instanceof Error ? e.message : String(e)}`));
    this.subscriptions.push(watcher, watcher.onDidCreate(fromDisk), watcher.onDidChange(fromDisk), watcher.onDidDelete(fromDisk));
  }

  static async open(uri: vscode.Uri, log: (message: string) => void): Promise<VsSidecarStore> {
    const store = new VsSidecarStore(uri, log);
    try {
      await store.readDisk();
    } catch (e) {
      store.dispose(); // its watcher and listeners would otherwise outlive the failed open
      throw e;
    }
    return store;
  }

  text(): string | null {
    return this.cached;
  }

  private openDocument(): vscode.TextDocument | undefined {
    return vscode.workspace.textDocuments.find((d) => d.uri.toString() === this.uri.toString());
  }

  private update(text: string | null): void {
    if (text === this.cached) return;
    this.cached = text;
    this.changed.fire();
  }

  /** The open document wins (it may hold unsaved edits); otherwise the file on disk, or null if there is none. */
  async readDisk(): Promise<void> {
    const text = await this.reads.read();
    if (text !== undefined) this.update(text);
  }

  private async readFile(): Promise<string | null> {
    try {
      return new TextDecoder('utf-8').decode(await vscode.workspace.fs.readFile(this.uri));
    } catch (e) {
      if (e instanceof vscode.FileSystemError && e.code === 'FileNotFound') return null;
      throw e;
    }
  }

  async write(after: string, label: string): Promise<boolean> {
    const edit = new vscode.WorkspaceEdit();
    const meta: vscode.WorkspaceEditEntryMetadata = { label, needsConfirmation: false };
    if (this.cached === null) {
      // First pick: the file is created and filled in one undoable edit. If a file appeared
      // meanwhile (a checkout before its watcher event), the edit fails rather than insert into it.
      edit.createFile(this.uri, { ignoreIfExists: false, overwrite: false }, meta);
      edit.insert(this.uri, new vscode.Position(0, 0), after, meta);
    } else {
      const doc = await vscode.workspace.openTextDocument(this.uri);
      const before = doc.getText();
      // The action was computed on `cached`; if the document moved on meanwhile, do not guess.
      if (before !== this.cached) return false;
      for (const e of lineDiffEdits(before, after)) {
        edit.replace(this.uri, new vscode.Range(doc.positionAt(e.offset), doc.positionAt(e.offset + e.length)), e.text, meta);
      }
    }
    const ok = await vscode.workspace.applyEdit(edit);
    if (ok) {
      const doc = await vscode.workspace.openTextDocument(this.uri);
      this.update(doc.getText());
    }
    return ok;
  }

  /** Saves the document (nothing to do when it is not open or not dirty); overlapping calls run in turn. */
  save(): Promise<boolean> {
    return this.saves.save();
  }

  private diskText(): Promise<string | null> {
    return this.readFile().catch(() => null);
  }

  /** Back to the text on disk: the document is replaced by it and saved (revertText.ts), so it is no longer dirty. */
  async revert(): Promise<void> {
    const doc = this.openDocument();
    if (!doc || !doc.isDirty) return this.readDisk();
    const replaceAll = (text: string): Thenable<boolean> => {
      const edit = new vscode.WorkspaceEdit();
      edit.replace(this.uri, new vscode.Range(doc.positionAt(0), doc.positionAt(doc.getText().length)), text);
      return vscode.workspace.applyEdit(edit);
    };
    await revertToDisk({ get isDirty() { return doc.isDirty; }, getText: () => doc.getText(), replaceAll, save: () => doc.save() }, () => this.readFile(), this.fileName);
  }

  /**
   * When the spectrum editor closes without saving, its unsaved edits would otherwise stay in a
   * dirty document nobody sees. Reverted only when no tab shows the sidecar: text the chemist can
   * see (and may have typed into) is left alone.
   */
  async discardUnseenChanges(): Promise<void> {
    const doc = this.openDocument();
    if (!doc?.isDirty) return;
    const shown = vscode.window.tabGroups.all.some((g) => g.tabs.some((t) => t.input instanceof vscode.TabInputText && t.input.uri.toString() === this.uri.toString()));
    if (!shown) await this.revert();
  }

  dispose(): void {
    for (const s of this.subscriptions) s.dispose();
  }
}
