/** Best-of-n wall time in ms: the minimum is the least disturbed by other load on a shared machine. */
export function best(repeats: number, f: () => unknown): number {
  let min = Infinity;
  for (let i = 0; i < repeats; i++) {
    const t0 = performance.now();
    f();
    min = Math.min(min, performance.now() - t0);
  }
  return min;
}

/** One pass over a text's char codes: the least any reader of it must do. */
export function scanText(text: string): number {
  let sum = 0;
  for (let i = 0; i < text.length; i++) sum = (sum + text.charCodeAt(i)) | 0;
  return sum;
}

/** One pass over the values: the least any peak picker must do. */
export function scanValues(data: Float64Array): number {
  let max = 0;
  for (let i = 0; i < data.length; i++) max = Math.max(max, Math.abs(data[i] ?? 0));
  return max;
}
