import { describe, expect, it } from 'vitest';
import { simulate1D } from '../../../src/core/simulate/simulate1D';
import type { SpinSystem } from '../../../src/core/simulate/spinSystem';
import { hzPerPoint, hzToPoint, resolutionHz } from '../../../src/core/spectrum/axis';
import type { DimensionProcessing, WindowFunction } from '../../../src/core/spectrum/processing';
import { madSigma } from '../../../src/core/spectrum/noise';
import { argMax, fwhmPoints, sampleSd } from './helpers';

const singlet = (ppm: number, w: number, count = 1): SpinSystem => ({ observeMhz: 500, spins: [{ label: 'H-1', ppm, linewidthHz: w, count }], couplings: [] });

function longAcq(window: WindowFunction): DimensionProcessing {
  // 16.4 s acquisition: exp(-pi * 1 Hz * 16.4 s) ~ 1e-22, so no truncation; 0.015 Hz per point.
  return { acquiredPoints: 16384, spectralWidthHz: 1000, carrierHz: 1000, window, size: 65536 };
}

describe('simulate1D lineshape', () => {
  it('gives a Lorentzian whose FWHM equals the input width without a window (analytic: FT of exp(-pi w t))', () => {
    const s = simulate1D(singlet(2.1, 1.0), longAcq({ kind: 'none' })).spectrum;
    const top = argMax(s.data);
    expect(Math.abs(top - hzToPoint(s.axis, 1050))).toBeLessThanOrEqual(1);
    expect(fwhmPoints(s.data, top) * resolutionHz(s.axis)).toBeCloseTo(1.0, 2);
  });

  it('adds lb to the FWHM with an exponential window of lb Hz (analytic: exp(-pi w t) exp(-pi lb t))', () => {
    const s = simulate1D(singlet(2.1, 1.0), longAcq({ kind: 'exponential', lbHz: 2 })).spectrum;
    expect(fwhmPoints(s.data, argMax(s.data)) * resolutionHz(s.axis)).toBeCloseTo(3.0, 2);
  });

  it('makes peak integrals proportional to proton counts (CH3 : CH = 3 : 1)', () => {
    const sys: SpinSystem = { observeMhz: 500, spins: [{ label: 'H-1', ppm: 1.5, linewidthHz: 1 }, { label: 'H-2', ppm: 2.5, linewidthHz: 1, count: 3 }], couplings: [] };
    const s = simulate1D(sys, longAcq({ kind: 'none' })).spectrum;
    const integrate = (hz: number): number => {
      let sum = 0;
      const c = Math.round(hzToPoint(s.axis, hz));
      const half = Math.round(100 / resolutionHz(s.axis));
      for (let i = c - half; i <= c + half; i++) sum += s.data[i] ?? 0;
      return sum;
    };
    // +-100 Hz windows hold all but ~0.3% of each Lorentzian ((2/pi) atan); the folded tails differ slightly.
    expect(integrate(1250) / integrate(750)).toBeCloseTo(3, 2);
    // Discrete Fourier identity sum_k X[k] = N x[0]; x[0] = 4 protons, halved first point (processFid).
    const total = s.data.reduce((a, b) => a + b, 0);
    expect(total / (s.data.length * 0.5 * 4)).toBeCloseTo(1, 9);
  });

  it('places a doublet at nu +- J/2 (first-order rule) and records the processing', () => {
    const sys: SpinSystem = { observeMhz: 500, spins: [{ label: 'H-1', ppm: 2.0, linewidthHz: 0.8 }, { label: 'H-2', ppm: 1.2, linewidthHz: 0.8 }], couplings: [{ a: 'H-1', b: 'H-2', jHz: 7.2 }] };
    const p = longAcq({ kind: 'none' });
    const s = simulate1D(sys, p).spectrum;
    const near = (hz: number): number => {
      const c = Math.round(hzToPoint(s.axis, hz));
      return argMax(s.data, c - 20, c + 20);
    };
    const step = hzPerPoint(s.axis);
    expect(Math.abs((near(1003.6) - near(996.4)) * step)).toBeCloseTo(7.2, 1);
    expect(s.processing).toEqual(p);
  });

  it('refuses a line outside the spectral window instead of folding it silently', () => {
    expect(() => simulate1D(singlet(9.0, 1), longAcq({ kind: 'none' }))).toThrow(/H-1.*outside the F2 spectral window/);
  });
});

describe('simulate1D noise', () => {
  const sys: SpinSystem = { observeMhz: 500, spins: [{ label: 'H-1', ppm: 2.0, linewidthHz: 1 }], couplings: [] };
  const p: DimensionProcessing = { acquiredPoints: 8192, spectralWidthHz: 2000, carrierHz: 1000, window: { kind: 'exponential', lbHz: 0.3 }, size: 32768 };

  it('is reproducible for a seed and differs between seeds', () => {
    const a = simulate1D(sys, p, { noise: { seed: 5, snr: 100 } }).spectrum.data;
    const b = simulate1D(sys, p, { noise: { seed: 5, snr: 100 } }).spectrum.data;
    const c = simulate1D(sys, p, { noise: { seed: 6, snr: 100 } }).spectrum.data;
    expect(a.every((v, i) => v === b[i])).toBe(true);
    expect(a.some((v, i) => v !== c[i])).toBe(true);
  });

  it('has spectral noise sigma = tallest line / snr, measured in a signal-free region (definition in noise.ts)', () => {
    const snr = 40;
    const clean = simulate1D(sys, p).spectrum.data;
    const r = simulate1D(sys, p, { noise: { seed: 11, snr } });
    const tallest = Math.max(...clean);
    expect(r.noiseSigma).toBeCloseTo(tallest / snr, 9);
    // Signal-free: the first 12000 points (>= 180 Hz from the line). About 3000 independent values
    // (4x zero-fill correlates neighbours), so the sampled sigma is within ~2% (1/sqrt(2n)); allow 5%.
    const measured = sampleSd(r.spectrum.data, 0, 12000);
    expect(measured / (tallest / snr)).toBeGreaterThan(0.95);
    expect(measured / (tallest / snr)).toBeLessThan(1.05);
    // A robust estimate agrees (1.4826 x MAD is sigma for normal data).
    expect(madSigma(r.spectrum.data.subarray(0, 12000)) / (tallest / snr)).toBeCloseTo(1, 1);
  });
});
