import { describe, expect, it } from 'vitest';
import { ContourCache, setLevels, step } from '../../webview/contourCache';
import { planTile } from '../../webview/tiles';

const tile = (peak: number) => {
  const data = new Float32Array(25);
  data[12] = peak; // centre of a 5 x 5 tile
  data[0] = -peak / 2;
  return { rows: 5, cols: 5, data };
};
const plan = (col0: number) => planTile({ row0: 0, row1: 4, col0, col1: col0 + 4 }, { rows: 5, cols: 4096 }, { width: 5, height: 5 }, { pixelsPerCell: 1, margin: 0, chunkCells: 1 });

describe('ContourCache', () => {
  it('queues only levels the tile reaches, on each sign', () => {
    const c = new ContourCache();
    const e = c.put(plan(0), tile(10), [1, 4, 8, 16], 'a');
    // positive max 10: 1, 4, 8; negative max 5: 1, 4
    expect(e.queue.map((q) => q.sign * q.magnitude)).toEqual([1, -1, 4, -4, 8]);
  });

  it('does one level per step when the budget is zero, so input is handled between levels', () => {
    const c = new ContourCache();
    const e = c.put(plan(0), tile(10), [1, 4], 'a');
    let t = 0;
    const clock = () => (t += 1);
    expect(step(e, 0, clock)).toBe(true);
    expect(e.done).toHaveLength(1);
    while (step(e, 0, clock));
    expect(e.done.map((l) => l.level)).toEqual([1, -1, 4, -4]);
    expect(e.done.every((l) => l.rings.length === 1)).toBe(true);
  });

  it('recomputes geometry when the levels change, keeps it when they do not', () => {
    const c = new ContourCache();
    const e = c.put(plan(0), tile(10), [1], 'a');
    while (step(e, 0, () => 0));
    setLevels(e, [1], 'a');
    expect(e.done).toHaveLength(2);
    setLevels(e, [2], 'b');
    expect(e.done).toHaveLength(0);
    expect(e.queue).toHaveLength(2);
  });

  it('drops the least recently used tile beyond its capacity', () => {
    const c = new ContourCache(2);
    const a = plan(0), b = plan(100), d = plan(200);
    c.put(a, tile(1), [1], 'x');
    c.put(b, tile(1), [1], 'x');
    expect(c.get(a.key)).toBeDefined(); // a is now the most recent
    c.put(d, tile(1), [1], 'x');
    expect(c.get(b.key)).toBeUndefined();
    expect(c.get(a.key)).toBeDefined();
    expect(c.size).toBe(2);
  });
});
