import { describe, expect, it } from 'vitest';
import { qualityFlags, type FlagInput } from '../../../src/core/measure/flags';

// Thresholds from design.md ("J below about half the linewidth", "shift difference / J below about
// 10") and the issue (chi2_red > 4, F1 Hz/point > J/3); the resolution rule is ours (flags.ts).
const ok: FlagInput = { jHz: 7, jSdHz: 0.05, linewidthHz: 4, hzPerPoint: 0.6, dimension: 'F2', shiftDiffHz: 300, chi2Reduced: 1.1, lineshapeAssumed: false };

describe('qualityFlags', () => {
  it('raises nothing for a resolved, well-fitted, first-order F2 measurement', () => {
    expect(qualityFlags(ok)).toEqual({ flags: [], notes: [] });
  });
  it('unresolved just below J = 0.5 w, not at it (sigma negligible)', () => {
    expect(qualityFlags({ ...ok, jHz: 1.99, jSdHz: 0 }).flags).toContain('unresolved');
    expect(qualityFlags({ ...ok, jHz: 2.0, jSdHz: 0 }).flags).not.toContain('unresolved');
  });
  it('unresolved also when J - 2 sigma falls below 0.5 w (the data cannot exclude it)', () => {
    expect(qualityFlags({ ...ok, jHz: 2.5, jSdHz: 0.26 }).flags).toContain('unresolved');
    expect(qualityFlags({ ...ok, jHz: 2.5, jSdHz: 0.24 }).flags).not.toContain('unresolved');
  });
  it('second order below |Δν| / J = 10', () => {
    expect(qualityFlags({ ...ok, shiftDiffHz: -69 }).flags).toContain('second_order_suspected');
    expect(qualityFlags({ ...ok, shiftDiffHz: 71 }).flags).not.toContain('second_order_suspected');
  });
  it('fit_poor above chi2_red 4', () => {
    expect(qualityFlags({ ...ok, chi2Reduced: 4.5 }).flags).toEqual(['fit_poor']);
  });
  it('f1_coarse only in F1 and only when Hz/point > J/3', () => {
    expect(qualityFlags({ ...ok, dimension: 'F1', hzPerPoint: 2.4, linewidthHz: 12 }).flags).toEqual(['f1_coarse']);
    expect(qualityFlags({ ...ok, dimension: 'F1', hzPerPoint: 2.3, linewidthHz: 12 }).flags).toEqual([]);
  });
  it('resolution_limited with fewer than 1.5 points per linewidth, or a sub-0.1-point sigma from an assumed line shape', () => {
    expect(qualityFlags({ ...ok, hzPerPoint: 2.7 }).flags).toEqual(['resolution_limited']);
    expect(qualityFlags({ ...ok, hzPerPoint: 2.6 }).flags).toEqual([]);
    expect(qualityFlags({ ...ok, jSdHz: 0.05, lineshapeAssumed: true }).flags).toEqual(['resolution_limited']);
    expect(qualityFlags({ ...ok, jSdHz: 0.05, lineshapeAssumed: false }).flags).toEqual([]);
  });
  it('adds one plain-language note per flag', () => {
    const q = qualityFlags({ ...ok, jHz: 1, shiftDiffHz: 5, chi2Reduced: 9 });
    expect(q.notes.length).toBe(q.flags.length);
  });
  it('says in a note when sigma exceeds half of J (the value is not determined), without a new flag', () => {
    const q = qualityFlags({ ...ok, jHz: 1, jSdHz: 0.6 });
    expect(q.notes.join(' ')).toMatch(/not determined/);
    expect(q.flags).toEqual(['unresolved']);
  });
});
