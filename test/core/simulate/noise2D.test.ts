import { describe, expect, it } from 'vitest';
import { simulateDqfCosy } from '../../../src/core/simulate/dqfCosy';
import { noiseGain } from '../../../src/core/simulate/lineshape';
import { rowCovariance, statesNoise, windowNoiseFast } from '../../../src/core/simulate/noise2D';
import { seededRandom } from '../../../src/core/simulate/random';
import type { SpinSystem } from '../../../src/core/simulate/spinSystem';
import type { DimensionProcessing } from '../../../src/core/spectrum/processing';
import { sampleSd } from './helpers';

const p1: DimensionProcessing = { acquiredPoints: 64, spectralWidthHz: 1000, carrierHz: 1000, window: { kind: 'sine', power: 2, shiftDeg: 90 }, size: 256 };
const p2: DimensionProcessing = { acquiredPoints: 256, spectralWidthHz: 1000, carrierHz: 1000, window: { kind: 'sine', power: 1, shiftDeg: 90 }, size: 512 };

/** Sample correlation between rows r and r + lag, pooled over the grid. */
function rowLagCorrelation(d: Float64Array, rows: number, cols: number, lag: number): number {
  let sxy = 0;
  let sxx = 0;
  for (let r = 0; r + lag < rows; r++) {
    for (let c = 0; c < cols; c++) {
      const a = d[r * cols + c] ?? 0;
      const b = d[(r + lag) * cols + c] ?? 0;
      sxy += a * b;
      sxx += (a * a + b * b) / 2;
    }
  }
  return sxy / sxx;
}

describe('2D noise (States processing of time-domain noise)', () => {
  it('has sigma = FID sigma x g1 x g2 at every point (variance of a linear transform of white noise)', () => {
    const full = { row0: 0, rows: p1.size, col0: 0, cols: p2.size };
    const d = statesNoise(p1, p2, 1, seededRandom(3), full);
    const expected = noiseGain(p1) * noiseGain(p2);
    // 131072 values, neighbours correlated by 4x and 2x zero-filling: ~16000 independent, so ~0.6% error.
    expect(sampleSd(d) / expected).toBeGreaterThan(0.97);
    expect(sampleSd(d) / expected).toBeLessThan(1.03);
  });

  it('is correlated between F1 rows as the window and zero-filling predict (exact and fast paths)', () => {
    const full = { row0: 0, rows: p1.size, col0: 0, cols: p2.size };
    const exact = statesNoise(p1, p2, 1, seededRandom(4), full);
    const small = { row0: 40, rows: 24, col0: 100, cols: 512 - 100 };
    for (const lag of [1, 2, 4]) {
      const predicted = rowCovariance(p1, lag) / rowCovariance(p1, 0);
      expect(Math.abs(rowLagCorrelation(exact, full.rows, full.cols, lag) - predicted)).toBeLessThan(0.03);
      let pooled = 0;
      for (let seed = 0; seed < 8; seed++) pooled += rowLagCorrelation(windowNoiseFast(p1, p2, 1, seededRandom(100 + seed), small), small.rows, small.cols, lag) / 8;
      expect(Math.abs(pooled - predicted)).toBeLessThan(0.03);
    }
  });

  it('gives the fast window noise the same sigma as the exact path', () => {
    const small = { row0: 10, rows: 32, col0: 0, cols: 512 };
    const values: number[] = [];
    for (let seed = 0; seed < 8; seed++) values.push(...windowNoiseFast(p1, p2, 1, seededRandom(200 + seed), small));
    const ratio = sampleSd(values) / (noiseGain(p1) * noiseGain(p2));
    expect(ratio).toBeGreaterThan(0.96);
    expect(ratio).toBeLessThan(1.04);
  });
});

describe('simulateDqfCosy noise', () => {
  const sys: SpinSystem = {
    observeMhz: 500,
    spins: [{ label: 'A', ppm: 2.9, linewidthHz: 2 }, { label: 'X', ppm: 2.7, linewidthHz: 2 }],
    couplings: [{ a: 'A', b: 'X', jHz: 8 }],
  };

  it('has noise sigma = tallest |value| / snr, measured where there is no signal (definition in noise.ts)', () => {
    const snr = 25;
    const clean = simulateDqfCosy(sys, { f1: p1, f2: p2 });
    const noisy = simulateDqfCosy(sys, { f1: p1, f2: p2, noise: { seed: 9, snr } });
    let tallest = 0;
    for (const v of clean.spectrum.data) tallest = Math.max(tallest, Math.abs(v));
    expect(noisy.noiseSigma).toBeCloseTo(tallest / snr, 12);
    // Rows 160..255 lie at F1 = 871..500 Hz, more than 470 Hz from both spins (1350 and 1450 Hz).
    const quiet = noisy.spectrum.data.subarray(160 * p2.size);
    const ratio = sampleSd(quiet) / noisy.noiseSigma;
    expect(ratio).toBeGreaterThan(0.95);
    expect(ratio).toBeLessThan(1.05);
  });

  it('refuses an snr for a window without signal instead of silently adding no noise', () => {
    const empty = { row0: 200, rows: 16, col0: 0, cols: 64 };
    expect(() => simulateDqfCosy(sys, { f1: p1, f2: p2, window: empty, noise: { seed: 1, snr: 10 } })).not.toThrow();
    const zero: SpinSystem = { ...sys, couplings: [] };
    expect(() => simulateDqfCosy(zero, { f1: p1, f2: p2, noise: { seed: 1, snr: 10 } })).toThrow(/noise.snr needs a signal/);
  });

  it('is reproducible for a seed, and a window is an exact slice of the full spectrum (signal and exact noise)', () => {
    const noise = { seed: 12, sigma: 0.01 };
    const full = simulateDqfCosy(sys, { f1: p1, f2: p2, noise }).spectrum;
    const again = simulateDqfCosy(sys, { f1: p1, f2: p2, noise }).spectrum;
    expect(again.data.every((v, i) => v === full.data[i])).toBe(true);
    const w = { row0: 20, rows: 30, col0: 50, cols: 100 };
    const part = simulateDqfCosy(sys, { f1: p1, f2: p2, noise, window: w, noiseMethod: 'exact' }).spectrum;
    let diff = 0;
    for (let r = 0; r < w.rows; r++) {
      for (let c = 0; c < w.cols; c++) diff = Math.max(diff, Math.abs((part.data[r * w.cols + c] ?? 0) - (full.data[(w.row0 + r) * p2.size + w.col0 + c] ?? 0)));
    }
    expect(diff).toBeLessThan(1e-12);
    expect(part.f1.firstHz).toBeCloseTo(full.f1.firstHz + 20 * ((full.f1.lastHz - full.f1.firstHz) / (full.f1.points - 1)), 9);
    expect(part.f2.lastHz).toBeCloseTo(full.f2.firstHz + 149 * ((full.f2.lastHz - full.f2.firstHz) / (full.f2.points - 1)), 9);
  });
});
