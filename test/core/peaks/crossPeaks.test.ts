import { describe, expect, it } from 'vitest';
import { pickCrossPeaks } from '../../../src/core/peaks/crossPeaks';
import { diagonalFragments } from '../../../src/core/peaks/symmetry';
import type { CrossPeak } from '../../../src/core/peaks/types';
import { MHZ, pattern, ppmAxis, spectrum2D, type Grid2D, type Peak2D } from './synth';

const single = [{ offsetHz: 0, amp: 1 }];
/** Homonuclear grid covering 3000..3000-(n2-1)*r2 Hz in F2 and about the same range in F1. */
function grid(n2: number, r2: number, n1: number, r1: number, w2Hz: number, w1Hz: number): Grid2D {
  return { f2: ppmAxis(n2, 5, 5 - ((n2 - 1) * r2) / MHZ), f1: ppmAxis(n1, 5, 5 - ((n1 - 1) * r1) / MHZ), w2Hz, w1Hz };
}
/** A cross peak antiphase in the active J in both dimensions, in-phase in the given passive ones. */
function cross(f2Hz: number, f1Hz: number, active: number, passive2: number[], passive1: number[], amp = 100): Peak2D {
  const split = (p: number[]) => pattern([{ j: active, antiphase: true }, ...p.map((j) => ({ j, antiphase: false }))]);
  return { f2Hz, f1Hz, f2: split(passive2), f1: split(passive1), amp };
}

describe('pickCrossPeaks: grouping', () => {
  it('groups the 16 lobes of a dd x dd antiphase multiplet into one cross peak at the true shifts', () => {
    // J_active 8 Hz, passive 3 Hz in F2 and 5 Hz in F1; 1 Hz/point both ways, Gaussian 2.5 Hz wide.
    const g = grid(160, 1, 160, 1, 2.5, 2.5);
    const s = spectrum2D(g, [cross(2920.3, 2910.6, 8, [3], [5])]);
    const { peaks } = pickCrossPeaks(s, { noise: 0.1 });
    expect(peaks).toHaveLength(1);
    const p = peaks[0]!;
    expect(p.extrema).toHaveLength(16);
    expect(p.extrema.filter((e) => e.sign > 0)).toHaveLength(8);
    // |S|-weighted centroid of a symmetric pattern: exact up to the parabolic bias (<= 0.066 point
    // for a 2-point-wide Gaussian, derived in interpolate.ts); 0.1 Hz allows for overlapping lobes.
    expect(Math.abs(p.f2Hz - 2920.3)).toBeLessThan(0.1);
    expect(Math.abs(p.f1Hz - 2910.6)).toBeLessThan(0.1);
    expect(p.f2Ppm).toBeCloseTo(2920.3 / MHZ, 3);
    expect(p.kind).toBe('cross');
    expect(p.height).toBe(Math.max(...p.extrema.map((e) => Math.abs(e.height))));
    // extent covers the outermost lines, +/-(8+3)/2 Hz in F2 and +/-(8+5)/2 Hz in F1
    expect(p.extent.f2FromPpm).toBeGreaterThanOrEqual((2920.3 + 5.5) / MHZ - 1e-9);
    expect(p.extent.f2ToPpm).toBeLessThanOrEqual((2920.3 - 5.5) / MHZ + 1e-9);
    expect(p.extent.f1FromPpm).toBeGreaterThanOrEqual((2910.6 + 6.5) / MHZ - 1e-9);
    expect(p.extent.f1ToPpm).toBeLessThanOrEqual((2910.6 - 6.5) / MHZ + 1e-9);
    expect(p.extent.col0).toBeLessThan(p.extent.col1);
    // ... but not far beyond them (half height of the outer lobes, 2.5 Hz lines)
    expect(p.extent.f2FromPpm - p.extent.f2ToPpm).toBeLessThan((11 + 2.5 + 2) / MHZ);
  });

  it('keeps a wide multiplet whole (active J 18 Hz, passive 2 Hz: a 16 Hz gap between lobes)', () => {
    const g = grid(256, 1, 48, 8, 2.5, 16);
    const s = spectrum2D(g, [cross(2900, 2850, 18, [2], [2])]);
    const { peaks } = pickCrossPeaks(s, { noise: 0.1 });
    expect(peaks).toHaveLength(1);
    expect(peaks[0]!.extrema.length).toBeGreaterThanOrEqual(4);
    expect(Math.abs(peaks[0]!.f2Hz - 2900)).toBeLessThan(0.1);
  });

  it('does not merge two cross peaks 40 Hz apart in F2 (1 Hz/point)', () => {
    const g = grid(256, 1, 48, 8, 3, 16);
    const s = spectrum2D(g, [cross(2900, 2850, 7, [3], [3]), cross(2860, 2850, 7, [3], [3])]);
    const { peaks } = pickCrossPeaks(s, { noise: 0.1 });
    expect(peaks.map((p) => Math.round(p.f2Hz))).toEqual([2900, 2860]);
  });

  it('does not merge two cross peaks 40 Hz apart in F1 (8 Hz/point, lines 16 Hz wide)', () => {
    const g = grid(256, 1, 48, 8, 3, 16);
    const s = spectrum2D(g, [cross(2900, 2850, 7, [3], [3]), cross(2900, 2810, 7, [3], [3])]);
    const { peaks } = pickCrossPeaks(s, { noise: 0.1 });
    expect(peaks).toHaveLength(2);
    expect(peaks.map((p) => Math.abs(p.f1Hz - 2830))).toEqual([expect.closeTo(20, 0), expect.closeTo(20, 0)]);
  });

  it('rejoins the two F1 halves of one multiplet that lie further apart than the link distance', () => {
    // F1: only the outer lobes, + at +14 Hz and - at -14 Hz (what a broad-line F1 multiplet shows
    // when its inner lobes cancel); 28 Hz apart > 22 Hz link, but each half is one row of lobes.
    const g = grid(256, 1, 48, 8, 3, 12);
    const f1 = [{ offsetHz: 14, amp: 0.5 }, { offsetHz: -14, amp: -0.5 }];
    const s = spectrum2D(g, [{ f2Hz: 2900, f1Hz: 2850, f2: pattern([{ j: 7, antiphase: true }]), f1, amp: 100 }]);
    const { peaks } = pickCrossPeaks(s, { noise: 0.1 });
    expect(peaks).toHaveLength(1);
    expect(peaks[0]!.extrema).toHaveLength(4);
    // F1 lines only 1.5 points wide: parabolic bias up to 0.11 point per lobe (derived as in
    // interpolate.ts) and unequal interpolated heights shift the centroid; allow a quarter point.
    expect(Math.abs(peaks[0]!.f1Hz - 2850)).toBeLessThan(0.25 * 8);
  });

  it('does not join two one-row groups of the same sign pattern (not an F1 antiphase pair)', () => {
    const g = grid(256, 1, 48, 8, 3, 12);
    const f1 = [{ offsetHz: 14, amp: 0.5 }, { offsetHz: -14, amp: 0.5 }];
    const s = spectrum2D(g, [{ f2Hz: 2900, f1Hz: 2850, f2: pattern([{ j: 7, antiphase: true }]), f1, amp: 100 }]);
    expect(pickCrossPeaks(s, { noise: 0.1 }).peaks).toHaveLength(2);
  });

  it('groups a multiplet whole with lobes about 30 sigma high in seeded noise, and finds no other peak', () => {
    const g = grid(256, 1, 48, 8, 3, 16);
    const s = spectrum2D(g, [cross(2900, 2850, 7, [4], [4], 480)], { sigma: 1, seed: 5 });
    const { peaks, noise } = pickCrossPeaks(s);
    expect(noise).toBeGreaterThan(0.8);
    expect(peaks).toHaveLength(1);
    expect(Math.abs(peaks[0]!.f2Hz - 2900)).toBeLessThan(0.5);
  });
});

describe('pickCrossPeaks: diagonal, partners, order', () => {
  // A at 2900 Hz, X at 2780 Hz (J 7), B at 2700 Hz: one-sided cross peak (A in F1, B in F2).
  const g = grid(400, 1, 50, 8, 3, 16);
  const A = 2900;
  const X = 2780;
  const B = 2700;
  const peaksIn: Peak2D[] = [
    cross(A, A, 7, [], []),
    cross(X, X, 7, [], []),
    cross(A, X, 7, [], []),
    cross(X, A, 7, [], []),
    cross(B, A, 7, [], [], 60),
  ];
  const s = spectrum2D(g, peaksIn);
  const { peaks } = pickCrossPeaks(s, { noise: 0.1 });
  const at = (f2: number, f1: number): CrossPeak | undefined =>
    peaks.find((p) => Math.abs(p.f2Hz - f2) < 1 && Math.abs(p.f1Hz - f1) < 2);

  it('finds the five multiplets', () => {
    expect(peaks).toHaveLength(5);
    for (const p of peaksIn) expect(at(p.f2Hz, p.f1Hz)).toBeDefined();
  });

  it('classifies peaks centred on F1 = F2 as diagonal, the others as cross', () => {
    expect(at(A, A)?.kind).toBe('diagonal');
    expect(at(X, X)?.kind).toBe('diagonal');
    expect(at(A, X)?.kind).toBe('cross');
    expect(at(X, A)?.kind).toBe('cross');
    expect(at(B, A)?.kind).toBe('cross');
  });

  it('pairs (A,X) with (X,A), leaves the one-sided and diagonal peaks without partner', () => {
    const ax = at(A, X)!;
    const xa = at(X, A)!;
    expect(peaks[ax.partner!]).toBe(xa);
    expect(peaks[xa.partner!]).toBe(ax);
    expect(at(B, A)?.partner).toBeNull();
    expect(at(A, A)?.partner).toBeNull();
  });

  it('sorts by F2 ppm descending, then F1 ppm descending within one F2 column', () => {
    const order = peaks.map((p) => [Math.round(p.f2Hz), Math.round(p.f1Hz)]);
    expect(order).toEqual([[A, A], [A, X], [X, A], [X, X], [B, A]]);
  });

  it('orders one F2 column by F1 even when noise moves the F2 centres by a fraction of a point', () => {
    // (A,X) is placed 0.4 Hz higher in F2 than the diagonal (A,A): still sorted below it.
    const t = spectrum2D(g, [cross(A, A, 7, [], []), cross(A + 0.4, X, 7, [], [])]);
    expect(pickCrossPeaks(t, { noise: 0.1 }).peaks.map((p) => Math.round(p.f1Hz))).toEqual([A, X]);
  });

  it('does not pair two peaks whose swapped centres are 3 F1 points apart', () => {
    const t = spectrum2D(g, [cross(A, X, 7, [], []), cross(X, A - 24, 7, [], [])]);
    const r = pickCrossPeaks(t, { noise: 0.1 }).peaks;
    expect(r).toHaveLength(2);
    expect(r.map((p) => p.partner)).toEqual([null, null]);
  });
});

describe('pickCrossPeaks: input checks', () => {
  it('rejects a spectrum too small to pick and says which', () => {
    const g = grid(2, 1, 2, 1, 1, 1);
    expect(() => pickCrossPeaks(spectrum2D(g, [{ f2Hz: 3000, f1Hz: 3000, f2: single, f1: single, amp: 1 }]))).toThrow(/synthetic' needs at least 3 x 3/);
  });
  it('rejects a non-positive link distance', () => {
    const g = grid(16, 1, 16, 1, 2, 2);
    expect(() => pickCrossPeaks(spectrum2D(g, []), { linkHz: 0 })).toThrow(/option linkHz/);
  });
});

describe('diagonalFragments: an unpartnered peak straddling the diagonal is part of a diagonal multiplet', () => {
  const peak = (f2Ppm: number, f1Ppm: number, halfF2: number, halfF1: number, partner: number | null): CrossPeak => ({
    f2Ppm, f1Ppm, f2Hz: f2Ppm * MHZ, f1Hz: f1Ppm * MHZ, kind: 'cross', height: 1, extrema: [], partner,
    extent: { f2FromPpm: f2Ppm + halfF2, f2ToPpm: f2Ppm - halfF2, f1FromPpm: f1Ppm + halfF1, f1ToPpm: f1Ppm - halfF1, row0: 0, row1: 0, col0: 0, col1: 0 },
  });
  // Geometry only: the distance from the centre to F1 = F2 against the peak's own half extent.
  it('makes a lone peak diagonal when its centre is nearer the diagonal than its half extent', () => {
    const ps = [peak(3.8388, 3.8181, 0.0016, 0.025, null), peak(3.5254, 3.4926, 0.042, 0.081, null)];
    diagonalFragments(ps);
    expect(ps.map((p) => p.kind)).toEqual(['diagonal', 'diagonal']);
  });
  it('keeps a peak with a symmetric partner, and a lone peak whose centre lies beyond its half extent', () => {
    const ps = [peak(3.8388, 3.8181, 0.0016, 0.025, 1), peak(3.8181, 3.8388, 0.025, 0.0016, 0), peak(2.50, 2.47, 0.01, 0.01, null)];
    diagonalFragments(ps);
    expect(ps.map((p) => p.kind)).toEqual(['cross', 'cross', 'cross']);
  });
});
