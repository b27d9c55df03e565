import { Matrix } from 'ml-matrix';
import { madSigma } from '../spectrum/noise';
import type { DimensionProcessing } from '../spectrum/processing';
import { windowValues } from '../simulate/window';

/**
 * Correlation of the noise between spectral points `lag` apart, rho[lag] (rho[0] = 1).
 *
 * Why: zero-filling and apodization make neighbouring points of a processed spectrum correlated,
 * so a least-squares fit that treats them as independent understates its uncertainty.
 */
export type NoiseCorrelation = Float64Array;

/**
 * From the processing: white complex time-domain noise n_k of variance s^2 per part, scaled by
 * g_k (window, first point halved) and transformed to N points, gives real parts with
 * Cov(Re X_a, Re X_b) = s^2 sum_k g_k^2 cos(2 pi (a - b) k / N) (derived from the DFT definition;
 * checked against simulated noise in the tests). Stationary, so one row of the Toeplitz matrix.
 */
export function correlationFromProcessing(p: DimensionProcessing, maxLag: number): NoiseCorrelation {
  const n = p.acquiredPoints;
  const w = windowValues(p.window, n, p.spectralWidthHz);
  const g2 = Float64Array.from(w, (v, k) => (k === 0 ? 0.25 : 1) * v * v);
  let total = 0;
  for (const v of g2) total += v;
  const rho = new Float64Array(maxLag + 1);
  for (let lag = 0; lag <= maxLag; lag++) {
    let s = 0;
    for (let k = 0; k < n; k++) s += (g2[k] ?? 0) * Math.cos((2 * Math.PI * lag * k) / p.size);
    rho[lag] = s / total;
  }
  return rho;
}

/**
 * From the data when the processing is unknown: the average autocorrelation of the quietest
 * half of blocks (by robust sigma) of the given traces. Lags past the first
 * one whose estimate is within 3 standard errors (3 / sqrt(samples)) of zero are set to zero.
 */
export function estimateCorrelation(traces: Float64Array[], maxLag: number, block = 64): NoiseCorrelation {
  const blocks: { sigma: number; values: Float64Array }[] = [];
  for (const t of traces) {
    for (let start = 0; start + block <= t.length; start += block) {
      const values = t.subarray(start, start + block);
      blocks.push({ sigma: madSigma(values), values });
    }
  }
  const rho = new Float64Array(maxLag + 1);
  rho[0] = 1;
  if (blocks.length === 0) return rho;
  blocks.sort((a, b) => a.sigma - b.sigma);
  const quiet = blocks.slice(0, Math.max(1, Math.floor(blocks.length / 2)));
  const acc = new Float64Array(maxLag + 1);
  for (const { values } of quiet) {
    // No mean subtraction: processed noise has zero mean, and removing a block mean from strongly
    // correlated noise biases the correlation low.
    for (let lag = 0; lag <= maxLag && lag < values.length; lag++) {
      let s = 0;
      for (let i = 0; i + lag < values.length; i++) s += (values[i] ?? 0) * (values[i + lag] ?? 0);
      acc[lag] = (acc[lag] ?? 0) + s / (values.length - lag);
    }
  }
  const floor = 3 / Math.sqrt(quiet.length * block);
  for (let lag = 1; lag <= maxLag; lag++) {
    const v = (acc[lag] ?? 0) / (acc[0] || 1);
    if (Math.abs(v) < floor) break;
    rho[lag] = v;
  }
  return rho;
}

function rhoAt(rho: NoiseCorrelation, lag: number): number {
  return rho[Math.abs(lag)] ?? 0;
}

/**
 * Σ·v / sigma^2 for a vector laid out as `positions.length` traces of m points, with separable
 * noise correlation: rhoAcross between traces (by their index distance in the spectrum) times
 * rhoAlong within a trace. 2D processing is separable, so the 2D noise correlation is this product.
 */
export function applyCorrelation(
  v: ArrayLike<number>,
  positions: readonly number[],
  m: number,
  rhoAlong: NoiseCorrelation,
  rhoAcross: NoiseCorrelation,
): Float64Array {
  const nTr = positions.length;
  const along = new Float64Array(nTr * m);
  const maxLag = rhoAlong.length - 1;
  for (let t = 0; t < nTr; t++) {
    for (let i = 0; i < m; i++) {
      let s = 0;
      const j0 = Math.max(0, i - maxLag);
      const j1 = Math.min(m - 1, i + maxLag);
      for (let j = j0; j <= j1; j++) s += rhoAt(rhoAlong, i - j) * (v[t * m + j] ?? 0);
      along[t * m + i] = s;
    }
  }
  const out = new Float64Array(nTr * m);
  for (let t = 0; t < nTr; t++) {
    for (let u = 0; u < nTr; u++) {
      const c = rhoAt(rhoAcross, (positions[t] ?? 0) - (positions[u] ?? 0));
      if (c === 0) continue;
      for (let i = 0; i < m; i++) out[t * m + i] = (out[t * m + i] ?? 0) + c * (along[u * m + i] ?? 0);
    }
  }
  return out;
}

/** JᵀRJ for the correlation R of applyCorrelation (Σ = sigma^2 R). */
export function jtRj(
  jac: Matrix,
  positions: readonly number[],
  m: number,
  rhoAlong: NoiseCorrelation,
  rhoAcross: NoiseCorrelation,
): Matrix {
  const p = jac.columns;
  const cols = Array.from({ length: p }, (_, q) => jac.getColumn(q));
  const applied = cols.map((c) => applyCorrelation(c, positions, m, rhoAlong, rhoAcross));
  const out = new Matrix(p, p);
  for (let a = 0; a < p; a++) {
    for (let b = 0; b < p; b++) out.set(a, b, dot(cols[a] ?? [], applied[b] ?? new Float64Array(0)));
  }
  return out;
}

export function dot(a: ArrayLike<number>, b: ArrayLike<number>): number {
  let s = 0;
  for (let i = 0; i < a.length; i++) s += (a[i] ?? 0) * (b[i] ?? 0);
  return s;
}
