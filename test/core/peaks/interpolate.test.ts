import { describe, expect, it } from 'vitest';
import { lorentzianPeak, parabolicHeight, parabolicOffset } from '../../../src/core/peaks/interpolate';
import { gauss, lorentz } from './synth';

/** Samples of a unit line of width w (points) at -1, 0, 1 when the true maximum is at delta. */
function samples(shape: (x: number, w: number) => number, w: number, delta: number): [number, number, number] {
  return [shape(-1 - delta, w), shape(-delta, w), shape(1 - delta, w)];
}

describe('parabolicOffset', () => {
  it('is exact for a parabola (analytic: the vertex of the parabola through three points)', () => {
    const f = (x: number): number => 3 - 2 * (x - 0.37) ** 2;
    const p = parabolicOffset(f(-1), f(0), f(1));
    expect(p).toBeCloseTo(0.37, 12);
    expect(parabolicHeight(f(-1), f(0), f(1), p)).toBeCloseTo(3, 12);
  });

  it('has no bias on a peak at a point or midway between two (symmetry of the samples, derived)', () => {
    for (const w of [2, 4, 6]) {
      expect(parabolicOffset(...samples(gauss, w, 0))).toBeCloseTo(0, 12);
      expect(parabolicOffset(...samples(gauss, w, 0.5))).toBeCloseTo(0.5, 12);
      expect(parabolicOffset(...samples(lorentz, w, -0.5))).toBeCloseTo(-0.5, 12);
    }
  });

  it('pulls a Gaussian peak towards the nearest point by at most 0.017 point at 4 points FWHM (derived, interpolate.ts)', () => {
    for (let delta = -0.45; delta <= 0.45; delta += 0.05) {
      const err = parabolicOffset(...samples(gauss, 4, delta)) - delta;
      expect(Math.abs(err)).toBeLessThanOrEqual(0.0168);
      if (Math.abs(delta) > 0.01) expect(Math.sign(err)).toBe(-Math.sign(delta));
    }
  });

  it('pulls a Lorentzian peak by at most 0.041 point at 4 points FWHM (derived, interpolate.ts)', () => {
    let worst = 0;
    for (let delta = -0.45; delta <= 0.45; delta += 0.05) {
      worst = Math.max(worst, Math.abs(parabolicOffset(...samples(lorentz, 4, delta)) - delta));
    }
    expect(worst).toBeLessThanOrEqual(0.0407);
    // and the bound is not vacuous: the bias is real for a Lorentzian
    expect(worst).toBeGreaterThan(0.03);
  });

  it('stays within half a point for any extremum, including flat tops', () => {
    expect(parabolicOffset(1, 1, 0)).toBe(-0.5);
    expect(parabolicOffset(0, 1, 1)).toBe(0.5);
    expect(parabolicOffset(1, 1, 1)).toBe(0);
    expect(parabolicOffset(-0.9, -1, 0.2)).toBeGreaterThanOrEqual(-0.5);
  });
});

describe('lorentzianPeak', () => {
  it('is exact for a sampled Lorentzian (analytic: 1/L(x) = 1 + (2(x - x0)/w)^2 is a parabola)', () => {
    for (const w of [1.5, 3, 6]) {
      for (const delta of [-0.45, -0.2, 0, 0.3, 0.5]) {
        const [l, c, r] = samples(lorentz, w, delta).map((y) => 7 * y) as [number, number, number];
        const p = lorentzianPeak(l, c, r);
        expect(p.offset).toBeCloseTo(delta, 10);
        expect(p.height).toBeCloseTo(7, 10);
      }
    }
  });

  it('falls back to the parabola when a neighbour is not positive', () => {
    expect(lorentzianPeak(-1, 2, 1).offset).toBeCloseTo(parabolicOffset(-1, 2, 1), 12);
  });
});
