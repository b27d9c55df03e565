import { resolutionHz, type Axis } from '../spectrum/axis';
import type { WindowFunction } from '../spectrum/processing';
import { selectModel, uncertainty, type FitContext, type Selection, type Uncertainty } from './fit';
import { processedLine, pseudoVoigtLine, type LineModel } from './lineshape';
import { boundedCoupling, boundedSlope } from './model';

/**
 * When a file does not record its processing, the line shape is a guess, and a fit under one guess
 * states a σ that holds only if the guess is right. On an undersampled cross peak the guesses can
 * disagree by more than ten of those σ while fitting equally well (an antiphase J under a squared
 * cosine bell looks like 2J under a sine bell). So several line-shape families are fitted, those the
 * data cannot reject are kept, and J is their equal-weight model average with the law-of-total-
 * variance σ (Buckland, Burnham & Augustin, Biometrics 53 (1997) 603 [mem]): within-family variance
 * plus the spread between families.
 */

/** Zero-filling factors tried: acquisition time 1 / (k Δ) for a digital resolution Δ (common practice: 1-4). */
const ZERO_FILL = [1, 2, 4];
/** Windows tried: none, sine bell and squared cosine bell (shifted by 90°), the usual DQF-COSY choices (common practice). */
const WINDOWS: readonly WindowFunction[] = [
  { kind: 'none' },
  { kind: 'sine', power: 1, shiftDeg: 90 },
  { kind: 'sine', power: 2, shiftDeg: 90 },
];

export interface Family {
  name: string;
  line: LineModel;
}

/** The candidate line shapes for an axis whose processing is unknown. */
export function candidateLines(axis: Axis): Family[] {
  const hz = resolutionHz(axis);
  const sw = axis.points * hz;
  const out: Family[] = [{ name: 'Lorentz-Gauss mix', line: pseudoVoigtLine() }];
  for (const k of ZERO_FILL) {
    const n = Math.round(axis.points / k);
    if (n < 8) continue;
    for (const window of WINDOWS) {
      const line = processedLine({ acquiredPoints: n, spectralWidthHz: sw, carrierHz: 0, window, size: axis.points });
      out.push({ name: line.description, line });
    }
  }
  return out;
}

export interface FamilyFit {
  family: Family;
  sel: Selection;
  unc: Uncertainty;
  jHz: number;
  jSdHz: number;
}

export interface AveragedFit {
  /** The family with the lowest reduced χ²: its fit supplies the traces, passives and width. */
  best: FamilyFit;
  accepted: FamilyFit[];
  jHz: number;
  /** √(mean within-family variance + variance between the families' J). */
  jSdHz: number;
  notes: string[];
}

/** Sum of a one-sided correlation function as a two-sided one: 1 + 2 Σ_{k≥1} ρ_k (≥ 1). */
function correlationLength(rho: Float64Array): number {
  let s = 1;
  for (let k = 1; k < rho.length; k++) s += 2 * Math.max(0, rho[k] ?? 0);
  return s;
}

/**
 * Band of reduced χ² above the best family within which another family is not rejected: three
 * standard deviations of a reduced χ² with ν degrees of freedom, √(2/ν) (chi-squared distribution),
 * ν counted in independent noise samples (points over the correlation length along and across).
 */
function chi2Band(ctx: FitContext): number {
  const pts = ctx.block.freqs.length * ctx.block.data.length;
  const nu = Math.max(1, pts / (correlationLength(ctx.rhoAlong) * correlationLength(ctx.rhoAcross)));
  return 3 * Math.sqrt(2 / nu);
}

function fitFamily(ctx: FitContext, family: Family, maxPassive: number, centre: number, jApp: number): FamilyFit {
  // Single-proton passives only: with an assumed line shape, a group's extra lines would absorb the shape mismatch.
  const sel = selectModel(ctx, family.line, maxPassive, centre, jApp, 1);
  const unc = uncertainty(ctx, sel.fit);
  return { family, sel, unc, jHz: Math.abs(boundedCoupling(sel.fit.theta[1] ?? 0)),
    jSdHz: Math.sqrt(Math.max(0, unc.cov.get(1, 1))) * boundedSlope(sel.fit.theta[1] ?? 0) };
}

/** Fits every candidate family and averages J over those the data do not reject. */
export function fitAssumedShape(ctx: FitContext, axis: Axis, maxPassive: number, centre: number, jApp: number): AveragedFit {
  const fits = candidateLines(axis).map((f) => fitFamily(ctx, f, maxPassive, centre, jApp))
    .filter((f) => Number.isFinite(f.unc.chi2Reduced) && Number.isFinite(f.jSdHz));
  fits.sort((a, b) => a.unc.chi2Reduced - b.unc.chi2Reduced);
  const best = fits[0];
  if (!best) throw new RangeError('no line-shape family could be fitted');
  const limit = best.unc.chi2Reduced + chi2Band(ctx);
  const accepted = fits.filter((f) => f.unc.chi2Reduced <= limit);
  const k = accepted.length;
  const jHz = accepted.reduce((s, f) => s + f.jHz, 0) / k;
  const within = accepted.reduce((s, f) => s + f.jSdHz ** 2, 0) / k;
  const between = accepted.reduce((s, f) => s + (f.jHz - jHz) ** 2, 0) / k;
  const list = accepted.map((f) => `${f.family.name}: ${f.jHz.toFixed(2)} ± ${f.jSdHz.toFixed(2)} Hz (chi2_red ${f.unc.chi2Reduced.toFixed(2)})`);
  const notes = [
    `The line shape is unknown, so ${fits.length} line shapes were fitted (a Lorentz-Gauss mix and the exact processed line for ` +
      `zero-filling 1, 2 or 4 times with no window, a sine bell or a squared cosine bell); ${k} fit within the noise ` +
      `(reduced chi-squared within ${(limit - best.unc.chi2Reduced).toFixed(2)} of the best): ${list.join('; ')}. ` +
      `J is their average; its uncertainty adds the spread between them (${Math.sqrt(between).toFixed(2)} Hz) to the fit's own.`,
  ];
  return { best, accepted, jHz, jSdHz: Math.sqrt(within + between), notes };
}
