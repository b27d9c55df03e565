import type { Axis } from './axis';
import type { DimensionProcessing } from './processing';

/** A processed, real, phase-sensitive 1D spectrum. */
export interface Spectrum1D {
  readonly dims: 1;
  readonly title: string;
  readonly data: Float64Array;
  readonly axis: Axis;
  /** Processing of the acquisition dimension, when the file records it. */
  readonly processing?: DimensionProcessing;
}

/**
 * A processed, real, phase-sensitive 2D spectrum stored row-major: row r is the F2 trace at F1
 * point r, so value (r, c) is data[r * f2.points + c].
 */
export interface Spectrum2D {
  readonly dims: 2;
  readonly title: string;
  readonly data: Float64Array;
  /** Indirect dimension (rows). */
  readonly f1: Axis;
  /** Direct, acquisition dimension (columns). */
  readonly f2: Axis;
  readonly processing?: { readonly f1?: DimensionProcessing; readonly f2?: DimensionProcessing };
}

export type Spectrum = Spectrum1D | Spectrum2D;

export function make2D(
  title: string,
  data: Float64Array,
  f1: Axis,
  f2: Axis,
  processing?: Spectrum2D['processing'],
): Spectrum2D {
  if (data.length !== f1.points * f2.points) {
    throw new RangeError(`2D data has ${data.length} values, axes need ${f1.points} x ${f2.points} = ${f1.points * f2.points}`);
  }
  return processing ? { dims: 2, title, data, f1, f2, processing } : { dims: 2, title, data, f1, f2 };
}

export function make1D(title: string, data: Float64Array, axis: Axis, processing?: DimensionProcessing): Spectrum1D {
  if (data.length !== axis.points) {
    throw new RangeError(`1D data has ${data.length} values, axis needs ${axis.points}`);
  }
  return processing ? { dims: 1, title, data, axis, processing } : { dims: 1, title, data, axis };
}

export function valueAt(s: Spectrum2D, row: number, col: number): number {
  return s.data[row * s.f2.points + col] ?? Number.NaN;
}
