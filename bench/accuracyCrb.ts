/**
 * The information limit of the accuracy study: the standard deviation of J that a least-squares
 * fit of the exact model would have at the TRUE parameters, from the Jacobian there and the known
 * noise covariance (the same sandwich the measurement uses for its own σ, src/core/measure/fit.ts).
 * For white noise this is the Cramér–Rao bound (J ᵀJ)⁻¹σ² (e.g. Kay, Fundamentals of Statistical
 * Signal Processing: Estimation Theory, 1993, ch. 3 [mem]); for the correlated noise of a zero-filled,
 * windowed spectrum it is the bound for the least-squares estimator (the generalised bound needs Σ⁻¹,
 * which zero-filling makes singular). Either way it is what the data hold for an unweighted fit.
 */
import { correlationFromProcessing } from '../src/core/measure/correlation';
import { fitFrom, uncertainty, type FitContext } from '../src/core/measure/fit';
import { processedLine } from '../src/core/measure/lineshape';
import { makeTheta, type ModelSpec } from '../src/core/measure/model';
import { extractTraces } from '../src/core/measure/traces';
import type { CrossPeakInput } from '../src/core/measure/types';
import type { Spectrum2D } from '../src/core/spectrum/spectrum';

export interface TrueParameters {
  centreHz: number;
  jHz: number;
  naturalHz: number;
  /** Passive couplings of the F2 multiplet, Hz (empty: none). */
  passiveHz: number[];
}

/** σ(J) at the true parameters of a noise-free simulated cross peak with noise level sigma. */
export function informationLimitSd(noiseFree: Spectrum2D, peak: CrossPeakInput, sigma: number, truth: TrueParameters): number {
  const block = extractTraces(noiseFree, peak, 'F2', 8);
  const along = block.alongProcessing;
  const acrossP = block.acrossProcessing;
  if (!along || !acrossP) throw new RangeError('the information limit needs the processing of both dimensions');
  const m = block.freqs.length;
  const span = Math.max(1, (block.positions.at(-1) ?? 0) - (block.positions[0] ?? 0));
  const ctx: FitContext = {
    block, sigma, rhoAlong: correlationFromProcessing(along, m), rhoAcross: correlationFromProcessing(acrossP, span),
  };
  const spec: ModelSpec = { line: processedLine(along), passives: truth.passiveHz.length };
  const theta = makeTheta(spec, truth.centreHz, truth.jHz, truth.naturalHz, truth.passiveHz);
  const atTruth = fitFrom(ctx, spec, theta, 0); // no iteration: the Jacobian at the true parameters
  return Math.sqrt(Math.max(0, uncertainty(ctx, atTruth).cov.get(1, 1)));
}
