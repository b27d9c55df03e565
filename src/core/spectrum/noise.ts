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
  const med = median(v);
  for (let i = 0; i < n; i++) v[i] = Math.abs((v[i] ?? 0) - med);
  return MAD_TO_SIGMA * median(v);
}

/** Median by selection (Hoare's quickselect, expected O(n)); reorders `v`. */
function median(v: Float64Array): number {
  const n = v.length;
  const hi = select(v, n >> 1);
  if (n % 2) return hi;
  // The lower middle is the largest value left of the upper middle after selection.
  let lo = -Infinity;
  for (let i = 0; i < n >> 1; i++) lo = Math.max(lo, v[i] ?? -Infinity);
  return (lo + hi) / 2;
}

/** Puts the k-th smallest value at index k (smaller ones before it) and returns it. */
function select(v: Float64Array, k: number): number {
  let left = 0;
  let right = v.length - 1;
  while (right > left) {
    const pivot = medianOfThree(v[left] ?? 0, v[(left + right) >> 1] ?? 0, v[right] ?? 0);
    let i = left;
    let j = right;
    while (i <= j) {
      while ((v[i] ?? 0) < pivot) i++;
      while ((v[j] ?? 0) > pivot) j--;
      if (i <= j) {
        const t = v[i] ?? 0;
        v[i] = v[j] ?? 0;
        v[j] = t;
        i++;
        j--;
      }
    }
    if (k <= j) right = j;
    else if (k >= i) left = i;
    else break;
  }
  return v[k] ?? Number.NaN;
}

function medianOfThree(a: number, b: number, c: number): number {
  return Math.max(Math.min(a, b), Math.min(Math.max(a, b), c));
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
