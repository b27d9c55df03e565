import { pointToHz, pointToPpm } from '../spectrum/axis';
import type { Spectrum2D } from '../spectrum/spectrum';
import { parabolicHeight, parabolicOffset } from './interpolate';
import { pickingLevel } from './level';
import type { Extremum, LevelOptions } from './types';

/** Longest walk, in points, when measuring how far a value falls away from an extremum. */
const PROMINENCE_WALK = 64;

/**
 * Local maxima (S > level) and minima (S < -level) of a 2D spectrum over the 8 neighbours, with
 * sub-point positions and heights. Ties: an extremum must be strictly beyond the neighbours that
 * come earlier in row-major order and at least equal to the later ones, so a flat top of equal
 * values gives one extremum, not several. Points on the outermost rows and columns are not picked
 * (they cannot be interpolated).
 *
 * Position: three-point parabolic interpolation separately along F2 (row) and F1 (column); see
 * interpolate.ts for the bias. Height: product of the two one-dimensional vertex heights divided
 * by the grid value, exact in form for a separable (product) lineshape.
 *
 * One pass over the data with two comparisons for most points; objects only for extrema.
 */
export function pickExtrema2D(s: Spectrum2D, opts: LevelOptions = {}): { extrema: Extremum[]; noise: number; level: number } {
  const rows = s.f1.points;
  const cols = s.f2.points;
  if (rows < 3 || cols < 3) throw new RangeError(`spectrum '${s.title}' needs at least 3 x 3 points to pick peaks, has ${rows} x ${cols}`);
  if (s.data.length !== rows * cols) {
    throw new RangeError(`spectrum '${s.title}' has ${s.data.length} values, axes need ${rows} x ${cols}`);
  }
  const where = (i: number): string => `spectrum '${s.title}', row ${Math.floor(i / cols)}, column ${i % cols}`;
  const { noise, level, prominence } = pickingLevel(s.data, opts, where);
  const d = s.data;
  const extrema: Extremum[] = [];
  for (let r = 1; r < rows - 1; r++) {
    const base = r * cols;
    for (let c = 1; c < cols - 1; c++) {
      const i = base + c;
      const v = d[i] ?? 0;
      let sign: 1 | -1;
      if (v > level && isLocalMax(d, i, cols, 1)) sign = 1;
      else if (v < -level && isLocalMax(d, i, cols, -1)) sign = -1;
      else continue;
      if (prominence > 0 && axisProminence(d, r, c, rows, cols, sign) < prominence) continue;
      extrema.push(interpolateAt(s, r, c));
    }
  }
  return { extrema, noise, level };
}

/** sign * S at i exceeds the earlier 4 neighbours and is not below the later 4 (row-major). */
function isLocalMax(d: Float64Array, i: number, n: number, sign: 1 | -1): boolean {
  const v = sign * (d[i] ?? 0);
  const at = (k: number): number => sign * (d[k] ?? 0);
  return (
    v > at(i - n - 1) && v > at(i - n) && v > at(i - n + 1) && v > at(i - 1) &&
    v >= at(i + 1) && v >= at(i + n - 1) && v >= at(i + n) && v >= at(i + n + 1)
  );
}

/**
 * Smallest fall of sign * S over the four axis directions, each walked until a larger value, a sign
 * change (the lobe ends: the fall is the full height), the edge or PROMINENCE_WALK points.
 * A cheap stand-in for topographic prominence: a noise bump on a slope has a larger value a
 * point or two uphill, so its fall in that direction is of the order of sigma.
 */
function axisProminence(d: Float64Array, r: number, c: number, rows: number, cols: number, sign: 1 | -1): number {
  const start = r * cols + c;
  const h = sign * (d[start] ?? 0);
  const walk = (stride: number, room: number): number => {
    let min = h;
    const steps = Math.min(room, PROMINENCE_WALK);
    for (let k = 1; k <= steps; k++) {
      const v = sign * (d[start + k * stride] ?? 0);
      if (v <= 0) return h;
      if (v > h) return h - min;
      if (v < min) min = v;
    }
    return h - min;
  };
  return Math.min(walk(-1, c), walk(1, cols - 1 - c), walk(-cols, r), walk(cols, rows - 1 - r));
}

function interpolateAt(s: Spectrum2D, r: number, c: number): Extremum {
  const d = s.data;
  const n = s.f2.points;
  const i = r * n + c;
  const v = d[i] ?? 0;
  const left = d[i - 1] ?? 0;
  const right = d[i + 1] ?? 0;
  const up = d[i - n] ?? 0;
  const down = d[i + n] ?? 0;
  const oc = parabolicOffset(left, v, right);
  const or = parabolicOffset(up, v, down);
  const hc = parabolicHeight(left, v, right, oc);
  const hr = parabolicHeight(up, v, down, or);
  const row = r + or;
  const col = c + oc;
  return {
    row,
    col,
    f1Ppm: pointToPpm(s.f1, row),
    f2Ppm: pointToPpm(s.f2, col),
    f1Hz: pointToHz(s.f1, row),
    f2Hz: pointToHz(s.f2, col),
    height: (hc * hr) / v,
    sign: v > 0 ? 1 : -1,
    gridRow: r,
    gridCol: c,
  };
}
