import { processedAxis } from './process';
import { make1D, type Spectrum1D } from '../spectrum/spectrum';
import type { DimensionProcessing } from '../spectrum/processing';
import { checkInWindow, checkProcessing, fidOf, noiseGain, type FidLine } from './lineshape';
import { processFid } from './process';
import { maxAbs, spectralSigma, type NoiseSpec } from './noise';
import { seededRandom } from './random';
import { spinMultiplet, validateSpinSystem, type SpinSystem } from './spinSystem';

export interface Simulate1DOptions {
  readonly title?: string;
  readonly noise?: NoiseSpec;
}

export interface Simulated1D {
  readonly spectrum: Spectrum1D;
  /** Standard deviation of the noise in the processed spectrum (0 without noise). */
  readonly noiseSigma: number;
  /** Standard deviation added to each of the real and imaginary FID channels. */
  readonly fidNoiseSigma: number;
}

/** Every line of every spin's first-order multiplet, relative to the carrier. */
export function lines1D(system: SpinSystem, p: DimensionProcessing): FidLine[] {
  const out: FidLine[] = [];
  for (const spin of system.spins) {
    const m = spinMultiplet(system, spin.label);
    for (const l of m.lines) {
      const hz = m.centreHz + l.offsetHz - p.carrierHz;
      checkInWindow(hz, p, `spin ${spin.label} line`, 'F2');
      out.push({ hz, amplitude: l.amplitude, widthHz: spin.linewidthHz });
    }
  }
  return out;
}

/**
 * A processed 1D ¹H spectrum of a first-order spin system: FID with T2 decay (R2 = pi * width),
 * optional seeded noise added in the time domain, then processFid (window, zero-fill, FFT).
 */
export function simulate1D(system: SpinSystem, p: DimensionProcessing, opts: Simulate1DOptions = {}): Simulated1D {
  validateSpinSystem(system);
  checkProcessing(p, 'F2');
  const fid = fidOf(lines1D(system, p), p);
  let noiseSigma = 0;
  let fidNoiseSigma = 0;
  if (opts.noise) {
    const clean = processFid(fid.re, fid.im, p).re;
    noiseSigma = spectralSigma(opts.noise, maxAbs(clean));
    fidNoiseSigma = noiseSigma / noiseGain(p);
    const rng = seededRandom(opts.noise.seed);
    for (let k = 0; k < p.acquiredPoints; k++) {
      fid.re[k] = (fid.re[k] ?? 0) + fidNoiseSigma * rng.gaussian();
      fid.im[k] = (fid.im[k] ?? 0) + fidNoiseSigma * rng.gaussian();
    }
  }
  const data = processFid(fid.re, fid.im, p).re;
  const spectrum = make1D(opts.title ?? 'simulated 1H spectrum', data, processedAxis(p, system.observeMhz), p);
  return { spectrum, noiseSigma, fidNoiseSigma };
}
