import { estimateNoise } from '../spectrum/noise';
import type { LevelOptions } from './types';

export interface PickingLevel {
  /** Noise sigma used (given or estimated). */
  readonly noise: number;
  /** Absolute picking level: |S| must exceed it. */
  readonly level: number;
  /** Minimum prominence, absolute. */
  readonly prominence: number;
}

const DEFAULT_THRESHOLD = 6;
const DEFAULT_FLOOR = 0.005;
const DEFAULT_PROMINENCE = 5;

function checkOption(name: string, value: number | undefined, allowZero: boolean): void {
  if (value === undefined) return;
  const ok = Number.isFinite(value) && (allowZero ? value >= 0 : value > 0);
  if (!ok) throw new RangeError(`option ${name} must be a finite number ${allowZero ? '>= 0' : '> 0'}, got ${value}`);
}

/**
 * Checks the data (every value finite; `where` names the offending point) and the options, and
 * returns the noise sigma and the absolute level: max(threshold * sigma, floor * max |S|).
 */
export function pickingLevel(data: Float64Array, opts: LevelOptions, where: (i: number) => string): PickingLevel {
  checkOption('threshold', opts.threshold, false);
  checkOption('noise', opts.noise, false);
  checkOption('floor', opts.floor, true);
  checkOption('prominence', opts.prominence, true);
  let maxAbs = 0;
  for (let i = 0; i < data.length; i++) {
    const v = data[i] ?? Number.NaN;
    if (!Number.isFinite(v)) throw new RangeError(`data value at ${where(i)} is not finite (${v})`);
    const a = Math.abs(v);
    if (a > maxAbs) maxAbs = a;
  }
  const noise = opts.noise ?? estimateNoise(data);
  const threshold = opts.threshold ?? DEFAULT_THRESHOLD;
  const floor = (opts.floor ?? DEFAULT_FLOOR) * maxAbs;
  const level = Math.max(threshold * (Number.isFinite(noise) ? noise : 0), floor);
  // Capped at the level, so that an isolated peak just above the level always counts.
  const prominence = Math.min(level, (opts.prominence ?? DEFAULT_PROMINENCE) * (Number.isFinite(noise) ? noise : 0));
  return { noise, level, prominence };
}
