import type { CrossPeak } from './types';

const DEFAULT_MAX_DISTANCE_PPM = 0.1;

/**
 * The cross peak a click at (f2Ppm, f1Ppm) means: the smallest Euclidean distance, in ppm, from the
 * point to the peak's extent box (0 inside it). ppm in both dimensions, because a homonuclear
 * COSY is drawn on a square ppm plot, so this matches what the user sees. Ties (e.g. a click inside
 * two overlapping boxes) go to the nearer centre, then to the lower index. Returns null when no box
 * lies within maxDistancePpm (default 0.1 ppm).
 */
export function nearestCrossPeak(
  peaks: readonly CrossPeak[],
  f2Ppm: number,
  f1Ppm: number,
  opts: { maxDistancePpm?: number } = {},
): number | null {
  if (!Number.isFinite(f2Ppm) || !Number.isFinite(f1Ppm)) {
    throw new RangeError(`click position must be finite ppm values, got F2 ${f2Ppm}, F1 ${f1Ppm}`);
  }
  const maxDistance = opts.maxDistancePpm ?? DEFAULT_MAX_DISTANCE_PPM;
  if (!(maxDistance >= 0) || !Number.isFinite(maxDistance)) {
    throw new RangeError(`option maxDistancePpm must be a finite number >= 0, got ${maxDistance}`);
  }
  let best: number | null = null;
  let bestBox = Infinity;
  let bestCentre = Infinity;
  peaks.forEach((p, i) => {
    const box = Math.hypot(outside(f2Ppm, p.extent.f2ToPpm, p.extent.f2FromPpm), outside(f1Ppm, p.extent.f1ToPpm, p.extent.f1FromPpm));
    const centre = Math.hypot(f2Ppm - p.f2Ppm, f1Ppm - p.f1Ppm);
    if (box > maxDistance) return;
    if (box < bestBox || (box === bestBox && centre < bestCentre)) {
      best = i;
      bestBox = box;
      bestCentre = centre;
    }
  });
  return best;
}

/** Distance of x outside the interval [lo, hi], 0 inside. */
function outside(x: number, lo: number, hi: number): number {
  return x < lo ? lo - x : x > hi ? x - hi : 0;
}
