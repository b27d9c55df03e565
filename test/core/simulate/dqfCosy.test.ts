import { describe, expect, it } from 'vitest';
import { cosyPeaks, simulateCrossPeakRegion, simulateDqfCosy } from '../../../src/core/simulate/dqfCosy';
import type { SpinSystem } from '../../../src/core/simulate/spinSystem';
import { hzToPoint, pointToHz } from '../../../src/core/spectrum/axis';
import type { DimensionProcessing } from '../../../src/core/spectrum/processing';
import { row } from '../../../src/core/spectrum/extract';
import type { Spectrum2D } from '../../../src/core/spectrum/spectrum';
import { argMax, argMin, parabolicVertex } from './helpers';

// Expected behaviour: the product-operator result for a weakly coupled DQF-COSY (e.g. Keeler,
// Understanding NMR Spectroscopy, 2nd ed., ch. 8 [mem]): cross peaks antiphase in the active J in
// both dimensions (corner signs + - - +), in-phase in the passive J, at the two shifts.

const ax: SpinSystem = {
  observeMhz: 500,
  spins: [{ label: 'A', ppm: 2.6, linewidthHz: 1.5 }, { label: 'X', ppm: 1.6, linewidthHz: 1.5 }],
  couplings: [{ a: 'A', b: 'X', jHz: 10 }],
};
const sq: DimensionProcessing = { acquiredPoints: 256, spectralWidthHz: 1000, carrierHz: 1000, window: { kind: 'sine', power: 2, shiftDeg: 90 }, size: 512 };
const fine: DimensionProcessing = { acquiredPoints: 2048, spectralWidthHz: 1000, carrierHz: 1000, window: { kind: 'none' }, size: 8192 };
/** F1: 0.49 Hz per point, so a 64-row window spans 31 Hz. */
const f1fine: DimensionProcessing = { acquiredPoints: 1024, spectralWidthHz: 1000, carrierHz: 1000, window: { kind: 'none' }, size: 2048 };

/** Value at the grid point nearest (F1 Hz, F2 Hz). */
function at(s: Spectrum2D, f1Hz: number, f2Hz: number): number {
  const r = Math.round(hzToPoint(s.f1, f1Hz));
  const c = Math.round(hzToPoint(s.f2, f2Hz));
  return s.data[r * s.f2.points + c] ?? NaN;
}

describe('DQF-COSY peak model', () => {
  it('lists a cross peak each way and a diagonal peak per spin for one coupled pair', () => {
    const peaks = cosyPeaks(ax);
    expect(peaks.map((p) => `${p.kind}:${p.f1Spin}/${p.f2Spin}`).sort()).toEqual(['cross:A/X', 'cross:X/A', 'diagonal:A/A', 'diagonal:X/X']);
    expect(peaks.every((p) => p.activeJHz === 10 && p.shiftToJRatio === 50)).toBe(true);
  });

  it('has the four corners of the active square with signs + - - + (antiphase in both dimensions)', () => {
    const s = simulateCrossPeakRegion(ax, 'A', 'X', { f1: f1fine, f2: fine, rows: 64, cols: 256 }).spectrum;
    const [a, x, j] = [1300, 800, 10];
    const pp = at(s, a + j / 2, x + j / 2);
    expect(pp).toBeGreaterThan(0);
    expect(at(s, a + j / 2, x - j / 2)).toBeLessThan(-0.9 * pp);
    expect(at(s, a - j / 2, x + j / 2)).toBeLessThan(-0.9 * pp);
    expect(at(s, a - j / 2, x - j / 2)).toBeGreaterThan(0.9 * pp);
  });

  it('models the diagonal peak as antiphase absorption too (documented simplification; same corner signs)', () => {
    const s = simulateCrossPeakRegion(ax, 'A', 'A', { f1: f1fine, f2: fine, rows: 64, cols: 256 }).spectrum;
    const [a, j] = [1300, 10];
    expect(at(s, a + j / 2, a + j / 2)).toBeGreaterThan(0);
    expect(at(s, a + j / 2, a - j / 2)).toBeLessThan(0);
    expect(at(s, a - j / 2, a + j / 2)).toBeLessThan(0);
    expect(at(s, a - j / 2, a - j / 2)).toBeGreaterThan(0);
  });

  it('is symmetric about the diagonal when both dimensions are processed alike (cross peaks at (A,X) and (X,A) mirror each other)', () => {
    const amx: SpinSystem = { ...ax, spins: [...ax.spins, { label: 'M', ppm: 2.2, linewidthHz: 1.5 }], couplings: [...ax.couplings, { a: 'A', b: 'M', jHz: 4 }, { a: 'X', b: 'M', jHz: 6 }] };
    const s = simulateDqfCosy(amx, { f1: sq, f2: sq }).spectrum;
    const n = sq.size;
    let peak = 0;
    let asym = 0;
    for (let r = 0; r < n; r++) {
      for (let c = 0; c < n; c++) {
        peak = Math.max(peak, Math.abs(s.data[r * n + c] ?? 0));
        asym = Math.max(asym, Math.abs((s.data[r * n + c] ?? 0) - (s.data[c * n + r] ?? 0)));
      }
    }
    expect(peak).toBeGreaterThan(0);
    expect(asym / peak).toBeLessThan(1e-12);
  });

  it('splits the F2 trace antiphase in the active J and in-phase in the passive J, centred on the shift', () => {
    const amx: SpinSystem = {
      observeMhz: 500,
      spins: [{ label: 'A', ppm: 2.6, linewidthHz: 0.7 }, { label: 'M', ppm: 2.2, linewidthHz: 0.7 }, { label: 'X', ppm: 1.6, linewidthHz: 0.7 }],
      couplings: [{ a: 'A', b: 'X', jHz: 12 }, { a: 'A', b: 'M', jHz: 3 }, { a: 'X', b: 'M', jHz: 5 }],
    };
    const res = simulateCrossPeakRegion(amx, 'A', 'X', { f1: f1fine, f2: fine, rows: 64, cols: 512 });
    const s = res.spectrum;
    const x = 800;
    // The F1 component at nu_A + J_AX/2 + J_AM/2 (positive antiphase lobe, in-phase passive line).
    const trace = row(s, Math.round(hzToPoint(s.f1, 1300 + 6 + 1.5)));
    const extremum = (hz: number, sign: 1 | -1): { hz: number; value: number } => {
      const c = Math.round(hzToPoint(s.f2, hz));
      const i = sign > 0 ? argMax(trace, c - 4, c + 5) : argMin(trace, c - 4, c + 5);
      return { hz: pointToHz(s.f2, parabolicVertex(trace, i)), value: trace[i] ?? NaN };
    };
    const expected: [number, 1 | -1][] = [[x + 6 + 2.5, 1], [x + 6 - 2.5, 1], [x - 6 + 2.5, -1], [x - 6 - 2.5, -1]];
    const found = expected.map(([hz, sign]) => extremum(hz, sign));
    found.forEach((f, i) => {
      expect(Math.abs(f.hz - (expected[i]?.[0] ?? NaN))).toBeLessThan(0.02);
      expect(Math.sign(f.value)).toBe(expected[i]?.[1]);
    });
    const centre = found.reduce((acc, f) => acc + f.hz, 0) / 4;
    expect(Math.abs(centre - x)).toBeLessThan(0.01);
    // The opposite F1 lobe (nu_A - J_AX/2 + J_AM/2) flips the sign of the whole trace.
    const other = row(s, Math.round(hzToPoint(s.f1, 1300 - 6 + 1.5)));
    const c0 = Math.round(hzToPoint(s.f2, x + 6 + 2.5));
    expect(Math.sign(other[argMin(other, c0 - 4, c0 + 5)] ?? NaN)).toBe(-1);
    const truth = res.peaks.find((p) => p.kind === 'cross' && p.f1Spin === 'A' && p.f2Spin === 'X');
    expect(truth?.passiveF1Hz).toEqual([3]);
    expect(truth?.passiveF2Hz).toEqual([5]);
  });
});

describe('apparent antiphase splitting (shared/checks/references.md, Lorentzian table)', () => {
  // Lorentzian F2 line: no window, 10 s acquisition (no truncation), 0.024 Hz per point.
  const f2: DimensionProcessing = { acquiredPoints: 4096, spectralWidthHz: 400, carrierHz: 575, window: { kind: 'none' }, size: 16384 };
  const f1: DimensionProcessing = { acquiredPoints: 64, spectralWidthHz: 400, carrierHz: 575, window: { kind: 'sine', power: 2, shiftDeg: 90 }, size: 128 };
  const apparent = (j: number, w: number): number => {
    const sys: SpinSystem = { observeMhz: 500, spins: [{ label: 'A', ppm: 1.0, linewidthHz: w }, { label: 'X', ppm: 1.3, linewidthHz: w }], couplings: [{ a: 'A', b: 'X', jHz: j }] };
    const s = simulateCrossPeakRegion(sys, 'A', 'X', { f1, f2, rows: 16, cols: 2048 }).spectrum;
    let best = 0;
    for (let r = 0; r < s.f1.points; r++) if (Math.abs(row(s, r)[argMax(row(s, r))] ?? 0) > Math.abs(row(s, best)[argMax(row(s, best))] ?? 0)) best = r;
    const tr = row(s, best);
    const i = argMax(tr);
    const k = argMin(tr);
    return Math.abs(pointToHz(s.f2, parabolicVertex(tr, i)) - pointToHz(s.f2, parabolicVertex(tr, k)));
  };
  it('equals J at large J/w (J/w = 5: d = 5.0010)', () => {
    expect(apparent(5, 1)).toBeCloseTo(5.001, 2);
  });
  it('overestimates J near the linewidth (J/w = 1: d = 1.0746; J/w = 0.5: d = 0.7168)', () => {
    expect(apparent(1, 1)).toBeCloseTo(1.0746, 2);
    expect(apparent(0.5, 1)).toBeCloseTo(0.7168, 2);
  });
});

describe('DQF-COSY input checks', () => {
  it('says which spin falls outside which spectral window', () => {
    const narrow: DimensionProcessing = { ...sq, spectralWidthHz: 400 };
    expect(() => simulateDqfCosy(ax, { f1: narrow, f2: sq })).toThrow(/spin [AX].*outside the F1 spectral window/);
  });
  it('rejects a window that leaves the grid', () => {
    expect(() => simulateDqfCosy(ax, { f1: sq, f2: sq, window: { row0: 500, rows: 32, col0: 0, cols: 64 } })).toThrow(/window rows 500\.\.531/);
  });
  it('rejects a processing size that is not a power of two', () => {
    expect(() => simulateDqfCosy(ax, { f1: { ...sq, size: 300 }, f2: sq })).toThrow(/F1 processing: size/);
  });
});
