/**
 * Contour levels: a geometric series lowest x spacing^k (k = 0..levels-1) in multiples of the
 * noise, the same magnitudes on both signs. d3-contour's thresholds are lower bounds ("each
 * threshold value t is the lower bound of the region >= t", d3-contour README), so negative
 * levels are contoured on the negated grid: region (-v >= L) is exactly (v <= -L), and its ring is
 * the isoline at -L without the frame that the region v >= -L would have.
 */
import type { ContourSettings, SpectrumMeta } from '../src/protocol';

export interface Levels {
  /** Ascending positive magnitudes, data units. */
  readonly magnitudes: readonly number[];
}

export const LEVEL_LIMITS = { minLowest: 0.1, maxLowest: 1e6, minLevels: 1, maxLevels: 64, minSpacing: 1.01, maxSpacing: 10 } as const;

/**
 * The unit the levels are counted in: the noise sigma, or (noise-free simulated data) a thousandth
 * of the largest |value| so that levels still spread over the peaks.
 */
export function levelUnit(meta: Pick<SpectrumMeta, 'noise' | 'min' | 'max'>): number {
  if (Number.isFinite(meta.noise) && meta.noise > 0) return meta.noise;
  const peak = Math.max(Math.abs(meta.min), Math.abs(meta.max));
  return peak > 0 ? peak / 1000 : 1;
}

/** Validates settings with a message naming the field; used for toolbar input and init. */
export function checkContourSettings(s: ContourSettings): string | null {
  const L = LEVEL_LIMITS;
  if (!(s.lowestLevel >= L.minLowest && s.lowestLevel <= L.maxLowest)) return `lowest level must be between ${L.minLowest} and ${L.maxLowest} x noise, got ${s.lowestLevel}`;
  if (!Number.isInteger(s.levels) || s.levels < L.minLevels || s.levels > L.maxLevels) return `number of levels must be a whole number from ${L.minLevels} to ${L.maxLevels}, got ${s.levels}`;
  if (!(s.spacing >= L.minSpacing && s.spacing <= L.maxSpacing)) return `level spacing must be between ${L.minSpacing} and ${L.maxSpacing}, got ${s.spacing}`;
  return null;
}

export function contourLevels(unit: number, s: ContourSettings): Levels {
  const bad = checkContourSettings(s);
  if (bad) throw new RangeError(bad);
  if (!(unit > 0)) throw new RangeError(`level unit must be positive, got ${unit}`);
  const magnitudes: number[] = [];
  for (let k = 0; k < s.levels; k++) magnitudes.push(unit * s.lowestLevel * s.spacing ** k);
  return { magnitudes };
}

/** Part of cache keys: the same levels give the same key. */
export function levelsKey(l: Levels): string {
  return l.magnitudes.map((m) => m.toPrecision(6)).join(',');
}

/** Used when neither the saved view state nor the host's settings hold valid levels. */
export const FALLBACK_CONTOURS: ContourSettings = { lowestLevel: 8, levels: 10, spacing: 1.4 };

/** The first valid settings among the candidates (saved state, then the host's), else the fallback. */
export function usableContours(...candidates: readonly (ContourSettings | undefined)[]): ContourSettings {
  return candidates.find((c): c is ContourSettings => c !== undefined && checkContourSettings(c) === null) ?? FALLBACK_CONTOURS;
}
