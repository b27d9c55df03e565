import { makeAxis, type Axis } from '../spectrum/axis';
import type { DimensionProcessing } from '../spectrum/processing';
import { fft } from './fft';
import { windowValues } from './window';

/**
 * Process one complex FID (acquiredPoints values) into a real absorption spectrum of p.size points
 * in display order: point 0 is the highest frequency. Steps: halve the first point (removes the
 * baseline offset of the discrete transform; common practice), apodize, zero-fill, FFT, reorder.
 * The FID convention is s(t) = sum a exp(+2 pi i nu t), nu relative to the carrier, so the
 * spectrum is in absorption with zero phase correction.
 */
export function processFid(re: ArrayLike<number>, im: ArrayLike<number>, p: DimensionProcessing): { re: Float64Array; im: Float64Array } {
  const n = p.acquiredPoints;
  if (re.length < n || im.length < n) throw new RangeError(`FID has ${re.length} points, processing expects ${n}`);
  if (p.size < n) throw new RangeError(`zero-filled size ${p.size} is smaller than the ${n} acquired points`);
  const w = windowValues(p.window, n, p.spectralWidthHz);
  const tre = new Float64Array(p.size);
  const tim = new Float64Array(p.size);
  for (let k = 0; k < n; k++) {
    const scale = (w[k] ?? 0) * (k === 0 ? 0.5 : 1);
    tre[k] = (re[k] ?? 0) * scale;
    tim[k] = (im[k] ?? 0) * scale;
  }
  // s(t) = exp(+2 pi i nu t) peaks at bin +nu under exp(-2 pi i ...) transform.
  const f = fft(tre, tim);
  return toDisplayOrder(f.re, f.im);
}

/** FFT order (0..+SW/2, then -SW/2..0) to display order (+SW/2 .. -SW/2). */
function toDisplayOrder(re: Float64Array, im: Float64Array): { re: Float64Array; im: Float64Array } {
  const n = re.length;
  const half = n / 2;
  const outRe = new Float64Array(n);
  const outIm = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    // display index i holds frequency (half - 1 - i) * SW / n
    const bin = (half - 1 - i + n) % n;
    outRe[i] = re[bin] ?? 0;
    outIm[i] = im[bin] ?? 0;
  }
  return { re: outRe, im: outIm };
}

/** The axis of a spectrum processed with p: point i is at carrier + (size/2 - 1 - i) * SW / size. */
export function processedAxis(p: DimensionProcessing, observeMhz: number): Axis {
  const step = p.spectralWidthHz / p.size;
  const first = p.carrierHz + (p.size / 2 - 1) * step;
  const last = p.carrierHz - (p.size / 2) * step;
  return makeAxis(p.size, first, last, observeMhz);
}
