/** One local extremum of a 2D spectrum, positioned between grid points by interpolation. */
export interface Extremum {
  /** Fractional F1 point (row) after interpolation. */
  row: number;
  /** Fractional F2 point (column) after interpolation. */
  col: number;
  f1Ppm: number;
  f2Ppm: number;
  f1Hz: number;
  f2Hz: number;
  /** Interpolated, signed height. */
  height: number;
  /** +1 for a local maximum (positive lobe), -1 for a local minimum (negative lobe). */
  sign: 1 | -1;
  /** The grid point the extremum was found at (before interpolation). */
  gridRow: number;
  gridCol: number;
}

/**
 * Bounding box of a cross peak: the union of every lobe's half-height span along its own row and
 * column (extent.ts), so it covers the multiplet's lines without growing with the signal-to-noise
 * ratio; callers that fit line tails should pad it. ppm limits run high to low (from >= to);
 * point indices low to high, inclusive.
 */
export interface CrossPeakExtent {
  f1FromPpm: number;
  f1ToPpm: number;
  f2FromPpm: number;
  f2ToPpm: number;
  row0: number;
  row1: number;
  col0: number;
  col1: number;
}

/** A whole multiplet (all its positive and negative lobes) grouped as one cross or diagonal peak. */
export interface CrossPeak {
  f1Ppm: number;
  f2Ppm: number;
  f1Hz: number;
  f2Hz: number;
  kind: 'cross' | 'diagonal';
  /** Largest |height| among the extrema (always >= 0). */
  height: number;
  extent: CrossPeakExtent;
  extrema: Extremum[];
  /** Index (in the same sorted list) of the symmetric cross peak (A,X) <-> (X,A), or null. */
  partner: number | null;
}

/** One line of a 1D multiplet. */
export interface Line1D {
  /** Fractional point index after interpolation. */
  point: number;
  hz: number;
  ppm: number;
  height: number;
}

/** A group of 1D lines taken as one multiplet. ppm limits run high to low (fromPpm >= toPpm). */
export interface Multiplet1D {
  /** Centre: height-weighted centroid of the lines. */
  ppm: number;
  hz: number;
  fromPpm: number;
  toPpm: number;
  /** Point indices of the extent, low to high. */
  point0: number;
  point1: number;
  /** Tallest line height. */
  height: number;
  lines: Line1D[];
}

/** Options shared by the 1D and 2D pickers. */
export interface LevelOptions {
  /** Picking level in multiples of the noise sigma (default 6). */
  threshold?: number;
  /** Noise sigma in data units; estimated with estimateNoise when omitted. */
  noise?: number;
  /**
   * Lowest level as a fraction of max |S| (default 0.005). It only binds when max |S| exceeds
   * threshold / floor (1200 sigma at the defaults), e.g. for noise-free simulated data, where the
   * sigma estimate is near zero and the F1 truncation ripples of the strongest peaks (about 0.3%
   * of max |S| with a squared cosine bell over 256 F1 points, seen in a simulation) would be picked.
   */
  floor?: number;
  /**
   * Minimum prominence of an extremum in multiples of sigma (default 5): how far the value must
   * fall along each axis direction before a larger value or a sign change. Removes the spurious
   * maxima that noise makes on the slopes of strong peaks and on the floor between close lines
   * (at 3 sigma, a test dd at 100 sigma still gave a false line between its inner lines).
   * 0 turns the check off.
   */
  prominence?: number;
}
