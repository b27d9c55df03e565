/**
 * Half-height extent of one lobe along one axis: from the grid point of an extremum, walk in each
 * direction while sign * S stays above half the extremum's grid value. Returns the last indices
 * still above (inclusive), so a lobe one point wide gives [i, i].
 *
 * Half height, not the picking level, so that the extent describes the multiplet and does not
 * grow with the signal-to-noise ratio (at a level of 6 sigma the tails of a strong Lorentzian
 * line reach far beyond its lobes).
 */
export function lobeSpan(
  data: Float64Array,
  start: number,
  stride: number,
  index: number,
  count: number,
  sign: 1 | -1,
): [number, number] {
  const half = 0.5 * sign * (data[start] ?? 0);
  let lo = index;
  while (lo > 0 && sign * (data[start - (index - lo + 1) * stride] ?? 0) > half) lo--;
  let hi = index;
  while (hi < count - 1 && sign * (data[start + (hi - index + 1) * stride] ?? 0) > half) hi++;
  return [lo, hi];
}
