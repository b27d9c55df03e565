/** Small measuring helpers for the simulator tests (no expected values in here). */

/** Full width at half height of the peak at index `top`, by linear interpolation of the half-height crossings, in points. */
export function fwhmPoints(y: ArrayLike<number>, top: number): number {
  const half = (y[top] ?? NaN) / 2;
  let l = top;
  while (l > 0 && (y[l] ?? 0) > half) l--;
  let r = top;
  while (r < y.length - 1 && (y[r] ?? 0) > half) r++;
  const yl0 = y[l] ?? 0;
  const yl1 = y[l + 1] ?? 0;
  const yr0 = y[r - 1] ?? 0;
  const yr1 = y[r] ?? 0;
  const left = l + (half - yl0) / (yl1 - yl0);
  const right = r - 1 + (yr0 - half) / (yr0 - yr1);
  return right - left;
}

export function argMax(y: ArrayLike<number>, from = 0, to = y.length): number {
  let best = from;
  for (let i = from; i < to; i++) if ((y[i] ?? -Infinity) > (y[best] ?? -Infinity)) best = i;
  return best;
}

export function argMin(y: ArrayLike<number>, from = 0, to = y.length): number {
  let best = from;
  for (let i = from; i < to; i++) if ((y[i] ?? Infinity) < (y[best] ?? Infinity)) best = i;
  return best;
}

/** Vertex of the parabola through (i-1, i, i+1): sub-point position of an extremum. */
export function parabolicVertex(y: ArrayLike<number>, i: number): number {
  const a = y[i - 1] ?? 0;
  const b = y[i] ?? 0;
  const c = y[i + 1] ?? 0;
  const d = a - 2 * b + c;
  return d === 0 ? i : i + (0.5 * (a - c)) / d;
}

export function sampleSd(y: ArrayLike<number>, from = 0, to = y.length): number {
  let s = 0;
  let s2 = 0;
  const n = to - from;
  for (let i = from; i < to; i++) {
    const v = y[i] ?? 0;
    s += v;
    s2 += v * v;
  }
  const m = s / n;
  return Math.sqrt((s2 - n * m * m) / (n - 1));
}
