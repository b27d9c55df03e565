import { describe, expect, it } from 'vitest';
import { simulateCase, type StudyCase } from '../../../bench/accuracyStudy';
import { MeasureError, measureCrossPeak, type CrossPeakInput } from '../../../src/core/measure';
import { simulateCrossPeakRegion } from '../../../src/core/simulate/dqfCosy';
import { make2D } from '../../../src/core/spectrum/spectrum';
import type { DimensionProcessing } from '../../../src/core/spectrum/processing';

const base: StudyCase = { jOverW: 2, hzPerPoint: 0.6, snr: 300, aqS: 0.3, naturalHz: 0.8, passiveOverW: 0, shiftDeg: 90, seed: 5 };

describe('measureCrossPeak on simulated DQF-COSY cross peaks (simulator in src/core/simulate)', () => {
  it('recovers a resolved active J within 3 sigma, with sigma below 0.05 Hz at SNR 300, and no flags', () => {
    const { spectrum, peak, jHz } = simulateCase(base);
    const m = measureCrossPeak(spectrum, peak);
    expect(Math.abs(m.jHz - jHz)).toBeLessThan(3 * m.jSdHz);
    expect(m.jSdHz).toBeLessThan(0.05);
    expect(m.flags).toEqual([]);
    expect(m.lineshape).toMatch(/^processing: squared sine bell, shift 90 deg, AQ 0\.\d+ s/);
    expect(m.method).toBe('fit');
    expect(m.dimension).toBe('F2');
    expect(m.traces.length).toBeGreaterThan(1);
    expect(m.chi2Reduced).toBeLessThan(2);
  });

  it('finds the passive coupling of the F2 multiplet and keeps it apart from the active one', () => {
    const { spectrum, peak, jHz, widthHz } = simulateCase({ ...base, passiveOverW: 1.5, seed: 6 });
    const m = measureCrossPeak(spectrum, peak);
    expect(m.passiveHz.length).toBe(1);
    expect(Math.abs((m.passiveHz[0] ?? 0) - 1.5 * widthHz)).toBeLessThan(3 * (m.passiveSdHz[0] ?? 0));
    expect(Math.abs(m.jHz - jHz)).toBeLessThan(3 * m.jSdHz);
  });

  it('flags J below half the linewidth as unresolved, and still measures it without the naive bias', () => {
    const { spectrum, peak, jHz } = simulateCase({ ...base, jOverW: 0.4, snr: 2000, seed: 7 });
    const fit = measureCrossPeak(spectrum, peak);
    const naive = measureCrossPeak(spectrum, peak, { method: 'naive' });
    expect(fit.flags).toContain('unresolved');
    expect(fit.notes.join(' ')).toMatch(/cancel/);
    expect(Math.abs(fit.jHz - jHz)).toBeLessThan(3 * fit.jSdHz);
    // references.md: the apparent splitting at J/w -> 0 is at least 0.577 w, far above J = 0.4 w
    expect(naive.jHz - jHz).toBeGreaterThan(0.15 * jHz);
  });

  it('measures along F1 when asked, and flags the coarse F1 digital resolution', () => {
    const { spectrum, peak, jHz } = simulateCase({ ...base, jOverW: 2, snr: 1000, seed: 8 });
    const m = measureCrossPeak(spectrum, peak, { dimension: 'F1' });
    expect(m.dimension).toBe('F1');
    expect(m.flags).toContain('f1_coarse'); // 5 Hz/point in F1 > J/3
    expect(Math.abs(m.jHz - jHz)).toBeLessThan(Math.max(3 * m.jSdHz, 0.3));
  });

  it('flags a poor fit when the data hold something the model lacks (a baseline offset)', () => {
    const { spectrum, peak } = simulateCase({ ...base, snr: 500, seed: 9 });
    const data = Float64Array.from(spectrum.data);
    let max = 0;
    for (const v of data) max = Math.max(max, Math.abs(v));
    for (let i = 0; i < data.length; i++) data[i] = (data[i] ?? 0) + 0.05 * max * Math.sin(i / 7);
    const m = measureCrossPeak(make2D('with baseline', data, spectrum.f1, spectrum.f2, spectrum.processing), peak, { noise: max / 500 });
    expect(m.flags).toContain('fit_poor');
    expect(m.notes.join(' ')).toMatch(/inflated/);
  });

  it('flags a possible second-order system when the shift difference is below 10 J', () => {
    const f: DimensionProcessing = { acquiredPoints: 180, spectralWidthHz: 600, carrierHz: 0, size: 1024, window: { kind: 'sine', power: 2, shiftDeg: 90 } };
    const f1: DimensionProcessing = { acquiredPoints: 64, spectralWidthHz: 600, carrierHz: 0, size: 128, window: { kind: 'sine', power: 2, shiftDeg: 90 } };
    const system = { observeMhz: 600, spins: [{ label: 'A', ppm: 0.05, linewidthHz: 1 }, { label: 'X', ppm: -0.05, linewidthHz: 1 }], couplings: [{ a: 'A', b: 'X', jHz: 8 }] };
    const sim = simulateCrossPeakRegion(system, 'X', 'A', { f1, f2: f, rows: 24, cols: 160, noise: { seed: 3, snr: 300 } });
    const peak: CrossPeakInput = { f1Ppm: -0.05, f2Ppm: 0.05 }; // no extent: the default window
    const m = measureCrossPeak(sim.spectrum, peak);
    expect(m.flags).toContain('second_order_suspected'); // 60 Hz / 8 Hz = 7.5 < 10
    expect(Math.abs(m.jHz - 8)).toBeLessThan(3 * m.jSdHz);
  });

  it('cannot tell a CH3 partner from a doubled J (the inner lines cancel): reports the smaller J and flags ambiguous_multiplet', () => {
    // A coupled to three equivalent X: A's trace is antiphase in J with two in-phase J from the other
    // X protons = lines -1, -1, +1, +1 at -3J/2, -J/2, J/2, 3J/2: an antiphase 2J with a passive J
    // (product of the splittings; any NMR text on DQF-COSY multiplets).
    const f: DimensionProcessing = { acquiredPoints: 180, spectralWidthHz: 600, carrierHz: 0, size: 1024, window: { kind: 'sine', power: 2, shiftDeg: 90 } };
    const f1: DimensionProcessing = { acquiredPoints: 64, spectralWidthHz: 600, carrierHz: 0, size: 128, window: { kind: 'sine', power: 2, shiftDeg: 90 } };
    const system = { observeMhz: 600, spins: [{ label: 'A', ppm: 0.3, linewidthHz: 1 }, { label: 'X', ppm: -0.3, linewidthHz: 1, count: 3 }], couplings: [{ a: 'A', b: 'X', jHz: 7 }] };
    const sim = simulateCrossPeakRegion(system, 'X', 'A', { f1, f2: f, rows: 24, cols: 160, noise: { seed: 4, snr: 500 } });
    const m = measureCrossPeak(sim.spectrum, { f1Ppm: -0.3, f2Ppm: 0.3 });
    // sin(2x) cos(x) = 2 sin(x) cos²(x): the 2J-with-passive-J reading and J with a group of two equivalent
    // passives at J are the same pattern (trigonometric identity); the smaller J is reported and flagged.
    expect(Math.abs(m.jHz - 7)).toBeLessThan(0.2);
    expect(m.passiveHz.some((p) => Math.abs(p - 7) < 0.3)).toBe(true);
    expect(m.flags).toContain('ambiguous_multiplet');
    expect(m.notes.join(' ')).toMatch(/Multiplet check: J read 1[34]\.\d\d Hz/);
  });

  it('says when the processing is unknown and fits several assumed line shapes (Lorentz-Gauss mix, guessed processing)', () => {
    const { spectrum, peak, jHz } = simulateCase({ ...base, seed: 10 });
    const bare = make2D('no processing recorded', spectrum.data, spectrum.f1, spectrum.f2);
    const m = measureCrossPeak(bare, peak);
    expect(m.lineshape).toMatch(/^(Lorentz-Gauss mix 0\.\d\d|processing: .+)$/);
    expect(m.notes.join(' ')).toMatch(/processing is not recorded/);
    expect(m.notes.join(' ')).toMatch(/line shapes were fitted/);
    expect(Math.abs(m.jHz - jHz)).toBeLessThan(0.3);
    expect(Math.abs(m.jHz - jHz)).toBeLessThan(3 * m.jSdHz);
  });

  it('throws a MeasureError naming the dimension and position when there is only noise', () => {
    const { spectrum } = simulateCase({ ...base, seed: 11 });
    const peak: CrossPeakInput = { f1Ppm: -200 / 600, f2Ppm: 160 / 600 };
    expect(() => measureCrossPeak(spectrum, peak)).toThrow(MeasureError);
    expect(() => measureCrossPeak(spectrum, peak)).toThrow(/no antiphase pair above noise in F2 at 0\.2667 ppm/);
  });

  it('rejects bad options with the option named', () => {
    const { spectrum, peak } = simulateCase(base);
    expect(() => measureCrossPeak(spectrum, peak, { maxPassive: -1 })).toThrow(/maxPassive/);
    expect(() => measureCrossPeak(spectrum, peak, { rows: 0 })).toThrow(/rows/);
    expect(() => measureCrossPeak(spectrum, peak, { noise: 0 })).toThrow(/noise/);
  });
});
