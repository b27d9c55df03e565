/**
 * Three-point parabolic interpolation of an extremum: the vertex of the parabola through
 * (-1, yl), (0, y0), (1, yr). For an extremum at 0 (y0 >= both neighbours, or <= both) the offset
 * lies in [-0.5, 0.5].
 *
 * Chosen over Gaussian (log-parabolic) interpolation because it works for lobes of either sign and
 * for neighbours that cross zero (adjacent antiphase lobes), where logarithms are undefined.
 * Its bias (derived by evaluating the formula on sampled lineshapes): zero when the true peak is on
 * a point or midway between two; otherwise the estimate is pulled towards the nearest point, by at
 * most 0.017 point for a Gaussian 4 points wide at half height (0.007 at 6 points, 0.066 at 2) and
 * 0.041 point for a Lorentzian 4 points wide (0.020 at 6 points). Line widths here mean full width
 * at half height in points.
 */
export function parabolicOffset(yl: number, y0: number, yr: number): number {
  const curvature = yl - 2 * y0 + yr;
  if (curvature === 0) return 0;
  const p = (0.5 * (yl - yr)) / curvature;
  return Math.max(-0.5, Math.min(0.5, p));
}

/** Height of the parabola through the three points at its vertex `offset`. */
export function parabolicHeight(yl: number, y0: number, yr: number, offset: number): number {
  return y0 - 0.25 * (yl - yr) * offset;
}

/**
 * Three-point interpolation of a positive maximum through 1/y: the reciprocal of a Lorentzian,
 * 1 + (2(x - x0)/w)^2, is exactly a parabola, so position and height are exact for an isolated
 * Lorentzian line, the shape of an exponentially decaying FID's transform (used for 1D lines,
 * where the parabola's height error on narrow lines biases a height-weighted centre). Falls back
 * to the plain parabola when a value is not positive.
 */
export function lorentzianPeak(yl: number, y0: number, yr: number): { offset: number; height: number } {
  if (!(yl > 0 && y0 > 0 && yr > 0)) {
    const offset = parabolicOffset(yl, y0, yr);
    return { offset, height: parabolicHeight(yl, y0, yr, offset) };
  }
  const [ul, u0, ur] = [1 / yl, 1 / y0, 1 / yr];
  const offset = parabolicOffset(ul, u0, ur);
  return { offset, height: 1 / parabolicHeight(ul, u0, ur, offset) };
}
