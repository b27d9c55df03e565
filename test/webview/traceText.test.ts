import { describe, expect, it } from 'vitest';
import type { MeasurementView } from '../../src/protocol';
import { measurementLines } from '../../webview/traceText';

const base: MeasurementView = {
  peakIndex: 3, jHz: 7.2345, jSdHz: 0.0512, passiveHz: [3.1, 1.95], linewidthHz: 1.2, method: 'fit', dimension: 'F2',
  flags: [], notes: [], traces: [],
};

describe('measurementLines', () => {
  it('shows J ± sigma with the configured decimals, method and dimension', () => {
    expect(measurementLines(base, 2)[0]).toBe('J = 7.23 ± 0.05 Hz   (model fit, F2)');
    expect(measurementLines(base, 2)[1]).toBe('passive: 3.10, 1.95 Hz   linewidth: 1.20 Hz');
  });
  it('adds a caution line only when flags are set', () => {
    expect(measurementLines(base, 2).some((l) => l.startsWith('Caution'))).toBe(false);
    const flagged = measurementLines({ ...base, flags: ['resolution-limited'], notes: ['Hz/point 1.5'] }, 1);
    expect(flagged).toContain('flags: resolution-limited');
    expect(flagged.some((l) => l.startsWith('Caution'))).toBe(true);
    expect(flagged).toContain('note: Hz/point 1.5');
  });
});
