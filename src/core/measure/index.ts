import { resolutionHz, hzToPpm } from '../spectrum/axis';
import { estimateNoise } from '../spectrum/noise';
import type { Spectrum2D } from '../spectrum/spectrum';
import { fitAssumedShape } from './assumedShape';
import { correlationFromProcessing, estimateCorrelation, type NoiseCorrelation } from './correlation';
import { selectModel, uncertainty, type FitContext, type FitResult, type Selection } from './fit';
import { preferSmallerActive } from './multiplet';
import { qualityFlags } from './flags';
import { processedLine, pseudoVoigtLine } from './lineshape';
import { apparentFwhm, boundedCoupling, boundedSlope, lineWidth, mixFraction, passiveIndex } from './model';
import { naiveSplitting } from './naive';
import { extractTraces, ppmOf, sampleTraces, type TraceBlock } from './traces';
import { MeasureError, type CrossPeakInput, type Measurement, type QualityFlag, type MeasureOptions, type TraceFit } from './types';

export { MeasureError } from './types';
export type { QualityFlag, TraceFit, Measurement, MeasureOptions, CrossPeakInput } from './types';

/** Passive couplings tried by default: a CH next to a CH3 and a CH2 and one more proton has four. */
const DEFAULT_MAX_PASSIVE = 4;
/** With an assumed line shape, more couplings absorb the shape mismatch instead: the former default there. */
const ASSUMED_MAX_PASSIVE = 2;

function checkOptions(o: MeasureOptions): void {
  if (o.maxPassive !== undefined && !(Number.isInteger(o.maxPassive) && o.maxPassive >= 0 && o.maxPassive <= 4)) {
    throw new RangeError(`maxPassive must be an integer 0..4, got ${o.maxPassive}`);
  }
  if (o.rows !== undefined && !(Number.isInteger(o.rows) && o.rows >= 1)) throw new RangeError(`rows must be a positive integer, got ${o.rows}`);
  if (o.noise !== undefined && !(o.noise > 0 && Number.isFinite(o.noise))) throw new RangeError(`noise must be positive, got ${o.noise}`);
}

/** Noise correlation along and across the traces: from the processing when known, else measured. */
function correlations(s: Spectrum2D, block: TraceBlock): { along: NoiseCorrelation; across: NoiseCorrelation; measured: boolean } {
  const m = block.freqs.length;
  const span = Math.max(1, (block.positions.at(-1) ?? 0) - (block.positions[0] ?? 0));
  const other = block.dimension === 'F2' ? 'F1' : 'F2';
  const along = block.alongProcessing
    ? correlationFromProcessing(block.alongProcessing, m)
    : estimateCorrelation(sampleTraces(s, block.dimension, 64), Math.min(32, m));
  const across = block.acrossProcessing
    ? correlationFromProcessing(block.acrossProcessing, span)
    : estimateCorrelation(sampleTraces(s, other, 64), Math.min(16, span), 32);
  return { along, across, measured: !block.alongProcessing || !block.acrossProcessing };
}

function traceFits(block: TraceBlock, fitted: Float64Array): TraceFit[] {
  const m = block.freqs.length;
  return block.data.map((data, t) => {
    const f = fitted.slice(t * m, (t + 1) * m);
    return {
      row: block.positions[t] ?? 0,
      f1Ppm: ppmOf(block.across, block.positions[t] ?? 0),
      fromPpm: ppmOf(block.along, block.from),
      toPpm: ppmOf(block.along, block.to),
      data: Float64Array.from(data),
      fitted: f,
      residual: Float64Array.from(data, (v, i) => v - (f[i] ?? 0)),
    };
  });
}

function sd(cov: { get(i: number, j: number): number }, i: number): number {
  return Math.sqrt(Math.max(0, cov.get(i, i)));
}

/** Apparent FWHM and its σ from the width parameter's variance (numeric derivative). */
function linewidthWithSd(fit: FitResult, varWidth: number): [number, number] {
  const fw = apparentFwhm(fit.spec, fit.theta);
  const h = 1e-4 * Math.max(1, Math.abs(fit.theta[2] ?? 0));
  const up = Float64Array.from(fit.theta);
  const dn = Float64Array.from(fit.theta);
  up[2] = (up[2] ?? 0) + h;
  dn[2] = (dn[2] ?? 0) - h;
  const slope = (apparentFwhm(fit.spec, up) - apparentFwhm(fit.spec, dn)) / (2 * h);
  return [fw, Math.abs(slope) * Math.sqrt(Math.max(0, varWidth))];
}

/**
 * When the partner is a group of n equivalent protons, n - 1 of them split A in-phase by the same J,
 * the inner lines cancel, and the F2 trace equals an antiphase pair at n J (n = 2: exactly, with no
 * passive; n = 3: with a passive of J). No fit of this trace can tell; say so when it is possible.
 */
function equivalentPartnerNotes(jHz: number, passiveHz: number[], linewidthHz: number): string[] {
  const half = passiveHz.find((p) => Math.abs(p - jHz / 2) < 0.25 * linewidthHz);
  const generic = 'If the partner is a CH2 or CH3 group (equivalent protons), the inner lines of this cross peak cancel and ' +
    'the splitting measured is a multiple of J: for a CH2 partner the trace is an antiphase pair at 2J. Check the multiplicity ' +
    'of the partner, or measure the symmetric cross peak.';
  return half !== undefined
    ? [`A passive coupling of ${half.toFixed(2)} Hz is half the active one: this is the pattern of a CH3 partner with J = ` +
      `${half.toFixed(2)} Hz (measured splitting 2J). ${generic}`]
    : [generic];
}

/**
 * J of the active coupling at a DQF-COSY cross peak, from the traces through it along F2 (default)
 * or F1. The 'fit' method models the multiplet (module fit.ts); 'naive' reads the antiphase
 * extrema (kept for comparison). Throws MeasureError when there is nothing to measure.
 */
export function measureCrossPeak(s: Spectrum2D, peak: CrossPeakInput, opts: MeasureOptions = {}): Measurement {
  checkOptions(opts);
  const dimension = opts.dimension ?? 'F2';
  const method = opts.method ?? 'fit';
  const block = extractTraces(s, peak, dimension, opts.rows ?? 8);
  const sigma = opts.noise ?? estimateNoise(s.data);
  if (!(sigma > 0)) throw new MeasureError(`the noise level of '${s.title}' is zero or unmeasurable; pass it explicitly`);
  const rho = correlations(s, block);
  const ctx: FitContext = { block, sigma, rhoAlong: rho.along, rhoAcross: rho.across };
  // The fit starts from the strongest points (the span of the whole multiplet); the naive method reports the adjacent pair.
  const start = naiveSplitting(block, sigma, rho.along, rho.across, 'strongest');
  const naive = method === 'naive' ? naiveSplitting(block, sigma, rho.along, rho.across) : start;
  const line = block.alongProcessing ? processedLine(block.alongProcessing) : pseudoVoigtLine();
  const notes: string[] = [];
  if (!block.alongProcessing) {
    notes.push(`The ${dimension} processing is not recorded in the file, so the line shape is assumed (see below), ` +
      'and the noise correlation between points was measured on empty parts of the spectrum.');
  }
  // Unknown processing: several line shapes, J averaged over those the data do not reject (assumedShape.ts).
  const averaged = method === 'fit' && !block.alongProcessing
    ? fitAssumedShape(ctx, block.along, opts.maxPassive ?? ASSUMED_MAX_PASSIVE, start.centreHz, start.jHz)
    : undefined;
  const maxPassive = method === 'fit' ? opts.maxPassive ?? DEFAULT_MAX_PASSIVE : 0;
  const chosen = averaged ? undefined : selectModel(ctx, line, maxPassive, start.centreHz, start.jHz);
  // The multiplet check (multiplet.ts) for the exact line shape; the assumed-shape average keeps its own choice.
  const checked = chosen && method === 'fit' ? preferSmallerActive(ctx, chosen, maxPassive) : undefined;
  const sel = averaged?.best.sel ?? checked ?? (chosen as Selection);
  const unc = averaged?.best.unc ?? uncertainty(ctx, sel.fit);
  const fit = sel.fit;
  const [linewidthHz, linewidthSdHz] = linewidthWithSd(fit, unc.cov.get(2, 2));
  const mix = mixFraction(fit.spec, fit.theta);
  const fitLine = fit.spec.line;
  const lineshape = fitLine.kind === 'pseudoVoigt' ? `Lorentz-Gauss mix ${mix.toFixed(2)}` : fitLine.description;
  const hzPt = resolutionHz(block.along);
  let jHz: number;
  let jSdHz: number;
  let centreHz: number;
  const fitted = fit.fitted;
  const chi2 = unc.chi2Reduced;
  if (method === 'naive') {
    jHz = naive.jHz;
    jSdHz = naive.jSdHz;
    centreHz = naive.centreHz;
    notes.push('Naive method: the distance between the strongest positive and negative points of the summed traces ' +
      '(parabolic interpolation); it overestimates J near and below the linewidth. The linewidth, chi-squared and the ' +
      'fitted traces come from a model fit without passive couplings.');
  } else {
    jHz = averaged?.jHz ?? Math.abs(boundedCoupling(fit.theta[1] ?? 0));
    jSdHz = averaged?.jSdHz ?? sd(unc.cov, 1) * boundedSlope(fit.theta[1] ?? 0);
    centreHz = fit.theta[0] ?? 0;
    notes.push(...sel.notes, ...(averaged?.notes ?? []));
    notes.push(`Natural linewidth ${lineWidth(fit.spec, fit.theta).toFixed(2)} Hz; uncertainty from the fit covariance with the ` +
      'measured noise, correlation between points included (sandwich estimator)' + (unc.inflated ? `, scaled by sqrt(chi2_red) = ${Math.sqrt(chi2).toFixed(2)}.` : '.'));
  }
  const passiveHz = Array.from({ length: method === 'fit' ? fit.spec.passives : 0 }, (_, i) => Math.abs(boundedCoupling(fit.theta[passiveIndex(fit.spec, i)] ?? 0)));
  const passiveSdHz = passiveHz.map((_, i) => sd(unc.cov, passiveIndex(fit.spec, i)) * boundedSlope(fit.theta[passiveIndex(fit.spec, i)] ?? 0));
  const q0: QualityFlag[] = [];
  notes.push(...equivalentPartnerNotes(jHz, passiveHz, linewidthHz));
  if (checked?.ambiguous) q0.push('ambiguous_multiplet');
  const q = qualityFlags({
    jHz, jSdHz, linewidthHz, hzPerPoint: hzPt, dimension,
    shiftDiffHz: (peak.f1Ppm - peak.f2Ppm) * s.f2.observeMhz,
    chi2Reduced: chi2,
    lineshapeAssumed: !block.alongProcessing,
  });
  notes.push(...q.notes);
  let rss = 0;
  block.data.forEach((y, t) => y.forEach((v, i) => (rss += (v - (fitted[t * y.length + i] ?? 0)) ** 2)));
  return {
    jHz, jSdHz, passiveHz, passiveSdHz, linewidthHz, linewidthSdHz, method, dimension, centreHz,
    centrePpm: hzToPpm(block.along, centreHz), noise: sigma,
    residualRms: Math.sqrt(rss / Math.max(1, fitted.length)), chi2Reduced: chi2,
    flags: [...q.flags, ...q0], notes, traces: traceFits(block, fitted), lineshape,
  };
}
export { measurePair, reconcile, type PairMeasurement, type PartnerResult } from './pair';
