/**
 * From a view in ppm to what is visible in stored point indices (for tile planning), and the
 * intensity range a 1D view should show. Pure, tested in Node.
 */
import type { GridRegion, SpectrumMeta } from '../src/protocol';
import type { TileData } from './contours';
import { fullDomain, ppmToPoint, type Domain, type View } from './scales';
import type { Extent } from './viewModel';
import type { PointWindow } from './tiles';

/** Visible fractional point ranges (clamped to the grid; lo <= hi). A 1D spectrum is row 0. */
export function pointWindowOf(meta: Pick<SpectrumMeta, 'f1' | 'f2'>, view: View): PointWindow {
  const span = (a: SpectrumMeta['f2'], d: Domain): [number, number] => {
    const p0 = ppmToPoint(a, d[0]);
    const p1 = ppmToPoint(a, d[1]);
    return [Math.max(0, Math.min(p0, p1)), Math.min(a.points - 1, Math.max(p0, p1))];
  };
  const [col0, col1] = span(meta.f2, view.x);
  const [row0, row1] = meta.f1 ? span(meta.f1, view.y) : [0, 0];
  return { row0, row1, col0, col1 };
}

/**
 * Intensity domain [top, bottom] for the cells of a 1D tile whose centres fall in the window,
 * with a margin of `pad` times the range; null when they are all equal or none is visible.
 */
export function intensityDomain(tile: TileData, region: GridRegion, win: PointWindow, pad = 0.08): Domain | null {
  const k = (region.col1 - region.col0 + 1) / tile.cols;
  let lo = Infinity;
  let hi = -Infinity;
  for (let j = 0; j < tile.cols; j++) {
    const c = region.col0 + (j + 0.5) * k - 0.5; // centre of cell j (see contours.tileToGrid)
    if (c < win.col0 || c > win.col1) continue;
    const v = tile.data[j] ?? 0;
    lo = Math.min(lo, v);
    hi = Math.max(hi, v);
  }
  if (!(hi > lo)) return null;
  return [hi + pad * (hi - lo), lo - pad * (hi - lo)];
}

/**
 * The whole spectrum as a view extent. 2D: both ppm axes, at least 8 points visible each way.
 * 1D: F2 ppm and the intensity range with a 5 % margin.
 */
export function extentOf(m: Pick<SpectrumMeta, 'f1' | 'f2' | 'min' | 'max'>): Extent {
  const x = fullDomain(m.f2);
  const minSpanX = (Math.abs(x[0] - x[1]) / (m.f2.points - 1)) * 8;
  if (m.f1) {
    const y = fullDomain(m.f1);
    return { x, y, minSpanX, minSpanY: (Math.abs(y[0] - y[1]) / (m.f1.points - 1)) * 8 };
  }
  const range = m.max - m.min || 1;
  return { x, y: [m.max + 0.05 * range, m.min - 0.05 * range], minSpanX, minSpanY: range / 1e4 };
}
