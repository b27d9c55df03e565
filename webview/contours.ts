/**
 * Contour geometry for one decimated tile with d3-contour (marching squares with linear
 * interpolation). Output stays in tile coordinates, where d3-contour places sample (i, j) at
 * (i + 0.5, j + 0.5) (d3-contour README: "the grid ... [0, n] x [0, m]"; its smoothing puts each
 * value at the cell centre), and `tileToGrid` maps it to stored point indices. Plain data only:
 * the canvas code turns rings into paths, the snapshot test into SVG path strings.
 */
// d3-contour only indexes the values (values[i]), so a typed array is passed without copying.
import { contours } from 'd3-contour';

export interface TileData {
  readonly rows: number;
  readonly cols: number;
  readonly data: Float32Array;
}

/** Rings of one level: each ring a flat [x0, y0, x1, y1, ...] list in tile coordinates. */
export interface LevelRings {
  /** Signed level (data units). */
  readonly level: number;
  readonly rings: readonly Float32Array[];
}

/** Negated copy: negative levels are contoured as positive ones on -v (see levels.ts). */
export function negate(data: Float32Array): Float32Array {
  const out = new Float32Array(data.length);
  for (let i = 0; i < data.length; i++) out[i] = -(data[i] ?? 0);
  return out;
}

/** Largest value of a grid (levels above it have no contour and are skipped). */
export function maxOf(data: Float32Array): number {
  let m = -Infinity;
  for (let i = 0; i < data.length; i++) {
    const v = data[i] ?? -Infinity;
    if (v > m) m = v;
  }
  return m;
}

/**
 * Rings of the isoline at `magnitude` on `values` (pass the negated grid for a negative level; the
 * returned `level` carries the sign). Holes are returned as rings too: drawn as strokes they are
 * simply further isolines.
 */
export function contourLevel(tile: TileData, values: Float32Array, magnitude: number, sign: 1 | -1): LevelRings {
  if (values.length !== tile.rows * tile.cols) throw new RangeError(`contourLevel: ${values.length} values for a ${tile.rows} x ${tile.cols} tile`);
  const rings: Float32Array[] = [];
  if (tile.rows >= 2 && tile.cols >= 2) {
    const mp = contours().size([tile.cols, tile.rows]).contour(values as unknown as number[], magnitude);
    for (const polygon of mp.coordinates) {
      for (const ring of polygon) {
        const flat = new Float32Array(ring.length * 2);
        ring.forEach((p, i) => {
          flat[2 * i] = p[0] ?? 0;
          flat[2 * i + 1] = p[1] ?? 0;
        });
        rings.push(flat);
      }
    }
  }
  return { level: sign * magnitude, rings };
}

/** Every level of a tile, positive then negative, lowest first (what a synchronous caller needs). */
export function contourTile(tile: TileData, magnitudes: readonly number[]): LevelRings[] {
  const neg = negate(tile.data);
  const maxPos = maxOf(tile.data);
  const maxNeg = maxOf(neg);
  const out: LevelRings[] = [];
  for (const m of magnitudes) if (m <= maxPos) out.push(contourLevel(tile, tile.data, m, 1));
  for (const m of magnitudes) if (m <= maxNeg) out.push(contourLevel(tile, neg, m, -1));
  return out;
}

/** Tile coordinate -> stored point index, per axis: point = start + u * stride - 0.5. */
export function tileToGrid(regionStart: number, regionPoints: number, cells: number): { scale: number; offset: number } {
  const stride = regionPoints / cells;
  return { scale: stride, offset: regionStart - 0.5 };
}

/** SVG path data of rings (for snapshots and `couplet render`-like output), fixed decimals. */
export function ringsToSvgPath(rings: readonly Float32Array[], decimals = 2): string {
  const f = (v: number | undefined): string => (v ?? 0).toFixed(decimals);
  return rings
    .map((r) => {
      let d = `M${f(r[0])},${f(r[1])}`;
      for (let i = 2; i < r.length; i += 2) d += `L${f(r[i])},${f(r[i + 1])}`;
      return `${d}Z`;
    })
    .join('');
}
