/**
 * What one frame of the plot shows and where: the layout of the canvas, the frame's content, and
 * the screen position of a place in ppm. No DOM, so hit testing (hitTest.ts) is tested in Node;
 * plot.ts draws it.
 */
import type { MultipletView, PeakView, PickView, ReviewMarkView, SpectrumMeta } from '../src/protocol';
import type { CacheEntry } from './contourCache';
import { xScale, yScale, type Size, type View } from './scales';

export interface Layout {
  readonly dpr: number;
  readonly css: Size;
  /** Plot area inside the canvas, CSS pixels. */
  readonly left: number;
  readonly top: number;
  readonly plot: Size;
}

export const MARGIN = { left: 58, right: 14, top: 10, bottom: 40 } as const;

export function layoutFor(css: Size, dpr: number): Layout {
  return { dpr, css, left: MARGIN.left, top: MARGIN.top, plot: { width: Math.max(10, css.width - MARGIN.left - MARGIN.right), height: Math.max(10, css.height - MARGIN.top - MARGIN.bottom) } };
}

export interface Frame {
  readonly meta: SpectrumMeta;
  readonly view: View;
  readonly tiles: readonly CacheEntry[];
  readonly levelCount: number;
  readonly peaks: readonly PeakView[];
  readonly picks: readonly PickView[];
  readonly selected: number | null;
  readonly box: { x0: number; y0: number; x1: number; y1: number } | null;
  /** Changes since another revision (review.ts), and the one in focus. */
  readonly marks?: readonly ReviewMarkView[];
  readonly markFocus?: number | null;
  /** 1D: the selected multiplet's analysis (region band, fitted curve, line positions). */
  readonly multiplet?: MultipletView | null;
}

/** Screen position (CSS px, canvas coordinates) of a peak or pick; 1D markers sit near the top. */
export function screenOf(f: Frame, L: Layout, f2Ppm: number, f1Ppm: number | undefined): { x: number; y: number } {
  const x = xScale(f.view, L.plot)(f2Ppm) + L.left;
  const y = f.meta.dims === 2 && f1Ppm !== undefined ? yScale(f.view, L.plot)(f1Ppm) + L.top : L.top + 14;
  return { x, y };
}
