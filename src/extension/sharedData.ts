/** Spectrum data in shared memory: the host, the fit worker and a restarted fit worker read the same bytes. */

/** A Float64Array over a SharedArrayBuffer with the same values (the input itself if already shared). */
export function sharedCopy(data: Float64Array): Float64Array {
  if (data.buffer instanceof SharedArrayBuffer) return data;
  const shared = new Float64Array(new SharedArrayBuffer(data.byteLength));
  shared.set(data);
  return shared;
}
