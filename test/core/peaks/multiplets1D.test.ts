import { describe, expect, it } from 'vitest';
import { pickMultiplets1D } from '../../../src/core/peaks/multiplets1D';
import { makeAxis } from '../../../src/core/spectrum/axis';
import { make1D } from '../../../src/core/spectrum/spectrum';
import { MHZ, pattern, spectrum1D } from './synth';

// 0.25 Hz/point, Lorentzian lines 1 Hz wide (4 points): typical 1D 1H digital resolution (common practice).
const axis = makeAxis(2048, 3000, 3000 - 2047 * 0.25, MHZ);
const inPhase = (...js: number[]) => pattern(js.map((j) => ({ j, antiphase: false })));

describe('pickMultiplets1D', () => {
  const s = spectrum1D(
    axis,
    [
      { hz: 2900.1, lines: inPhase(10, 4), amp: 400 }, // dd: lines at +-7, +-3 Hz
      { hz: 2800, lines: inPhase(7, 7), amp: 400 }, // t: 1:2:1 at -7, 0, +7 Hz
      { hz: 2700, lines: inPhase(16), amp: 400 }, // d with a large J: one 16 Hz gap
      { hz: 2650, lines: inPhase(), amp: 100 }, // two singlets 40 Hz apart
      { hz: 2610, lines: inPhase(), amp: 100 },
    ],
    1,
    { sigma: 1, seed: 21 },
  );
  const { multiplets, noise } = pickMultiplets1D(s);

  it('finds each multiplet once, sorted by ppm descending, with its number of lines', () => {
    expect(multiplets.map((m) => m.lines.length)).toEqual([4, 3, 2, 1, 1]);
    expect(multiplets.map((m) => Math.round(m.hz))).toEqual([2900, 2800, 2700, 2650, 2610]);
    expect(noise).toBeGreaterThan(0.8);
    expect(noise).toBeLessThan(1.2);
  });

  it('puts the centre of a symmetric multiplet at its true shift (height-weighted centroid)', () => {
    // parabolic bias <= 0.041 point = 0.010 Hz for a 4-point Lorentzian (interpolate.ts), plus noise
    expect(Math.abs(multiplets[0]!.hz - 2900.1)).toBeLessThan(0.05);
    expect(multiplets[0]!.ppm).toBeCloseTo(multiplets[0]!.hz / MHZ, 12);
    expect(Math.abs(multiplets[1]!.hz - 2800)).toBeLessThan(0.05);
  });

  it('finds line positions and the 1:2:1 heights of a triplet (Pascal triangle)', () => {
    const t = multiplets[1]!;
    expect(t.lines.map((l) => l.hz - 2800)).toEqual([expect.closeTo(7, 1), expect.closeTo(0, 1), expect.closeTo(-7, 1)]);
    const [a, b, c] = t.lines.map((l) => l.height);
    expect(b! / a!).toBeGreaterThan(1.9);
    expect(b! / c!).toBeLessThan(2.1);
    expect(t.height).toBe(b);
  });

  it('gives an extent from the outermost lines to their half height, high ppm first', () => {
    const d = multiplets[0]!;
    expect(d.fromPpm).toBeGreaterThan(d.toPpm);
    expect(d.fromPpm * MHZ).toBeGreaterThanOrEqual(2900.1 + 7 - 0.25);
    expect(d.fromPpm * MHZ).toBeLessThanOrEqual(2900.1 + 7 + 0.5 + 0.25);
    expect(d.toPpm * MHZ).toBeLessThanOrEqual(2900.1 - 7 + 0.25);
    expect(d.point0).toBeLessThan(d.point1);
  });

  it('finds nothing in pure noise at 6 sigma (normal tail 2e-9 per point, from memory)', () => {
    const n = spectrum1D(axis, [], 1, { sigma: 3, seed: 4 });
    expect(pickMultiplets1D(n).multiplets).toHaveLength(0);
  });

  it('splits a doublet when maxGapHz is below its J', () => {
    expect(pickMultiplets1D(s, { maxGapHz: 12 }).multiplets.map((m) => m.lines.length)).toEqual([4, 3, 1, 1, 1, 1]);
  });

  it('says where a non-finite value is, and rejects bad options', () => {
    const data = new Float64Array(16);
    data[9] = Number.POSITIVE_INFINITY;
    const bad = make1D('scan', data, makeAxis(16, 10, 0, MHZ));
    expect(() => pickMultiplets1D(bad)).toThrow(/'scan', point 9 is not finite/);
    expect(() => pickMultiplets1D(s, { maxGapHz: -2 })).toThrow(/option maxGapHz/);
  });
});
