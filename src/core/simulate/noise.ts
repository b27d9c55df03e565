/**
 * How much noise to add, and how reproducibly. Noise is white complex Gaussian noise added to the
 * FID before processing, so the spectral noise carries the correlation that apodization and
 * zero-filling give it.
 * - `snr`: the tallest point of the noise-free simulated spectrum (largest |value|) divided by the
 *   standard deviation of the noise in the processed spectrum equals snr.
 * - `sigma`: the standard deviation of the noise in the processed spectrum, in spectrum units.
 */
export type NoiseSpec = { readonly seed: number; readonly snr: number } | { readonly seed: number; readonly sigma: number };

/** Spectral noise sigma that a NoiseSpec asks for, given the noise-free spectrum's largest |value|. */
export function spectralSigma(noise: NoiseSpec, peakAbs: number): number {
  if ('snr' in noise) {
    if (!(noise.snr > 0) || !Number.isFinite(noise.snr)) throw new RangeError(`noise.snr must be a positive number, got ${noise.snr}`);
    if (!(peakAbs > 0)) throw new RangeError('noise.snr needs a signal, but the noise-free data are all zero here; give noise.sigma instead');
    return peakAbs / noise.snr;
  }
  if (!(noise.sigma >= 0) || !Number.isFinite(noise.sigma)) throw new RangeError(`noise.sigma must be >= 0, got ${noise.sigma}`);
  return noise.sigma;
}

export function maxAbs(values: ArrayLike<number>): number {
  let m = 0;
  for (let i = 0; i < values.length; i++) m = Math.max(m, Math.abs(values[i] ?? 0));
  return m;
}
