/**
 * The custom editor for JCAMP-DX spectra. The opened file is the spectrum (read only); the document
 * being edited is its sidecar: panel actions are WorkspaceEdits on it, recorded on this editor's
 * edit stack, so undo/redo, the dirty marker, save, revert and hot exit behave as usual.
 */
import * as vscode from 'vscode';
import { decodeBackup, encodeBackup, textToRestore } from './backupText';
import { publish } from './diagnostics';
import { writeUndoable } from './editHistory';
import type { WorkerLike } from './fitClient';
import { PanelSession, type CancelToken, type Measurer, type SessionPorts, type SidecarStore } from './panelSession';
import { CompareOverlay } from './review/compareOverlay';
import { readSettings } from './settings';
import { sidecarState } from './sidecarState';
import { SpectrumDocument } from './spectrumDocument';
import { errorHtml, localRoots, spectrumHtml } from './webviewHtml';
import { folderSidecars } from './folderSidecars';
import { workspaceLabels } from './workspaceLabels';

export const VIEW_TYPE = 'couplet.spectrum';

export interface OpenPanel {
  readonly document: SpectrumDocument;
  readonly panel: vscode.WebviewPanel;
  readonly session: PanelSession;
  /** The compare overlay (issue 6 review), refreshed when the sidecar changes. */
  readonly overlay: CompareOverlay;
}

const noMeasurer: Measurer = {
  measure: () => Promise.reject(new Error('J is measured at DQF-COSY cross peaks; this spectrum is 1D')),
  cancel: () => undefined,
};

export class SpectrumEditorProvider implements vscode.CustomEditorProvider<SpectrumDocument> {
  private readonly edits = new vscode.EventEmitter<vscode.CustomDocumentEditEvent<SpectrumDocument>>();
  readonly onDidChangeCustomDocument = this.edits.event;
  private readonly panels = new Set<OpenPanel>();
  private lastActive: OpenPanel | undefined;

  constructor(
    private readonly extensionUri: vscode.Uri,
    private readonly diagnostics: vscode.DiagnosticCollection,
    private readonly output: vscode.OutputChannel,
    private readonly spawn: () => WorkerLike,
  ) {}

  /** The panel a command acts on: the active one, else the one used last. */
  active(): OpenPanel | undefined {
    return [...this.panels].find((p) => p.panel.active) ?? this.lastActive;
  }

  async openCustomDocument(uri: vscode.Uri, context: vscode.CustomDocumentOpenContext): Promise<SpectrumDocument> {
    const doc = await SpectrumDocument.open(uri, this.spawn, (m) => this.output.appendLine(m));
    if (doc.loadError) void vscode.window.showErrorMessage(`Couplet: ${doc.loadError}`);
    const refresh = (): void => {
      if (doc.model) publish(this.diagnostics, doc.store.uri, sidecarState(doc.store.text(), doc.store.fileName, doc.model.sha256).diagnostics);
    };
    doc.store.onDidChange(refresh);
    refresh();
    // Problems of a sidecar nobody has open would go stale (it can change on disk unseen).
    doc.onDispose(() => this.diagnostics.delete(doc.store.uri));
    if (context.backupId) await this.restoreBackup(doc, vscode.Uri.parse(context.backupId));
    return doc;
  }

  /** Hot exit: the unsaved sidecar text comes back (unless VS Code already restored the document itself). */
  private async restoreBackup(doc: SpectrumDocument, backup: vscode.Uri): Promise<void> {
    try {
      const saved = decodeBackup(new TextDecoder('utf-8').decode(await vscode.workspace.fs.readFile(backup)));
      if (saved === null) {
        this.output.appendLine(`the backup of ${doc.store.fileName} is damaged (cut short); it was not restored, the sidecar is as on disk`);
        void vscode.window.showWarningMessage(`Couplet: the unsaved changes of ${doc.store.fileName} could not be restored (damaged backup); the sidecar is as on disk.`);
        return;
      }
      const text = textToRestore(saved, doc.store.text());
      if (text !== null && !(await doc.store.write(text, 'Restore unsaved changes'))) {
        this.output.appendLine(`could not restore the backup of ${doc.store.fileName}: VS Code did not apply the change`);
      }
    } catch (e) {
      this.output.appendLine(`could not restore the backup of ${doc.store.fileName}: ${String(e)}`);
    }
  }

  async resolveCustomEditor(document: SpectrumDocument, panel: vscode.WebviewPanel): Promise<void> {
    panel.webview.options = { enableScripts: document.model !== null, localResourceRoots: localRoots(this.extensionUri) };
    if (!document.model) {
      panel.webview.html = errorHtml(document.loadError ?? 'unknown error');
      return;
    }
    const store: SidecarStore = {
      fileName: document.store.fileName,
      text: () => document.store.text(),
      write: (after, label) => writeUndoable(document.store, after, label,
        (e) => this.edits.fire({ document, label: e.label, undo: e.undo, redo: e.redo }),
        (m) => void vscode.window.showWarningMessage(m)),
    };
    const overlay = new CompareOverlay(store.fileName, store.text, (m) => void panel.webview.postMessage(m));
    // A webview restored after being hidden starts again with `ready`: after its init, the overlay comes back.
    const oneD = document.model.spectrum.dims === 1;
    const session = new PanelSession(document.model, store, document.fits ?? noMeasurer, {
      ...this.ports(panel), afterInit: () => overlay.restored(),
      ...(oneD && document.fits && { analyser: document.fits, folderSidecars: () => folderSidecars(document.uri, store.fileName) }),
    });
    // `when` clauses of the 1D commands (region, integral reference).
    const setOneD = (): void => void vscode.commands.executeCommand('setContext', 'couplet.spectrum1D', oneD);
    setOneD();
    const entry: OpenPanel = { document, panel, session, overlay };
    this.panels.add(entry);
    this.lastActive = entry;
    const subs = [
      panel.webview.onDidReceiveMessage((m: unknown) => void session.receive(m)),
      document.store.onDidChange(() => {
        session.sidecarChanged();
        overlay.sidecarChanged();
      }),
      vscode.workspace.onDidChangeConfiguration((e) => {
        if (e.affectsConfiguration('couplet')) session.settingsChanged();
      }),
      panel.onDidChangeViewState((e) => {
        if (!e.webviewPanel.active) return;
        this.lastActive = entry;
        setOneD();
      }),
    ];
    panel.onDidDispose(() => {
      subs.forEach((s) => s.dispose());
      session.dispose();
      overlay.dispose();
      this.panels.delete(entry);
      if (this.lastActive === entry) this.lastActive = undefined;
    });
    panel.webview.html = spectrumHtml(panel.webview, this.extensionUri);
  }

  private ports(panel: vscode.WebviewPanel): SessionPorts {
    return {
      post: (m) => void panel.webview.postMessage(m),
      settings: () => readSettings((key) => vscode.workspace.getConfiguration().get(key)),
      knownLabels: () => workspaceLabels(),
      log: (m) => this.output.appendLine(m),
      notify: (m) => void vscode.window.showWarningMessage(`Couplet: ${m}`),
      inform: (m) => void vscode.window.showInformationMessage(`Couplet: ${m}`),
      withProgress: (title, work) => Promise.resolve(vscode.window.withProgress(
        { location: vscode.ProgressLocation.Notification, title, cancellable: true },
        (progress, token) => {
          let last = 0;
          const cancel: CancelToken = { get cancelled() { return token.isCancellationRequested; }, onCancel: (f) => void token.onCancellationRequested(f) };
          return work((done, total) => {
            progress.report({ message: `${done} of ${total}`, increment: total > 0 ? ((done - last) / total) * 100 : 0 });
            last = done;
          }, cancel);
        })),
    };
  }

  async saveCustomDocument(document: SpectrumDocument): Promise<void> {
    if (!(await document.store.save())) throw new Error(`Couplet: ${document.store.fileName} was not saved`);
  }

  async saveCustomDocumentAs(document: SpectrumDocument): Promise<void> {
    // The data file is never rewritten, and a sidecar is tied to its data file's name and hash.
    throw new Error(`Couplet: Save As is not offered for spectra; ${document.store.fileName} is saved with Save.`);
  }

  async revertCustomDocument(document: SpectrumDocument): Promise<void> {
    await document.store.revert();
  }

  async backupCustomDocument(document: SpectrumDocument, context: vscode.CustomDocumentBackupContext): Promise<vscode.CustomDocumentBackup> {
    await vscode.workspace.fs.writeFile(context.destination, new TextEncoder().encode(encodeBackup(document.store.text() ?? '')));
    return {
      id: context.destination.toString(),
      delete: () => void vscode.workspace.fs.delete(context.destination).then(undefined, () => undefined),
    };
  }
}
