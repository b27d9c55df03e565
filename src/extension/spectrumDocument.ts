/**
 * A spectrum opened in the Couplet editor: the parsed data and peaks (read once; the data file is
 * never written), its sidecar store, and the fit worker. Shared by every panel showing the file.
 */
import { createHash } from 'node:crypto';
import * as vscode from 'vscode';
import { sidecarNameFor } from '../core/sidecar';
import { FitClient, type WorkerLike } from './fitClient';
import { VsSidecarStore } from './sidecarStore';
import type { SpectrumModel } from './spectrumModel';

export class SpectrumDocument implements vscode.CustomDocument {
  private constructor(
    readonly uri: vscode.Uri,
    readonly model: SpectrumModel | null,
    /** Why the file could not be read (file:line), when `model` is null. */
    readonly loadError: string | null,
    readonly store: VsSidecarStore,
    /** The worker client: cross-peak fits (2D) or multiplet analyses (1D); null when the file could not be read. */
    readonly fits: FitClient | null,
    private readonly log: (message: string) => void,
  ) {}

  static async open(uri: vscode.Uri, spawn: () => WorkerLike, log: (message: string) => void): Promise<SpectrumDocument> {
    const fileName = uri.path.split('/').pop() ?? uri.path;
    // The data first: a file that cannot be read must not leave a sidecar watcher behind.
    const bytes = await vscode.workspace.fs.readFile(uri);
    const store = await VsSidecarStore.open(vscode.Uri.joinPath(uri, '..', sidecarNameFor(fileName)), log);
    // Hashing here, not in core: core does no I/O and no hashing (design.md, sidecar).
    const sha256 = createHash('sha256').update(bytes).digest('hex');
    // JCAMP-DX is ASCII; latin1 maps each byte to one character, so line numbers stay right in damaged files.
    const text = Buffer.from(bytes).toString('latin1');
    const loader = new FitClient(spawn, null);
    try {
      const r = await loader.open(text, fileName);
      const model: SpectrumModel = { fileName, sha256, spectrum: r.spectrum, noise: r.noise, crossPeaks: r.crossPeaks, multiplets: r.multiplets };
      const s = r.spectrum;
      // 2D: cross-peak fits; 1D: multiplet analyses (a lineshape search can take seconds).
      const fits = s.dims === 2
        ? new FitClient(spawn, { title: s.title, data: s.data, f1: s.f1, f2: s.f2, ...(s.processing && { processing: s.processing }) })
        : new FitClient(spawn, { dims: 1, spectrum: { title: s.title, data: s.data, axis: s.axis, ...(s.processing && { processing: s.processing }) } });
      return new SpectrumDocument(uri, model, null, store, fits, log);
    } catch (e) {
      const message = e instanceof Error ? e.message : String(e);
      return new SpectrumDocument(uri, null, message.includes(fileName) ? message : `${fileName}: ${message}`, store, null, log);
    } finally {
      loader.dispose();
    }
  }

  private readonly disposeListeners: (() => void)[] = [];

  onDispose(listener: () => void): void {
    this.disposeListeners.push(listener);
  }

  dispose(): void {
    for (const f of this.disposeListeners) f();
    this.fits?.dispose();
    const store = this.store;
    void store.discardUnseenChanges()
      .catch((e: unknown) => this.log(`${store.fileName}: unsaved changes nobody sees were kept (not reverted): ${e instanceof Error ? e.message : String(e)}`))
      .finally(() => store.dispose());
  }
}
