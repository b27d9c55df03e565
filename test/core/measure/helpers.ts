import { makeAxis } from '../../../src/core/spectrum/axis';
import { make2D, type Spectrum2D } from '../../../src/core/spectrum/spectrum';
import type { CrossPeakInput } from '../../../src/core/measure';

/**
 * A small 2D spectrum whose rows are amplitude_r * f(Hz): a separable cross peak written from an
 * analytic F2 pattern (no processing recorded). F2 runs from +halfHz to -halfHz around 0 Hz.
 */
export function separable2D(f: (hz: number) => number, rowAmps: number[], halfHz: number, hzPerPoint: number): { s: Spectrum2D; peak: CrossPeakInput } {
  const cols = Math.round((2 * halfHz) / hzPerPoint) + 1;
  const rows = rowAmps.length + 4;
  const f2 = makeAxis(cols, halfHz, -halfHz, 600);
  const f1 = makeAxis(rows, 1200 + 10 * rows, 1200, 600);
  const data = new Float64Array(rows * cols);
  rowAmps.forEach((a, r) => {
    for (let c = 0; c < cols; c++) data[(r + 2) * cols + c] = a * f(halfHz - c * hzPerPoint);
  });
  const s = make2D('analytic cross peak', data, f1, f2);
  const peak: CrossPeakInput = {
    f1Ppm: (1200 + 10 * (rows - 3)) / 600, f2Ppm: 0,
    extent: { f1FromPpm: 0, f1ToPpm: 0, f2FromPpm: (0.8 * halfHz) / 600, f2ToPpm: (-0.8 * halfHz) / 600, row0: 2, row1: rows - 3, col0: Math.round(0.1 * cols), col1: Math.round(0.9 * cols) },
  };
  return { s, peak };
}

/** Lorentzian absorption line of full width w at half height, height 1. */
export function lorentz(x: number, w: number): number {
  return 1 / (1 + ((2 * x) / w) ** 2);
}
