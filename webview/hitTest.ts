/**
 * Which peak or pick a place on the plot means, by distance on screen (what the eye sees), not in
 * ppm. Pure given the frame's geometry, so it is tested in Node. Split from panel.ts.
 */
import type { PickView } from '../src/protocol';
import { screenOf, type Frame, type Layout } from './frame';
import { nearestOnScreen } from './viewModel';

/** Clicks farther than this from every peak select nothing, CSS px. */
export const SNAP_PX = 24;
/** A pick is drawn on a peak when their markers are this close, CSS px. */
const PICK_PX = 6;

/** Peak nearest a canvas point (CSS px); 1D compares positions along F2 only. */
export function peakAt(f: Frame, L: Layout, x: number, y: number): number | null {
  const pts = f.peaks.map((k) => ({ index: k.index, ...screenOf(f, L, k.f2Ppm, k.f1Ppm) }));
  return nearestOnScreen(f.meta.dims === 2 ? pts : pts.map((p) => ({ ...p, y })), x, y, SNAP_PX);
}

/** The sidecar pick drawn on a peak, if any. */
export function pickOn(f: Frame, L: Layout, peakIndex: number | null): PickView | undefined {
  const k = f.peaks.find((p) => p.index === peakIndex);
  if (!k) return undefined;
  const at = screenOf(f, L, k.f2Ppm, k.f1Ppm);
  return f.picks.find((p) => {
    const s = screenOf(f, L, p.f2Ppm, p.f1Ppm);
    return Math.hypot(s.x - at.x, s.y - at.y) <= PICK_PX;
  });
}
