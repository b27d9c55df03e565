import { describe, expect, it } from 'vitest';
import { correlationFromProcessing, estimateCorrelation } from '../../../src/core/measure/correlation';
import { processFid } from '../../../src/core/simulate/process';
import { fillGaussian, seededRandom } from '../../../src/core/simulate/random';
import type { DimensionProcessing } from '../../../src/core/spectrum/processing';

const p: DimensionProcessing = { acquiredPoints: 128, spectralWidthHz: 1000, carrierHz: 0, size: 512, window: { kind: 'sine', power: 2, shiftDeg: 90 } };

/** Processed spectra of white complex Gaussian FID noise (seeded): the quantity the formula describes. */
function noiseSpectra(count: number, seed: number): Float64Array[] {
  const rng = seededRandom(seed);
  const out: Float64Array[] = [];
  for (let i = 0; i < count; i++) {
    const re = fillGaussian(rng, new Float64Array(p.acquiredPoints), 1);
    const im = fillGaussian(rng, new Float64Array(p.acquiredPoints), 1);
    out.push(processFid(re, im, p).re);
  }
  return out;
}

describe('noise correlation between spectral points', () => {
  const spectra = noiseSpectra(200, 11);
  const empirical = (lag: number): number => {
    let c = 0;
    let v = 0;
    for (const s of spectra) {
      for (let i = 0; i + lag < s.length; i++) {
        c += (s[i] ?? 0) * (s[i + lag] ?? 0);
        v += (s[i] ?? 0) ** 2;
      }
    }
    return c / v;
  };

  it('from the processing matches the autocorrelation of simulated processed noise (4x zero-fill, cos^2 bell)', () => {
    const rho = correlationFromProcessing(p, 12);
    // 200 x 512 samples: standard error of a correlation ~ 1/sqrt(1e5 / correlation length) < 0.01.
    for (let lag = 0; lag <= 12; lag++) expect(Math.abs((rho[lag] ?? 0) - empirical(lag))).toBeLessThan(0.02);
    expect(rho[1]).toBeGreaterThan(0.8); // zero-filling 4x: neighbours are strongly correlated
  });

  it('estimated from noise-only traces agrees with the formula within the estimator noise', () => {
    const est = estimateCorrelation(spectra.slice(0, 64), 8);
    const rho = correlationFromProcessing(p, 8);
    for (let lag = 0; lag <= 4; lag++) expect(Math.abs((est[lag] ?? 0) - (rho[lag] ?? 0))).toBeLessThan(0.06);
  });

  it('is 1 at lag 0 and near 0 at all lags without zero-filling or window (white noise stays white)', () => {
    const flat: DimensionProcessing = { ...p, size: 128, window: { kind: 'none' } };
    const rho = correlationFromProcessing(flat, 5);
    expect(rho[0]).toBe(1);
    // the halved first point leaves a tiny constant correlation: 0.75 / (n - 0.75) (from the formula)
    for (let lag = 1; lag <= 5; lag++) expect(Math.abs(rho[lag] ?? 0)).toBeLessThan(0.01);
  });
});
