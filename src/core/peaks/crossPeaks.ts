import { pointToHz, pointToPpm, resolutionHz } from '../spectrum/axis';
import type { Spectrum2D } from '../spectrum/spectrum';
import { lobeSpan } from './extent';
import { pickExtrema2D } from './extrema2D';
import { linkExtrema, type LinkOptions } from './group2D';
import { assignPartners, diagonalFragments, isDiagonal } from './symmetry';
import type { CrossPeak, CrossPeakExtent, Extremum, LevelOptions } from './types';

export type CrossPeakOptions = LevelOptions & LinkOptions;

/**
 * Peak picking for a phase-sensitive DQF-COSY: extrema of both signs (pickExtrema2D), grouped into
 * multiplets (linkExtrema), each summarised as one CrossPeak, classified as diagonal or cross,
 * matched with its symmetric partner (an unmatched piece of a diagonal multiplet then becomes
 * diagonal: diagonalFragments), and sorted by F2 ppm descending, then F1 ppm descending
 * (sortPeaks: one F2 column at a time).
 */
export function pickCrossPeaks(s: Spectrum2D, opts: CrossPeakOptions = {}): { peaks: CrossPeak[]; noise: number; level: number } {
  const { extrema, noise, level } = pickExtrema2D(s, opts);
  const groups = linkExtrema(s, extrema, opts);
  const peaks = groups.map((g) => summarise(s, g.map((i) => extrema[i]).filter((e): e is Extremum => e !== undefined)));
  const sorted = sortPeaks(s, peaks);
  assignPartners(s, sorted);
  diagonalFragments(sorted);
  return { peaks: sorted, noise, level };
}

/** Peaks whose F2 centres lie within this many F2 points form one column for sorting. */
const COLUMN_POINTS = 2;

/**
 * F2 ppm descending, then F1 ppm descending - with the peaks of one F2 column (same proton in F2,
 * centres within COLUMN_POINTS of each other, chained) ordered by F1 alone, so that noise in the
 * F2 centroids (a fraction of a point) cannot swap a column's peaks between runs or files.
 */
function sortPeaks(s: Spectrum2D, peaks: CrossPeak[]): CrossPeak[] {
  const tol = COLUMN_POINTS * resolutionHz(s.f2) / s.f2.observeMhz;
  const byF2 = [...peaks].sort((a, b) => b.f2Ppm - a.f2Ppm || b.f1Ppm - a.f1Ppm);
  const columns: CrossPeak[][] = [];
  for (const p of byF2) {
    const column = columns[columns.length - 1];
    const last = column?.[column.length - 1];
    if (column && last && last.f2Ppm - p.f2Ppm <= tol) column.push(p);
    else columns.push([p]);
  }
  return columns.flatMap((c) => c.sort((a, b) => b.f1Ppm - a.f1Ppm || b.f2Ppm - a.f2Ppm));
}

/**
 * Centre = |height|-weighted centroid of the extrema positions. For a first-order multiplet the
 * lobes are placed and sized symmetrically about the true shifts in both dimensions, so this
 * recovers them, whereas the signed centroid of an antiphase pattern is 0/0 (the signs cancel).
 * Less sensitive than the midpoint of the extent to one weak outer lobe that barely passes the level.
 */
function summarise(s: Spectrum2D, extrema: Extremum[]): CrossPeak {
  let w = 0;
  let row = 0;
  let col = 0;
  let height = 0;
  for (const e of extrema) {
    const a = Math.abs(e.height);
    w += a;
    row += a * e.row;
    col += a * e.col;
    height = Math.max(height, a);
  }
  row /= w;
  col /= w;
  const f1Ppm = pointToPpm(s.f1, row);
  const f2Ppm = pointToPpm(s.f2, col);
  const peak: CrossPeak = {
    f1Ppm,
    f2Ppm,
    f1Hz: pointToHz(s.f1, row),
    f2Hz: pointToHz(s.f2, col),
    kind: 'cross',
    height,
    extent: extentOf(s, extrema),
    extrema: [...extrema].sort((a, b) => a.row - b.row || a.col - b.col),
    partner: null,
  };
  peak.kind = isDiagonal(s, peak) ? 'diagonal' : 'cross';
  return peak;
}

/** Union of the half-height spans of every lobe, along its own row (F2) and column (F1). */
function extentOf(s: Spectrum2D, extrema: readonly Extremum[]): CrossPeakExtent {
  const n = s.f2.points;
  let row0 = Infinity;
  let row1 = -Infinity;
  let col0 = Infinity;
  let col1 = -Infinity;
  for (const e of extrema) {
    const start = e.gridRow * n + e.gridCol;
    const [c0, c1] = lobeSpan(s.data, start, 1, e.gridCol, n, e.sign);
    const [r0, r1] = lobeSpan(s.data, start, n, e.gridRow, s.f1.points, e.sign);
    row0 = Math.min(row0, r0);
    row1 = Math.max(row1, r1);
    col0 = Math.min(col0, c0);
    col1 = Math.max(col1, c1);
  }
  const p1 = [pointToPpm(s.f1, row0), pointToPpm(s.f1, row1)];
  const p2 = [pointToPpm(s.f2, col0), pointToPpm(s.f2, col1)];
  return {
    f1FromPpm: Math.max(...p1),
    f1ToPpm: Math.min(...p1),
    f2FromPpm: Math.max(...p2),
    f2ToPpm: Math.min(...p2),
    row0,
    row1,
    col0,
    col1,
  };
}
