import type { Spectrum2D } from './spectrum';

function checkIndex(name: string, i: number, n: number): void {
  if (!Number.isInteger(i) || i < 0 || i >= n) throw new RangeError(`${name} ${i} outside 0..${n - 1}`);
}

/** The F2 trace at F1 point `row` (a view, not a copy). */
export function row(s: Spectrum2D, r: number): Float64Array {
  checkIndex('row', r, s.f1.points);
  const n = s.f2.points;
  return s.data.subarray(r * n, (r + 1) * n);
}

/** The F1 trace at F2 point `col` (a copy). */
export function column(s: Spectrum2D, c: number): Float64Array {
  checkIndex('column', c, s.f2.points);
  const out = new Float64Array(s.f1.points);
  const n = s.f2.points;
  for (let r = 0; r < out.length; r++) out[r] = s.data[r * n + c] ?? 0;
  return out;
}

/** Rows r0..r1 and columns c0..c1 inclusive, clamped to the data, as a row-major copy. */
export interface Region {
  readonly data: Float64Array;
  readonly rows: number;
  readonly cols: number;
  readonly row0: number;
  readonly col0: number;
}

export function region(s: Spectrum2D, r0: number, r1: number, c0: number, c1: number): Region {
  const rowA = Math.max(0, Math.min(r0, r1));
  const rowB = Math.min(s.f1.points - 1, Math.max(r0, r1));
  const colA = Math.max(0, Math.min(c0, c1));
  const colB = Math.min(s.f2.points - 1, Math.max(c0, c1));
  if (rowB < rowA || colB < colA) throw new RangeError('region lies outside the spectrum');
  const rows = rowB - rowA + 1;
  const cols = colB - colA + 1;
  const data = new Float64Array(rows * cols);
  for (let r = 0; r < rows; r++) {
    const start = (rowA + r) * s.f2.points + colA;
    data.set(s.data.subarray(start, start + cols), r * cols);
  }
  return { data, rows, cols, row0: rowA, col0: colA };
}

/** A strip: the sum of F2 traces over rows r0..r1 inclusive (e.g. across a cross peak's F1 extent). */
export function stripSum(s: Spectrum2D, r0: number, r1: number): Float64Array {
  const out = new Float64Array(s.f2.points);
  for (let r = Math.max(0, r0); r <= Math.min(s.f1.points - 1, r1); r++) {
    const tr = row(s, r);
    for (let c = 0; c < out.length; c++) out[c] = (out[c] ?? 0) + (tr[c] ?? 0);
  }
  return out;
}
