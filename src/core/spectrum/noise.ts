/**
 * Robust noise level: the standard deviation of Gaussian noise estimated from the median absolute
 * deviation (sigma = 1.4826 * MAD, the consistency constant for normal data), taken over the
 * quietest of several blocks so that peaks do not inflate it.
 */
const MAD_TO_SIGMA = 1.4826;

export function madSigma(values: ArrayLike<number>): number {
  const n = values.length;
  if (n === 0) return Number.NaN;
  const v = Float64Array.from(values);
  v.sort();
  const med = median(v);
  const dev = new Float64Array(n);
  for (let i = 0; i < n; i++) dev[i] = Math.abs((v[i] ?? 0) - med);
  dev.sort();
  return MAD_TO_SIGMA * median(dev);
}

function median(sorted: Float64Array): number {
  const n = sorted.length;
  const mid = n >> 1;
  return n % 2 ? (sorted[mid] ?? 0) : ((sorted[mid - 1] ?? 0) + (sorted[mid] ?? 0)) / 2;
}

/**
 * Noise sigma of a 1D or flattened 2D array: split into `blocks` contiguous blocks, take the MAD
 * sigma of each, and return the median of the lowest quarter (blocks free of signal).
 */
export function estimateNoise(data: ArrayLike<number>, blocks = 32): number {
  const n = data.length;
  if (n < 16) return madSigma(data);
  const nb = Math.max(4, Math.min(blocks, Math.floor(n / 8)));
  const size = Math.floor(n / nb);
  const sigmas: number[] = [];
  for (let b = 0; b < nb; b++) {
    const start = b * size;
    const slice = new Float64Array(size);
    for (let i = 0; i < size; i++) slice[i] = data[start + i] ?? 0;
    sigmas.push(madSigma(slice));
  }
  sigmas.sort((a, b) => a - b);
  const quiet = sigmas.slice(0, Math.max(1, Math.floor(nb / 4)));
  return quiet[Math.floor(quiet.length / 2)] ?? Number.NaN;
}
