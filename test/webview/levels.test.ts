import { describe, expect, it } from 'vitest';
import { checkContourSettings, contourLevels, levelsKey, levelUnit, usableContours } from '../../webview/levels';

describe('contourLevels', () => {
  it('is lowest x spacing^k in noise units (geometric series)', () => {
    const l = contourLevels(2, { lowestLevel: 5, levels: 4, spacing: 1.5 });
    // 2 * 5 * 1.5^k = 10, 15, 22.5, 33.75
    expect(l.magnitudes).toEqual([10, 15, 22.5, 33.75]);
  });
  it('names the bad setting', () => {
    expect(() => contourLevels(1, { lowestLevel: 5, levels: 0, spacing: 1.5 })).toThrow('number of levels');
    expect(checkContourSettings({ lowestLevel: 5, levels: 3, spacing: 1 })).toContain('spacing');
    expect(checkContourSettings({ lowestLevel: -1, levels: 3, spacing: 2 })).toContain('lowest level');
    expect(checkContourSettings({ lowestLevel: 3, levels: 3, spacing: 2 })).toBeNull();
  });
  it('falls back to a thousandth of the largest |value| when the noise is zero (noise-free data)', () => {
    expect(levelUnit({ noise: 0, min: -500, max: 200 })).toBe(0.5);
    expect(levelUnit({ noise: 3, min: -500, max: 200 })).toBe(3);
  });
  it('gives equal keys for equal levels and different keys otherwise', () => {
    const a = contourLevels(1, { lowestLevel: 5, levels: 3, spacing: 2 });
    const b = contourLevels(1, { lowestLevel: 5, levels: 3, spacing: 2 });
    const c = contourLevels(1, { lowestLevel: 5, levels: 4, spacing: 2 });
    expect(levelsKey(a)).toBe(levelsKey(b));
    expect(levelsKey(a)).not.toBe(levelsKey(c));
  });
});

describe('usableContours', () => {
  it('takes the first valid candidate and falls back when none is valid', () => {
    const good = { lowestLevel: 6, levels: 8, spacing: 1.3 };
    expect(usableContours({ lowestLevel: 6, levels: 0, spacing: 1.3 }, good)).toBe(good);
    expect(usableContours(undefined, { lowestLevel: 6, levels: 8, spacing: 0.5 })).toEqual({ lowestLevel: 8, levels: 10, spacing: 1.4 });
  });
});
