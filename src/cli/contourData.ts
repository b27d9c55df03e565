/**
 * Contours of a whole 2D spectrum in ppm, for `couplet render`: the panel's own pure modules
 * (webview/levels.ts for the levels, webview/contours.ts for d3-contour) on a decimated grid
 * (src/core/spectrum/decimate.ts, which keeps the sign of the largest value so that antiphase
 * peaks survive), so the picture shows the levels the panel shows.
 */
import { decimate, estimateNoise, pointToPpm, type Spectrum2D } from '../core/spectrum';
import type { ContourSet } from '../core/review/svg';
import type { ContourSettings } from '../protocol';
import { contourTile, tileToGrid } from '../../webview/contours';
import { contourLevels, FALLBACK_CONTOURS, levelUnit } from '../../webview/levels';

function range(data: Float64Array): { min: number; max: number } {
  let min = Infinity;
  let max = -Infinity;
  for (const v of data) {
    if (v < min) min = v;
    if (v > max) max = v;
  }
  return { min, max };
}

/** Rings of every level, positive then negative, on a grid of at most `cols` x `rows` cells. */
export function spectrumContours(s: Spectrum2D, cols: number, rows: number, settings: ContourSettings = FALLBACK_CONTOURS): ContourSet[] {
  const tile = decimate(s, { row0: 0, row1: s.f1.points - 1, col0: 0, col1: s.f2.points - 1 }, rows, cols);
  const { min, max } = range(s.data);
  const levels = contourLevels(levelUnit({ noise: estimateNoise(s.data), min, max }), settings);
  const gx = tileToGrid(0, s.f2.points, tile.cols);
  const gy = tileToGrid(0, s.f1.points, tile.rows);
  return contourTile(tile, levels.magnitudes).map((l) => ({
    level: l.level,
    rings: l.rings.map((r) => {
      const out = new Float64Array(r.length);
      for (let i = 0; i + 1 < r.length; i += 2) {
        out[i] = pointToPpm(s.f2, (r[i] ?? 0) * gx.scale + gx.offset);
        out[i + 1] = pointToPpm(s.f1, (r[i + 1] ?? 0) * gy.scale + gy.offset);
      }
      return out;
    }),
  }));
}
