/**
 * A small simulated DQF-COSY shared by the extension tests: an invented AX pair (first order at
 * 600 MHz, J = 7.5 Hz), squared cosine bell, SNR 300 with a fixed seed, so every run is the same.
 */
import { createHash } from 'node:crypto';
import { pickCrossPeaks } from '../../src/core/peaks';
import { simulateDqfCosy } from '../../src/core/simulate/dqfCosy';
import type { SpinSystem } from '../../src/core/simulate/spinSystem';
import type { DimensionProcessing } from '../../src/core/spectrum/processing';
import type { Spectrum2D } from '../../src/core/spectrum/spectrum';
import type { SpectrumModel } from '../../src/extension/spectrumModel';

export const system: SpinSystem = {
  observeMhz: 600,
  spins: [
    { label: 'H-1', ppm: 4.2, linewidthHz: 1.2 },
    { label: 'H-2', ppm: 3.85, linewidthHz: 1.2 },
  ],
  couplings: [{ a: 'H-1', b: 'H-2', jHz: 7.5 }],
};

const bell = { kind: 'sine', power: 2, shiftDeg: 90 } as const;
const f2: DimensionProcessing = { acquiredPoints: 512, spectralWidthHz: 1200, carrierHz: 2410, window: bell, size: 1024 };
const f1: DimensionProcessing = { acquiredPoints: 64, spectralWidthHz: 1200, carrierHz: 2410, window: bell, size: 128 };

let cached: SpectrumModel | undefined;

/** The model the host would build for this spectrum (fileName cosy.jdx, hash of a fixed text). */
export function testModel(): SpectrumModel {
  if (cached) return cached;
  const spectrum: Spectrum2D = simulateDqfCosy(system, { f1, f2, noise: { seed: 11, snr: 300 } }).spectrum;
  const { peaks, noise } = pickCrossPeaks(spectrum);
  cached = { fileName: 'cosy.jdx', sha256: createHash('sha256').update('test spectrum').digest('hex'), spectrum, noise, crossPeaks: peaks, multiplets: [] };
  return cached;
}
