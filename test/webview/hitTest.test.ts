/**
 * Hit testing on the plot (webview/hitTest.ts). Geometry by hand: F2 and F1 run from 5 to 3 ppm
 * (3000..1800 Hz at 600 MHz) over a 400 x 200 px plot whose corner is at (58, 10) (plot.ts MARGIN),
 * so 4.0 ppm is at x = 58 + 200 = 258 and y = 10 + 100 = 110.
 */
import { describe, expect, it } from 'vitest';
import type { PeakView, PickView, SpectrumMeta } from '../../src/protocol';
import { peakAt, pickOn, SNAP_PX } from '../../webview/hitTest';
import { layoutFor, type Frame } from '../../webview/frame';

const axis = { points: 1001, firstHz: 3000, lastHz: 1800, observeMhz: 600 };
const meta2: SpectrumMeta = { fileName: 'cosy.jdx', title: '', dims: 2, f1: axis, f2: axis, noise: 1, min: -1, max: 1 };
const layout = layoutFor({ width: 472, height: 250 }, 1);
const peak = (index: number, f2Ppm: number, f1Ppm?: number): PeakView => ({ index, kind: f1Ppm === undefined ? 'multiplet' : 'cross', f2Ppm, ...(f1Ppm !== undefined && { f1Ppm }), extent: { f2FromPpm: f2Ppm, f2ToPpm: f2Ppm }, partner: null });
const frame = (meta: SpectrumMeta, peaks: PeakView[], picks: PickView[] = []): Frame => ({
  meta, view: { x: [5, 3], y: [5, 3] }, tiles: [], levelCount: 1, peaks, picks, selected: null, box: null,
});

describe('hit testing', () => {
  it('selects the peak nearest on screen, within the snap distance only', () => {
    const f = frame(meta2, [peak(0, 4.0, 4.0), peak(1, 3.5, 3.5)]);
    expect(peakAt(f, layout, 258 + 5, 110 - 5)).toBe(0);
    expect(peakAt(f, layout, 258 + SNAP_PX + 1, 110)).toBeNull();
  });

  it('compares 1D positions along F2 only (the marker height is not where the user clicks)', () => {
    const meta1: SpectrumMeta = { fileName: '1h.jdx', title: '', dims: 1, f2: axis, noise: 1, min: 0, max: 1 };
    const f = frame(meta1, [peak(0, 4.0), peak(1, 3.5)]);
    expect(peakAt(f, layout, 258 + 3, 200)).toBe(0);
    expect(peakAt(f, layout, 58 + 300, 30)).toBe(1);
  });

  it('finds the pick drawn on a peak (within 6 px), not one 10 px away', () => {
    const near: PickView = { id: 'p-1', f2Ppm: 4.01, f1Ppm: 4.0, label: ['H-1', 'H-2'] };
    const far: PickView = { id: 'p-2', f2Ppm: 4.05, f1Ppm: 4.0, label: [] };
    expect(pickOn(frame(meta2, [peak(0, 4.0, 4.0)], [far, near]), layout, 0)?.id).toBe('p-1');
    expect(pickOn(frame(meta2, [peak(0, 4.0, 4.0)], [far]), layout, 0)).toBeUndefined();
    expect(pickOn(frame(meta2, [peak(0, 4.0, 4.0)], [near]), layout, null)).toBeUndefined();
  });
});
