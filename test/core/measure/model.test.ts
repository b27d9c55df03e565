import { describe, expect, it } from 'vitest';
import { processedLine } from '../../../src/core/measure/lineshape';
import { boundedCoupling, boundedSlope, J_MAX_HZ, makeTheta, pattern, type ModelSpec } from '../../../src/core/measure/model';
import type { DimensionProcessing } from '../../../src/core/spectrum/processing';

const proc: DimensionProcessing = { acquiredPoints: 400, spectralWidthHz: 800, carrierHz: 0, size: 2048, window: { kind: 'sine', power: 2, shiftDeg: 90 } };
const line = processedLine(proc);
const freqs = Float64Array.from({ length: 400 }, (_, i) => -50 + i * 0.25);

function shape(spec: ModelSpec, j: number, passives: number[]): Float64Array {
  const out = new Float64Array(freqs.length);
  pattern(spec, makeTheta(spec, 0.3, j, 1.2, passives), freqs, out);
  return out;
}

function maxAbsDiff(a: Float64Array, b: Float64Array, scale = 1): number {
  return a.reduce((m, v, i) => Math.max(m, Math.abs(v - scale * (b[i] ?? 0))), 0);
}

describe('model pattern with groups of equivalent passive protons', () => {
  it('a group of n equivalent protons equals n separate passive couplings of the same size (binomial rule, Pascal triangle)', () => {
    for (const n of [2, 3]) {
      const grouped = shape({ line, passives: 1, groups: [n] }, 7, [6.5]);
      const separate = shape({ line, passives: n }, 7, Array.from({ length: n }, () => 6.5));
      const peak = separate.reduce((m, v) => Math.max(m, Math.abs(v)), 0);
      expect(peak).toBeGreaterThan(0);
      expect(maxAbsDiff(grouped, separate)).toBeLessThan(1e-9 * peak);
    }
  });

  it('CH3 identity: antiphase 2J with a passive J is J with a group of two at J (sin 2x cos x = 2 sin x cos² x)', () => {
    // With unnormalised line weights (doublet 1:1 = 2 cos, triplet 1:2:1 = 4 cos², antiphase = 2i sin) both sides are 8 sin x cos² x.
    const big = shape({ line, passives: 1 }, 14, [7]);
    const small = shape({ line, passives: 1, groups: [2] }, 7, [7]);
    const peak = big.reduce((m, v) => Math.max(m, Math.abs(v)), 0);
    expect(maxAbsDiff(big, small)).toBeLessThan(1e-9 * peak);
  });

  it('different passive sizes are not confused with a group (the check above can fail)', () => {
    const grouped = shape({ line, passives: 1, groups: [2] }, 7, [6.5]);
    const separate = shape({ line, passives: 2 }, 7, [6.5, 4]);
    const peak = separate.reduce((m, v) => Math.max(m, Math.abs(v)), 0);
    expect(maxAbsDiff(grouped, separate)).toBeGreaterThan(0.05 * peak);
  });
});

describe('coupling bound (|J(H,H)| <= 20 Hz: handbook ranges in shared/checks/references.md)', () => {
  it('is the identity in the usual range and stays inside the bound beyond it', () => {
    for (const u of [-15.9, -3, 0, 7.5, 12, 16]) expect(boundedCoupling(u)).toBe(u);
    for (const u of [19, 25, 40, 1e3]) {
      expect(boundedCoupling(u)).toBeLessThanOrEqual(J_MAX_HZ);
      expect(boundedCoupling(-u)).toBeGreaterThanOrEqual(-J_MAX_HZ);
      expect(boundedCoupling(u)).toBeGreaterThan(16);
    }
  });

  it('has the slope of its numerical derivative (delta method for sd), continuous at the knee', () => {
    for (const u of [10, 16.5, 18, 22, -19]) {
      const h = 1e-5;
      const numeric = (boundedCoupling(u + h) - boundedCoupling(u - h)) / (2 * h);
      expect(boundedSlope(u)).toBeCloseTo(numeric, 6);
    }
    expect(boundedCoupling(16 + 1e-9)).toBeCloseTo(16, 6);
  });
});
