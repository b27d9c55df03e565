import { describe, expect, it } from 'vitest';
import { nearestCrossPeak } from '../../../src/core/peaks/nearest';
import type { CrossPeak } from '../../../src/core/peaks/types';

/** A peak with a square extent of half-size h ppm around (f2, f1); only fields the search reads matter. */
function peak(f2: number, f1: number, h: number): CrossPeak {
  return {
    f1Ppm: f1, f2Ppm: f2, f1Hz: f1 * 600, f2Hz: f2 * 600, kind: 'cross', height: 1,
    extent: { f1FromPpm: f1 + h, f1ToPpm: f1 - h, f2FromPpm: f2 + h, f2ToPpm: f2 - h, row0: 0, row1: 1, col0: 0, col1: 1 },
    extrema: [], partner: null,
  };
}

describe('nearestCrossPeak (Euclidean ppm distance to the extent box)', () => {
  const peaks = [peak(4.0, 3.0, 0.02), peak(3.9, 3.0, 0.02), peak(4.0, 2.0, 0.05)];

  it('returns the peak whose box contains the click', () => {
    expect(nearestCrossPeak(peaks, 4.01, 3.01)).toBe(0);
    expect(nearestCrossPeak(peaks, 3.89, 2.99)).toBe(1);
  });

  it('measures from the box edge, not the centre: a big multiplet wins a click beside it', () => {
    // 0.06 ppm from the centre of peak 2 but 0.01 from its edge; 0.09 ppm from peak 0's box.
    expect(nearestCrossPeak(peaks, 4.0, 2.06)).toBe(2);
  });

  it('returns the nearer box between two (Pythagoras in ppm)', () => {
    // box edges: peak 1 at F2 3.92, peak 0 at F2 3.98, both at F1 3.02.
    // (3.935, 3.04): hypot(0.015, 0.02) = 0.025 ppm from peak 1, hypot(0.045, 0.02) = 0.049 from peak 0.
    expect(nearestCrossPeak(peaks, 3.935, 3.04)).toBe(1);
    // (3.955, 3.04): 0.039 ppm from peak 1, hypot(0.025, 0.02) = 0.032 from peak 0.
    expect(nearestCrossPeak(peaks, 3.955, 3.04)).toBe(0);
  });

  it('returns null beyond maxDistancePpm', () => {
    expect(nearestCrossPeak(peaks, 5.0, 5.0)).toBeNull();
    expect(nearestCrossPeak(peaks, 4.0, 3.1, { maxDistancePpm: 0.05 })).toBeNull();
    expect(nearestCrossPeak(peaks, 4.0, 3.1, { maxDistancePpm: 0.1 })).toBe(0);
    expect(nearestCrossPeak([], 4, 3)).toBeNull();
  });

  it('breaks a tie inside two overlapping boxes by the nearer centre', () => {
    const overlapping = [peak(4.0, 3.0, 0.05), peak(4.03, 3.0, 0.05)];
    expect(nearestCrossPeak(overlapping, 4.02, 3.0)).toBe(1);
    expect(nearestCrossPeak(overlapping, 4.01, 3.0)).toBe(0);
  });

  it('rejects a non-finite click and a negative distance', () => {
    expect(() => nearestCrossPeak(peaks, Number.NaN, 3)).toThrow(/click position/);
    expect(() => nearestCrossPeak(peaks, 4, 3, { maxDistancePpm: -1 })).toThrow(/maxDistancePpm/);
  });
});
