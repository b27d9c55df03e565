/**
 * Decimation of a grid region for display: the webview asks for a region at (at most) its screen
 * resolution and the host answers with this. Each output cell covers a block of stored points and
 * keeps the value of largest magnitude WITH its sign, so a narrow antiphase peak never averages
 * away: a plain mean of +a and -a next to each other would draw nothing at all.
 */
import type { Spectrum } from './spectrum';

/** Inclusive index ranges on the stored grid (rows = F1 points, cols = F2 points; 1D: row 0). */
export interface DecimateRegion {
  readonly row0: number;
  readonly row1: number;
  readonly col0: number;
  readonly col1: number;
}

export interface DecimatedTile {
  readonly rows: number;
  readonly cols: number;
  /** Row-major, rows x cols. */
  readonly data: Float32Array;
}

/**
 * Start index (relative to the region) of each of `cells` blocks over `n` points, plus the end:
 * block i covers [edges[i], edges[i + 1]). Blocks differ in size by at most one point.
 */
export function blockEdges(n: number, cells: number): Int32Array {
  const edges = new Int32Array(cells + 1);
  for (let i = 0; i <= cells; i++) edges[i] = Math.floor((i * n) / cells);
  return edges;
}

function checkRange(name: string, lo: number, hi: number, points: number): void {
  if (!Number.isInteger(lo) || !Number.isInteger(hi) || lo < 0 || hi < lo || hi >= points) {
    throw new RangeError(`decimate: region ${name} ${lo}..${hi} is not inside 0..${points - 1}`);
  }
}

/**
 * The region [row0..row1] x [col0..col1] reduced to at most maxRows x maxCols cells, each the
 * stored value of largest |value| in its block (sign kept). Without reduction the values are copied.
 */
export function decimate(s: Spectrum, region: DecimateRegion, maxRows: number, maxCols: number): DecimatedTile {
  if (!Number.isInteger(maxRows) || maxRows < 1 || !Number.isInteger(maxCols) || maxCols < 1) {
    throw new RangeError(`decimate: maxRows and maxCols must be positive integers, got ${maxRows} and ${maxCols}`);
  }
  const width = s.dims === 2 ? s.f2.points : s.axis.points;
  const height = s.dims === 2 ? s.f1.points : 1;
  checkRange('rows', region.row0, region.row1, height);
  checkRange('columns', region.col0, region.col1, width);
  const nRows = region.row1 - region.row0 + 1;
  const nCols = region.col1 - region.col0 + 1;
  const rows = Math.min(nRows, maxRows);
  const cols = Math.min(nCols, maxCols);
  const rowEdges = blockEdges(nRows, rows);
  const colEdges = blockEdges(nCols, cols);
  const out = new Float32Array(rows * cols);
  // Best value and its magnitude per output column of the current output row: one pass over the
  // stored rows in memory order (the source can be 4096 x 4096; striding by column would thrash).
  const best = new Float64Array(cols);
  const bestAbs = new Float64Array(cols);
  const src = s.data;
  for (let i = 0; i < rows; i++) {
    best.fill(Number.NaN); // a block of only NaN (a hole) stays NaN
    bestAbs.fill(-1);
    const r0 = region.row0 + (rowEdges[i] ?? 0);
    const r1 = region.row0 + (rowEdges[i + 1] ?? 0);
    for (let r = r0; r < r1; r++) {
      const base = r * width + region.col0;
      for (let j = 0; j < cols; j++) {
        const c1 = colEdges[j + 1] ?? 0;
        let b = best[j] ?? 0;
        let ba = bestAbs[j] ?? -1;
        for (let c = colEdges[j] ?? 0; c < c1; c++) {
          const v = src[base + c] ?? 0;
          const a = Math.abs(v);
          if (a > ba) {
            ba = a;
            b = v;
          }
        }
        best[j] = b;
        bestAbs[j] = ba;
      }
    }
    out.set(best, i * cols);
  }
  return { rows, cols, data: out };
}
