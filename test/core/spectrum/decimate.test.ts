import { describe, expect, it } from 'vitest';
import { blockEdges, decimate } from '../../../src/core/spectrum/decimate';
import { makeAxis } from '../../../src/core/spectrum/axis';
import { make1D, make2D } from '../../../src/core/spectrum/spectrum';

/** 2D spectrum whose value at (r, c) is given by f. */
function grid(rows: number, cols: number, f: (r: number, c: number) => number) {
  const data = new Float64Array(rows * cols);
  for (let r = 0; r < rows; r++) for (let c = 0; c < cols; c++) data[r * cols + c] = f(r, c);
  return make2D('t', data, makeAxis(rows, 1000, 0, 600), makeAxis(cols, 2000, 0, 600));
}

describe('blockEdges', () => {
  it('splits 10 points into 3 blocks of 3, 3, 4 (floor(i * n / cells))', () => {
    expect([...blockEdges(10, 3)]).toEqual([0, 3, 6, 10]);
  });
  it('gives one point per block when cells equals points', () => {
    expect([...blockEdges(4, 4)]).toEqual([0, 1, 2, 3, 4]);
  });
});

describe('decimate', () => {
  it('copies the region unchanged when it already fits', () => {
    const s = grid(4, 5, (r, c) => r * 10 + c);
    const t = decimate(s, { row0: 1, row1: 2, col0: 2, col1: 4 }, 10, 10);
    expect(t.rows).toBe(2);
    expect(t.cols).toBe(3);
    expect([...t.data]).toEqual([12, 13, 14, 22, 23, 24]);
  });

  it('keeps the value of largest magnitude in each block with its sign', () => {
    // 2 x 4 grid -> 1 x 2 cells: left block {1, -5, 2, 3} -> -5, right block {4, 0, -1, 4.5} -> 4.5
    const values = [1, -5, 4, 0, 2, 3, -1, 4.5];
    const s = grid(2, 4, (r, c) => values[r * 4 + c] ?? 0);
    const t = decimate(s, { row0: 0, row1: 1, col0: 0, col1: 3 }, 1, 2);
    expect([...t.data]).toEqual([-5, 4.5]);
  });

  it('keeps a one-point antiphase pair that averaging would cancel', () => {
    const s = grid(8, 8, (r, c) => (r === 3 && c === 4 ? 7 : r === 3 && c === 5 ? -7 : 0));
    const t = decimate(s, { row0: 0, row1: 7, col0: 0, col1: 7 }, 2, 2);
    // rows 0-3 / cols 4-7 hold both; the first of equal magnitude (7 at col 4) wins
    expect([...t.data]).toEqual([0, 7, 0, 0]);
  });

  it('never returns more cells than asked for and covers the whole region', () => {
    const s = grid(37, 53, (r, c) => (r === 36 && c === 52 ? 9 : 0));
    const t = decimate(s, { row0: 0, row1: 36, col0: 0, col1: 52 }, 5, 7);
    expect(t.rows).toBe(5);
    expect(t.cols).toBe(7);
    expect(t.data[t.data.length - 1]).toBe(9); // the last stored point lands in the last cell
  });

  it('treats a 1D spectrum as one row', () => {
    const s = make1D('t', Float64Array.from([0, 1, -3, 2, 0, 0]), makeAxis(6, 600, 0, 600));
    const t = decimate(s, { row0: 0, row1: 0, col0: 0, col1: 5 }, 1, 3);
    expect(t.rows).toBe(1);
    expect([...t.data]).toEqual([1, -3, 0]);
  });

  it('returns NaN for a block of only NaN (a hole, not a zero)', () => {
    const s = grid(2, 2, (_r, c) => (c === 0 ? Number.NaN : 1));
    const t = decimate(s, { row0: 0, row1: 1, col0: 0, col1: 1 }, 1, 2);
    expect(Number.isNaN(t.data[0])).toBe(true);
    expect(t.data[1]).toBe(1);
  });

  it('names the bad field for a region outside the grid', () => {
    const s = grid(4, 4, () => 0);
    expect(() => decimate(s, { row0: 0, row1: 4, col0: 0, col1: 3 }, 2, 2)).toThrow('region rows 0..4 is not inside 0..3');
    expect(() => decimate(s, { row0: 0, row1: 3, col0: 2, col1: 1 }, 2, 2)).toThrow('region columns 2..1');
    expect(() => decimate(s, { row0: 0, row1: 3, col0: 0, col1: 3 }, 0, 2)).toThrow('maxRows and maxCols');
  });
});
