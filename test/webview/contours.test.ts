import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { contourLevel, contourTile, negate, ringsToSvgPath, tileToGrid, type TileData } from '../../webview/contours';

function tile(rows: number, cols: number, f: (x: number, y: number) => number): TileData {
  const data = new Float32Array(rows * cols);
  for (let y = 0; y < rows; y++) for (let x = 0; x < cols; x++) data[y * cols + x] = f(x, y);
  return { rows, cols, data };
}

function bbox(r: Float32Array): [number, number, number, number] {
  let x0 = Infinity, y0 = Infinity, x1 = -Infinity, y1 = -Infinity;
  for (let i = 0; i < r.length; i += 2) {
    x0 = Math.min(x0, r[i] ?? 0); x1 = Math.max(x1, r[i] ?? 0);
    y0 = Math.min(y0, r[i + 1] ?? 0); y1 = Math.max(y1, r[i + 1] ?? 0);
  }
  return [x0, y0, x1, y1];
}

// A pyramid 4 - |dx| - |dy| (clipped at 0) on a 9 x 9 grid, apex at sample (4, 4).
const pyramid = tile(9, 9, (x, y) => Math.max(0, 4 - Math.abs(x - 4) - Math.abs(y - 4)));

describe('contourLevel on a single peak', () => {
  it('gives one ring per level below the apex and none above it', () => {
    const levels = contourTile(pyramid, [0.5, 1.5, 2.5, 3.5, 4.5]);
    expect(levels.map((l) => l.level)).toEqual([0.5, 1.5, 2.5, 3.5]);
    for (const l of levels) expect(l.rings).toHaveLength(1);
  });

  it('interpolates linearly with samples at cell centres (d3-contour): level 2.5 spans 3..6', () => {
    // Along row 4 the values 2 (x = 2) and 3 (x = 3) bracket 2.5: crossing at x = 2.5, which is
    // tile coordinate 2.5 + 0.5 = 3; symmetrically 6 on the right; the same in y.
    const ring = contourLevel(pyramid, pyramid.data, 2.5, 1).rings[0] ?? new Float32Array();
    const [x0, y0, x1, y1] = bbox(ring);
    expect(x0).toBeCloseTo(3, 6);
    expect(x1).toBeCloseTo(6, 6);
    expect(y0).toBeCloseTo(3, 6);
    expect(y1).toBeCloseTo(6, 6);
  });

  it('draws a negative peak only through the negated grid, as the isoline at -L', () => {
    const dip = { ...pyramid, data: negate(pyramid.data) };
    const levels = contourTile(dip, [2.5]);
    expect(levels).toHaveLength(1);
    expect(levels[0]?.level).toBe(-2.5);
    expect(bbox(levels[0]?.rings[0] ?? new Float32Array())).toEqual(bbox(contourLevel(pyramid, pyramid.data, 2.5, 1).rings[0] ?? new Float32Array()));
  });
});

describe('contourLevel on a saddle', () => {
  it('separates the two positive and the two negative corners (v = (x - 1)(y - 1) on 3 x 3)', () => {
    const saddle = tile(3, 3, (x, y) => (x - 1) * (y - 1));
    const levels = contourTile(saddle, [0.5]);
    expect(levels.map((l) => [l.level, l.rings.length])).toEqual([[0.5, 2], [-0.5, 2]]);
  });
});

describe('tileToGrid', () => {
  it('maps the centre of cell j to the centre of its block of stored points', () => {
    // region cols 100..115 (16 points) in 4 cells: cell 1 covers 104..107, centre 105.5
    const m = tileToGrid(100, 16, 4);
    expect(m.scale * 1.5 + m.offset).toBe(105.5);
    const id = tileToGrid(100, 16, 16); // no decimation: cell j centre is point 100 + j
    expect(id.scale * 3.5 + id.offset).toBe(103);
  });
});

describe('contour snapshot', () => {
  it('matches the stored SVG of a small antiphase cross peak (writes *-changed.svg on mismatch)', () => {
    // Antiphase in both dimensions, as a DQF-COSY cross peak in its active coupling: four lobes.
    const g = (u: number): number => u * Math.exp(-u * u / 4);
    const cross = tile(16, 16, (x, y) => 4 * g(x - 7.5) * g(y - 7.5));
    const levels = contourTile(cross, [0.5, 1.0]);
    const low = levels.filter((l) => Math.abs(l.level) === 0.5);
    expect(low.map((l) => l.rings.length)).toEqual([2, 2]); // two positive, two negative lobes
    const paths = levels.map((l) => `<path class="${l.level > 0 ? 'pos' : 'neg'}" data-level="${l.level}" d="${ringsToSvgPath(l.rings)}"/>`);
    const svg = `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 16 16">\n${paths.join('\n')}\n</svg>\n`;
    const dir = join(__dirname, '__snapshots__');
    const file = join(dir, 'antiphaseCrossPeak.svg');
    if (!existsSync(file)) {
      // A missing snapshot is written once locally; in CI it means the file was lost, which must fail.
      if (process.env.CI) expect.fail(`snapshot ${file} is missing`);
      mkdirSync(dir, { recursive: true });
      writeFileSync(file, svg);
    }
    const stored = readFileSync(file, 'utf8');
    if (stored !== svg) {
      writeFileSync(join(dir, 'antiphaseCrossPeak-changed.svg'), svg);
      expect.fail('contours changed: compare antiphaseCrossPeak-changed.svg with antiphaseCrossPeak.svg');
    }
  });
});
