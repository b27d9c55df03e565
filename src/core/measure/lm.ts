import { Matrix, pseudoInverse, solve } from 'ml-matrix';

/**
 * Levenberg-Marquardt least squares over ml-matrix, written out because the covariance needs the
 * Jacobian at the solution. Damping follows Marquardt (J. SIAM 11 (1963) 431 [mem]): solve
 * (JᵀJ + λ diag(JᵀJ)) δ = -Jᵀr, shrink λ tenfold after a step that lowers the residual sum of
 * squares, grow it tenfold otherwise. The Jacobian is by finite differences (Nocedal &
 * Wright, Numerical Optimization, 2nd ed., sec. 8.1 [mem]); bounds are the caller's business
 * (reparametrise, e.g. width = exp(u)).
 */
export interface LmOptions {
  maxIterations?: number;
  /** Stop when the relative decrease of the residual sum of squares falls below this. */
  tolerance?: number;
  /** Typical magnitude of each parameter; the difference step is 1e-5 of it. */
  scales?: ArrayLike<number>;
}

export interface LmResult {
  params: Float64Array;
  residual: Float64Array;
  /** Jacobian of the residual vector at the solution (rows: residuals, columns: parameters). */
  jacobian: Matrix;
  rss: number;
  iterations: number;
  converged: boolean;
}

export type ResidualFn = (params: Float64Array) => Float64Array;

/**
 * Jacobian columns ∂r/∂p_j by differences, step 1e-5 of the parameter's scale: forward differences
 * (given r at p) while iterating, where only the step direction depends on them; central ones for
 * the Jacobian returned, which the covariance uses.
 */
function jacobianColumns(fn: ResidualFn, p: Float64Array, scales?: ArrayLike<number>, rAtP?: Float64Array): Float64Array[] {
  const cols: Float64Array[] = [];
  for (let j = 0; j < p.length; j++) {
    const h = 1e-5 * Math.max(Math.abs(scales?.[j] ?? 1), 1e-12);
    const up = Float64Array.from(p);
    up[j] = (p[j] ?? 0) + h;
    const ru = fn(up);
    if (rAtP) {
      cols.push(Float64Array.from(ru, (v, i) => (v - (rAtP[i] ?? 0)) / h));
      continue;
    }
    const down = Float64Array.from(p);
    down[j] = (p[j] ?? 0) - h;
    const rd = fn(down);
    cols.push(Float64Array.from(ru, (v, i) => (v - (rd[i] ?? 0)) / (2 * h)));
  }
  return cols;
}

function dotArrays(a: Float64Array, b: Float64Array): number {
  let s = 0;
  for (let i = 0; i < a.length; i++) s += (a[i] ?? 0) * (b[i] ?? 0);
  return s;
}

function toMatrix(cols: Float64Array[], m: number): Matrix {
  const out = new Matrix(m, cols.length);
  cols.forEach((c, j) => c.forEach((v, i) => out.set(i, j, v)));
  return out;
}

export function jacobianFd(fn: ResidualFn, p: Float64Array, scales?: ArrayLike<number>): Matrix {
  return toMatrix(jacobianColumns(fn, p, scales), fn(p).length);
}

export function levenbergMarquardt(fn: ResidualFn, p0: ArrayLike<number>, opts: LmOptions = {}): LmResult {
  const maxIt = opts.maxIterations ?? 200;
  const tol = opts.tolerance ?? 1e-12;
  let p = Float64Array.from(p0);
  let r = fn(p);
  let rss = dotArrays(r, r);
  if (!Number.isFinite(rss)) throw new RangeError('least squares: residuals are not finite at the starting values');
  const np = p.length;
  let lambda = 1e-3;
  let it = 0;
  let converged = false;
  let cols = jacobianColumns(fn, p, opts.scales, r);
  while (it < maxIt && !converged) {
    it++;
    // Normal equations from the columns directly: the m x p Jacobian never becomes a Matrix here.
    const jtj = new Matrix(np, np);
    const g = new Matrix(np, 1);
    for (let a = 0; a < np; a++) {
      const ca = cols[a] ?? new Float64Array(0);
      g.set(a, 0, -dotArrays(ca, r));
      for (let b = a; b < np; b++) {
        const v = dotArrays(ca, cols[b] ?? new Float64Array(0));
        jtj.set(a, b, v);
        jtj.set(b, a, v);
      }
    }
    let improved = false;
    while (lambda < 1e16) {
      const a = jtj.clone();
      for (let i = 0; i < np; i++) a.set(i, i, jtj.get(i, i) * (1 + lambda) + 1e-30);
      const step = solve(a, g, true);
      const trial = Float64Array.from(p, (v, i) => v + step.get(i, 0));
      const rt = fn(trial);
      const rssT = dotArrays(rt, rt);
      if (Number.isFinite(rssT) && rssT <= rss) {
        converged = rss - rssT <= tol * rss || rss === 0;
        p = trial;
        r = rt;
        rss = rssT;
        lambda = Math.max(lambda / 10, 1e-12);
        improved = true;
        break;
      }
      lambda *= 10;
    }
    if (!improved) {
      converged = true; // no step lowers the sum of squares: a minimum within rounding
      break;
    }
    cols = jacobianColumns(fn, p, opts.scales, r);
  }
  return { params: p, residual: r, jacobian: jacobianFd(fn, p, opts.scales), rss, iterations: it, converged };
}

/**
 * Covariance of least-squares estimates for independent noise of variance sigma2:
 * (JᵀJ)⁻¹ sigma2 (e.g. Press et al., Numerical Recipes, 3rd ed., sec. 15.5 [mem]). The
 * pseudo-inverse keeps it finite when a parameter sits where the model does not depend on it.
 */
export function covarianceOls(jac: Matrix, sigma2: number): Matrix {
  return pseudoInverse(jac.transpose().mmul(jac)).mul(sigma2);
}

/**
 * Covariance of ordinary least-squares estimates under correlated noise with covariance matrix Σ,
 * given JᵀΣJ: the sandwich (JᵀJ)⁻¹ (JᵀΣJ) (JᵀJ)⁻¹ (e.g. Seber & Wild, Nonlinear Regression,
 * sec. 2.1.4 [mem]). Exact to first order; needs no inverse of Σ, which zero-filling makes singular.
 */
export function covarianceSandwich(jac: Matrix, jtSigmaJ: Matrix): Matrix {
  const inv = pseudoInverse(jac.transpose().mmul(jac));
  return inv.mmul(jtSigmaJ).mmul(inv);
}
