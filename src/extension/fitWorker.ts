/**
 * The worker: parsing with peak picking, and measureCrossPeak, off the extension host's main
 * thread. A fit is one synchronous call, so cancellation is done by the host terminating this
 * worker (fitClient.ts); nothing here needs to poll.
 */
import { parentPort } from 'node:worker_threads';
import { MeasureError, measureCrossPeak } from '../core/measure';
import { analyseMultiplet } from '../core/report/multiplet';
import { make1D, make2D, type Spectrum, type Spectrum1D, type Spectrum2D } from '../core/spectrum/spectrum';
import { compoundSi } from './notes/compoundSi';
import { sharedCopy } from './sharedData';
import { loadSpectrumModel } from './spectrumModel';
import type { FromWorker, Spectrum1DTransfer, ToWorker } from './workerMessages';

let spectrum: Spectrum2D | null = null;
let spectrum1D: Spectrum1D | null = null;
/** 1D spectra of compound reports by key, newest last: the same object each time keeps the core's fit caches. */
const reportSpectra = new Map<string, Spectrum1D>();
const REPORT_SPECTRA = 4;

function reportSpectrum(t: Spectrum1DTransfer & { readonly key: string }): Spectrum1D {
  const known = reportSpectra.get(t.key);
  reportSpectra.delete(t.key);
  const s = known ?? make1D(t.title, t.data, t.axis, t.processing);
  reportSpectra.set(t.key, s);
  const oldest = reportSpectra.keys().next().value;
  if (reportSpectra.size > REPORT_SPECTRA && oldest !== undefined) reportSpectra.delete(oldest);
  return s;
}

/** The same spectrum with its data moved to shared memory (the reply then shares instead of copying). */
function shared(s: Spectrum): Spectrum {
  return { ...s, data: sharedCopy(s.data) };
}

function failed(inReplyTo: number, e: unknown): FromWorker {
  return { type: 'failed', inReplyTo, message: e instanceof Error ? e.message : String(e), expected: e instanceof MeasureError || (e instanceof Error && e.name === 'JcampError') };
}

export function handle(m: ToWorker): FromWorker | null {
  switch (m.type) {
    case 'load':
      spectrum = make2D(m.spectrum.title, m.spectrum.data, m.spectrum.f1, m.spectrum.f2, m.spectrum.processing);
      return null;
    case 'load1D':
      spectrum1D = make1D(m.spectrum.title, m.spectrum.data, m.spectrum.axis, m.spectrum.processing);
      return null;
    case 'analyse':
      if (spectrum1D === null) return { type: 'failed', inReplyTo: m.id, message: 'the worker has no 1D spectrum loaded', expected: false };
      try {
        return { type: 'analysed', inReplyTo: m.id, analysis: analyseMultiplet(spectrum1D, m.fromPpm, m.toPpm, m.options) };
      } catch (e) {
        // A region too narrow or outside the data is the user's input, not a bug.
        return e instanceof RangeError ? { type: 'failed', inReplyTo: m.id, message: e.message, expected: true } : failed(m.id, e);
      }
    case 'compound':
      try {
        const { spectrum1D: t, ...rest } = m.input;
        return { type: 'compounded', inReplyTo: m.id, report: compoundSi({ ...rest, ...(t && { spectrum1D: reportSpectrum(t) }) }) };
      } catch (e) {
        // compoundSi's errors say what the chemist must fix (no sidecar, a sidecar with errors).
        return { type: 'failed', inReplyTo: m.id, message: e instanceof Error ? e.message : String(e), expected: true };
      }
    case 'open':
      try {
        // The hash is not needed here; the host computed it from the same bytes.
        const model = loadSpectrumModel(m.text, m.fileName, '');
        return { type: 'opened', inReplyTo: m.id, spectrum: shared(model.spectrum), noise: model.noise, crossPeaks: [...model.crossPeaks], multiplets: [...model.multiplets] };
      } catch (e) {
        return failed(m.id, e);
      }
    case 'measure':
      if (spectrum === null) return { type: 'failed', inReplyTo: m.id, message: 'the fit worker has no spectrum loaded', expected: false };
      try {
        return { type: 'measured', inReplyTo: m.id, measurement: measureCrossPeak(spectrum, m.peak, m.options) };
      } catch (e) {
        return failed(m.id, e);
      }
  }
}

parentPort?.on('message', (m: ToWorker) => {
  const reply = handle(m);
  if (reply) parentPort?.postMessage(reply);
});
