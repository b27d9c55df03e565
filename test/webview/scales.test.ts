import { describe, expect, it } from 'vitest';
import type { AxisMeta } from '../../src/protocol';
import { fullDomain, pointToPixel, pointToPpm, ppmToHz, ppmToPoint, xScale, yScale } from '../../webview/scales';

// 600 MHz, 11 points from 6000 Hz (10 ppm) down to 0 Hz (0 ppm): 1 ppm per point, high ppm first.
const axis: AxisMeta = { points: 11, firstHz: 6000, lastHz: 0, observeMhz: 600 };

describe('point <-> ppm', () => {
  it('maps point 0 to 10 ppm and point 10 to 0 ppm (ppm = Hz / MHz)', () => {
    expect(pointToPpm(axis, 0)).toBe(10);
    expect(pointToPpm(axis, 10)).toBe(0);
    expect(pointToPpm(axis, 2.5)).toBe(7.5);
    expect(ppmToPoint(axis, 7.5)).toBe(2.5);
  });
  it('orders the full domain high -> low whichever way the file stores it', () => {
    expect(fullDomain(axis)).toEqual([10, 0]);
    expect(fullDomain({ ...axis, firstHz: 0, lastHz: 6000 })).toEqual([10, 0]);
  });
  it('gives Hz for the read-out (3.5 ppm at 600 MHz = 2100 Hz)', () => {
    expect(ppmToHz(axis, 3.5)).toBe(2100);
  });
});

describe('screen scales', () => {
  const view = { x: [8, 2] as const, y: [9, 1] as const };
  const size = { width: 600, height: 400 };
  it('puts high ppm on the left in F2 and at the top in F1', () => {
    expect(xScale(view, size)(8)).toBe(0);
    expect(xScale(view, size)(2)).toBe(600);
    expect(xScale(view, size)(5)).toBe(300);
    expect(yScale(view, size)(9)).toBe(0);
    expect(yScale(view, size)(1)).toBe(400);
    expect(xScale(view, size).invert(150)).toBe(6.5);
  });
  it('composes point -> ppm -> pixel into one affine map (checked by hand at two points)', () => {
    const a = pointToPixel(axis, view.x, size.width);
    // point 2 = 8 ppm -> 0 px; point 8 = 2 ppm -> 600 px: 100 px per point
    expect(a.scale).toBeCloseTo(100, 12);
    expect(a.scale * 2 + a.offset).toBeCloseTo(0, 9);
    expect(a.scale * 8 + a.offset).toBeCloseTo(600, 9);
  });
});
