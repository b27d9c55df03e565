import { describe, expect, it } from 'vitest';
import { joinHalves } from '../../../src/core/peaks/fragments';
import type { Extremum } from '../../../src/core/peaks/types';

/** Hand-built extremum at (row, col) with a sign; only position and sign matter to joinHalves. */
function ex(row: number, col: number, sign: 1 | -1): Extremum {
  return { row, col, f1Ppm: 0, f2Ppm: 0, f1Hz: 0, f2Hz: 0, height: sign * 10, sign, gridRow: Math.round(row), gridCol: Math.round(col) };
}

describe('joinHalves (hand-checkable grids)', () => {
  it('joins two one-row groups of opposite sign in the same columns', () => {
    const e = [ex(10, 50, 1), ex(10, 55, -1), ex(14.5, 50, -1), ex(14.5, 55, 1)];
    expect(joinHalves(e, [[0, 1], [2, 3]], 6, 20)).toEqual([[0, 1, 2, 3]]);
  });

  it('joins a half reduced to one lobe when the columns are within reach2', () => {
    const e = [ex(10, 50, 1), ex(10, 55, -1), ex(14.5, 62, 1)];
    expect(joinHalves(e, [[0, 1], [2]], 6, 20)).toEqual([[0, 1, 2]]);
  });

  it('keeps groups with a same-sign lobe at the same column apart (in-phase in F1: not one multiplet)', () => {
    const e = [ex(10, 50, 1), ex(10, 55, -1), ex(14.5, 50.5, 1), ex(14.5, 55, -1)];
    expect(joinHalves(e, [[0, 1], [2, 3]], 6, 20)).toEqual([[0, 1], [2, 3]]);
  });

  it('keeps groups more than reach1 rows apart, or spanning more than one row, apart', () => {
    const far = [ex(10, 50, 1), ex(17, 50, -1)];
    expect(joinHalves(far, [[0], [1]], 6, 20)).toEqual([[0], [1]]);
    const whole = [ex(10, 50, 1), ex(12, 50, -1), ex(15, 50, -1)];
    expect(joinHalves(whole, [[0, 1], [2]], 6, 20)).toEqual([[0, 1], [2]]);
  });

  it('joins each half once, the closest pair first', () => {
    const e = [ex(10, 50, 1), ex(13, 50, -1), ex(15, 50, 1)];
    expect(joinHalves(e, [[0], [1], [2]], 6, 20)).toEqual([[0], [1, 2]]);
  });
});
