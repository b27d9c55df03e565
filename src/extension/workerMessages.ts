/**
 * Messages between the extension host and the fit worker (worker_threads). Same request/reply
 * convention as src/protocol.ts: requests carry `id`, replies `inReplyTo`.
 */
import type { CrossPeakInput, Measurement, MeasureOptions } from '../core/measure';
import type { CrossPeak, Multiplet1D } from '../core/peaks';
import type { Axis } from '../core/spectrum/axis';
import type { MultipletAnalysis, MultipletOptions } from '../core/report/multiplet';
import type { Spectrum, Spectrum1D, Spectrum2D } from '../core/spectrum/spectrum';
import type { CompoundReport } from '../core/report/compound';
import type { CompoundInput } from './notes/compoundSi';

/** The spectrum as the worker receives it; `data` is best a view on a SharedArrayBuffer (no copy per worker). */
export interface SpectrumTransfer {
  readonly title: string;
  readonly data: Float64Array;
  readonly f1: Axis;
  readonly f2: Axis;
  readonly processing?: Spectrum2D['processing'];
}

/** Sent once after the worker starts; no reply. */
export interface LoadMessage {
  readonly type: 'load';
  readonly spectrum: SpectrumTransfer;
}

/** A 1D spectrum, sent once after the worker starts instead of `load`; no reply. */
export interface Load1DMessage {
  readonly type: 'load1D';
  readonly spectrum: Spectrum1DTransfer;
}

export interface Spectrum1DTransfer {
  readonly title: string;
  readonly data: Float64Array;
  readonly axis: Axis;
  readonly processing?: Spectrum1D['processing'];
}

/** Analyse the 1D multiplet between two shifts (lineshape fit: up to a few seconds). */
export interface AnalyseRequest {
  readonly type: 'analyse';
  readonly id: number;
  readonly fromPpm: number;
  readonly toPpm: number;
  readonly options: MultipletOptions;
}

export interface FitRequest {
  readonly type: 'measure';
  readonly id: number;
  readonly peak: CrossPeakInput;
  readonly options: MeasureOptions;
}

/** Parse a JCAMP-DX text and pick its peaks (about a second for a 512 x 2048 DQF-COSY). */
export interface OpenRequest {
  readonly type: 'open';
  readonly id: number;
  readonly text: string;
  readonly fileName: string;
}

/**
 * A compound's SI report (compoundSi) for the note features: seconds of 1D lineshape fits on a cold
 * cache. The 1D spectrum comes with a key (file and mtime): the worker keeps the spectrum of a key,
 * so the core's per-spectrum caches of multiplet fits survive from one request to the next.
 */
export interface CompoundRequest {
  readonly type: 'compound';
  readonly id: number;
  readonly input: Omit<CompoundInput, 'spectrum1D'> & { readonly spectrum1D?: Spectrum1DTransfer & { readonly key: string } };
}

export type ToWorker = LoadMessage | Load1DMessage | FitRequest | AnalyseRequest | OpenRequest | CompoundRequest;

export interface FitReply {
  readonly type: 'measured';
  readonly inReplyTo: number;
  readonly measurement: Measurement;
}

export interface AnalyseReply {
  readonly type: 'analysed';
  readonly inReplyTo: number;
  readonly analysis: MultipletAnalysis;
}

/** `expected` is true for a MeasureError (nothing to measure there), false for a bug. */
export interface FitFailed {
  readonly type: 'failed';
  readonly inReplyTo: number;
  readonly message: string;
  readonly expected: boolean;
}

/** The parsed spectrum (its data in a SharedArrayBuffer, so the reply does not copy it) and its peaks. */
export interface OpenReply {
  readonly type: 'opened';
  readonly inReplyTo: number;
  readonly spectrum: Spectrum;
  readonly noise: number;
  readonly crossPeaks: CrossPeak[];
  readonly multiplets: Multiplet1D[];
}

export interface CompoundReply {
  readonly type: 'compounded';
  readonly inReplyTo: number;
  readonly report: CompoundReport;
}

export type FromWorker = FitReply | AnalyseReply | FitFailed | OpenReply | CompoundReply;
