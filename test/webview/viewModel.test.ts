import { describe, expect, it } from 'vitest';
import { boxZoom, centredOn, clampView, nearestOnScreen, pan, step, zoomAt, type Extent } from '../../webview/viewModel';

// F2 10 -> 0 ppm over 1000 px (100 px per ppm), F1 10 -> 0 ppm over 500 px (50 px per ppm).
const extent: Extent = { x: [10, 0], y: [10, 0], minSpanX: 0.01, minSpanY: 0.01 };
const size = { width: 1000, height: 500 };
const full = { x: extent.x, y: extent.y };

describe('zoomAt', () => {
  it('keeps the ppm under the cursor fixed (2x at 7.5 ppm F2, 5 ppm F1)', () => {
    const v = zoomAt(full, extent, size, 250, 250, 2);
    expect(v.x).toEqual([8.75, 3.75]); // 7.5 + (10 - 7.5)/2, 7.5 + (0 - 7.5)/2
    expect(v.y).toEqual([7.5, 2.5]);
  });
  it('zooms one axis only when asked (1D: along F2)', () => {
    const v = zoomAt(full, extent, size, 500, 250, 2, 'x');
    expect(v.y).toEqual([10, 0]);
    expect(v.x).toEqual([7.5, 2.5]);
  });
  it('cannot zoom out beyond the whole spectrum', () => {
    expect(zoomAt(full, extent, size, 100, 100, 0.25)).toEqual(full);
  });
});

describe('clampView', () => {
  it('falls back to the whole spectrum for a view that is not a number (an extreme wheel delta, a damaged state)', () => {
    expect(clampView({ x: [Number.NaN, 3], y: [10, 0] }, extent)).toEqual(full);
    expect(zoomAt(full, extent, size, 500, 250, 0)).toEqual(full); // factor 0: exp(-deltaY * k) for a huge deltaY
    expect(zoomAt(full, extent, size, 500, 250, Number.POSITIVE_INFINITY).x.every(Number.isFinite)).toBe(true);
  });
});

describe('pan', () => {
  it('moves the content with the pointer: dragging right by 100 px shows 1 ppm more on the high-ppm side', () => {
    const v = zoomAt(full, extent, size, 500, 250, 2);
    const p = pan(v, extent, size, 100, 0);
    expect(p.x[0]).toBeCloseTo(v.x[0] + 0.5, 12); // half-width view: 0.5 ppm per 100 px
    expect(p.x[1]).toBeCloseTo(v.x[1] + 0.5, 12);
  });
  it('stops at the edge of the spectrum without changing the span', () => {
    const v = zoomAt(full, extent, size, 500, 250, 2);
    const p = pan(v, extent, size, 5000, 0);
    expect(p.x).toEqual([10, 5]);
  });
});

describe('boxZoom', () => {
  it('shows the dragged box in either drag direction', () => {
    const a = boxZoom(full, extent, size, 100, 50, 300, 150);
    const b = boxZoom(full, extent, size, 300, 150, 100, 50);
    expect(a).toEqual({ x: [9, 7], y: [9, 7] });
    expect(b).toEqual(a);
  });
});

describe('clampView and centredOn', () => {
  it('enforces the smallest span', () => {
    const v = clampView({ x: [5.001, 5], y: [5, 4] }, extent);
    expect(Math.abs(v.x[0] - v.x[1])).toBeCloseTo(0.01, 12);
  });
  it('centres a view on a peak in screen order (high ppm first)', () => {
    expect(centredOn(extent, 4, 3, 1, 2)).toEqual({ x: [4.5, 3.5], y: [4, 2] });
  });
});

describe('nearestOnScreen and step', () => {
  const pts = [{ index: 7, x: 10, y: 10 }, { index: 3, x: 40, y: 10 }];
  it('snaps to the nearest point in screen distance within the radius', () => {
    expect(nearestOnScreen(pts, 30, 12, 20)).toBe(3);
    expect(nearestOnScreen(pts, 12, 25, 20)).toBe(7); // 15.1 px away
    expect(nearestOnScreen(pts, 12, 30, 20)).toBeNull(); // 20.1 px away
    expect(nearestOnScreen(pts, 100, 100, 20)).toBeNull();
  });
  it('walks the order and wraps around', () => {
    expect(step([7, 3, 5], null, 1)).toBe(7);
    expect(step([7, 3, 5], null, -1)).toBe(5);
    expect(step([7, 3, 5], 5, 1)).toBe(7);
    expect(step([7, 3, 5], 7, -1)).toBe(5);
    expect(step([], 1, 1)).toBeNull();
  });
});
