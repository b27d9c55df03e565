import { hzToPpm, nearestPoint, pointToHz, ppmToPoint, resolutionHz, type Axis } from '../spectrum/axis';
import type { DimensionProcessing } from '../spectrum/processing';
import type { Spectrum2D } from '../spectrum/spectrum';
import { MeasureError, type CrossPeakInput } from './types';

/**
 * The traces through a cross peak along the measured dimension: for F2, rows of the spectrum over
 * a column window; for F1, columns over a row window. Everything downstream is dimension-free.
 */
export interface TraceBlock {
  dimension: 'F2' | 'F1';
  /** Axis along the traces, and the other one. */
  along: Axis;
  across: Axis;
  alongProcessing?: DimensionProcessing;
  acrossProcessing?: DimensionProcessing;
  /** Index of each trace on the across axis, ascending. */
  positions: number[];
  /** First and last point of the window along the traces (inclusive, first < last). */
  from: number;
  to: number;
  /** Frequency of each window point, Hz. */
  freqs: Float64Array;
  /** One array of window values per trace. */
  data: Float64Array[];
  /** Position of the peak on the along axis, Hz. */
  peakHz: number;
}

/** Fallback half-window when the peak has no extent: wide enough for a multiplet with two couplings. */
const DEFAULT_HALF_WINDOW_HZ = 30;

export function getAt(s: Spectrum2D, dimension: 'F2' | 'F1', trace: number, point: number): number {
  return dimension === 'F2' ? s.data[trace * s.f2.points + point] ?? 0 : s.data[point * s.f2.points + trace] ?? 0;
}

function clampPoint(axis: Axis, p: number): number {
  return Math.min(axis.points - 1, Math.max(0, Math.round(p)));
}

function alongWindow(axis: Axis, centrePpm: number, fromPpm?: number, toPpm?: number): [number, number] {
  let a: number;
  let b: number;
  if (fromPpm !== undefined && toPpm !== undefined) {
    a = ppmToPoint(axis, fromPpm);
    b = ppmToPoint(axis, toPpm);
  } else {
    const c = ppmToPoint(axis, centrePpm);
    const half = DEFAULT_HALF_WINDOW_HZ / resolutionHz(axis);
    a = c - half;
    b = c + half;
  }
  const lo = Math.min(a, b);
  const hi = Math.max(a, b);
  // Pad by a quarter of the span (at least 4 points) so the line tails are in the fit.
  const pad = Math.max(4, 0.25 * (hi - lo));
  return [clampPoint(axis, lo - pad), clampPoint(axis, hi + pad)];
}

export function extractTraces(
  s: Spectrum2D,
  peak: CrossPeakInput,
  dimension: 'F2' | 'F1',
  maxTraces: number,
): TraceBlock {
  const f2 = dimension === 'F2';
  const along = f2 ? s.f2 : s.f1;
  const across = f2 ? s.f1 : s.f2;
  const ext = peak.extent;
  const [from, to] = f2
    ? alongWindow(along, peak.f2Ppm, ext?.f2FromPpm, ext?.f2ToPpm)
    : alongWindow(along, peak.f1Ppm, ext?.f1FromPpm, ext?.f1ToPpm);
  if (to - from < 5) throw new MeasureError(`window in ${dimension} at ${(f2 ? peak.f2Ppm : peak.f1Ppm).toFixed(4)} ppm has fewer than 6 points`);
  const acrossPpm = f2 ? peak.f1Ppm : peak.f2Ppm;
  let t0: number;
  let t1: number;
  if (ext) {
    t0 = f2 ? Math.min(ext.row0, ext.row1) : Math.min(ext.col0, ext.col1);
    t1 = f2 ? Math.max(ext.row0, ext.row1) : Math.max(ext.col0, ext.col1);
  } else {
    const c = nearestPoint(across, acrossPpm);
    t0 = c - 2;
    t1 = c + 2;
  }
  t0 = Math.max(0, t0);
  t1 = Math.min(across.points - 1, t1);
  const energy: { pos: number; e: number }[] = [];
  for (let t = t0; t <= t1; t++) {
    let e = 0;
    for (let p = from; p <= to; p++) e += getAt(s, dimension, t, p) ** 2;
    energy.push({ pos: t, e });
  }
  energy.sort((a, b) => b.e - a.e);
  const positions = energy.slice(0, Math.max(1, maxTraces)).map((x) => x.pos).sort((a, b) => a - b);
  const m = to - from + 1;
  const freqs = Float64Array.from({ length: m }, (_, i) => pointToHz(along, from + i));
  const data = positions.map((t) => Float64Array.from({ length: m }, (_, i) => getAt(s, dimension, t, from + i)));
  const proc = s.processing;
  const block: TraceBlock = {
    dimension, along, across, positions, from, to, freqs, data,
    peakHz: (f2 ? peak.f2Ppm : peak.f1Ppm) * along.observeMhz,
  };
  const ap = f2 ? proc?.f2 : proc?.f1;
  const cp = f2 ? proc?.f1 : proc?.f2;
  if (ap) block.alongProcessing = ap;
  if (cp) block.acrossProcessing = cp;
  return block;
}

/** A few whole traces of the spectrum along one dimension, spread over it, for the noise correlation. */
export function sampleTraces(s: Spectrum2D, dimension: 'F2' | 'F1', count: number): Float64Array[] {
  const n = dimension === 'F2' ? s.f1.points : s.f2.points;
  const len = dimension === 'F2' ? s.f2.points : s.f1.points;
  const step = Math.max(1, Math.floor(n / count));
  const out: Float64Array[] = [];
  for (let t = 0; t < n; t += step) out.push(Float64Array.from({ length: len }, (_, i) => getAt(s, dimension, t, i)));
  return out;
}

export function ppmOf(axis: Axis, point: number): number {
  return hzToPpm(axis, pointToHz(axis, point));
}
