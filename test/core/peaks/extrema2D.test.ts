import { describe, expect, it } from 'vitest';
import { pickExtrema2D } from '../../../src/core/peaks/extrema2D';
import { makeAxis } from '../../../src/core/spectrum/axis';
import { make2D } from '../../../src/core/spectrum/spectrum';
import { MHZ, pattern, pointOf, ppmAxis, spectrum2D, type Grid2D } from './synth';

// F2 1 Hz/point, F1 8 Hz/point: typical DQF-COSY digital resolution (references.md, common practice).
const grid: Grid2D = { f2: ppmAxis(256, 5.0, 5.0 - 255 / MHZ), f1: ppmAxis(48, 5.0, 5.0 - (47 * 8) / MHZ), w2Hz: 4, w1Hz: 24 };
const single = [{ offsetHz: 0, amp: 1 }];

/** Standard normal density and upper tail by numerical integration (Simpson's rule). */
function phi(z: number): number {
  return Math.exp(-0.5 * z * z) / Math.sqrt(2 * Math.PI);
}
function cdf(z: number): number {
  const lo = -12;
  const n = 4000;
  const h = (z - lo) / n;
  let s = phi(lo) + phi(z);
  for (let i = 1; i < n; i++) s += (i % 2 ? 4 : 2) * phi(lo + i * h);
  return (s * h) / 3;
}

describe('pickExtrema2D', () => {
  it('finds one Gaussian peak at its analytic position within the parabolic bias (derived, interpolate.ts)', () => {
    const f2Hz = 2900.3; // 0.3 point off the grid in F2
    const f1Hz = 2900 - 0.35 * 8; // 0.35 point off the grid in F1
    const s = spectrum2D(grid, [{ f2Hz, f1Hz, f2: single, f1: single, amp: 100 }]);
    const { extrema } = pickExtrema2D(s, { noise: 1 });
    expect(extrema).toHaveLength(1);
    const e = extrema[0]!;
    // F2: Gaussian 4 points wide -> bias <= 0.017 point; F1: 3 points wide -> bias <= 0.030 point.
    expect(Math.abs(e.col - pointOf(s.f2, f2Hz))).toBeLessThanOrEqual(0.0168);
    expect(Math.abs(e.row - pointOf(s.f1, f1Hz))).toBeLessThanOrEqual(0.0296);
    expect(Math.abs(e.f2Hz - f2Hz)).toBeLessThanOrEqual(0.0168);
    expect(e.f2Ppm).toBeCloseTo(e.f2Hz / MHZ, 12);
    // Height: separable estimate, relative error <= 0.0073 (4 points) + 0.021 (3 points), derived.
    expect(Math.abs(e.height / 100 - 1)).toBeLessThanOrEqual(0.0073 + 0.0209);
    expect(e.sign).toBe(1);
  });

  it('finds minima as negative extrema', () => {
    const s = spectrum2D(grid, [{ f2Hz: 2950, f1Hz: 2900, f2: single, f1: single, amp: -50 }]);
    const { extrema } = pickExtrema2D(s, { noise: 1 });
    expect(extrema).toHaveLength(1);
    expect(extrema[0]!.sign).toBe(-1);
    // F1 centre midway between two points (12.5): worst case for the height, derived bound as above
    expect(Math.abs(extrema[0]!.height / -50 - 1)).toBeLessThanOrEqual(0.0073 + 0.0209);
  });

  it('finds the four lobes of an antiphase doublet x antiphase doublet with alternating signs', () => {
    const anti = pattern([{ j: 12, antiphase: true }]);
    const anti1 = pattern([{ j: 40, antiphase: true }]); // resolved at 8 Hz/point
    const s = spectrum2D(grid, [{ f2Hz: 2900, f1Hz: 2850, f2: anti, f1: anti1, amp: 100 }]);
    const { extrema } = pickExtrema2D(s, { noise: 1 });
    expect(extrema).toHaveLength(4);
    const product = extrema.map((e) => e.sign * Math.sign(e.f2Hz - 2900) * Math.sign(e.f1Hz - 2850));
    expect(new Set(product).size).toBe(1); // sign = +/- sign(dF2) * sign(dF1): the antiphase square
  });

  it('picks only values beyond threshold * sigma', () => {
    const s = spectrum2D(grid, [{ f2Hz: 2900, f1Hz: 2900, f2: single, f1: single, amp: 5 }]);
    expect(pickExtrema2D(s, { noise: 1, threshold: 6 }).extrema).toHaveLength(0);
    expect(pickExtrema2D(s, { noise: 1, threshold: 4 }).extrema).toHaveLength(1);
    expect(pickExtrema2D(s, { noise: 1, threshold: 4 }).level).toBe(4);
  });

  it('finds no peaks in pure noise at 6 sigma: 2 Q(6) = 2.0e-9 per point (normal tail, Abramowitz & Stegun 26.2, from memory)', () => {
    const n = 256;
    const axis = makeAxis(n, 3000, 2000, MHZ);
    const s = spectrum2D({ f1: axis, f2: axis, w1Hz: 1, w2Hz: 1 }, [], { sigma: 2.5, seed: 7 });
    const r = pickExtrema2D(s);
    expect(r.noise).toBeGreaterThan(2.5 * 0.9); // robust MAD estimate near the true sigma
    expect(r.noise).toBeLessThan(2.5 * 1.1);
    expect(r.extrema).toHaveLength(0); // expected 65536 * 2e-9 = 1.3e-4 peaks
  });

  it('finds as many noise extrema at 3 sigma as the order statistics predict (derived)', () => {
    // P(a point is a local max above z) = int_z^inf phi(t) Phi(t)^8 dt for independent neighbours;
    // both signs double it. Expected count over the interior points, tolerance 5 standard deviations.
    const n = 256;
    const axis = makeAxis(n, 3000, 2000, MHZ);
    const s = spectrum2D({ f1: axis, f2: axis, w1Hz: 1, w2Hz: 1 }, [], { sigma: 1, seed: 11 });
    let p = 0;
    const h = 0.002;
    for (let t = 3 + h / 2; t < 9; t += h) p += phi(t) * cdf(t) ** 8 * h;
    const expected = 2 * p * (n - 2) ** 2;
    const count = pickExtrema2D(s, { noise: 1, threshold: 3, prominence: 0 }).extrema.length;
    expect(Math.abs(count - expected)).toBeLessThan(5 * Math.sqrt(expected));
  });

  it('ignores noise bumps on the slope of a strong Lorentzian peak (prominence)', () => {
    const g: Grid2D = { ...grid, shape: 'lorentz', w2Hz: 3, w1Hz: 16 };
    const s = spectrum2D(g, [{ f2Hz: 2900, f1Hz: 2850, f2: single, f1: single, amp: 5000 }], { sigma: 1, seed: 3 });
    const off = pickExtrema2D(s, { noise: 1, floor: 0, prominence: 0 }).extrema.length;
    const on = pickExtrema2D(s, { noise: 1, floor: 0 }).extrema;
    expect(off).toBeGreaterThan(1); // the problem is real without the check
    expect(on).toHaveLength(1);
  });

  it('returns one extremum for a flat top of two equal points', () => {
    const data = new Float64Array(25);
    data[12] = 10;
    data[13] = 10;
    const a = makeAxis(5, 10, 0, MHZ);
    const { extrema } = pickExtrema2D(make2D('plateau', data, a, a), { noise: 1 });
    expect(extrema).toHaveLength(1);
    expect(extrema[0]!.col).toBeCloseTo(2.5, 12); // the vertex of the flat top lies midway
  });

  it('says where a non-finite value is', () => {
    const a = makeAxis(5, 10, 0, MHZ);
    const data = new Float64Array(25);
    data[7] = Number.NaN;
    expect(() => pickExtrema2D(make2D('broken', data, a, a))).toThrow(/broken', row 1, column 2 is not finite/);
  });

  it('rejects bad options with their name', () => {
    const s = spectrum2D(grid, []);
    expect(() => pickExtrema2D(s, { threshold: -1 })).toThrow(/option threshold/);
    expect(() => pickExtrema2D(s, { noise: 0 })).toThrow(/option noise/);
  });
});
