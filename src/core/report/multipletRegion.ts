/**
 * The region a 1D multiplet is analysed and integrated over: the chemist's own (`from_ppm`/`to_ppm`
 * on the pick) when set, else the automatic extent of the picked lines widened by the line tails,
 * but never past the midpoint to a neighbouring multiplet (so two neighbours never share points).
 */
import type { Multiplet1D } from '../peaks/types';

/** Extra width on each side of a multiplet's outer lines (Lorentzian tails), Hz. */
export const TAIL_HZ = 6;

/** [from, to] in ppm, high to low, for multiplets[i] of one spectrum (sorted high to low ppm, as pickMultiplets1D returns them). */
export function autoRegion(multiplets: readonly Multiplet1D[], i: number, observeMhz: number): [number, number] {
  const m = multiplets[i];
  if (!m) throw new RangeError(`no multiplet ${i} (${multiplets.length} picked)`);
  const tail = TAIL_HZ / observeMhz;
  const up = multiplets[i - 1];
  const down = multiplets[i + 1];
  const from = Math.min(m.fromPpm + tail, up ? (up.toPpm + m.fromPpm) / 2 : Infinity);
  const to = Math.max(m.toPpm - tail, down ? (down.fromPpm + m.toPpm) / 2 : -Infinity);
  return [from, to];
}

/** Farthest a shift may lie outside a multiplet's extent and still mean it, ppm (as the panel and the 2D snap). */
export const MAX_DISTANCE_PPM = 0.1;

/**
 * Index of the multiplet whose extent (widened by the tails) holds ppm, else the nearest within
 * MAX_DISTANCE_PPM; null when none is that close (a shift in an empty stretch means no multiplet).
 */
export function multipletAt(multiplets: readonly Multiplet1D[], ppm: number, observeMhz: number): number | null {
  const tail = TAIL_HZ / observeMhz;
  let best: number | null = null;
  let bestDistance = MAX_DISTANCE_PPM;
  multiplets.forEach((m, i) => {
    const d = ppm > m.fromPpm + tail ? ppm - m.fromPpm - tail : ppm < m.toPpm - tail ? m.toPpm - tail - ppm : 0;
    if (d < bestDistance) {
      best = i;
      bestDistance = d;
    }
  });
  return best;
}
