import { describe, expect, it } from 'vitest';
import { noiseBlocks, pickingLevel } from '../../../src/core/peaks/level';
import { addNoise } from './synth';

describe('pickingLevel', () => {
  it('estimates the sigma of a 2048-point noise trace with a small downward bias (about -6%; -16% with 64-point blocks; measured, level.ts)', () => {
    let sum = 0;
    const runs = 20;
    for (let seed = 1; seed <= runs; seed++) {
      const d = new Float64Array(2048);
      addNoise(d, 2, seed);
      sum += pickingLevel(d, {}, String).noise / 2;
    }
    const mean = sum / runs;
    expect(mean).toBeGreaterThan(0.92);
    expect(mean).toBeLessThan(1.0);
  });

  it('uses 4 to 32 blocks of at least 1024 points', () => {
    expect(noiseBlocks(2048)).toBe(4);
    expect(noiseBlocks(16384)).toBe(16);
    expect(noiseBlocks(2048 * 1024)).toBe(32);
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
