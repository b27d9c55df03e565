import { describe, expect, it } from 'vitest';
import { pickingLevel } from '../../../src/core/peaks/level';
import { addNoise } from './synth';

describe('pickingLevel', () => {
  it('estimates the sigma of a 2048-point noise trace within 4% on average (estimateNoise pools the noise-only blocks)', () => {
    let sum = 0;
    const runs = 20;
    for (let seed = 1; seed <= runs; seed++) {
      const d = new Float64Array(2048);
      addNoise(d, 2, seed);
      sum += pickingLevel(d, {}, String).noise / 2;
    }
    const mean = sum / runs;
    expect(mean).toBeGreaterThan(0.96);
    expect(mean).toBeLessThan(1.04);
  });

  it('sets the level to threshold * sigma, or the floor fraction of max |S| when that is higher', () => {
    const d = new Float64Array([0, 1000, -3, 2]);
    expect(pickingLevel(d, { noise: 1 }, String).level).toBe(6);
    expect(pickingLevel(d, { noise: 0.001 }, String).level).toBeCloseTo(5, 12); // 0.005 * 1000
    expect(pickingLevel(d, { noise: 0.001, floor: 0 }, String).level).toBeCloseTo(0.006, 12);
  });

  it('caps the prominence at the level', () => {
    const d = new Float64Array([0, 1, 0, 0]);
    expect(pickingLevel(d, { noise: 1, threshold: 2, prominence: 5 }, String).prominence).toBe(2);
    expect(pickingLevel(d, { noise: 1 }, String).prominence).toBe(5);
  });
});
