/**
 * Zoom and pan as pure functions of the view (ppm domains). Our own small model rather than
 * d3-zoom: a box zoom changes the aspect ratio, which d3-zoom's single scale factor k cannot
 * represent. Views stay inside the full spectrum and keep at least a few points visible.
 */
import type { Domain, Size, View } from './scales';

export interface Extent {
  /** Full domains in screen order (x: high -> low ppm; y: high -> low ppm, or top -> bottom intensity). */
  readonly x: Domain;
  readonly y: Domain;
  /** Smallest span allowed on each axis (absolute units). */
  readonly minSpanX: number;
  readonly minSpanY: number;
}

function clampDomain(d: Domain, full: Domain, minSpan: number): Domain {
  const dir = Math.sign(full[1] - full[0]) || 1;
  const fullSpan = Math.abs(full[1] - full[0]);
  let span = Math.min(fullSpan, Math.max(minSpan, Math.abs(d[1] - d[0])));
  if (!Number.isFinite(span)) span = fullSpan;
  const lo = Math.min(full[0], full[1]);
  const hi = Math.max(full[0], full[1]);
  let centre = (d[0] + d[1]) / 2;
  // A view that is not a number (a zoom factor of 0 or infinity) would stay NaN for good: show it all.
  if (!Number.isFinite(centre)) centre = (lo + hi) / 2;
  centre = Math.min(hi - span / 2, Math.max(lo + span / 2, centre));
  return dir > 0 ? [centre - span / 2, centre + span / 2] : [centre + span / 2, centre - span / 2];
}

export function clampView(v: View, e: Extent): View {
  return { x: clampDomain(v.x, e.x, e.minSpanX), y: clampDomain(v.y, e.y, e.minSpanY) };
}

export function fullView(e: Extent): View {
  return { x: e.x, y: e.y };
}

/** Data value under pixel p of an axis showing domain d over n pixels. */
function at(d: Domain, p: number, n: number): number {
  return d[0] + (p / n) * (d[1] - d[0]);
}

function zoomDomain(d: Domain, p: number, n: number, factor: number): Domain {
  const c = at(d, p, n);
  return [c + (d[0] - c) / factor, c + (d[1] - c) / factor];
}

/** Zoom by `factor` (> 1 in) keeping the value under the cursor (px, py) fixed; `axes` limits it to one axis. */
export function zoomAt(v: View, e: Extent, size: Size, px: number, py: number, factor: number, axes: 'xy' | 'x' | 'y' = 'xy'): View {
  return clampView({
    x: axes === 'y' ? v.x : zoomDomain(v.x, px, size.width, factor),
    y: axes === 'x' ? v.y : zoomDomain(v.y, py, size.height, factor),
  }, e);
}

/** Drag by (dx, dy) pixels: the content follows the pointer. */
export function pan(v: View, e: Extent, size: Size, dx: number, dy: number): View {
  const sx = ((v.x[1] - v.x[0]) / size.width) * dx;
  const sy = ((v.y[1] - v.y[0]) / size.height) * dy;
  return clampView({ x: [v.x[0] - sx, v.x[1] - sx], y: [v.y[0] - sy, v.y[1] - sy] }, e);
}

/** The view showing the pixel box between two corners (any drag direction). */
export function boxZoom(v: View, e: Extent, size: Size, x0: number, y0: number, x1: number, y1: number): View {
  const [l, r] = x0 < x1 ? [x0, x1] : [x1, x0];
  const [t, b] = y0 < y1 ? [y0, y1] : [y1, y0];
  return clampView({ x: [at(v.x, l, size.width), at(v.x, r, size.width)], y: [at(v.y, t, size.height), at(v.y, b, size.height)] }, e);
}

/** A view of `spanX` x `spanY` centred on (x, y), in the full extent's direction. */
export function centredOn(e: Extent, x: number, y: number, spanX: number, spanY: number): View {
  const sx = Math.sign(e.x[1] - e.x[0]) || 1;
  const sy = Math.sign(e.y[1] - e.y[0]) || 1;
  return clampView({ x: [x - (sx * spanX) / 2, x + (sx * spanX) / 2], y: [y - (sy * spanY) / 2, y + (sy * spanY) / 2] }, e);
}

export interface ScreenPoint {
  readonly index: number;
  readonly x: number;
  readonly y: number;
}

/** The point nearest (px, py) in screen distance, if within maxDist pixels. */
export function nearestOnScreen(points: readonly ScreenPoint[], px: number, py: number, maxDist: number): number | null {
  let best: number | null = null;
  let bestD = maxDist * maxDist;
  for (const p of points) {
    const d = (p.x - px) ** 2 + (p.y - py) ** 2;
    if (d <= bestD) {
      bestD = d;
      best = p.index;
    }
  }
  return best;
}

/** Next or previous index in a list ordered for keyboard travel, wrapping around. */
export function step(order: readonly number[], current: number | null, delta: 1 | -1): number | null {
  if (order.length === 0) return null;
  const at0 = current === null ? -1 : order.indexOf(current);
  if (at0 < 0) return delta > 0 ? (order[0] ?? null) : (order[order.length - 1] ?? null);
  return order[(at0 + delta + order.length) % order.length] ?? null;
}
