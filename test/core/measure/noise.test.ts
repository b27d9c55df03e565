import { describe, expect, it } from 'vitest';
import { simulateCase, type StudyCase } from '../../../bench/accuracyStudy';
import { estimateNoise } from '../../../src/core/spectrum/noise';

const base: StudyCase = { jOverW: 1, hzPerPoint: 0.6, snr: 100, aqS: 0.3, naturalHz: 0.8, passiveOverW: 0, shiftDeg: 90, seed: 0 };

/** True processed-noise sigma of a simulated case: largest |noise-free value| / SNR (the simulator's definition). */
function trueSigma(c: StudyCase): number {
  const clean = simulateCase({ ...c, snr: 1e15 }).spectrum.data;
  let m = 0;
  for (const v of clean) m = Math.max(m, Math.abs(v));
  return m / c.snr;
}

describe('noise sigma that the uncertainty rests on (estimateNoise on cross-peak windows)', () => {
  it('is unbiased within 4 % on small, correlated simulated windows (8 seeds; the simulator knows the truth)', () => {
    // Why this matters: sigma(J) scales with it, so a low noise estimate shrinks every stated uncertainty.
    const ratios: number[] = [];
    for (let seed = 1; seed <= 8; seed++) {
      const c = { ...base, seed };
      ratios.push(estimateNoise(simulateCase(c).spectrum.data) / trueSigma(c));
    }
    expect(Math.abs(ratios.reduce((s, x) => s + x, 0) / ratios.length - 1)).toBeLessThan(0.04);
  });
});
