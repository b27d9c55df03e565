import { describe, expect, it } from 'vitest';
import { pickMultiplets1D } from '../../../src/core/peaks/multiplets1D';
import { simulate1D } from '../../../src/core/simulate/simulate1D';
import { spinMultiplet, type SpinSystem } from '../../../src/core/simulate/spinSystem';
import type { DimensionProcessing } from '../../../src/core/spectrum/processing';
import { fourSpinSystem } from './fourSpin';

// The four-spin system with narrow lines, so that every line of the ddd of H-2 (two of them 1 Hz
// apart) is resolved.
const system: SpinSystem = fourSpinSystem(0.5);
// 5.5 s acquisition, 0.18 Hz/point after zero-filling (common practice for 1H 1D spectra).
const p: DimensionProcessing = { acquiredPoints: 32768, spectralWidthHz: 6000, carrierHz: 1980, window: { kind: 'none' }, size: 32768 };

describe('pickMultiplets1D on a simulated 1D spectrum (the simulator returns the truth)', () => {
  const sim = simulate1D(system, p, { noise: { seed: 9, snr: 1000 } });
  const { multiplets } = pickMultiplets1D(sim.spectrum);

  it('finds one multiplet per proton, in ppm order, with every first-order line', () => {
    expect(multiplets).toHaveLength(system.spins.length);
    system.spins.forEach((spin, i) => {
      const m = multiplets[i]!;
      const truth = spinMultiplet(system, spin.label);
      expect(m.lines.length, spin.label).toBe(truth.lines.length);
      // the centre: height-weighted centroid of a symmetric multiplet, within 0.05 Hz
      expect(Math.abs(m.hz - truth.centreHz), spin.label).toBeLessThan(0.05);
      // each line within 0.05 Hz of its true position (both lists run high to low frequency)
      const expected = truth.lines.map((l) => truth.centreHz + l.offsetHz).sort((a, b) => b - a);
      m.lines.forEach((l, k) => expect(Math.abs(l.hz - (expected[k] ?? NaN)), `${spin.label} line ${k}`).toBeLessThan(0.05));
    });
  });
});
