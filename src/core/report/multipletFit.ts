/**
 * Fit of a 1D multiplet's lineshape as one first-order splitting tree (multipletModel.ts): short
 * screening fits to rank trees, polished fits with uncertainties, and the criterion that compares
 * trees, the Bayesian information criterion (Schwarz, Ann. Stat. 6 (1978) 461 [mem]) computed with
 * the noise sd and the noise correlation of the processed spectrum. The search is multipletSearch.ts.
 */
import { pseudoInverse, type Matrix } from 'ml-matrix';
import { jtRj, type NoiseCorrelation } from '../measure/correlation';
import type { LineModel } from '../measure/lineshape';
import { covarianceSandwich, jacobianFd, levenbergMarquardt } from '../measure/lm';
import {
  basisOf, hasMixParam, jsOf, mixOf, residualOf, shapeOf, solveLinear, widthOf,
  type ModelLayout, type Region, type TreeSpec,
} from './multipletModel';
import type { TreeGroup } from './splittingTree';

export interface FitContext {
  readonly region: Region;
  readonly line: LineModel;
  /** Noise sd of the spectrum. */
  readonly sigma: number;
  /** Noise correlation between points `lag` apart (rho[0] = 1). */
  readonly rho: NoiseCorrelation;
}

export interface LineshapeFit {
  /**
   * Fitted couplings as modelled (one entry per J parameter), largest J first. sdHz: from the
   * covariance with the noise sd and the processing's noise correlation (sandwich formula), scaled
   * up by χ²_red when the residual exceeds the noise (never scaled down).
   */
  groups: TreeGroup[];
  centreHz: number;
  centreSdHz: number;
  /** The line model's width parameter at the solution (a starting value for related trees). */
  widthParam: number;
  /** Full width at half height of one fitted line, Hz. */
  fwhmHz: number;
  amplitude: number;
  rss: number;
  /** RSS over its expectation for noise alone (1 for a model that explains the data). */
  chi2Reduced: number;
  /** √(max(0, RSS − E[RSS]) / points) over the tallest point of the data: misfit beyond noise. */
  excessMisfit: number;
  /** Information criterion (lower is better), comparable between trees on the same region. */
  criterion: number;
  /** The whole fitted model (multiplet plus baseline) at the region's frequencies (for inspection and plots). */
  model: Float64Array;
  /** The fitted baseline alone at the region's frequencies (already part of `model`). */
  baseline: Float64Array;
}

/** Correlation sum Σ_lag ρ(lag) over both sides: how many points one independent noise value spans. */
export function correlationSum(rho: NoiseCorrelation): number {
  let s = rho[0] ?? 1;
  for (let k = 1; k < rho.length; k++) s += 2 * (rho[k] ?? 0);
  return Math.max(1, s);
}

function layoutOf(ctx: FitContext, counts: readonly number[]): ModelLayout {
  return { line: ctx.line, counts };
}

/** A fit without uncertainties: enough to rank trees. */
export interface QuickFit {
  counts: readonly number[];
  theta: Float64Array;
  rss: number;
  criterion: number;
}

/** LM iterations of a screening fit; a polished fit continues from it with up to 60 more. */
const QUICK_ITERATIONS = 6;

/**
 * BIC on the effective number of independent points (m / Σρ), plus half a parameter's price for each
 * partner beyond one per J: with J below the linewidth, a d and a t differ by little more than broadening.
 */
function criterionOf(ctx: FitContext, rss: number, params: number, counts: readonly number[]): number {
  const cf = correlationSum(ctx.rho);
  const m = ctx.region.freqs.length;
  const extra = counts.reduce((a, n) => a + n - 1, 0);
  return rss / (ctx.sigma ** 2 * cf) + (params + LINEAR_PARAMS + 0.5 * extra) * Math.log(Math.max(2, m / cf));
}

const LINEAR_PARAMS = 3;

function projectedResidual(ctx: FitContext, layout: ModelLayout): (th: Float64Array) => Float64Array {
  const { freqs, data } = ctx.region;
  return (th) => {
    const basis = basisOf(shapeOf(layout, th, freqs));
    return residualOf(basis, solveLinear(basis, data), data);
  };
}

/** A short least-squares fit of one tree from starting values (or from an earlier theta); null when not finite. */
export function quickFit(ctx: FitContext, tree: TreeSpec, centre0: number, width0: number, maxIterations = QUICK_ITERATIONS, from?: Float64Array): QuickFit | null {
  const layout = layoutOf(ctx, tree.counts);
  const theta0 = from ?? [centre0, ...tree.js, width0, ...(hasMixParam(layout) ? [-2] : [])];
  let res;
  try {
    res = levenbergMarquardt(projectedResidual(ctx, layout), theta0, { maxIterations, tolerance: 1e-6, scales: Array.from(theta0, () => 1) });
  } catch {
    return null;
  }
  if (!res.params.every(Number.isFinite) || !Number.isFinite(res.rss)) return null;
  return { counts: tree.counts, theta: res.params, rss: res.rss, criterion: criterionOf(ctx, res.rss, res.params.length, tree.counts) };
}

/** Continue a screening fit to convergence and add uncertainties; null when the amplitude is not positive. */
export function polish(ctx: FitContext, q: QuickFit): LineshapeFit | null {
  const tree = { js: jsOf(layoutOf(ctx, q.counts), q.theta), counts: q.counts };
  const full = quickFit(ctx, tree, 0, 0, 60, q.theta);
  return full ? summarise(ctx, layoutOf(ctx, q.counts), full.theta, full.rss) : null;
}

/** Least-squares fit of one tree from starting values; null when it does not converge to something finite. */
export function fitTree(ctx: FitContext, tree: TreeSpec, centre0: number, width0: number): LineshapeFit | null {
  const q = quickFit(ctx, tree, centre0, width0);
  return q ? polish(ctx, q) : null;
}

/** Uncertainties by the sandwich formula with the correlated noise (as measure/fit.ts), inflated by χ²_red when above 1. */
function summarise(ctx: FitContext, layout: ModelLayout, th: Float64Array, rss: number): LineshapeFit | null {
  const { freqs, data } = ctx.region;
  const m = freqs.length;
  const shape = shapeOf(layout, th, freqs);
  const basis = basisOf(shape);
  const coef = solveLinear(basis, data);
  const amp = coef[0] ?? 0;
  if (!(amp > 0)) return null;
  // Full Jacobian of the (unprojected) model: nonlinear columns by differences, then the linear basis.
  const nonlin = jacobianFd((p) => Float64Array.from(shapeOf(layout, p, freqs), (v) => amp * v), th, Array.from(th, () => 1));
  const jac = nonlin.clone().addColumn(nonlin.columns, basis[0] ?? new Float64Array(m));
  jac.addColumn(jac.columns, basis[1] ?? new Float64Array(m)).addColumn(jac.columns, basis[2] ?? new Float64Array(m));
  const sigma2 = ctx.sigma ** 2;
  const jrj = jtRj(jac, [0], m, ctx.rho, Float64Array.of(1));
  let cov: Matrix = covarianceSandwich(jac, jrj.clone().mul(sigma2));
  const jtj = jac.transpose().mmul(jac);
  const trHR = traceProduct(jtj, jrj);
  const expected = sigma2 * Math.max(1, m - trHR);
  const chi2Reduced = rss / expected;
  if (chi2Reduced > 1) cov = cov.mul(chi2Reduced);
  const resid = residualOf(basis, coef, data);
  const model = Float64Array.from(data, (v, i) => v - (resid[i] ?? 0));
  let top = 0;
  for (const v of data) top = Math.max(top, v);
  const js = jsOf(layout, th);
  const groups = js.map((j, q) => ({ jHz: j, sdHz: Math.sqrt(Math.max(0, cov.get(q + 1, q + 1))), count: layout.counts[q] ?? 1 }));
  return {
    groups: groups.sort((a, b) => b.jHz - a.jHz),
    centreHz: th[0] ?? 0,
    centreSdHz: Math.sqrt(Math.max(0, cov.get(0, 0))),
    widthParam: widthOf(layout, th),
    fwhmHz: ctx.line.fwhm(widthOf(layout, th), mixOf(layout, th)),
    amplitude: amp,
    rss,
    chi2Reduced,
    excessMisfit: top > 0 ? Math.sqrt(Math.max(0, rss - expected) / m) / top : Infinity,
    criterion: criterionOf(ctx, rss, th.length, layout.counts),
    model,
    baseline: Float64Array.from(data, (_, i) => (coef[1] ?? 0) * (basis[1]?.[i] ?? 0) + (coef[2] ?? 0) * (basis[2]?.[i] ?? 0)),
  };
}

/** tr((JᵀJ)⁻¹ JᵀRJ) = tr(H R): the noise the fit absorbs, in units of σ². */
function traceProduct(jtj: Matrix, jrj: Matrix): number {
  return pseudoInverse(jtj).mmul(jrj).trace();
}
