/**
 * The measurement the panel shows and what Accept sends. Replies can come back out of order (a
 * fit of one peak takes a second, the cached one of the next peak a few ms): only the reply to the
 * latest request is shown, so the trace and the J that Accept records are never those of a peak
 * clicked earlier. Pure (no DOM), tested in Node.
 */
import type { AcceptRequest, MeasurementView } from '../src/protocol';

type Method = 'fit' | 'naive';
type Dim = 'F2' | 'F1';

export interface AcceptChoice {
  /** What to send; absent when nothing may be accepted now (the status says why). */
  readonly request?: AcceptRequest;
  readonly status: string;
}

export class MeasureState {
  /** The measurement shown in the trace view. */
  shown: MeasurementView | null = null;
  /** The peak whose last measurement failed: Accept then records a bare pick (labels only). */
  failedPeak: number | null = null;
  private latest = 0;

  /** Call when a measurement is requested; pass the token to `measured` or `failed`. */
  started(): number {
    return ++this.latest;
  }

  /** A reply; false (and nothing changes) when a later request has been made since. */
  measured(token: number, m: MeasurementView): boolean {
    if (token !== this.latest) return false;
    this.shown = m;
    this.failedPeak = null;
    return true;
  }

  failed(token: number, peak: number): boolean {
    if (token !== this.latest) return false;
    this.failedPeak = peak;
    return true;
  }

  /** A cancelled request: nothing failed, so Accept does not offer a pick without J for it. */
  cancelled(token: number): boolean {
    if (token !== this.latest) return false;
    this.failedPeak = null;
    return true;
  }

  /** What Accept does for the selected peak: the shown J, a bare pick after a failure, or a reason. */
  accept(selected: number | null, labels: readonly string[], dims: 1 | 2, method: Method, dimension: Dim, jDecimals: number): AcceptChoice {
    if (dims === 1) {
      // 1D: a multiplet is picked and labelled; there is no antiphase J to measure.
      if (selected === null) return { status: 'Select a multiplet first (click near it, or N / P).' };
      return { request: { type: 'accept', peakIndex: selected, method, dimension: 'F2', labels }, status: `Picked multiplet ${selected}${labels.length ? ` as ${labels.join(', ')}` : ''}.` };
    }
    const m = this.shown;
    if (selected !== null && m?.peakIndex !== selected && this.failedPeak === selected) {
      return { request: { type: 'accept', peakIndex: selected, method, dimension, labels }, status: 'Recording the pick without J (its measurement failed).' };
    }
    if (!m || m.peakIndex !== selected) return { status: 'Measure the selected peak before accepting.' };
    return { request: { type: 'accept', peakIndex: m.peakIndex, method: m.method, dimension: m.dimension, labels }, status: `Accepted J = ${m.jHz.toFixed(jDecimals)} Hz.` };
  }
}
