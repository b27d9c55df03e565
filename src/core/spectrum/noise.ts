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
 * Noise sigma of a 1D or flattened 2D array, in two stages. (1) Split into `blocks` contiguous
 * blocks and take the median MAD sigma of the quietest quarter: free of signal, but biased low,
 * because the quietest blocks are selected partly for their chance low noise. (2) Pool every
 * block whose own sigma is below twice that first estimate (noise-only blocks scatter far less
 * than that) and take the MAD sigma of the pooled values, which removes the selection bias while
 * still leaving out blocks that hold peaks.
 */
export function estimateNoise(data: ArrayLike<number>, blocks = 32): number {
  const n = data.length;
  if (n < 16) return madSigma(data);
  const nb = Math.max(4, Math.min(blocks, Math.floor(n / 8)));
  const size = Math.floor(n / nb);
  const slices: Float64Array[] = [];
  const sigmas: number[] = [];
  for (let b = 0; b < nb; b++) {
    const slice = new Float64Array(size);
    for (let i = 0; i < size; i++) slice[i] = data[b * size + i] ?? 0;
    slices.push(slice);
    sigmas.push(madSigma(slice));
  }
  const sorted = [...sigmas].sort((a, b) => a - b);
  const quiet = sorted.slice(0, Math.max(1, Math.floor(nb / 4)));
  const first = quiet[Math.floor(quiet.length / 2)] ?? Number.NaN;
  const kept = slices.filter((_, b) => (sigmas[b] ?? Infinity) < 2 * first);
  const pooled = new Float64Array(kept.length * size);
  kept.forEach((slice, k) => pooled.set(slice, k * size));
  return pooled.length > 0 ? madSigma(pooled) : first;
}
