import { describe, expect, it } from 'vitest';
import { covers, planTile, strideFor } from '../../webview/tiles';

const opts = { pixelsPerCell: 1, margin: 0.25, chunkCells: 32 };

describe('strideFor', () => {
  it('rounds points per cell up to a power of two', () => {
    expect(strideFor(500, 1000)).toBe(1);
    expect(strideFor(1000, 1000)).toBe(1);
    expect(strideFor(1001, 1000)).toBe(2);
    expect(strideFor(4096, 1000)).toBe(8); // 4.096 -> 8
  });
});

describe('planTile', () => {
  it('decimates the full 4096 x 4096 grid for a 1000 x 700 canvas to at most one cell per pixel', () => {
    const p = planTile({ row0: 0, row1: 4095, col0: 0, col1: 4095 }, { rows: 4096, cols: 4096 }, { width: 1000, height: 700 }, opts);
    expect(p.region).toEqual({ row0: 0, row1: 4095, col0: 0, col1: 4095 });
    expect(p.colStride).toBe(8);
    expect(p.rowStride).toBe(8);
    expect(p.maxCols).toBe(512);
    expect(p.maxRows).toBe(512);
    expect(p.maxCols).toBeLessThanOrEqual(1000);
  });
  it('never gives more cells than pixels over the visible span, at any zoom', () => {
    for (const span of [3, 50, 999, 1000, 1001, 3000, 4095]) {
      const p = planTile({ row0: 100, row1: 100 + span, col0: 0, col1: span }, { rows: 4096, cols: 4096 }, { width: 1000, height: 700 }, opts);
      expect((span + 1) / p.colStride).toBeLessThanOrEqual(1000);
      expect((span + 1) / p.rowStride).toBeLessThanOrEqual(700);
    }
  });
  it('covers the view plus a margin, snapped to whole chunks and clamped to the grid', () => {
    const p = planTile({ row0: 1000, row1: 1199, col0: 2000, col1: 2399 }, { rows: 4096, cols: 4096 }, { width: 1000, height: 700 }, opts);
    // stride 1, chunk 32: cols 2000-100 = 1900 -> 1888; 2399+100+1 = 2500 -> 2528 - 1 = 2527
    expect(p.region.col0).toBe(1888);
    expect(p.region.col1).toBe(2527);
    expect(covers(p.region, { row0: 1000, row1: 1199, col0: 2000, col1: 2399 })).toBe(true);
    const edge = planTile({ row0: 0, row1: 10, col0: 4000, col1: 4095 }, { rows: 4096, cols: 4096 }, { width: 1000, height: 700 }, opts);
    expect(edge.region.row0).toBe(0);
    expect(edge.region.col1).toBe(4095);
  });
  it('keeps the same key for a small pan (the cached tile is reused) and changes it for a zoom', () => {
    const a = planTile({ row0: 1000, row1: 1199, col0: 2000, col1: 2399 }, { rows: 4096, cols: 4096 }, { width: 1000, height: 700 }, opts);
    const b = planTile({ row0: 1003, row1: 1202, col0: 2005, col1: 2404 }, { rows: 4096, cols: 4096 }, { width: 1000, height: 700 }, opts);
    const c = planTile({ row0: 0, row1: 4095, col0: 0, col1: 4095 }, { rows: 4096, cols: 4096 }, { width: 1000, height: 700 }, opts);
    expect(b.key).toBe(a.key);
    expect(c.key).not.toBe(a.key);
  });
  it('plans one row for a 1D spectrum', () => {
    const p = planTile({ row0: 0, row1: 0, col0: 0, col1: 65535 }, { rows: 1, cols: 65536 }, { width: 800, height: 400 }, opts);
    expect(p.region.row0).toBe(0);
    expect(p.region.row1).toBe(0);
    expect(p.maxRows).toBe(1);
    expect(p.colStride).toBe(128); // 65536 / 800 = 81.9 -> 128
  });
});
