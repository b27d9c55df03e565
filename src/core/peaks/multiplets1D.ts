import { pointToHz, pointToPpm, resolutionHz } from '../spectrum/axis';
import type { Spectrum1D } from '../spectrum/spectrum';
import { lobeSpan } from './extent';
import { lorentzianPeak } from './interpolate';
import { pickingLevel } from './level';
import type { LevelOptions, Line1D, Multiplet1D } from './types';

export interface Multiplet1DOptions extends LevelOptions {
  /**
   * Lines closer than this, Hz, belong to one multiplet (default 20): adjacent lines of a
   * first-order multiplet are at most the largest J apart (1H-1H J rarely above 18 Hz: handbook
   * tables, from memory).
   */
  maxGapHz?: number;
}

const DEFAULT_MAX_GAP_HZ = 20;
const PROMINENCE_WALK = 256;

/**
 * 1D multiplets: positive local maxima above the level (threshold * sigma) and prominent enough,
 * interpolated through 1/y (exact for Lorentzian lines: lorentzianPeak), grouped by single linkage along
 * the axis (a new multiplet starts at a gap wider than maxGapHz). Centre = height-weighted centroid
 * of the lines; extent = outermost lines to half their height. Sorted by ppm descending.
 */
export function pickMultiplets1D(s: Spectrum1D, opts: Multiplet1DOptions = {}): { multiplets: Multiplet1D[]; noise: number; level: number } {
  const n = s.axis.points;
  if (n < 3) throw new RangeError(`spectrum '${s.title}' needs at least 3 points to pick peaks, has ${n}`);
  if (s.data.length !== n) throw new RangeError(`spectrum '${s.title}' has ${s.data.length} values, its axis needs ${n}`);
  const maxGapHz = opts.maxGapHz ?? DEFAULT_MAX_GAP_HZ;
  if (!(maxGapHz > 0) || !Number.isFinite(maxGapHz)) throw new RangeError(`option maxGapHz must be a finite number > 0, got ${maxGapHz}`);
  const { noise, level, prominence } = pickingLevel(s.data, opts, (i) => `spectrum '${s.title}', point ${i}`);
  const lines = pickLines(s, level, prominence);
  const gapPoints = maxGapHz / resolutionHz(s.axis);
  const multiplets: Multiplet1D[] = [];
  let group: Line1D[] = [];
  for (const line of lines) {
    const last = group[group.length - 1];
    if (last && line.point - last.point > gapPoints) {
      multiplets.push(summarise(s, group));
      group = [];
    }
    group.push(line);
  }
  if (group.length > 0) multiplets.push(summarise(s, group));
  multiplets.sort((a, b) => b.ppm - a.ppm);
  return { multiplets, noise, level };
}

/** Local maxima in point order (ties: strictly above the left neighbour, not below the right). */
function pickLines(s: Spectrum1D, level: number, prominence: number): Line1D[] {
  const d = s.data;
  const lines: Line1D[] = [];
  for (let i = 1; i < d.length - 1; i++) {
    const v = d[i] ?? 0;
    const l = d[i - 1] ?? 0;
    const r = d[i + 1] ?? 0;
    if (!(v > level && v > l && v >= r)) continue;
    if (prominence > 0 && Math.min(fall(d, i, -1), fall(d, i, 1)) < prominence) continue;
    const { offset, height } = lorentzianPeak(l, v, r);
    const point = i + offset;
    lines.push({ point, hz: pointToHz(s.axis, point), ppm: pointToPpm(s.axis, point), height });
  }
  return lines;
}

/** How far S falls from point i in one direction before a larger value, zero or the edge (see extrema2D). */
function fall(d: Float64Array, i: number, step: 1 | -1): number {
  const h = d[i] ?? 0;
  let min = h;
  for (let k = 1, j = i + step; k <= PROMINENCE_WALK && j >= 0 && j < d.length; k++, j += step) {
    const v = d[j] ?? 0;
    if (v <= 0) return h;
    if (v > h) return h - min;
    if (v < min) min = v;
  }
  return h - min;
}

function summarise(s: Spectrum1D, lines: Line1D[]): Multiplet1D {
  let w = 0;
  let p = 0;
  let height = 0;
  for (const l of lines) {
    w += l.height;
    p += l.height * l.point;
    height = Math.max(height, l.height);
  }
  p /= w;
  const first = lines[0];
  const last = lines[lines.length - 1];
  const i0 = Math.round((first?.point ?? p));
  const i1 = Math.round((last?.point ?? p));
  const point0 = lobeSpan(s.data, i0, 1, i0, s.axis.points, 1)[0];
  const point1 = lobeSpan(s.data, i1, 1, i1, s.axis.points, 1)[1];
  const ppms = [pointToPpm(s.axis, point0), pointToPpm(s.axis, point1)];
  return {
    ppm: pointToPpm(s.axis, p),
    hz: pointToHz(s.axis, p),
    fromPpm: Math.max(...ppms),
    toPpm: Math.min(...ppms),
    point0,
    point1,
    height,
    lines,
  };
}
