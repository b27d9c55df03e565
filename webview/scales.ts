/**
 * Axis conversions for drawing: stored point <-> ppm (from the protocol's AxisMeta) and ppm <->
 * pixel. Chemists read 2D spectra with high ppm on the LEFT (F2) and at the TOP (F1), so both
 * screen scales run from high to low ppm. Pure: no DOM, tested in Node.
 */
import { scaleLinear, type ScaleLinear } from 'd3-scale';
import type { AxisMeta } from '../src/protocol';

/** [start, end] of a screen axis in data units: ppm (or intensity for a 1D y axis). */
export type Domain = readonly [number, number];

/** What is visible: x is F2 ppm [left, right]; y is F1 ppm [top, bottom] (1D: intensity [top, bottom]). */
export interface View {
  readonly x: Domain;
  readonly y: Domain;
}

export interface Size {
  readonly width: number;
  readonly height: number;
}

export function hzPerPoint(a: AxisMeta): number {
  return (a.lastHz - a.firstHz) / (a.points - 1);
}

/** ppm of a (fractional) stored point index. */
export function pointToPpm(a: AxisMeta, point: number): number {
  return (a.firstHz + point * hzPerPoint(a)) / a.observeMhz;
}

/** Fractional stored point index of a ppm value. */
export function ppmToPoint(a: AxisMeta, ppm: number): number {
  return (ppm * a.observeMhz - a.firstHz) / hzPerPoint(a);
}

/** The axis' full ppm range ordered high -> low (the on-screen order). */
export function fullDomain(a: AxisMeta): Domain {
  const p0 = pointToPpm(a, 0);
  const p1 = pointToPpm(a, a.points - 1);
  return p0 >= p1 ? [p0, p1] : [p1, p0];
}

/** Horizontal scale: domain[0] (high ppm) at pixel 0. */
export function xScale(view: View, size: Size): ScaleLinear<number, number> {
  return scaleLinear().domain([view.x[0], view.x[1]]).range([0, size.width]);
}

/** Vertical scale: domain[0] (high ppm, or the top intensity) at pixel 0. */
export function yScale(view: View, size: Size): ScaleLinear<number, number> {
  return scaleLinear().domain([view.y[0], view.y[1]]).range([0, size.height]);
}

/** px = scale * u + offset along one axis. */
export interface Affine1 {
  readonly scale: number;
  readonly offset: number;
}

/** Affine map from stored point index to pixel, composed of the two linear maps above. */
export function pointToPixel(a: AxisMeta, domain: Domain, pixels: number): Affine1 {
  const ppmPerPoint = hzPerPoint(a) / a.observeMhz;
  const ppm0 = a.firstHz / a.observeMhz;
  const pxPerPpm = pixels / (domain[1] - domain[0]);
  return { scale: ppmPerPoint * pxPerPpm, offset: (ppm0 - domain[0]) * pxPerPpm };
}

/** Hz of a ppm value on this axis (the read-out shows both). */
export function ppmToHz(a: AxisMeta, ppm: number): number {
  return ppm * a.observeMhz;
}
