/**
 * Seeded pseudo-random numbers, so that simulated noise is reproducible byte for byte.
 *
 * Uniform generator: xoshiro128** 1.1 (Blackman & Vigna, "Scrambled linear pseudorandom number
 * generators", ACM Trans. Math. Softw. 47 (2021) 36), 32-bit state words, period 2^128 - 1.
 * Its 128-bit state is filled from the seed with SplitMix32-style mixing (the seeding the authors
 * recommend is a different generator's output, never the raw seed), so nearby seeds give unrelated streams.
 * Gaussian deviates: the polar method of Marsaglia & Bray, SIAM Review 6 (1964) 260.
 */
export interface Random {
  /** Uniform on [0, 1), 32 bits of resolution. */
  uniform(): number;
  /** Raw 32-bit unsigned output of xoshiro128**. */
  nextUint32(): number;
  /** Standard normal deviate (mean 0, variance 1). */
  gaussian(): number;
}

function rotl(x: number, k: number): number {
  return (x << k) | (x >>> (32 - k));
}

/** One step of a 32-bit SplitMix-style mixer (golden-ratio increment, murmur3 finalizer constants). */
function splitMix32(state: { s: number }): number {
  state.s = (state.s + 0x9e3779b9) | 0;
  let z = state.s;
  z = Math.imul(z ^ (z >>> 16), 0x85ebca6b);
  z = Math.imul(z ^ (z >>> 13), 0xc2b2ae35);
  return (z ^ (z >>> 16)) >>> 0;
}

/** xoshiro128** from an explicit 128-bit state (four 32-bit words, not all zero). */
export function xoshiro128ss(state: readonly [number, number, number, number]): Random {
  if (state.every((w) => (w | 0) === 0)) throw new RangeError('xoshiro128** state must not be all zero');
  let [s0, s1, s2, s3] = state.map((w) => w | 0) as [number, number, number, number];
  const nextUint32 = (): number => {
    const result = Math.imul(rotl(Math.imul(s1, 5), 7), 9) >>> 0;
    const t = s1 << 9;
    s2 ^= s0;
    s3 ^= s1;
    s1 ^= s2;
    s0 ^= s3;
    s2 ^= t;
    s3 = rotl(s3, 11);
    return result;
  };
  const uniform = (): number => nextUint32() / 4294967296;
  let spare: number | undefined;
  const gaussian = (): number => {
    if (spare !== undefined) {
      const g = spare;
      spare = undefined;
      return g;
    }
    // Polar method: a point uniform in the unit disc gives two independent normal deviates.
    for (;;) {
      const u = 2 * uniform() - 1;
      const v = 2 * uniform() - 1;
      const s = u * u + v * v;
      if (s > 0 && s < 1) {
        const f = Math.sqrt((-2 * Math.log(s)) / s);
        spare = v * f;
        return u * f;
      }
    }
  };
  return { uniform, nextUint32, gaussian };
}

/** A generator seeded from one integer (any safe integer; the same seed gives the same stream). */
export function seededRandom(seed: number): Random {
  if (!Number.isSafeInteger(seed)) throw new RangeError(`random seed must be a safe integer, got ${seed}`);
  const st = { s: (seed | 0) ^ Math.floor(seed / 4294967296) };
  const words: [number, number, number, number] = [splitMix32(st), splitMix32(st), splitMix32(st), splitMix32(st)];
  if (words.every((w) => w === 0)) words[0] = 1;
  return xoshiro128ss(words);
}

/** Fill `out` with independent normal deviates of standard deviation sigma. */
export function fillGaussian(rng: Random, out: Float64Array, sigma: number): Float64Array {
  for (let i = 0; i < out.length; i++) out[i] = sigma * rng.gaussian();
  return out;
}
