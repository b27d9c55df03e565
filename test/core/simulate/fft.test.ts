import { describe, expect, it } from 'vitest';
import { fft } from '../../../src/core/simulate/fft';
import { processFid, processedAxis } from '../../../src/core/simulate/process';
import { hzToPoint } from '../../../src/core/spectrum/axis';
import type { DimensionProcessing } from '../../../src/core/spectrum/processing';

/** Direct O(n^2) DFT from its definition, X[k] = sum_j x[j] exp(-2 pi i j k / n). */
function directDft(re: number[], im: number[]): { re: number[]; im: number[] } {
  const n = re.length;
  const outRe: number[] = [];
  const outIm: number[] = [];
  for (let k = 0; k < n; k++) {
    let sr = 0;
    let si = 0;
    for (let j = 0; j < n; j++) {
      const a = (-2 * Math.PI * j * k) / n;
      sr += (re[j] ?? 0) * Math.cos(a) - (im[j] ?? 0) * Math.sin(a);
      si += (re[j] ?? 0) * Math.sin(a) + (im[j] ?? 0) * Math.cos(a);
    }
    outRe.push(sr);
    outIm.push(si);
  }
  return { re: outRe, im: outIm };
}

describe('fft', () => {
  it('agrees with the direct DFT from its definition to 1e-9 (64 points, pseudo-random input)', () => {
    let seed = 7;
    const rnd = (): number => ((seed = (seed * 16807) % 2147483647) / 2147483647) * 2 - 1;
    const re = Array.from({ length: 64 }, rnd);
    const im = Array.from({ length: 64 }, rnd);
    const fast = fft(re, im);
    const slow = directDft(re, im);
    for (let k = 0; k < 64; k++) {
      expect(fast.re[k]).toBeCloseTo(slow.re[k] ?? NaN, 9);
      expect(fast.im[k]).toBeCloseTo(slow.im[k] ?? NaN, 9);
    }
  });

  it('rejects sizes that are not powers of two', () => {
    expect(() => fft([1, 2, 3], [0, 0, 0])).toThrow(/power of two/);
  });
});

describe('processFid', () => {
  it('puts a line at carrier + nu on the processed axis, in absorption (analytic: FT of a decaying exponential)', () => {
    const p: DimensionProcessing = { acquiredPoints: 512, spectralWidthHz: 1000, carrierHz: 2000, window: { kind: 'none' }, size: 2048 };
    const nu = 125; // exactly on a point (256 x 1000/2048 Hz), so the dispersion is zero there
    const r2 = Math.PI * 2; // FWHM 2 Hz
    const re = new Float64Array(512);
    const im = new Float64Array(512);
    for (let k = 0; k < 512; k++) {
      const t = k / 1000;
      re[k] = Math.cos(2 * Math.PI * nu * t) * Math.exp(-r2 * t);
      im[k] = Math.sin(2 * Math.PI * nu * t) * Math.exp(-r2 * t);
    }
    const s = processFid(re, im, p);
    const axis = processedAxis(p, 500);
    let best = 0;
    for (let i = 1; i < s.re.length; i++) if ((s.re[i] ?? 0) > (s.re[best] ?? 0)) best = i;
    expect(Math.abs(best - hzToPoint(axis, 2000 + nu))).toBeLessThan(0.01);
    // Absorption: the imaginary (dispersion) part crosses zero at the peak.
    expect(Math.abs(s.im[best] ?? 1)).toBeLessThan(0.1 * (s.re[best] ?? 0));
  });
});
