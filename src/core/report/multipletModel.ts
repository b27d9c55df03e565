/**
 * The lineshape model of a first-order 1D multiplet: A · Σ_lines C-weighted line(ν − ν_line; width)
 * plus a linear baseline c0 + c1·x. A group of n equivalent partners with coupling J splits each
 * line into n + 1 lines at (n/2 − m)·J with binomial weights C(n, m) (Pascal's triangle; any NMR
 * text). The amplitudes (A, c0, c1) enter linearly and are solved in closed form for every set of
 * nonlinear parameters (variable projection: Golub & Pereyra, SIAM J. Numer. Anal. 10 (1973) 413
 * [mem]), so the iterative fit only sees centre, the J values, width and (without recorded
 * processing) the Lorentz-Gauss mix.
 */
import { Matrix, solve } from 'ml-matrix';
import type { LineModel } from '../measure/lineshape';
import { treeLines } from '../measure/splitting';

export { treeLines };

/** A splitting tree: coupling J_k (Hz) to n_k equivalent partners. */
export interface TreeSpec {
  readonly js: readonly number[];
  readonly counts: readonly number[];
}

/** The fit window: uniform frequencies (Hz) and the spectrum values there. */
export interface Region {
  readonly freqs: Float64Array;
  readonly data: Float64Array;
}

/** Internal nonlinear parameters: [centre Hz, J_1..J_g Hz, width, (mix logit)]. */
export interface ModelLayout {
  readonly line: LineModel;
  readonly counts: readonly number[];
}

export function hasMixParam(l: ModelLayout): boolean {
  return l.line.kind === 'pseudoVoigt';
}

/** Line width for the line model: the natural width w for the processed line (may dip below 0, as in measure/model.ts), |FWHM| for the pseudo-Voigt. */
export function widthOf(l: ModelLayout, theta: ArrayLike<number>): number {
  const w = theta[1 + l.counts.length] ?? 1;
  return hasMixParam(l) ? Math.abs(w) + 1e-6 : w;
}

export function mixOf(l: ModelLayout, theta: ArrayLike<number>): number {
  return hasMixParam(l) ? 1 / (1 + Math.exp(-(theta[2 + l.counts.length] ?? 0))) : 0;
}

export function jsOf(l: ModelLayout, theta: ArrayLike<number>): number[] {
  return l.counts.map((_, k) => Math.abs(theta[1 + k] ?? 0));
}

/** The multiplet shape (amplitude 1) at the region's frequencies. */
export function shapeOf(l: ModelLayout, theta: ArrayLike<number>, freqs: Float64Array): Float64Array {
  const centre = theta[0] ?? 0;
  const width = widthOf(l, theta);
  const mix = mixOf(l, theta);
  const { offsets, weights } = treeLines(jsOf(l, theta), l.counts);
  const m = freqs.length;
  const f0 = freqs[0] ?? 0;
  const step = m > 1 ? (freqs[1] ?? 0) - f0 : 0;
  const re = new Float64Array(m);
  const im = new Float64Array(m);
  const out = new Float64Array(m);
  offsets.forEach((o, k) => {
    // offset ν − f_i = (ν − f_0) − i·step on the uniform axis
    l.line.evaluateGrid(centre + o - f0, -step, width, mix, re, im);
    const w = weights[k] ?? 0;
    for (let i = 0; i < m; i++) out[i] = (out[i] ?? 0) + w * (re[i] ?? 0);
  });
  return out;
}

/** Constant and slope columns per window length, built once (the fit asks for them thousands of times). */
const baselineColumns = new Map<number, [Float64Array, Float64Array]>();

/** The linear basis: the shape, a constant and a slope (x from −1 to 1 across the window). */
export function basisOf(shape: Float64Array): Float64Array[] {
  const m = shape.length;
  let cols = baselineColumns.get(m);
  if (!cols) {
    cols = [new Float64Array(m).fill(1), Float64Array.from({ length: m }, (_, i) => (m > 1 ? (2 * i) / (m - 1) - 1 : 0))];
    if (baselineColumns.size > 64) baselineColumns.clear();
    baselineColumns.set(m, cols);
  }
  return [shape, ...cols];
}

/** Least-squares amplitudes of the basis for the data (normal equations; 3 × 3). */
export function solveLinear(basis: Float64Array[], data: Float64Array): number[] {
  const k = basis.length;
  const a = new Matrix(k, k);
  const b = new Matrix(k, 1);
  for (let p = 0; p < k; p++) {
    const bp = basis[p] ?? new Float64Array(0);
    b.set(p, 0, dot(bp, data));
    for (let q = p; q < k; q++) {
      const v = dot(bp, basis[q] ?? new Float64Array(0));
      a.set(p, q, v);
      a.set(q, p, v);
    }
  }
  for (let p = 0; p < k; p++) a.set(p, p, a.get(p, p) * (1 + 1e-12) + 1e-300);
  return solve(a, b, true).getColumn(0);
}

/** data − Σ c_p · basis_p. */
export function residualOf(basis: Float64Array[], coef: readonly number[], data: Float64Array): Float64Array {
  const r = Float64Array.from(data);
  basis.forEach((col, p) => {
    const c = coef[p] ?? 0;
    for (let i = 0; i < r.length; i++) r[i] = (r[i] ?? 0) - c * (col[i] ?? 0);
  });
  return r;
}

export function dot(a: ArrayLike<number>, b: ArrayLike<number>): number {
  let s = 0;
  for (let i = 0; i < a.length; i++) s += (a[i] ?? 0) * (b[i] ?? 0);
  return s;
}
