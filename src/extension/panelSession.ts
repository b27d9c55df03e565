/**
 * One open spectrum panel's logic, without VS Code: validates what the webview sends, answers it,
 * and turns accept/label/remove into sidecar text changes. The glue (spectrumEditor.ts) supplies
 * the ports below; tests supply fakes.
 */
import type { CrossPeakInput, Measurement, MeasureOptions } from '../core/measure';
import { applyEdits, setDataHash } from '../core/sidecar';
import { parseFromWebview, type FromWebview, type ToWebview, type ViewSettings } from '../protocol';
import { CancelledError, FitFailedError } from './fitClient';
import { measureAll, type MeasureAllSummary } from './measureAll';
import type { SidecarSource } from './multipletPartners';
import { MultipletSession, type Analyser } from './multipletSession';
import { couplingValues, measurementView } from './measurementView';
import { acceptText, labelText, removePickText, type CouplingValues } from './sidecarActions';
import { sidecarState, type SidecarState } from './sidecarState';
import { gridSize, peakViews, spectrumMeta, tileFor, type SpectrumModel } from './spectrumModel';

/** The sidecar document: its text now, and a way to replace it as one undoable change. */
export interface SidecarStore {
  /** e.g. `cosy.jdx.couplet.yaml` (used in messages). */
  readonly fileName: string;
  /** Current text; null while the file does not exist. */
  text(): string | null;
  /** Replaces the whole text by `after` (a minimal edit is derived); resolves false if the editor refused. */
  write(after: string, label: string): Promise<boolean>;
}

export interface Measurer {
  measure(peak: CrossPeakInput, options: MeasureOptions): Promise<Measurement>;
  cancel(): void;
}

export interface CancelToken {
  readonly cancelled: boolean;
  onCancel(listener: () => void): void;
}

export interface SessionPorts {
  post(message: ToWebview): void;
  settings(): ViewSettings;
  knownLabels(): Promise<readonly string[]>;
  /** For the output channel: invalid messages and other things a developer wants to see. */
  log(message: string): void;
  /** A warning the user sees (e.g. why an edit was refused). */
  notify(message: string): void;
  /** An information message the user sees (e.g. a batch finished). */
  inform(message: string): void;
  /** Batch work with progress and a cancel button. */
  withProgress<T>(title: string, work: (report: (done: number, total: number) => void, token: CancelToken) => Promise<T>): Promise<T>;
  /** Called after `init` was posted: a (re)loaded webview has forgotten what else the host had shown. */
  afterInit?(): void;
  /** 1D: the multiplet analysis (the worker) and the compound's other sidecars (COSY J of the partners). */
  analyser?: Analyser;
  folderSidecars?(): Promise<SidecarSource[]>;
}

type Method = 'fit' | 'naive';
type Dim = 'F2' | 'F1';
const key = (peak: number, method: Method, dim: Dim): string => `${peak}|${method}|${dim}`;

export class PanelSession {
  /** Measurements shown or made in this panel, so accept records exactly what the user saw. */
  private readonly measured = new Map<string, Measurement>();
  /** Accepted before the pick had two labels: becomes a coupling when it is labelled. */
  private readonly pending = new Map<string, CouplingValues>();
  /** Counts `cancel` messages: a batch ends when it changes, even between two fits (nothing in flight to kill). */
  private cancels = 0;
  /** Set when the panel closed: its webview is gone, so nothing is posted and running batches end. */
  private disposed = false;

  /** 1D spectra: analysis of the selected multiplet, regions and the integral reference. */
  readonly multiplet: MultipletSession | null;

  constructor(readonly model: SpectrumModel, private readonly store: SidecarStore, private readonly measurer: Measurer, private readonly ports: SessionPorts) {
    const analyser = ports.analyser;
    this.multiplet = model.spectrum.dims === 1 && analyser ? new MultipletSession(model, store, {
      analyser, folderSidecars: () => ports.folderSidecars?.() ?? Promise.resolve([]), post: (m) => this.post(m),
      edit: (label, change) => this.edit(label, change), refuse: (m) => this.refuse(m),
    }) : null;
  }

  state(): SidecarState {
    return sidecarState(this.store.text(), this.store.fileName, this.model.sha256);
  }

  /** Call when the panel closes. */
  dispose(): void {
    this.disposed = true;
  }

  /** Posting to a closed webview throws in VS Code; a late reply has nobody to go to. */
  private post(message: ToWebview): void {
    if (!this.disposed) this.ports.post(message);
  }

  /** Call when the sidecar text changed for any reason (edit, undo, revert, checkout). */
  sidecarChanged(): void {
    this.post({ type: 'sidecar', sidecar: this.state().view });
  }

  /** Call when a `couplet.*` setting changed: the open panel redraws with the new values. */
  settingsChanged(): void {
    this.post({ type: 'settings', settings: this.ports.settings() });
  }

  /** Validates and handles one raw message; invalid ones are logged and dropped. */
  async receive(raw: unknown): Promise<void> {
    if (this.disposed) return;
    const parsed = parseFromWebview(raw);
    if (!parsed.ok) {
      this.ports.log(`ignored a message from the ${this.model.fileName} panel: ${parsed.error}`);
      // A request the panel waits for is answered, or it would wait for ever (e.g. "Measuring…").
      const id: unknown = typeof raw === 'object' && raw !== null ? Reflect.get(raw, 'id') : undefined;
      if (typeof id === 'number' && Number.isInteger(id) && id >= 0) this.post({ type: 'error', inReplyTo: id, message: `Couplet did not understand the request: ${parsed.error}` });
      return;
    }
    try {
      await this.handle(parsed.value);
    } catch (e) {
      // A bug must not leave the panel waiting in silence: say what failed, keep the host running.
      this.ports.log(`${this.model.fileName}: handling "${parsed.value.type}" failed: ${e instanceof Error ? e.stack ?? e.message : String(e)}`);
      // A request's reply settles it: without inReplyTo a tile request would stay open and the plot stop loading.
      const m = parsed.value;
      this.post({ type: 'error', ...('id' in m && { inReplyTo: m.id }), message: `Couplet could not handle "${m.type}": ${describe(e)}` });
    }
  }

  private async handle(m: FromWebview): Promise<void> {
    switch (m.type) {
      case 'ready': return this.init();
      case 'requestTile': return this.tile(m.id, m);
      case 'measure': return this.measureOne(m.id, m.peakIndex, m.method, m.dimension);
      case 'accept': await this.accept(m.peakIndex, m.method, m.dimension, m.labels); return;
      case 'label': await this.edit(`Label ${m.pickId}`, (t) => labelText(this.existing(t), this.store.fileName, m.pickId, m.labels, this.pending.get(m.pickId))); return;
      case 'removePick': await this.removePick(m.pickId); return;
      case 'measureAll': await this.measureAll(m.method); return;
      case 'analyse': return this.multiplet ? this.multiplet.analyse(m.id, m.peakIndex)
        : this.post({ type: 'error', inReplyTo: m.id, message: `${this.model.fileName} is not a 1D spectrum: multiplets are analysed in a 1D ¹H spectrum` });
      case 'setRegion': await (this.multiplet?.setRegion(m.peakIndex, { fromPpm: m.fromPpm, toPpm: m.toPpm }) ?? this.refuse(`${this.model.fileName} is not a 1D spectrum`)); return;
      case 'cancel': this.cancels++; this.measurer.cancel(); return;
    }
  }

  /** The last scan of the workspace's atom labels, once one has answered. */
  private lastLabels: readonly string[] | null = null;

  private scanLabels(): Promise<readonly string[]> {
    // Completion is a convenience: a workspace that cannot be searched must not keep the plot from showing.
    return this.ports.knownLabels().then((l) => (this.lastLabels = l), (e: unknown) => {
      this.ports.log(`could not collect atom labels from the workspace: ${describe(e)}`);
      return this.lastLabels ?? [];
    });
  }

  private async init(): Promise<void> {
    // A panel shown again after being hidden reloads and asks again: it gets the last scan at once
    // (a scan reads every note) while a new one runs for the next time.
    const scan = this.scanLabels();
    const knownLabels = this.lastLabels ?? await scan;
    this.post({
      type: 'init', spectrum: spectrumMeta(this.model), settings: this.ports.settings(),
      peaks: peakViews(this.model), sidecar: this.state().view, knownLabels: [...knownLabels],
    });
    this.ports.afterInit?.();
  }

  private tile(id: number, r: { region: { row0: number; row1: number; col0: number; col1: number }; maxRows: number; maxCols: number }): void {
    const { rows, cols } = gridSize(this.model.spectrum);
    const g = r.region;
    if (g.row1 >= rows || g.col1 >= cols) {
      this.post({ type: 'error', inReplyTo: id, message: `tile rows ${g.row0}..${g.row1}, cols ${g.col0}..${g.col1} are outside the ${rows} x ${cols} grid of ${this.model.fileName}` });
      return;
    }
    this.post(tileFor(this.model, id, g, r.maxRows, r.maxCols));
  }

  /** The cross peak a request names, or a message saying why it cannot be measured. */
  private crossPeak(index: number): CrossPeakInput | string {
    if (this.model.spectrum.dims !== 2) return `${this.model.fileName} is a 1D spectrum: J is measured at DQF-COSY cross peaks; select a multiplet to see its analysis, and pick and label it`;
    const p = this.model.crossPeaks[index];
    if (!p) return `${this.model.fileName} has no peak ${index} (${this.model.crossPeaks.length} peaks picked)`;
    if (p.kind !== 'cross') return `peak ${index} at F2 ${p.f2Ppm.toFixed(4)} / F1 ${p.f1Ppm.toFixed(4)} ppm is a diagonal peak; J is measured at cross peaks`;
    return p;
  }

  /** Measures (or reuses this panel's earlier measurement of the same peak, method and dimension). */
  async measurement(index: number, method: Method, dimension: Dim): Promise<Measurement> {
    const k = key(index, method, dimension);
    const known = this.measured.get(k);
    if (known) return known;
    const peak = this.crossPeak(index);
    if (typeof peak === 'string') throw new FitFailedError(peak);
    const m = await this.measurer.measure(peak, { method, dimension, noise: this.model.noise });
    this.measured.set(k, m);
    return m;
  }

  private async measureOne(id: number, index: number, method: Method, dimension: Dim): Promise<void> {
    try {
      const m = await this.measurement(index, method, dimension);
      this.post({ type: 'measured', inReplyTo: id, measurement: measurementView(index, m) });
    } catch (e) {
      this.post({ type: 'error', inReplyTo: id, message: describe(e), ...(e instanceof CancelledError && { cancelled: true as const }) });
    }
  }

  /** Records the pick (and the coupling, once labelled); returns false when nothing was written. */
  async accept(index: number, method: Method, dimension: Dim, labels: readonly string[]): Promise<boolean> {
    const s = this.model.spectrum;
    let values: CouplingValues | undefined;
    let bare: string | null = null;
    let at: { f2Ppm: number; f1Ppm?: number; kind: 'cross' | 'diagonal' | 'multiplet' };
    if (s.dims === 2) {
      const p = this.model.crossPeaks[index];
      if (!p) return this.refuse(`${this.model.fileName} has no peak ${index}`);
      at = { f2Ppm: p.f2Ppm, f1Ppm: p.f1Ppm, kind: p.kind };
      if (p.kind === 'cross') {
        try {
          values = couplingValues(await this.measurement(index, method, dimension));
        } catch (e) {
          if (e instanceof CancelledError) return this.refuse(`not accepted: ${describe(e)}`);
          // The assignment is worth keeping even when J cannot be measured (overlap, an edge):
          // the pick is recorded with its labels only, and the user is told why there is no J.
          bare = describe(e);
        }
      }
    } else {
      const p = this.model.multiplets[index];
      if (!p) return this.refuse(`${this.model.fileName} has no multiplet ${index}`);
      at = { f2Ppm: p.ppm, kind: 'multiplet' };
    }
    let pickId = '';
    let coupled = false;
    const ok = await this.edit('Accept measurement', (t) => {
      const r = acceptText(t, this.store.fileName, { dataFileName: this.model.fileName, sha256: this.model.sha256, ...at, labels, ...(values && { values }) });
      pickId = r.pickId;
      coupled = r.coupled;
      return r.text;
    });
    if (ok && values && !coupled) this.pending.set(pickId, values);
    if (ok && bare !== null) this.ports.inform(`${pickId} recorded without J (labels only): the measurement failed: ${bare}`);
    return ok;
  }

  /** Removes a pick and the couplings that rested on it alone (one undo step), saying which. */
  private async removePick(pickId: string): Promise<void> {
    let removed: readonly string[] = [];
    const ok = await this.edit(`Remove ${pickId}`, (t) => {
      const r = removePickText(this.existing(t), this.store.fileName, pickId);
      removed = r.removedCouplings;
      return r.text;
    });
    this.pending.delete(pickId);
    if (ok && removed.length > 0) this.ports.inform(`removed ${pickId} and the coupling${removed.length > 1 ? 's' : ''} measured at it: ${removed.join(', ')} (undo brings them back)`);
  }

  /**
   * Records the data file's current hash in the sidecar, the one way out of a hash mismatch once
   * the chemist has confirmed the picks still fit the changed data. Refused for any other problem.
   */
  async recordDataHash(): Promise<boolean> {
    const text = this.store.text();
    const errors = this.state().diagnostics.filter((d) => d.severity === 'error');
    if (text === null || errors.length === 0) return this.refuse(`${this.store.fileName} already matches ${this.model.fileName}; nothing to record`);
    const other = errors.find((d) => d.code !== 'data-hash-mismatch');
    if (other) return this.refuse(`${other.message} — fix this first`);
    try {
      const after = applyEdits(text, setDataHash(text, this.model.sha256, this.store.fileName));
      return (await this.store.write(after, 'Record data hash')) || this.refuse(`VS Code did not apply the change to ${this.store.fileName}`);
    } catch (e) {
      return this.refuse(describe(e));
    }
  }

  /** Every cross peak, one after the other in the worker, with progress and cancel (measureAll.ts). */
  measureAll(method: Method): Promise<MeasureAllSummary> {
    const cancels = this.cancels;
    return measureAll({
      fileName: this.model.fileName, crossPeaks: this.model.crossPeaks, ports: this.ports,
      measure: (i) => this.measurement(i, method, 'F2'),
      cancelFits: () => this.measurer.cancel(),
      stopped: () => this.cancels !== cancels || this.disposed,
      post: (m) => this.post(m),
    });
  }

  private existing(t: string | null): string {
    if (t === null) throw new Error(`${this.store.fileName} does not exist yet; accept a measurement first`);
    return t;
  }

  /** Applies one text change, or explains (notification) why the sidecar is not written. */
  private async edit(label: string, change: (text: string | null) => string): Promise<boolean> {
    const state = this.state();
    if (state.view.blocked !== null) return this.refuse(state.view.blocked);
    const before = this.store.text();
    let after: string;
    try {
      after = change(before);
    } catch (e) {
      return this.refuse(describe(e));
    }
    if (after === before) return true;
    const ok = await this.store.write(after, label);
    if (!ok) return this.refuse(`VS Code did not apply the change to ${this.store.fileName}`);
    return true;
  }

  private refuse(message: string): false {
    this.ports.notify(message);
    this.post({ type: 'error', message });
    return false;
  }
}

function describe(e: unknown): string {
  return e instanceof Error ? e.message : String(e);
}
