/**
 * Request/reply client for the worker (fitWorker.ts), with cancellation. A running fit cannot be
 * interrupted from inside (it is one synchronous call), so `cancel` terminates the worker and
 * rejects what was pending; the next request starts a fresh worker. The spectrum sits in a
 * SharedArrayBuffer, so a restart does not copy it again.
 */
import type { CrossPeakInput, Measurement, MeasureOptions } from '../core/measure';
import { sharedCopy } from './sharedData';
import type { MultipletAnalysis, MultipletOptions } from '../core/report/multiplet';
import type { CompoundReport } from '../core/report/compound';
import type { CompoundRequest, FromWorker, OpenReply, Spectrum1DTransfer, SpectrumTransfer, ToWorker } from './workerMessages';

/** What the client needs of a node `Worker` (tests may pass a fake). */
export interface WorkerLike {
  postMessage(message: ToWorker): void;
  on(event: 'message', listener: (m: FromWorker) => void): unknown;
  on(event: 'error', listener: (e: Error) => void): unknown;
  on(event: 'exit', listener: (code: number) => void): unknown;
  terminate(): unknown;
}

/** The request was cancelled (by the user or because the panel closed). */
export class CancelledError extends Error {
  override readonly name = 'CancelledError';
}

/** The work could not be done on this input; the message says why (the core's MeasureError or JcampError). */
export class FitFailedError extends Error {
  override readonly name = 'FitFailedError';
}

interface Pending {
  resolve(m: FromWorker): void;
  reject(e: Error): void;
}

type Request = { readonly type: 'measure'; readonly peak: CrossPeakInput; readonly options: MeasureOptions } | { readonly type: 'open'; readonly text: string; readonly fileName: string }
  | { readonly type: 'analyse'; readonly fromPpm: number; readonly toPpm: number; readonly options: MultipletOptions }
  | Omit<CompoundRequest, 'id'>;

/** The spectrum a client loads into its workers: 2D (fits) or 1D (multiplet analyses). */
export type Loaded = { readonly dims: 2; readonly spectrum: SpectrumTransfer } | { readonly dims: 1; readonly spectrum: Spectrum1DTransfer };

export class FitClient {
  private worker: WorkerLike | null = null;
  private nextId = 1;
  private readonly pending = new Map<number, Pending>();
  private readonly spectrum: Loaded | null;
  /** After dispose no worker is started again (a request arriving late would otherwise leak one). */
  private disposed = false;

  /** `spectrum` is loaded into every worker this client starts (null for a client that only opens files). */
  constructor(private readonly spawn: () => WorkerLike, spectrum: SpectrumTransfer | Loaded | null) {
    const loaded: Loaded | null = spectrum === null ? null : 'dims' in spectrum ? spectrum : { dims: 2, spectrum };
    this.spectrum = loaded && (loaded.dims === 2
      ? { dims: 2, spectrum: { ...loaded.spectrum, data: sharedCopy(loaded.spectrum.data) } }
      : { dims: 1, spectrum: { ...loaded.spectrum, data: sharedCopy(loaded.spectrum.data) } });
  }

  /** Number of requests sent and not yet answered. */
  get inFlight(): number {
    return this.pending.size;
  }

  async measure(peak: CrossPeakInput, options: MeasureOptions): Promise<Measurement> {
    const r = await this.request({ type: 'measure', peak, options });
    if (r.type !== 'measured') throw new Error(`fit worker: expected a measurement, got "${r.type}"`);
    return r.measurement;
  }

  /** The 1D multiplet analysis between two shifts (the client must have been given a 1D spectrum). */
  async analyse(fromPpm: number, toPpm: number, options: MultipletOptions): Promise<MultipletAnalysis> {
    const r = await this.request({ type: 'analyse', fromPpm, toPpm, options });
    if (r.type !== 'analysed') throw new Error(`worker: expected a multiplet analysis, got "${r.type}"`);
    return r.analysis;
  }

  /** A compound's SI report, computed in the worker (the note features' client loads no spectrum of its own). */
  async compound(input: CompoundRequest['input']): Promise<CompoundReport> {
    const r = await this.request({ type: 'compound', input });
    if (r.type !== 'compounded') throw new Error(`worker: expected a compound report, got "${r.type}"`);
    return r.report;
  }

  async open(text: string, fileName: string): Promise<OpenReply> {
    const r = await this.request({ type: 'open', text, fileName });
    if (r.type !== 'opened') throw new Error(`worker: expected a parsed spectrum, got "${r.type}"`);
    return r;
  }

  /** Stops the work in progress: every pending request rejects with CancelledError. An idle worker is kept (restarting it costs a reload). */
  cancel(): void {
    if (this.pending.size > 0) this.stop(new CancelledError('measurement cancelled'));
  }

  dispose(): void {
    this.disposed = true;
    this.stop(new CancelledError('the spectrum panel was closed'));
  }

  private request(r: Request): Promise<FromWorker> {
    if (this.disposed) return Promise.reject(new CancelledError('the spectrum panel was closed'));
    const worker = this.ensureWorker();
    const id = this.nextId++;
    return new Promise<FromWorker>((resolve, reject) => {
      this.pending.set(id, { resolve, reject });
      worker.postMessage({ ...r, id });
    });
  }

  private stop(reason: Error): void {
    const w = this.worker;
    this.worker = null;
    if (w) void w.terminate();
    this.rejectAll(reason);
  }

  private rejectAll(reason: Error): void {
    const all = [...this.pending.values()];
    this.pending.clear();
    for (const p of all) p.reject(reason);
  }

  private ensureWorker(): WorkerLike {
    if (this.worker) return this.worker;
    const w = this.spawn();
    this.worker = w;
    // Events from a worker already replaced or stopped are ignored.
    w.on('message', (m) => {
      if (this.worker === w) this.settle(m);
    });
    w.on('error', (e) => {
      if (this.worker !== w) return;
      this.worker = null;
      this.rejectAll(new Error(`the fit worker failed: ${e.message}`));
    });
    w.on('exit', (code) => {
      if (this.worker !== w) return;
      this.worker = null;
      this.rejectAll(new Error(`the fit worker stopped unexpectedly (exit code ${code})`));
    });
    if (this.spectrum) w.postMessage(this.spectrum.dims === 2 ? { type: 'load', spectrum: this.spectrum.spectrum } : { type: 'load1D', spectrum: this.spectrum.spectrum });
    return w;
  }

  private settle(m: FromWorker): void {
    const p = this.pending.get(m.inReplyTo);
    if (!p) return;
    this.pending.delete(m.inReplyTo);
    if (m.type !== 'failed') p.resolve(m);
    else p.reject(m.expected ? new FitFailedError(m.message) : new Error(`fit worker: ${m.message}`));
  }
}
