/**
 * How one dimension was processed, when known. The simulator records it in the files it writes,
 * and the fit uses it to model the exact lineshape (truncation plus window) instead of a generic one.
 */
export type WindowFunction =
  | { readonly kind: 'none' }
  /** exp(-pi * lbHz * t): adds lbHz to the Lorentzian full width at half height. */
  | { readonly kind: 'exponential'; readonly lbHz: number }
  /** sin(phi + (pi - phi) * k / (n - 1)) ** power, phi = shiftDeg in degrees (90 = cosine bell). */
  | { readonly kind: 'sine'; readonly power: 1 | 2; readonly shiftDeg: number };

export interface DimensionProcessing {
  /** Complex points acquired (before zero-filling); acquisition time = acquiredPoints / spectralWidthHz. */
  readonly acquiredPoints: number;
  /** Spectral width, Hz (= 1 / dwell time). */
  readonly spectralWidthHz: number;
  /** Frequency of the spectrum centre relative to the shift reference, Hz. */
  readonly carrierHz: number;
  readonly window: WindowFunction;
  /** Points after zero-filling (a power of two); the processed spectrum has this many points. */
  readonly size: number;
}

export function acquisitionTime(p: DimensionProcessing): number {
  return p.acquiredPoints / p.spectralWidthHz;
}
