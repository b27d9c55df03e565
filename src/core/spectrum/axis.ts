/**
 * One frequency axis of a spectrum. Point 0 is the first point stored in the file; for NMR that is
 * normally the highest frequency (high ppm on the left), so `hzPerPoint` is usually negative.
 * ppm = Hz / observe frequency in MHz (the Hz axis is relative to the shift reference).
 */
export interface Axis {
  /** Number of points along the axis. */
  readonly points: number;
  /** Frequency of point 0, Hz. */
  readonly firstHz: number;
  /** Frequency of point `points - 1`, Hz. */
  readonly lastHz: number;
  /** Spectrometer frequency for this nucleus, MHz (ppm = Hz / observeMhz). */
  readonly observeMhz: number;
}

export function makeAxis(points: number, firstHz: number, lastHz: number, observeMhz: number): Axis {
  if (!Number.isInteger(points) || points < 2) throw new RangeError(`axis needs at least 2 points, got ${points}`);
  if (!(observeMhz > 0)) throw new RangeError(`observe frequency must be positive, got ${observeMhz} MHz`);
  if (!Number.isFinite(firstHz) || !Number.isFinite(lastHz) || firstHz === lastHz) {
    throw new RangeError(`axis limits must be finite and distinct, got ${firstHz} and ${lastHz} Hz`);
  }
  return { points, firstHz, lastHz, observeMhz };
}

/** Signed spacing between adjacent points, Hz (negative when frequency falls with index). */
export function hzPerPoint(axis: Axis): number {
  return (axis.lastHz - axis.firstHz) / (axis.points - 1);
}

/** Digital resolution, Hz per point, always positive. */
export function resolutionHz(axis: Axis): number {
  return Math.abs(hzPerPoint(axis));
}

export function pointToHz(axis: Axis, point: number): number {
  return axis.firstHz + point * hzPerPoint(axis);
}

export function hzToPoint(axis: Axis, hz: number): number {
  return (hz - axis.firstHz) / hzPerPoint(axis);
}

export function hzToPpm(axis: Axis, hz: number): number {
  return hz / axis.observeMhz;
}

export function ppmToHz(axis: Axis, ppm: number): number {
  return ppm * axis.observeMhz;
}

export function pointToPpm(axis: Axis, point: number): number {
  return hzToPpm(axis, pointToHz(axis, point));
}

export function ppmToPoint(axis: Axis, ppm: number): number {
  return hzToPoint(axis, ppmToHz(axis, ppm));
}

/** Nearest stored point to a ppm value, clamped to the axis. */
export function nearestPoint(axis: Axis, ppm: number): number {
  const p = Math.round(ppmToPoint(axis, ppm));
  return Math.min(axis.points - 1, Math.max(0, p));
}

/** True when the ppm value lies within the axis limits (either direction). */
export function containsPpm(axis: Axis, ppm: number): boolean {
  const p = ppmToPoint(axis, ppm);
  return p >= -0.5 && p <= axis.points - 0.5;
}

export function firstPpm(axis: Axis): number {
  return hzToPpm(axis, axis.firstHz);
}

export function lastPpm(axis: Axis): number {
  return hzToPpm(axis, axis.lastHz);
}
