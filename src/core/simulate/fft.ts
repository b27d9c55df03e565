import FFT from 'fft.js';

/** Cached transform objects: fft.js precomputes tables per size. */
const cache = new Map<number, FFT>();

function transformFor(n: number): FFT {
  if (n < 2 || (n & (n - 1)) !== 0) throw new RangeError(`FFT size must be a power of two >= 2, got ${n}`);
  let f = cache.get(n);
  if (!f) {
    f = new FFT(n);
    cache.set(n, f);
  }
  return f;
}

/**
 * Forward complex DFT, X[k] = sum_j x[j] exp(-2 pi i j k / n), of re + i*im (length n, a power of
 * two). Returns new arrays.
 */
export function fft(re: ArrayLike<number>, im: ArrayLike<number>): { re: Float64Array; im: Float64Array } {
  const n = re.length;
  if (im.length !== n) throw new RangeError(`real and imaginary parts differ in length (${n} vs ${im.length})`);
  const f = transformFor(n);
  const input = f.createComplexArray() as number[];
  for (let j = 0; j < n; j++) {
    input[2 * j] = re[j] ?? 0;
    input[2 * j + 1] = im[j] ?? 0;
  }
  const out = f.createComplexArray() as number[];
  f.transform(out, input);
  const outRe = new Float64Array(n);
  const outIm = new Float64Array(n);
  for (let k = 0; k < n; k++) {
    outRe[k] = out[2 * k] ?? 0;
    outIm[k] = out[2 * k + 1] ?? 0;
  }
  return { re: outRe, im: outIm };
}
