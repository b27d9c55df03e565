import { describe, expect, it } from 'vitest';
import { pickCrossPeaks } from '../../../src/core/peaks/crossPeaks';
import { nearestCrossPeak } from '../../../src/core/peaks/nearest';
import type { CrossPeak } from '../../../src/core/peaks/types';
import { simulateDqfCosy, type CosyPeakTruth } from '../../../src/core/simulate/dqfCosy';
import type { SpinSystem } from '../../../src/core/simulate/spinSystem';
import { resolutionHz } from '../../../src/core/spectrum/axis';
import type { DimensionProcessing } from '../../../src/core/spectrum/processing';
import { fourSpinSystem } from './fourSpin';

const system: SpinSystem = fourSpinSystem(1.2);
// Squared cosine bell in both dimensions (common practice for DQF-COSY); F2 1.46 Hz/point,
// F1 5.9 Hz/point after zero-filling: a typical digital resolution (references.md).
const bell = { kind: 'sine', power: 2, shiftDeg: 90 } as const;
const f2: DimensionProcessing = { acquiredPoints: 1024, spectralWidthHz: 3000, carrierHz: 1980, window: bell, size: 2048 };
const f1: DimensionProcessing = { acquiredPoints: 256, spectralWidthHz: 3000, carrierHz: 1980, window: bell, size: 512 };

/**
 * Cases: SNR 300; SNR 50 (inner F1 lobes lost, halves rejoined; centres looser); no noise (the
 * level floor binds). `tol` = how close, in points (F2, F1), a picked centre must be to the truth.
 */
const cases = [
  { name: 'SNR 300', noise: { seed: 17, snr: 300 }, tol: [0.5, 0.5] },
  { name: 'SNR 50', noise: { seed: 3, snr: 50 }, tol: [1.5, 0.75] },
  { name: 'no noise', noise: undefined, tol: [0.5, 0.5] },
] as const;

describe.each(cases)('pickCrossPeaks on a simulated DQF-COSY, $name (the simulator returns the truth)', ({ noise: spec, tol }) => {
  const sim = simulateDqfCosy(system, spec ? { f1, f2, noise: spec } : { f1, f2 });
  const s = sim.spectrum;
  const { peaks, noise } = pickCrossPeaks(s);
  const r1 = resolutionHz(s.f1);
  const r2 = resolutionHz(s.f2);
  /** The picked peak whose centre is within tol points of a true peak in each dimension. */
  const found = (t: { f1Hz: number; f2Hz: number }): CrossPeak | undefined =>
    peaks.find((p) => Math.abs(p.f2Hz - t.f2Hz) <= tol[0] * r2 && Math.abs(p.f1Hz - t.f1Hz) <= tol[1] * r1);
  // Diagonal truths repeat once per coupling partner at the same place: compare distinct places.
  const places = new Map<string, CosyPeakTruth>();
  for (const t of sim.peaks) places.set(`${t.f1Spin}/${t.f2Spin}`, t);

  it.runIf(spec !== undefined)('estimates the noise the simulator added (within 10%)', () => {
    expect(noise / sim.noiseSigma).toBeGreaterThan(0.9);
    expect(noise / sim.noiseSigma).toBeLessThan(1.1);
  });

  it('finds every true cross and diagonal peak once, centred within tol, of the right kind, and nothing else', () => {
    // First-order multiplets are symmetric about the shifts, so only interpolation bias and noise
    // move the |S|-weighted centroid.
    for (const t of places.values()) {
      const p = found(t);
      expect(p, `${t.kind} ${t.f1Spin}/${t.f2Spin}`).toBeDefined();
      expect(p?.kind).toBe(t.kind);
    }
    expect(peaks).toHaveLength(places.size);
  });

  it('pairs each cross peak with the one at the swapped shifts', () => {
    for (const t of places.values()) {
      if (t.kind !== 'cross') continue;
      const p = found(t)!;
      const mirror = found({ f1Hz: t.f2Hz, f2Hz: t.f1Hz });
      expect(mirror).toBeDefined();
      expect(p.partner, `${t.f1Spin}/${t.f2Spin}`).not.toBeNull();
      expect(peaks[p.partner!]).toBe(mirror);
    }
  });

  it('returns the right peak for a click 0.01 ppm off each true centre', () => {
    for (const t of places.values()) {
      const i = nearestCrossPeak(peaks, t.f2Ppm + 0.01, t.f1Ppm - 0.01);
      expect(i).not.toBeNull();
      expect(peaks[i!]).toBe(found(t));
    }
  });
});
