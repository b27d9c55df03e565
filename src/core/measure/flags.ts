import type { QualityFlag } from './types';

export interface FlagInput {
  jHz: number;
  jSdHz: number;
  linewidthHz: number;
  /** Digital resolution along the measured dimension, Hz per point. */
  hzPerPoint: number;
  dimension: 'F2' | 'F1';
  /** Shift difference of the two coupled protons (cross-peak F1 minus F2 position), Hz. */
  shiftDiffHz: number;
  chi2Reduced: number;
  /** True when the line shape was assumed (processing unknown) rather than modelled exactly. */
  lineshapeAssumed: boolean;
}

/** Thresholds, each with its reason; they are documented in the notes the flags add. */
export const FLAG_LIMITS = {
  /** J (or J - 2σ) below half the apparent linewidth: the two antiphase lines largely cancel (design.md). */
  unresolvedRatio: 0.5,
  /**
   * Fewer than 1.5 points per apparent linewidth: coarser than anything the accuracy study
   * validated (bench/accuracy.md reaches 1.75 points per linewidth with honest sigma).
   */
  pointsPerLinewidth: 1.5,
  /** A stated σ below a tenth of a point, with an assumed line shape, rests on that assumption. */
  sdPerPoint: 0.1,
  /** Shift difference over J below 10: first-order analysis may not hold (common practice). */
  secondOrderRatio: 10,
  /** RSS four times its expectation: the model misses something beyond the noise. */
  chi2Poor: 4,
  /** F1 digital resolution coarser than J/3 (common practice: a few points per splitting). */
  f1PointsPerJ: 3,
} as const;

/** The quality flags and a plain-language note for each; the chemist decides what to do with them. */
export function qualityFlags(q: FlagInput): { flags: QualityFlag[]; notes: string[] } {
  const flags: QualityFlag[] = [];
  const notes: string[] = [];
  const L = FLAG_LIMITS;
  const j = q.jHz.toFixed(2);
  const limit = L.unresolvedRatio * q.linewidthHz;
  if (q.jHz < limit || q.jHz - 2 * q.jSdHz < limit) {
    // Also when the data cannot exclude it: the lower end of J ± 2σ is below half the linewidth.
    flags.push('unresolved');
    notes.push((q.jHz < limit
      ? `J (${j} Hz) is below half the linewidth (${q.linewidthHz.toFixed(2)} Hz)`
      : `J - 2 sigma (${(q.jHz - 2 * q.jSdHz).toFixed(2)} Hz) is below half the linewidth (${q.linewidthHz.toFixed(2)} Hz), so the data ` +
        'do not exclude an unresolved coupling') +
      ': the antiphase lines largely cancel, so the value rests on the line-shape model; treat it as an estimate and check it ' +
      'against the 1D multiplet or the symmetric cross peak before using it for an assignment.');
  }
  if (q.jSdHz > 0.5 * q.jHz) {
    // No flag of its own (the flag set is fixed), but the chemist must not read a number here.
    notes.push(`J is not determined by these data: its standard deviation (${q.jSdHz.toFixed(2)} Hz) exceeds half its value; ` +
      'report it as not measured, or measure at higher signal-to-noise or in the symmetric cross peak.');
  }
  const coarse = q.hzPerPoint > q.linewidthHz / L.pointsPerLinewidth;
  const tooFine = q.lineshapeAssumed && q.jSdHz < L.sdPerPoint * q.hzPerPoint;
  if (coarse || tooFine) {
    flags.push('resolution_limited');
    notes.push(coarse
      ? `Digital resolution ${q.hzPerPoint.toFixed(2)} Hz/point gives fewer than ${L.pointsPerLinewidth} points per linewidth, ` +
        'coarser than the accuracy study covers; the line shape is poorly sampled and the uncertainty may be optimistic.'
      : `The stated uncertainty (${q.jSdHz.toFixed(3)} Hz) is below a tenth of a point (${q.hzPerPoint.toFixed(2)} Hz/point) ` +
        'while the line shape was assumed, not known; the precision holds only if that assumption does.');
  }
  if (q.jHz > 0 && Math.abs(q.shiftDiffHz) / q.jHz < L.secondOrderRatio) {
    flags.push('second_order_suspected');
    notes.push(`The shift difference (${Math.abs(q.shiftDiffHz).toFixed(1)} Hz) is less than ${L.secondOrderRatio} times J: ` +
      'the spin system may be second order, where line spacings are not coupling constants; a spin simulation is safer.');
  }
  if (q.chi2Reduced > L.chi2Poor) {
    flags.push('fit_poor');
    notes.push(`The fit leaves ${q.chi2Reduced.toFixed(1)} times the residual expected from noise (chi-squared); the ` +
      'model misses something (overlap, more couplings, phase or baseline). The uncertainty was inflated accordingly; inspect the residual.');
  }
  if (q.dimension === 'F1' && q.hzPerPoint > q.jHz / L.f1PointsPerJ) {
    flags.push('f1_coarse');
    notes.push(`Measured in F1 at ${q.hzPerPoint.toFixed(2)} Hz/point, coarser than J/${L.f1PointsPerJ}: prefer the F2 value ` +
      '(or the symmetric cross peak) where one exists.');
  }
  return { flags, notes };
}
