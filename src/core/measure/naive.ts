import { applyCorrelation, dot, type NoiseCorrelation } from './correlation';
import type { TraceBlock } from './traces';
import { MeasureError } from './types';

export interface NaiveResult {
  jHz: number;
  jSdHz: number;
  centreHz: number;
  /** Signed sum of the traces (each trace times the sign of its overlap with the strongest one). */
  summed: Float64Array;
  signs: number[];
}

/** Signs that make every trace agree with the strongest one (the F1 multiplet sets each row's sign). */
export function traceSigns(data: Float64Array[]): number[] {
  let best = 0;
  let bestE = -1;
  data.forEach((t, i) => {
    const e = dot(t, t);
    if (e > bestE) {
      bestE = e;
      best = i;
    }
  });
  const ref = data[best] ?? new Float64Array(0);
  return data.map((t) => (dot(t, ref) >= 0 ? 1 : -1));
}

/**
 * Vertex of the parabola through (-1, a), (0, b), (1, c) and its gradient with respect to a, b, c:
 * x = (a - c) / (2 (a - 2b + c)) (three-point interpolation, common practice).
 */
function vertex(a: number, b: number, c: number): { x: number; grad: [number, number, number] } {
  const d = a - 2 * b + c;
  const num = a - c;
  return { x: num / (2 * d), grad: [(d - num) / (2 * d * d), num / (d * d), (-d - num) / (2 * d * d)] };
}

/** Local extrema of the summed trace at least `thr` high, in index order, with their signs. */
function extrema(y: Float64Array, thr: number): { i: number; sign: number }[] {
  const out: { i: number; sign: number }[] = [];
  for (let i = 1; i < y.length - 1; i++) {
    const v = y[i] ?? 0;
    const a = y[i - 1] ?? 0;
    const b = y[i + 1] ?? 0;
    if (v >= thr && v > a && v >= b) out.push({ i, sign: 1 });
    else if (-v >= thr && v < a && v <= b) out.push({ i, sign: -1 });
  }
  return out;
}

/**
 * The pair a chemist reads: with passive couplings the strongest positive and negative points need
 * not be neighbours, so take the adjacent opposite-sign extrema whose sign order is that of the whole
 * antiphase multiplet (its outermost extrema), the pair nearest the multiplet centre. Falls back to
 * the strongest points when there is no such pair.
 */
function readPair(y: Float64Array, thr: number, iMax: number, iMin: number): [number, number] {
  const ex = extrema(y, thr);
  const first = ex[0];
  const last = ex.at(-1);
  if (!first || !last || first.sign === last.sign) return [iMax, iMin];
  const centre = (first.i + last.i) / 2;
  let best: [number, number] | undefined;
  let bestD = Infinity;
  for (let k = 0; k + 1 < ex.length; k++) {
    const a = ex[k];
    const b = ex[k + 1];
    if (!a || !b || a.sign !== first.sign || b.sign !== last.sign) continue;
    const d = Math.abs((a.i + b.i) / 2 - centre);
    if (d < bestD) {
      bestD = d;
      best = a.sign > 0 ? [a.i, b.i] : [b.i, a.i];
    }
  }
  return best ?? [iMax, iMin];
}

/**
 * The naive J: distance between the positive and negative extremum of the adjacent antiphase pair
 * nearest the multiplet centre (readPair; the strongest points without passive splittings) of the
 * summed traces, each refined by parabolic interpolation. Its standard deviation propagates the
 * noise (sigma, with the correlation between points and between traces) through both vertices.
 * Kept for comparison: it overestimates J near and below the linewidth (references.md).
 */
export function naiveSplitting(
  block: TraceBlock,
  sigma: number,
  rhoAlong: NoiseCorrelation,
  rhoAcross: NoiseCorrelation,
  /** 'adjacent': the pair a chemist reads (readPair); 'strongest': the strongest points (the fit's starting values). */
  pair: 'adjacent' | 'strongest' = 'adjacent',
): NaiveResult {
  const signs = traceSigns(block.data);
  const m = block.freqs.length;
  const summed = new Float64Array(m);
  block.data.forEach((t, k) => t.forEach((v, i) => (summed[i] = (summed[i] ?? 0) + (signs[k] ?? 1) * v)));
  let iMax = 0;
  let iMin = 0;
  for (let i = 0; i < m; i++) {
    if ((summed[i] ?? 0) > (summed[iMax] ?? 0)) iMax = i;
    if ((summed[i] ?? 0) < (summed[iMin] ?? 0)) iMin = i;
  }
  // Noise of the summed trace: sigma^2 * (signs' R_across signs) * rho_along.
  const acrossVar = dot(signs, applyCorrelation(signs, block.positions, 1, Float64Array.of(1), rhoAcross));
  const sumSigma = sigma * Math.sqrt(acrossVar);
  const where = `${block.dimension} at ${(block.peakHz / block.along.observeMhz).toFixed(4)} ppm`;
  if ((summed[iMax] ?? 0) < 3 * sumSigma || -(summed[iMin] ?? 0) < 3 * sumSigma) {
    throw new MeasureError(`no antiphase pair above noise in ${where}`);
  }
  if (iMax === 0 || iMax === m - 1 || iMin === 0 || iMin === m - 1) {
    throw new MeasureError(`antiphase extremum at the edge of the window in ${where}; the window is too narrow`);
  }
  // Extrema below 3 sigma or a sixth of the strongest are noise or wiggles a reader would ignore (common practice).
  if (pair === 'adjacent') [iMax, iMin] = readPair(summed, Math.max(3 * sumSigma, Math.max(summed[iMax] ?? 0, -(summed[iMin] ?? 0)) / 6), iMax, iMin);
  const vp = vertex(summed[iMax - 1] ?? 0, summed[iMax] ?? 0, summed[iMax + 1] ?? 0);
  const vn = vertex(summed[iMin - 1] ?? 0, summed[iMin] ?? 0, summed[iMin + 1] ?? 0);
  const hzPt = Math.abs((block.freqs[1] ?? 0) - (block.freqs[0] ?? 0));
  const xPos = iMax + vp.x;
  const xNeg = iMin + vn.x;
  // Gradient of |xPos - xNeg| over the summed trace, then its variance under correlated noise.
  const grad = new Float64Array(m);
  const s = xPos >= xNeg ? 1 : -1;
  vp.grad.forEach((g, k) => (grad[iMax - 1 + k] = (grad[iMax - 1 + k] ?? 0) + s * g));
  vn.grad.forEach((g, k) => (grad[iMin - 1 + k] = (grad[iMin - 1 + k] ?? 0) - s * g));
  const varPts = sumSigma ** 2 * dot(grad, applyCorrelation(grad, [0], m, rhoAlong, Float64Array.of(1)));
  const fAt = (x: number): number => (block.freqs[0] ?? 0) + x * ((block.freqs[1] ?? 0) - (block.freqs[0] ?? 0));
  return {
    jHz: Math.abs(xPos - xNeg) * hzPt,
    jSdHz: Math.sqrt(varPts) * hzPt,
    centreHz: (fAt(xPos) + fAt(xNeg)) / 2,
    summed,
    signs,
  };
}
