/**
 * A small simulated 1D ¹H spectrum for the extension tests: an invented pair, H-1 (1 H, 4.00 ppm)
 * and a CH3 H-9 (3 H, 1.20 ppm), J = 7.0 Hz, first order at 600 MHz (Δν/J = 240); seeded noise.
 */
import { createHash } from 'node:crypto';
import { pickMultiplets1D } from '../../src/core/peaks';
import { simulate1D } from '../../src/core/simulate/simulate1D';
import type { SpinSystem } from '../../src/core/simulate/spinSystem';
import type { DimensionProcessing } from '../../src/core/spectrum/processing';
import type { SpectrumModel } from '../../src/extension/spectrumModel';

export const J_HZ = 7.0;
export const system1D: SpinSystem = {
  observeMhz: 600,
  spins: [
    { label: 'H-1', ppm: 4.0, linewidthHz: 0.8 },
    { label: 'H-9', ppm: 1.2, linewidthHz: 0.8, count: 3 },
  ],
  couplings: [{ a: 'H-1', b: 'H-9', jHz: J_HZ }],
};

// 2.7 s acquisition, 0.18 Hz/point after zero-filling: both doublets well resolved.
const p: DimensionProcessing = { acquiredPoints: 8192, spectralWidthHz: 3000, carrierHz: 1560, window: { kind: 'none' }, size: 16384 };

let cached: SpectrumModel | undefined;

export function testModel1D(): SpectrumModel {
  if (cached) return cached;
  const { spectrum } = simulate1D(system1D, p, { noise: { seed: 7, snr: 2000 } });
  const { multiplets, noise } = pickMultiplets1D(spectrum);
  cached = { fileName: '1h.jdx', sha256: createHash('sha256').update('test 1D spectrum').digest('hex'), spectrum, noise, crossPeaks: [], multiplets };
  return cached;
}

/** Index of the multiplet nearest a shift. */
export function multipletAt(m: SpectrumModel, ppm: number): number {
  let best = -1;
  m.multiplets.forEach((k, i) => {
    if (best < 0 || Math.abs(k.ppm - ppm) < Math.abs((m.multiplets[best]?.ppm ?? Infinity) - ppm)) best = i;
  });
  return best;
}
