import { describe, expect, it } from 'vitest';
import { estimateNoise, madSigma } from '../../../src/core/spectrum/noise';
import { seededRandom } from '../../../src/core/simulate/random';

function gaussianNoise(n: number, sigma: number, seed: number): Float64Array {
  const rng = seededRandom(seed);
  return Float64Array.from({ length: n }, () => sigma * rng.gaussian());
}

describe('madSigma', () => {
  it('is 1.4826 x the median absolute deviation (consistency constant for normal data; Rousseeuw & Croux 1993, from memory)', () => {
    // values 1..5: median 3, absolute deviations 2,1,0,1,2 -> MAD 1
    expect(madSigma([1, 2, 3, 4, 5])).toBeCloseTo(1.4826, 10);
  });
});

describe('estimateNoise', () => {
  it('recovers the sigma of pure Gaussian noise within 3 % (the quietest-blocks selection bias is removed)', () => {
    for (const seed of [1, 2, 3]) {
      const est = estimateNoise(gaussianNoise(12000, 2.5, seed));
      expect(Math.abs(est / 2.5 - 1)).toBeLessThan(0.03);
    }
  });

  it('ignores strong peaks in a fifth of the blocks (within 5 %)', () => {
    const data = gaussianNoise(32768, 1, 9);
    for (let b = 0; b < 32; b += 5) {
      for (let i = 0; i < 1024; i++) data[b * 1024 + i] = (data[b * 1024 + i] ?? 0) + 500 * Math.exp(-(((i - 512) / 40) ** 2));
    }
    expect(Math.abs(estimateNoise(data) - 1)).toBeLessThan(0.05);
  });
});

describe('madSigma by selection', () => {
  it('matches the sorted-array definition of the median on even and odd lengths with ties', () => {
    const rng = seededRandom(4);
    for (const n of [1, 2, 3, 10, 11, 1000, 1001]) {
      const v = Float64Array.from({ length: n }, () => Math.round(rng.gaussian() * 3));
      const sorted = [...v].sort((a, b) => a - b);
      const med = n % 2 ? (sorted[n >> 1] ?? 0) : ((sorted[(n >> 1) - 1] ?? 0) + (sorted[n >> 1] ?? 0)) / 2;
      const dev = sorted.map((x) => Math.abs(x - med)).sort((a, b) => a - b);
      const mad = n % 2 ? (dev[n >> 1] ?? 0) : ((dev[(n >> 1) - 1] ?? 0) + (dev[n >> 1] ?? 0)) / 2;
      expect(madSigma(v)).toBeCloseTo(1.4826 * mad, 12);
    }
  });
});
