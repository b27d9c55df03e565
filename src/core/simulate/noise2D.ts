import { EigenvalueDecomposition, Matrix } from 'ml-matrix';
import type { DimensionProcessing } from '../spectrum/processing';
import { processFid } from './process';
import type { Random } from './random';
import { windowValues } from './window';

/** Rows r0..r0+rows-1 and columns c0..c0+cols-1 of the full processed grid (f1.size x f2.size). */
export interface GridWindow {
  readonly row0: number;
  readonly rows: number;
  readonly col0: number;
  readonly cols: number;
}

/**
 * Processed 2D noise for a States-type phase-sensitive acquisition, restricted to a window of the
 * full grid. Per t1 increment two complex t2 FIDs are recorded (cosine- and sine-modulated in t1),
 * each with white complex Gaussian noise of standard deviation fidSigma per channel. Processing,
 * as for the signal: each FID along t2 with p2 (processFid), keep the real (absorptive) part; the
 * two real parts form the complex t1 interferogram (cosine -> real, sine -> imaginary), processed
 * along t1 with p1; keep the real part (States, Haberkorn & Ruben, J. Magn. Reson. 48 (1982) 286 [mem]).
 * Linear and separable, so the resulting noise is Gaussian with sigma = fidSigma * g1 * g2
 * (g = noiseGain of each dimension) at every point, correlated as the windows and zero-filling make it.
 * The FID noise is drawn in a fixed order independent of the window, so any window is an exact
 * slice of the full spectrum's noise for the same generator state.
 */
export function statesNoise(p1: DimensionProcessing, p2: DimensionProcessing, fidSigma: number, rng: Random, win: GridWindow): Float64Array {
  const n1 = p1.acquiredPoints;
  const n2 = p2.acquiredPoints;
  // half[k1 * 2 + part][c]: real part after the t2 transform, only the window's columns.
  const cosPart = new Float64Array(n1 * win.cols);
  const sinPart = new Float64Array(n1 * win.cols);
  const re = new Float64Array(n2);
  const im = new Float64Array(n2);
  for (let k1 = 0; k1 < n1; k1++) {
    for (const target of [cosPart, sinPart]) {
      for (let k = 0; k < n2; k++) {
        re[k] = fidSigma * rng.gaussian();
        im[k] = fidSigma * rng.gaussian();
      }
      const f = processFid(re, im, p2).re;
      target.set(f.subarray(win.col0, win.col0 + win.cols), k1 * win.cols);
    }
  }
  const out = new Float64Array(win.rows * win.cols);
  const tr = new Float64Array(n1);
  const ti = new Float64Array(n1);
  for (let c = 0; c < win.cols; c++) {
    for (let k1 = 0; k1 < n1; k1++) {
      tr[k1] = cosPart[k1 * win.cols + c] ?? 0;
      ti[k1] = sinPart[k1 * win.cols + c] ?? 0;
    }
    const col = processFid(tr, ti, p1).re;
    for (let r = 0; r < win.rows; r++) out[r * win.cols + c] = col[win.row0 + r] ?? 0;
  }
  return out;
}

/**
 * F1 correlation of the processed noise between rows r and r + m (unit FID sigma):
 * sum_k c_k^2 cos(2 pi k m / size), c_k the window times the first-point halving (the covariance of
 * the real part of a transform of white noise; derivation in noiseGain).
 */
export function rowCovariance(p: DimensionProcessing, lag: number): number {
  const w = windowValues(p.window, p.acquiredPoints, p.spectralWidthHz);
  let s = 0;
  for (let k = 0; k < w.length; k++) {
    const c = (w[k] ?? 0) * (k === 0 ? 0.5 : 1);
    s += c * c * Math.cos((2 * Math.PI * k * lag) / p.size);
  }
  return s;
}

const mixCache = new Map<string, Matrix>();

/**
 * A (rows x rows) with A A^T = the F1 covariance of `rows` consecutive rows (symmetric Toeplitz):
 * eigendecomposition V diag(lambda) V^T, A = V diag(sqrt(max(lambda, 0))); zero-filling makes the
 * matrix singular, which a Cholesky factor would not survive. Cached: it depends only on p and rows.
 */
function rowMixer(p: DimensionProcessing, rows: number): Matrix {
  const key = `${JSON.stringify(p)}|${rows}`;
  const hit = mixCache.get(key);
  if (hit) return hit;
  const lags = Array.from({ length: rows }, (_, m) => rowCovariance(p, m));
  const cov = Matrix.from1DArray(rows, rows, Array.from({ length: rows * rows }, (_, i) => lags[Math.abs((i % rows) - Math.floor(i / rows))] ?? 0));
  const evd = new EigenvalueDecomposition(cov, { assumeSymmetric: true });
  const scale = evd.realEigenvalues.map((l) => Math.sqrt(Math.max(l, 0)));
  const mixer = evd.eigenvectorMatrix.mulRowVector(scale);
  if (mixCache.size > 16) mixCache.clear();
  mixCache.set(key, mixer);
  return mixer;
}

/**
 * Fast noise for a window of few rows, with exactly the same Gaussian distribution (variance and
 * correlation in both dimensions) as statesNoise, but not the same realization: the covariance is
 * separable, sigma^2 rho1(dr) rho2(dc), so `rows` independent rows processed along t2 (exact F2
 * correlation) are mixed by A with A A^T = the F1 covariance. Cost: `rows` transforms along t2
 * instead of 2 x acquired increments.
 */
export function windowNoiseFast(p1: DimensionProcessing, p2: DimensionProcessing, fidSigma: number, rng: Random, win: GridWindow): Float64Array {
  const n2 = p2.acquiredPoints;
  const u = new Float64Array(win.rows * win.cols);
  const re = new Float64Array(n2);
  const im = new Float64Array(n2);
  for (let r = 0; r < win.rows; r++) {
    for (let k = 0; k < n2; k++) {
      re[k] = fidSigma * rng.gaussian();
      im[k] = fidSigma * rng.gaussian();
    }
    u.set(processFid(re, im, p2).re.subarray(win.col0, win.col0 + win.cols), r * win.cols);
  }
  const a = rowMixer(p1, win.rows);
  const out = new Float64Array(win.rows * win.cols);
  for (let r = 0; r < win.rows; r++) {
    for (let j = 0; j < win.rows; j++) {
      const m = a.get(r, j);
      if (m === 0) continue;
      for (let c = 0; c < win.cols; c++) out[r * win.cols + c] = (out[r * win.cols + c] ?? 0) + m * (u[j * win.cols + c] ?? 0);
    }
  }
  return out;
}
