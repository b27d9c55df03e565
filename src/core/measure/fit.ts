import type { Matrix } from 'ml-matrix';
import { pseudoInverse } from 'ml-matrix';
import { applyCorrelation, dot, jtRj, type NoiseCorrelation } from './correlation';
import { covarianceSandwich, levenbergMarquardt, type ResidualFn } from './lm';
import { apparentFwhm, boundedCoupling, groupSize, makeTheta, paramCount, passiveIndex, pattern, type ModelSpec } from './model';
import type { LineModel } from './lineshape';
import type { TraceBlock } from './traces';

/** What the fit needs besides the model: the traces, the noise level and its correlation. */
export interface FitContext {
  block: TraceBlock;
  sigma: number;
  rhoAlong: NoiseCorrelation;
  rhoAcross: NoiseCorrelation;
}

export interface FitResult {
  spec: ModelSpec;
  theta: Float64Array;
  rss: number;
  /** Jacobian of the projected residual in the internal parameters. */
  jac: Matrix;
  shape: Float64Array;
  amplitudes: number[];
  /** Fitted values, traces one after another. */
  fitted: Float64Array;
}

/**
 * Variable projection (Golub & Pereyra, SIAM J. Numer. Anal. 10 (1973) 413 [mem]): the row
 * amplitudes are linear, so for a given pattern f each one is the least-squares value
 * a_t = <y_t, f> / <f, f>, and only the pattern parameters are iterated. The returned residual is
 * y - a f for all traces; its Jacobian (by differences) is the projected one.
 */
function project(ctx: FitContext, spec: ModelSpec, theta: ArrayLike<number>) {
  const m = ctx.block.freqs.length;
  const shape = new Float64Array(m);
  pattern(spec, theta, ctx.block.freqs, shape);
  const ff = dot(shape, shape);
  const amplitudes = ctx.block.data.map((y) => (ff > 0 ? dot(y, shape) / ff : 0));
  const fitted = new Float64Array(m * ctx.block.data.length);
  const residual = new Float64Array(fitted.length);
  ctx.block.data.forEach((y, t) => {
    const a = amplitudes[t] ?? 0;
    for (let i = 0; i < m; i++) {
      const f = a * (shape[i] ?? 0);
      fitted[t * m + i] = f;
      residual[t * m + i] = (y[i] ?? 0) - f;
    }
  });
  return { shape, amplitudes, fitted, residual };
}

function scalesFor(spec: ModelSpec): Float64Array {
  const s = new Float64Array(paramCount(spec)).fill(1);
  s[2] = spec.line.kind === 'pseudoVoigt' ? 0.1 : 1;
  s[3] = 0.01;
  return s;
}

export function fitFrom(ctx: FitContext, spec: ModelSpec, start: ArrayLike<number>, maxIterations = 100): FitResult {
  const fn: ResidualFn = (th) => project(ctx, spec, th).residual;
  const lm = levenbergMarquardt(fn, start, { scales: scalesFor(spec), maxIterations, tolerance: 1e-10 });
  const p = project(ctx, spec, lm.params);
  return { spec, theta: lm.params, rss: lm.rss, jac: lm.jacobian, ...p };
}

/** A starting point: the model (its groups may differ between starts) and its parameters. */
interface Start {
  spec: ModelSpec;
  th: Float64Array;
}

/** Multi-start: a short run from every start, then the best one run to convergence. */
function bestOf(ctx: FitContext, starts: Start[]): FitResult {
  let best: FitResult | undefined;
  for (const s of starts) {
    const r = fitFrom(ctx, s.spec, s.th, 10);
    if (!best || r.rss < best.rss) best = r;
  }
  if (!best) throw new RangeError('no starting values');
  return fitFrom(ctx, best.spec, best.theta);
}

/** Residual sum of squares of the projected problem (no Jacobian): cheap enough for grid searches. */
function rssAt(ctx: FitContext, spec: ModelSpec, theta: ArrayLike<number>): number {
  const r = project(ctx, spec, theta).residual;
  return dot(r, r);
}

/** Candidate couplings for a grid search, Hz: geometric from 0.15 w to the window half-width. */
function couplingGrid(ctx: FitContext, w: number): number[] {
  const f = ctx.block.freqs;
  const span = Math.abs((f[f.length - 1] ?? 0) - (f[0] ?? 0)) / 2;
  const lo = 0.15 * w;
  const out: number[] = [];
  for (let v = lo; v <= Math.max(span, 2 * lo); v *= 1.35) out.push(v);
  return out;
}

/**
 * Starting values by a grid search over J (and a new passive coupling), the other parameters held:
 * the `keep` grid points of lowest residual. Grid points cost one pattern evaluation each, far less
 * than a local fit, and they keep the fit out of the local minima that swap active and passive
 * splittings or lock onto an outer pair of lines.
 */
function gridStarts(ctx: FitContext, specs: ModelSpec[], base: Float64Array, w: number, widths: number[], keep = 2): Start[] {
  const fine = couplingGrid(ctx, w);
  // A new group of 2 or 3 protons at the first width only: its pattern has more lines, and the local fit refines the width.
  const scored: { rss: number; spec: ModelSpec; th: Float64Array }[] = [];
  for (const spec of specs) {
    const jp = spec.passives > 0 ? passiveIndex(spec, spec.passives - 1) : -1;
    const single = jp < 0 || groupSize(spec, spec.passives - 1) === 1;
    const grid = fine;
    for (const width of single ? widths : widths.slice(0, 1)) {
      for (const j of grid) {
        for (const p of jp >= 0 ? grid : [0]) {
          const th = Float64Array.from(base);
          th[1] = j;
          th[2] = width;
          if (jp >= 0) th[jp] = p;
          scored.push({ rss: rssAt(ctx, spec, th), spec, th });
        }
      }
    }
  }
  scored.sort((a, b) => a.rss - b.rss);
  return scored.slice(0, keep);
}

/** Equivalent protons a passive coupling may stand for (a CH, CH2 or CH3 neighbour). */
export const MAX_GROUP = 3;

/**
 * Passive protons a model may hold in all (with the active partner, 6 coupled protons, as the splitting
 * tree of the 1D analysis allows): bounds the line count 2 Π(n_i + 1), which sets the fit time.
 */
export const MAX_PASSIVE_PROTONS = 5;

/** The models with one more passive coupling than prev: the new one to 1, 2 or 3 equivalent protons. */
function nextSpecs(prev: ModelSpec, maxGroup: number): ModelSpec[] {
  const groups = Array.from({ length: prev.passives }, (_, i) => groupSize(prev, i));
  const used = groups.reduce((a, b) => a + b, 0);
  return Array.from({ length: Math.min(maxGroup, MAX_PASSIVE_PROTONS - used) }, (_, n) => ({ line: prev.line, passives: prev.passives + 1, groups: [...groups, n + 1] }));
}

/** Width parameters to try before any fit: natural widths (processed line) or log FWHM (pseudo-Voigt). */
function firstWidths(spec: ModelSpec, jApp: number): number[] {
  return spec.line.kind === 'pseudoVoigt' ? [0.5, 0.8, 1.3].map((f) => Math.log(f * jApp)) : [0.3, 1, 3, 8];
}

/**
 * χ² quantiles at p = 0.001 for 1..4 degrees of freedom (tables): the bar for adding passive couplings. Stricter than
 * the usual 0.01 because the new coupling is found by a search over many starting points (a
 * look-elsewhere effect the plain χ²(1) ignores), and a spurious passive coupling can swap roles
 * with the active one.
 */
const CHI2_P001 = [10.83, 13.82, 16.27, 18.47]; // degrees of freedom 1..4

/** Parameters of the model with one more passive coupling: the old ones, then J and the new Jp given. */
export function startWithPassive(fit: FitResult, next: ModelSpec, j: number, jp: number): Float64Array {
  const th = new Float64Array(paramCount(next));
  th.set(fit.theta.subarray(0, passiveIndex(fit.spec, 0)));
  th[1] = j;
  for (let i = 0; i < fit.spec.passives; i++) th[passiveIndex(next, i)] = fit.theta[passiveIndex(fit.spec, i)] ?? 0;
  th[passiveIndex(next, next.passives - 1)] = jp;
  return th;
}

/**
 * Fraction of the apparent linewidth below which a passive coupling, or its difference from the
 * active one, cannot be told apart from a smaller model: with Jp ≈ J the two inner lines of the
 * multiplet cancel (the pattern becomes an antiphase pair at J + Jp), and Jp → 0 only broadens the
 * lines. Such candidates soak up line-shape mismatch instead of measuring a coupling.
 */
const RESOLVABLE_FRACTION = 0.25;

function resolvable(fit: FitResult): boolean {
  const w = apparentFwhm(fit.spec, fit.theta);
  const j = Math.abs(boundedCoupling(fit.theta[1] ?? 0));
  for (let i = 0; i < fit.spec.passives; i++) {
    const jp = Math.abs(boundedCoupling(fit.theta[passiveIndex(fit.spec, i)] ?? 0));
    if (jp < RESOLVABLE_FRACTION * w || Math.abs(jp - j) < RESOLVABLE_FRACTION * w) return false;
  }
  return true;
}

/**
 * Likelihood-ratio statistic of a larger model against a smaller one: for nested least-squares models
 * the drop in RSS is the squared projection of the noise on the change d of the fitted values, so
 * under the smaller model ΔRSS / (σ² dᵀRd / dᵀd) follows χ²(df) even with correlated noise R.
 */
export function lrStat(ctx: FitContext, small: FitResult, large: FitResult, scale: number): number {
  const m = ctx.block.freqs.length;
  const d = Float64Array.from(large.fitted, (v, i) => v - (small.fitted[i] ?? 0));
  const dd = dot(d, d);
  const varFactor = dd > 0 ? dot(d, applyCorrelation(d, ctx.block.positions, m, ctx.rhoAlong, ctx.rhoAcross)) / dd : 1;
  return (small.rss - large.rss) / (ctx.sigma ** 2 * varFactor * scale);
}

export interface Selection {
  fit: FitResult;
  notes: string[];
}

/**
 * Fits 0..maxPassive passive couplings and keeps adding one while the drop in the residual sum of
 * squares is significant at p < 0.01: for nested least-squares models the drop is the squared
 * projection of the noise on the change d of the fitted values, so under the smaller model
 * ΔRSS / (σ² dᵀRd / dᵀd) follows χ²(1) even with correlated noise R (likelihood-ratio test).
 */
export function selectModel(ctx: FitContext, line: LineModel, maxPassive: number, centre: number, jApp: number, maxGroup = MAX_GROUP): Selection {
  const first: ModelSpec = { line, passives: 0 };
  const w0 = Math.max(jApp, 1e-3);
  const chain = [bestOf(ctx, gridStarts(ctx, [first], makeTheta(first, centre, jApp, 1, []), w0, firstWidths(first, jApp)))];
  for (let k = 1; k <= maxPassive; k++) {
    const prev = chain[k - 1] as FitResult;
    // Beyond two couplings only while the previous one was significant: saves fit time on simple multiplets.
    if (nextSpecs(prev.spec, maxGroup).length === 0) break;
    if (k > 2 && !(lrStat(ctx, chain[k - 2] as FitResult, prev, 1) > (CHI2_P001[0] ?? Infinity))) break;
    const specs = nextSpecs(prev.spec, maxGroup);
    const next = specs[0] as ModelSpec;
    const w = apparentFwhm(prev.spec, prev.theta);
    const base = startWithPassive(prev, next, prev.theta[1] ?? 0, 0);
    // Widths too: a smaller model may have bent the width to mimic the missing splitting.
    const widths = [prev.theta[2] ?? 0, firstWidths(next, w)[1] ?? 0];
    chain.push(bestOf(ctx, gridStarts(ctx, specs, base, w, widths, 3)));
  }
  // When even the largest model leaves more than the noise, judge every step against that
  // residual level (the F-test form), so a still-incomplete model cannot veto the next coupling.
  const last = chain.length - 1;
  const scale = Math.max(1, uncertainty(ctx, chain[last] as FitResult).chi2Reduced);
  let fit = chain[0] as FitResult;
  for (let k = 1; k <= last; k++) {
    // Compared with the best model so far (not only the previous one): an intermediate model can be
    // a poor local fit while the next one, with all the couplings, is right.
    const cand = chain[k] as FitResult;
    const df = k - fit.spec.passives;
    if (lrStat(ctx, fit, cand, scale) > (CHI2_P001[df - 1] ?? Infinity) && resolvable(cand)) fit = cand;
  }
  const spec = fit.spec;
  const notes = [
    `Passive couplings chosen by a likelihood-ratio test at p < 0.001 (chi-squared, 1 degree of freedom, ` +
      `correlated noise accounted for, scaled by the largest model's residual when it exceeds the noise; a coupling within a quarter ` +
      `linewidth of 0 or of J is not kept), 0 to ${maxPassive} tried (each a coupling to 1, 2 or 3 equivalent protons, ` +
      `binomial in-phase pattern; beyond 2 only while the previous one was significant); kept ${spec.passives}` +
      (spec.passives > 0 ? ` (equivalent protons: ${Array.from({ length: spec.passives }, (_, i) => groupSize(spec, i)).join(', ')}).` : '.'),
  ];
  return { fit, notes };
}

export interface Uncertainty {
  /** Covariance of the internal parameters, including the √χ²_red inflation when χ²_red > 1. */
  cov: Matrix;
  chi2Reduced: number;
  inflated: boolean;
}

/**
 * Covariance by the sandwich formula with the correlated noise Σ = σ² R (R separable: along the
 * traces times across them), and χ²_red = RSS / E[RSS], where under that noise
 * E[RSS] = σ² tr((I - H) R) = σ² (M - tr(P_A R) - tr((JᵀJ)⁻¹ JᵀRJ)), P_A the projection on the
 * row amplitudes. A χ²_red above 1 (misfit beyond the noise) inflates the covariance by χ²_red
 * (Birge ratio; common practice).
 */
export function uncertainty(ctx: FitContext, fit: FitResult): Uncertainty {
  const m = ctx.block.freqs.length;
  const nTr = ctx.block.data.length;
  const jrj = jtRj(fit.jac, ctx.block.positions, m, ctx.rhoAlong, ctx.rhoAcross);
  const cov = covarianceSandwich(fit.jac, jrj.clone().mul(ctx.sigma ** 2));
  const jtjInv = pseudoInverse(fit.jac.transpose().mmul(fit.jac));
  const trH = jtjInv.mmul(jrj).trace();
  const ff = dot(fit.shape, fit.shape);
  const fRf = dot(fit.shape, applyCorrelation(fit.shape, [0], m, ctx.rhoAlong, Float64Array.of(1)));
  const trPa = ff > 0 ? nTr * (fRf / ff) : 0;
  const expected = ctx.sigma ** 2 * Math.max(1e-9, m * nTr - trPa - trH);
  const chi2Reduced = fit.rss / expected;
  const inflated = chi2Reduced > 1;
  return { cov: inflated ? cov.mul(chi2Reduced) : cov, chi2Reduced, inflated };
}
