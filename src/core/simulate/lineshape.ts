import type { DimensionProcessing } from '../spectrum/processing';
import { processFid } from './process';
import { windowValues } from './window';

/** One damped complex exponential: frequency relative to the carrier, amplitude, Lorentzian FWHM. */
export interface FidLine {
  readonly hz: number;
  readonly amplitude: number;
  readonly widthHz: number;
}

/** Recompute the rotating phasor exactly every this many points so rounding cannot accumulate. */
const RESYNC = 256;

/**
 * Add sum_l a_l exp((2 pi i nu_l - pi w_l) t_k), t_k = k / SW, to re/im (acquiredPoints long).
 * T2 decay exp(-pi w t) has the Fourier transform of a Lorentzian of full width w at half height
 * (analytic). Phasors advance by complex multiplication, resynchronised from cos/sin every RESYNC points.
 */
export function addFidLines(re: Float64Array, im: Float64Array, lines: readonly FidLine[], swHz: number): void {
  const n = re.length;
  const dt = 1 / swHz;
  for (const l of lines) {
    const stepArg = 2 * Math.PI * l.hz * dt;
    const stepMag = Math.exp(-Math.PI * l.widthHz * dt);
    const sr = stepMag * Math.cos(stepArg);
    const si = stepMag * Math.sin(stepArg);
    let zr = 0;
    let zi = 0;
    for (let k = 0; k < n; k++) {
      if (k % RESYNC === 0) {
        const mag = l.amplitude * Math.exp(-Math.PI * l.widthHz * k * dt);
        zr = mag * Math.cos(stepArg * k);
        zi = mag * Math.sin(stepArg * k);
      }
      re[k] = (re[k] ?? 0) + zr;
      im[k] = (im[k] ?? 0) + zi;
      const nr = zr * sr - zi * si;
      zi = zr * si + zi * sr;
      zr = nr;
    }
  }
}

/** The complex FID (acquiredPoints long) of a set of lines. */
export function fidOf(lines: readonly FidLine[], p: DimensionProcessing): { re: Float64Array; im: Float64Array } {
  const re = new Float64Array(p.acquiredPoints);
  const im = new Float64Array(p.acquiredPoints);
  addFidLines(re, im, lines, p.spectralWidthHz);
  return { re, im };
}

/** Processed absorption spectrum (display order, p.size points) of a set of lines, noise-free. */
export function processedLines(lines: readonly FidLine[], p: DimensionProcessing): Float64Array {
  const f = fidOf(lines, p);
  return processFid(f.re, f.im, p).re;
}

/**
 * Standard deviation of the real processed spectrum per unit time-domain noise sigma (white complex
 * Gaussian noise, sigma on each of the real and imaginary channels): sqrt(sum_k c_k^2), c_k the
 * window times the first-point halving of processFid. Exact for every output point: the real part
 * of sum_k c_k n_k exp(-i theta_k) has variance sigma^2 sum_k c_k^2 (cos^2 + sin^2 = 1).
 */
export function noiseGain(p: DimensionProcessing): number {
  const w = windowValues(p.window, p.acquiredPoints, p.spectralWidthHz);
  let s = 0;
  for (let k = 0; k < w.length; k++) {
    const c = (w[k] ?? 0) * (k === 0 ? 0.5 : 1);
    s += c * c;
  }
  return Math.sqrt(s);
}

/** Throw when a frequency (relative to the carrier) lies outside the spectral window, naming what it belongs to. */
export function checkInWindow(hz: number, p: DimensionProcessing, what: string, dim: string): void {
  const half = p.spectralWidthHz / 2;
  if (!(hz > -half && hz < half)) {
    const lo = p.carrierHz - half;
    const hi = p.carrierHz + half;
    throw new RangeError(
      `${what} at ${(hz + p.carrierHz).toFixed(2)} Hz lies outside the ${dim} spectral window ${lo.toFixed(2)}..${hi.toFixed(2)} Hz (it would fold)`,
    );
  }
}

/** Validate a DimensionProcessing before simulating with it; names the dimension and field. */
export function checkProcessing(p: DimensionProcessing, dim: string): void {
  if (!Number.isInteger(p.acquiredPoints) || p.acquiredPoints < 2) {
    throw new RangeError(`${dim} processing: acquiredPoints must be an integer >= 2, got ${p.acquiredPoints}`);
  }
  if (!(p.spectralWidthHz > 0) || !Number.isFinite(p.spectralWidthHz)) {
    throw new RangeError(`${dim} processing: spectralWidthHz must be positive, got ${p.spectralWidthHz}`);
  }
  if (!Number.isFinite(p.carrierHz)) throw new RangeError(`${dim} processing: carrierHz must be finite, got ${p.carrierHz}`);
  if (!Number.isInteger(p.size) || p.size < p.acquiredPoints || (p.size & (p.size - 1)) !== 0) {
    throw new RangeError(`${dim} processing: size must be a power of two >= acquiredPoints (${p.acquiredPoints}), got ${p.size}`);
  }
}
