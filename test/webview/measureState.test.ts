/** What the panel shows after measurements, and what Accept sends (webview/measureState.ts). */
import { describe, expect, it } from 'vitest';
import type { MeasurementView } from '../../src/protocol';
import { MeasureState } from '../../webview/measureState';

const view = (peakIndex: number, jHz: number): MeasurementView => ({
  peakIndex, jHz, jSdHz: 0.05, passiveHz: [], linewidthHz: 1.2, method: 'fit', dimension: 'F2', flags: [], notes: [], traces: [],
});

describe('MeasureState', () => {
  it('shows only the reply to the latest request: a slow fit of an earlier peak does not replace it', () => {
    const s = new MeasureState();
    const slow = s.started(); // peak 1, a long fit
    const fast = s.started(); // then peak 2, cached on the host
    expect(s.measured(fast, view(2, 4.1))).toBe(true);
    expect(s.measured(slow, view(1, 7.5))).toBe(false);
    expect(s.shown?.peakIndex).toBe(2);
    expect(s.failed(slow, 1)).toBe(false);
    expect(s.failedPeak).toBeNull();
    expect(s.accept(2, ['H-1', 'H-2'], 2, 'fit', 'F2', 2)).toEqual({
      request: { type: 'accept', peakIndex: 2, method: 'fit', dimension: 'F2', labels: ['H-1', 'H-2'] }, status: 'Accepted J = 4.10 Hz.',
    });
  });

  it('refuses to accept a peak other than the one measured, and records a bare pick after a failure', () => {
    const s = new MeasureState();
    s.measured(s.started(), view(2, 4.1));
    expect(s.accept(3, [], 2, 'fit', 'F2', 2)).toEqual({ status: 'Measure the selected peak before accepting.' });
    expect(s.failed(s.started(), 3)).toBe(true);
    expect(s.accept(3, ['H-1'], 2, 'naive', 'F1', 2).request).toEqual({ type: 'accept', peakIndex: 3, method: 'naive', dimension: 'F1', labels: ['H-1'] });
    expect(s.accept(null, [], 2, 'fit', 'F2', 2).request).toBeUndefined();
  });

  it('picks a 1D multiplet without a measurement, and asks for a selection first', () => {
    const s = new MeasureState();
    expect(s.accept(null, [], 1, 'fit', 'F2', 2).request).toBeUndefined();
    expect(s.accept(0, ['H-3'], 1, 'fit', 'F1', 2)).toEqual({
      request: { type: 'accept', peakIndex: 0, method: 'fit', dimension: 'F2', labels: ['H-3'] }, status: 'Picked multiplet 0 as H-3.',
    });
  });
  it('does not offer a bare pick after a cancelled measurement (only after one that failed)', () => {
    const s = new MeasureState();
    expect(s.cancelled(s.started())).toBe(true);
    expect(s.failedPeak).toBeNull();
    expect(s.accept(1, [], 2, 'fit', 'F2', 2)).toEqual({ status: 'Measure the selected peak before accepting.' });
  });
});
