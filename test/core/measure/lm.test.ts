import { Matrix } from 'ml-matrix';
import { describe, expect, it } from 'vitest';
import { fitFrom, type FitContext } from '../../../src/core/measure/fit';
import { processedLine } from '../../../src/core/measure/lineshape';
import { covarianceOls, covarianceSandwich, jacobianFd, levenbergMarquardt } from '../../../src/core/measure/lm';
import { makeTheta } from '../../../src/core/measure/model';
import type { TraceBlock } from '../../../src/core/measure/traces';
import { processFid, processedAxis } from '../../../src/core/simulate/process';
import { pointToHz } from '../../../src/core/spectrum/axis';
import type { DimensionProcessing } from '../../../src/core/spectrum/processing';

describe('levenbergMarquardt on a straight line (textbook linear regression)', () => {
  // y = a + b x: b = Sxy / Sxx, a = ybar - b xbar; var(b) = s^2 / Sxx, var(a) = s^2 sum x^2 / (n Sxx)
  // (e.g. Press et al., Numerical Recipes, 3rd ed., sec. 15.2 [mem]; any statistics text).
  const x = [0, 1, 2, 3, 4, 5, 6, 7];
  const y = [1.1, 2.9, 5.2, 6.8, 9.1, 11.0, 12.8, 15.2];
  const n = x.length;
  const xbar = x.reduce((s, v) => s + v, 0) / n;
  const ybar = y.reduce((s, v) => s + v, 0) / n;
  const sxx = x.reduce((s, v) => s + (v - xbar) ** 2, 0);
  const sxy = x.reduce((s, v, i) => s + (v - xbar) * ((y[i] ?? 0) - ybar), 0);
  const b = sxy / sxx;
  const a = ybar - b * xbar;
  const fn = (p: Float64Array): Float64Array => Float64Array.from(x, (xi, i) => (y[i] ?? 0) - ((p[0] ?? 0) + (p[1] ?? 0) * xi));

  it('finds the closed-form estimates', () => {
    const r = levenbergMarquardt(fn, [0, 0]);
    expect(r.params[0]).toBeCloseTo(a, 9);
    expect(r.params[1]).toBeCloseTo(b, 9);
  });

  it('gives the analytic covariance (JᵀJ)⁻¹ sigma^2', () => {
    const sigma2 = 0.04;
    const r = levenbergMarquardt(fn, [0, 0]);
    const cov = covarianceOls(r.jacobian, sigma2);
    expect(cov.get(1, 1)).toBeCloseTo(sigma2 / sxx, 10); // difference Jacobian: ~1e-11
    expect(cov.get(0, 0)).toBeCloseTo((sigma2 * x.reduce((s, v) => s + v * v, 0)) / (n * sxx), 10);
  });

  it('sandwich covariance with independent noise (Σ = sigma^2 I) equals the ordinary one', () => {
    const r = levenbergMarquardt(fn, [0, 0]);
    const jtSj = r.jacobian.transpose().mmul(r.jacobian).mul(0.04);
    const s = covarianceSandwich(r.jacobian, jtSj);
    const o = covarianceOls(r.jacobian, 0.04);
    for (let i = 0; i < 2; i++) for (let j = 0; j < 2; j++) expect(s.get(i, j)).toBeCloseTo(o.get(i, j), 12);
  });

  it('sandwich covariance of a mean under AR(1)-correlated noise matches the analytic variance', () => {
    // var(mean) = (sigma^2 / n^2) sum_ij rho^|i-j| (definition of the variance of a sum).
    const m = 50;
    const rho = 0.6;
    const jac = new Matrix(m, 1).fill(1);
    const sigmaM = Matrix.from1DArray(m, m, Array.from({ length: m * m }, (_, k) => rho ** Math.abs(Math.floor(k / m) - (k % m))));
    const cov = covarianceSandwich(jac, jac.transpose().mmul(sigmaM).mmul(jac));
    let sum = 0;
    for (let i = 0; i < m; i++) for (let j = 0; j < m; j++) sum += rho ** Math.abs(i - j);
    expect(cov.get(0, 0)).toBeCloseTo(sum / (m * m), 12);
  });
});

describe('levenbergMarquardt on a nonlinear model', () => {
  it('covariance (JᵀJ)⁻¹ agrees with the inverse of half the finite-difference Hessian of the RSS at zero residual', () => {
    // Gauss-Newton: at zero residual the Hessian of RSS is exactly 2 JᵀJ (Nocedal & Wright, sec. 10.3 [mem]).
    const t = Array.from({ length: 30 }, (_, i) => i * 0.1);
    const truth = [2.5, 1.3];
    const data = t.map((ti) => (truth[0] ?? 0) * Math.exp(-(truth[1] ?? 0) * ti));
    const fn = (p: Float64Array): Float64Array => Float64Array.from(t, (ti, i) => (data[i] ?? 0) - (p[0] ?? 0) * Math.exp(-(p[1] ?? 0) * ti));
    const r = levenbergMarquardt(fn, [1, 0.5]);
    expect(r.params[0]).toBeCloseTo(2.5, 8);
    expect(r.params[1]).toBeCloseTo(1.3, 8);
    const rss = (p: number[]): number => fn(Float64Array.from(p)).reduce((s, v) => s + v * v, 0);
    const h = 1e-4;
    const p0 = Array.from(r.params);
    const hess = new Matrix(2, 2);
    for (let i = 0; i < 2; i++) {
      for (let j = 0; j < 2; j++) {
        const at = (di: number, dj: number): number => {
          const q = [...p0];
          q[i] = (q[i] ?? 0) + di;
          q[j] = (q[j] ?? 0) + dj;
          return rss(q);
        };
        hess.set(i, j, (at(h, h) - at(h, -h) - at(-h, h) + at(-h, -h)) / (4 * h * h));
      }
    }
    const fromHessian = hess.mul(0.5);
    const jtj = jacobianFd(fn, r.params).transpose().mmul(jacobianFd(fn, r.params));
    for (let i = 0; i < 2; i++) for (let j = 0; j < 2; j++) expect(fromHessian.get(i, j)).toBeCloseTo(jtj.get(i, j), 3);
  });

  it('recovers the parameters of a noise-free processed multiplet exactly (1e-6), data made by processFid', () => {
    const p: DimensionProcessing = { acquiredPoints: 180, spectralWidthHz: 600, carrierHz: 0, size: 2048, window: { kind: 'sine', power: 2, shiftDeg: 90 } };
    const axis = processedAxis(p, 600);
    const truth = { centre: 12.5, j: 3.1, jp: 7.4, w: 0.9 };
    // FID of A's multiplet: antiphase in J, in-phase in Jp (first-order cross-peak F2 pattern).
    const re = new Float64Array(p.acquiredPoints);
    const im = new Float64Array(p.acquiredPoints);
    for (const s0 of [1, -1]) {
      for (const s1 of [1, -1]) {
        const nu = truth.centre + (s0 * truth.j) / 2 + (s1 * truth.jp) / 2;
        for (let k = 0; k < p.acquiredPoints; k++) {
          const tk = k / p.spectralWidthHz;
          const a = s0 * Math.exp(-Math.PI * truth.w * tk);
          re[k] = (re[k] ?? 0) + a * Math.cos(2 * Math.PI * nu * tk);
          im[k] = (im[k] ?? 0) + a * Math.sin(2 * Math.PI * nu * tk);
        }
      }
    }
    const spec = processFid(re, im, p).re;
    const from = Math.round((axis.firstHz - 40) / (p.spectralWidthHz / p.size));
    const m = Math.round(60 / (p.spectralWidthHz / p.size));
    const freqs = Float64Array.from({ length: m }, (_, i) => pointToHz(axis, from + i));
    const trace = spec.slice(from, from + m);
    const block: TraceBlock = {
      dimension: 'F2', along: axis, across: axis, positions: [0, 1], from, to: from + m - 1, freqs,
      data: [Float64Array.from(trace, (v) => 2 * v), Float64Array.from(trace, (v) => -0.5 * v)], peakHz: truth.centre,
    };
    const ctx: FitContext = { block, sigma: 1, rhoAlong: Float64Array.of(1), rhoAcross: Float64Array.of(1) };
    const spec1 = { line: processedLine(p), passives: 1 };
    const fit = fitFrom(ctx, spec1, makeTheta(spec1, truth.centre + 0.3, truth.j * 1.2, truth.w + 0.5, [truth.jp - 0.4]), 200);
    expect(Math.abs((fit.theta[0] ?? 0) - truth.centre)).toBeLessThan(1e-6);
    expect(Math.abs(Math.abs(fit.theta[1] ?? 0) - truth.j)).toBeLessThan(1e-6);
    expect(Math.abs((fit.theta[2] ?? 0) - truth.w)).toBeLessThan(1e-6);
    expect(Math.abs(fit.theta[3] ?? 0)).toBeLessThan(1e-6);
    expect(Math.abs(Math.abs(fit.theta[4] ?? 0) - truth.jp)).toBeLessThan(1e-6);
    expect(fit.amplitudes[1]! / fit.amplitudes[0]!).toBeCloseTo(-0.25, 9);
  });
});
