/**
 * Which part of the grid to request, at which decimation, for a view and a canvas. The stride
 * (stored points per cell) is rounded UP to a power of two so that one zoom level maps to one
 * stride (a cache key), and never gives more cells than pixels over the visible span. The region
 * is the view plus a margin, snapped to a lattice of whole chunks so that small pans reuse the
 * cached tile and the ring a tile edge closes falls outside the visible plot.
 */
import type { GridRegion } from '../src/protocol';

/** Visible span in fractional stored point indices (lo <= hi on both axes). */
export interface PointWindow {
  readonly row0: number;
  readonly row1: number;
  readonly col0: number;
  readonly col1: number;
}

export interface TilePlan {
  readonly region: GridRegion;
  readonly maxRows: number;
  readonly maxCols: number;
  readonly rowStride: number;
  readonly colStride: number;
  /** Same region and decimation <=> same key. */
  readonly key: string;
}

export interface TileOptions {
  /** Screen pixels per contour cell (1 = full canvas resolution; 2 = half). */
  readonly pixelsPerCell: number;
  /** Extra fraction of the visible span requested on each side. */
  readonly margin: number;
  /** Region edges snap to multiples of this many cells. */
  readonly chunkCells: number;
}

export const DEFAULT_TILE_OPTIONS: TileOptions = { pixelsPerCell: 1, margin: 0.125, chunkCells: 32 };

/** Smallest power of two >= x (x >= 1). */
export function strideFor(pointsVisible: number, cellsAvailable: number): number {
  const need = pointsVisible / Math.max(1, cellsAvailable);
  let s = 1;
  while (s < need) s *= 2;
  return s;
}

function axisPlan(lo: number, hi: number, points: number, pixels: number, o: TileOptions): { a: number; b: number; stride: number; max: number } {
  const visible = Math.max(1, hi - lo + 1);
  const stride = strideFor(visible, Math.floor(pixels / o.pixelsPerCell));
  const chunk = stride * o.chunkCells;
  const pad = visible * o.margin;
  const a = Math.max(0, Math.floor((lo - pad) / chunk) * chunk);
  const b = Math.min(points - 1, Math.ceil((hi + pad + 1) / chunk) * chunk - 1);
  const n = b - a + 1;
  return { a, b, stride, max: Math.max(1, Math.ceil(n / stride)) };
}

/** The tile to request for a view; rows/cols are the grid's sizes (1D: rows = 1). */
export function planTile(view: PointWindow, grid: { rows: number; cols: number }, canvas: { width: number; height: number }, o: TileOptions = DEFAULT_TILE_OPTIONS): TilePlan {
  const c = axisPlan(view.col0, view.col1, grid.cols, canvas.width, o);
  const r = grid.rows === 1 ? { a: 0, b: 0, stride: 1, max: 1 } : axisPlan(view.row0, view.row1, grid.rows, canvas.height, o);
  const region: GridRegion = { row0: r.a, row1: r.b, col0: c.a, col1: c.b };
  return {
    region,
    maxRows: r.max,
    maxCols: c.max,
    rowStride: r.stride,
    colStride: c.stride,
    key: `${r.stride}x${c.stride}:${r.a}-${r.b}:${c.a}-${c.b}`,
  };
}

/** True when the tile's region covers the whole visible window (so it can be drawn as is). */
export function covers(region: GridRegion, view: PointWindow): boolean {
  return region.row0 <= Math.max(0, Math.floor(view.row0)) && region.col0 <= Math.max(0, Math.floor(view.col0)) && region.row1 >= Math.ceil(view.row1) && region.col1 >= Math.ceil(view.col1);
}
