import { describe, expect, it } from 'vitest';
import { extentOf, intensityDomain, pointWindowOf } from '../../webview/viewWindow';

// 600 MHz axes: F2 11 points 10 -> 0 ppm (1 ppm per point); F1 5 points 8 -> 0 ppm (2 ppm per point).
const f2 = { points: 11, firstHz: 6000, lastHz: 0, observeMhz: 600 };
const f1 = { points: 5, firstHz: 4800, lastHz: 0, observeMhz: 600 };

describe('pointWindowOf', () => {
  it('turns ppm domains into point ranges (high ppm = low index here)', () => {
    expect(pointWindowOf({ f1, f2 }, { x: [7.5, 2], y: [6, 2] })).toEqual({ col0: 2.5, col1: 8, row0: 1, row1: 3 });
  });
  it('clamps to the grid and uses row 0 for 1D', () => {
    expect(pointWindowOf({ f2 }, { x: [12, -1], y: [100, 0] })).toEqual({ col0: 0, col1: 10, row0: 0, row1: 0 });
  });
});

describe('intensityDomain', () => {
  const tile = { rows: 1, cols: 4, data: Float32Array.from([50, 1, 3, -1]) };
  it('fits the cells whose centres are visible, with an 8 % margin', () => {
    // region cols 0..7 in 4 cells: centres at 0.5, 2.5, 4.5, 6.5; window 1..7 sees cells 1-3 (1, 3, -1)
    const d = intensityDomain(tile, { row0: 0, row1: 0, col0: 0, col1: 7 }, { row0: 0, row1: 0, col0: 1, col1: 7 });
    expect(d?.[0]).toBeCloseTo(3 + 0.08 * 4, 12);
    expect(d?.[1]).toBeCloseTo(-1 - 0.08 * 4, 12);
  });
  it('gives null for a flat or invisible line', () => {
    expect(intensityDomain({ rows: 1, cols: 2, data: Float32Array.from([2, 2]) }, { row0: 0, row1: 0, col0: 0, col1: 1 }, { row0: 0, row1: 0, col0: 0, col1: 1 })).toBeNull();
  });
});

describe('extentOf', () => {
  it('spans both ppm axes high -> low with at least 8 points visible', () => {
    const e = extentOf({ f1, f2, min: -1, max: 1 });
    expect(e.x).toEqual([10, 0]);
    expect(e.y).toEqual([8, 0]);
    expect(e.minSpanX).toBe(8); // 1 ppm per point
    expect(e.minSpanY).toBe(16); // 2 ppm per point
  });
  it('uses the intensity range with a 5 % margin for 1D', () => {
    const e = extentOf({ f2, min: -100, max: 900 });
    expect(e.y).toEqual([950, -150]);
  });
});
