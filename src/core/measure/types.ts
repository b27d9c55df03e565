/**
 * Public types of the J measurement. The CLI and the extension build on these names; keep them stable.
 */

export type QualityFlag =
  | 'unresolved' | 'resolution_limited' | 'second_order_suspected' | 'fit_poor' | 'f1_coarse'
  /** The symmetric cross peak reads n = 2 or 3 times this J: that trace is split by a CH2/CH3 partner. */
  | 'equivalent_partner'
  /** The symmetric cross peak gives a J that neither agrees nor is a small multiple. */
  | 'partner_disagrees'
  /** A smaller active J with an equivalent-proton group or extra passive coupling fits as well as the larger reading. */
  | 'ambiguous_multiplet';

/** One trace used in a measurement: the data, the fitted model and their difference, over fromPpm..toPpm. */
export interface TraceFit {
  /** Index of the trace in the spectrum: the F1 row for an F2 measurement, the F2 column for an F1 one. */
  row: number;
  /** Position of the trace on the other axis, ppm (named for the usual F2 case). */
  f1Ppm: number;
  fromPpm: number;
  toPpm: number;
  data: Float64Array;
  fitted: Float64Array;
  residual: Float64Array;
}

export interface Measurement {
  jHz: number;
  jSdHz: number;
  passiveHz: number[];
  passiveSdHz: number[];
  /** Apparent full width at half height of one line in the processed spectrum, Hz. */
  linewidthHz: number;
  linewidthSdHz: number;
  method: 'fit' | 'naive';
  dimension: 'F2' | 'F1';
  centreHz: number;
  centrePpm: number;
  /** Noise standard deviation of the processed spectrum used for the uncertainty. */
  noise: number;
  residualRms: number;
  /** Residual sum of squares over its expectation under the measured, correlated noise. */
  chi2Reduced: number;
  flags: QualityFlag[];
  notes: string[];
  traces: TraceFit[];
  lineshape: string;
}

export interface MeasureOptions {
  method?: 'fit' | 'naive';
  dimension?: 'F2' | 'F1';
  /** Noise standard deviation of the processed spectrum; measured with estimateNoise when absent. */
  noise?: number;
  /** Largest number of passive couplings (each to 1-3 equivalent protons) the model may use (default 4). */
  maxPassive?: number;
  /** Largest number of traces fitted jointly (default 8, the strongest in the extent). */
  rows?: number;
}

/**
 * The fields of a picked cross peak that the measurement reads. Structurally compatible with the
 * CrossPeak of src/core/peaks; declared here so the measurement does not depend on the picker.
 */
export interface CrossPeakInput {
  readonly f1Ppm: number;
  readonly f2Ppm: number;
  readonly f1Hz?: number;
  readonly f2Hz?: number;
  readonly extent?: {
    readonly f1FromPpm: number;
    readonly f1ToPpm: number;
    readonly f2FromPpm: number;
    readonly f2ToPpm: number;
    readonly row0: number;
    readonly row1: number;
    readonly col0: number;
    readonly col1: number;
  };
}

/** A measurement that cannot be made; the message says what and where. */
export class MeasureError extends Error {
  override readonly name = 'MeasureError';
}
