import type { DimensionProcessing, WindowFunction } from '../spectrum/processing';
import { describeWindow } from '../simulate/window';
import { acquisitionTime } from '../spectrum/processing';

/**
 * The complex spectrum of one line, evaluated at any frequency: `evaluate(offsetHz, width, mix, out)`
 * writes (real, imaginary) of the line at frequency nu for a spectral point at f, offsetHz = nu - f.
 * The real part is the absorption line, the imaginary part the dispersion line (phase mixes them).
 */
export interface LineModel {
  readonly kind: 'processed' | 'pseudoVoigt';
  readonly description: string;
  evaluate(offsetHz: number, width: number, mix: number, out: Float64Array): void;
  /** The same at offsets offset0 + i * stepHz for i < re.length (a uniform axis), into re and im. */
  evaluateGrid(offset0: number, stepHz: number, width: number, mix: number, re: Float64Array, im: Float64Array): void;
  /** Full width at half height of the absorption line, Hz, for the given width parameter. */
  fwhm(width: number, mix: number): number;
}

/** One term c * z^k of a window written as a sum of complex exponentials in the point index k. */
interface WindowTerm {
  cRe: number;
  cIm: number;
  lnAbsZ: number;
  argZ: number;
}

/**
 * The window as a sum of exponentials: sin(a + bk) = (e^{i(a+bk)} - e^{-i(a+bk)}) / 2i and
 * sin^2(a + bk) = 1/2 - (e^{2i(a+bk)} + e^{-2i(a+bk)}) / 4 (Euler's formula).
 */
function windowTerms(w: WindowFunction, n: number, swHz: number): WindowTerm[] {
  switch (w.kind) {
    case 'none':
      return [{ cRe: 1, cIm: 0, lnAbsZ: 0, argZ: 0 }];
    case 'exponential':
      return [{ cRe: 1, cIm: 0, lnAbsZ: (-Math.PI * w.lbHz) / swHz, argZ: 0 }];
    case 'sine': {
      const a = (w.shiftDeg * Math.PI) / 180;
      const b = (Math.PI - a) / (n > 1 ? n - 1 : 1);
      if (w.power === 1) {
        // e^{ia}/(2i) = (sin a, -cos a)/2 ; -e^{-ia}/(2i) = (sin a, cos a)/2
        return [
          { cRe: Math.sin(a) / 2, cIm: -Math.cos(a) / 2, lnAbsZ: 0, argZ: b },
          { cRe: Math.sin(a) / 2, cIm: Math.cos(a) / 2, lnAbsZ: 0, argZ: -b },
        ];
      }
      return [
        { cRe: 0.5, cIm: 0, lnAbsZ: 0, argZ: 0 },
        { cRe: -Math.cos(2 * a) / 4, cIm: -Math.sin(2 * a) / 4, lnAbsZ: 0, argZ: 2 * b },
        { cRe: -Math.cos(2 * a) / 4, cIm: Math.sin(2 * a) / 4, lnAbsZ: 0, argZ: -2 * b },
      ];
    }
  }
}

/**
 * The exact processed line: the FID exp(2 pi i nu t - pi w t) sampled at t = k / SW for k < n
 * (truncated at AQ), first point halved, windowed, zero-filled and Fourier transformed, exactly
 * as processFid does. Each window term gives a geometric series, summed in closed form:
 * sum_{k<n} r^k = (1 - r^n) / (1 - r). The transform is the DFT evaluated at any frequency, so
 * it equals processFid at the grid points (tested) and is smooth in nu and w between them.
 * `width` is the natural Lorentzian full width w (R2 = pi w); `mix` is unused.
 */
export function processedLine(p: DimensionProcessing): LineModel {
  const n = p.acquiredPoints;
  const sw = p.spectralWidthHz;
  const terms = windowTerms(p.window, n, sw);
  let halfRe = 0;
  let halfIm = 0;
  for (const t of terms) {
    halfRe += t.cRe / 2;
    halfIm += t.cIm / 2;
  }
  // Per-term constants, so one evaluation costs six transcendental calls whatever the window.
  const pre = terms.map((t) => ({
    ...t,
    cosB: Math.cos(t.argZ), sinB: Math.sin(t.argZ), cosNB: Math.cos(n * t.argZ), sinNB: Math.sin(n * t.argZ),
    absZ: Math.exp(t.lnAbsZ), absZn: Math.exp(n * t.lnAbsZ),
  }));
  // On a uniform axis the phases advance by a fixed rotation per point, so the loop needs no
  // trigonometric calls (angle addition; rounding drift over a window is ~1e-13, far below noise).
  const evaluateGrid = (offset0: number, stepHz: number, width: number, _mix: number, re: Float64Array, im: Float64Array): void => {
    const theta0 = (2 * Math.PI * offset0) / sw;
    const dTheta = (2 * Math.PI * stepHz) / sw;
    const decay = (-Math.PI * width) / sw;
    const e1 = Math.exp(decay);
    const en = Math.exp(n * decay);
    let c0 = Math.cos(theta0);
    let s0 = Math.sin(theta0);
    let cn0 = Math.cos(n * theta0);
    let sn0 = Math.sin(n * theta0);
    const cd = Math.cos(dTheta);
    const sd = Math.sin(dTheta);
    const cnd = Math.cos(n * dTheta);
    const snd = Math.sin(n * dTheta);
    for (let i = 0; i < re.length; i++) {
      let sRe = -halfRe;
      let sIm = -halfIm;
      for (const t of pre) {
        // r = |z| e^{decay} e^{i(theta + arg z)}; r^n likewise with n.
        const mag = t.absZ * e1;
        const rRe = mag * (c0 * t.cosB - s0 * t.sinB);
        const rIm = mag * (s0 * t.cosB + c0 * t.sinB);
        const dRe = 1 - rRe;
        const dIm = -rIm;
        const den = dRe * dRe + dIm * dIm;
        let gRe = n; // r -> 1: the sum is n terms of 1
        let gIm = 0;
        if (den >= 1e-20) {
          const magN = t.absZn * en;
          const nRe = 1 - magN * (cn0 * t.cosNB - sn0 * t.sinNB);
          const nIm = -magN * (sn0 * t.cosNB + cn0 * t.sinNB);
          gRe = (nRe * dRe + nIm * dIm) / den;
          gIm = (nIm * dRe - nRe * dIm) / den;
        }
        sRe += t.cRe * gRe - t.cIm * gIm;
        sIm += t.cRe * gIm + t.cIm * gRe;
      }
      re[i] = sRe;
      im[i] = sIm;
      const c1 = c0 * cd - s0 * sd;
      s0 = s0 * cd + c0 * sd;
      c0 = c1;
      const cn1 = cn0 * cnd - sn0 * snd;
      sn0 = sn0 * cnd + cn0 * snd;
      cn0 = cn1;
    }
  };
  const one = { re: new Float64Array(1), im: new Float64Array(1) };
  const evaluate = (offsetHz: number, width: number, mix: number, out: Float64Array): void => {
    evaluateGrid(offsetHz, 0, width, mix, one.re, one.im);
    out[0] = one.re[0] ?? 0;
    out[1] = one.im[0] ?? 0;
  };
  const description = `processing: ${describeWindow(p.window)}, AQ ${acquisitionTime(p).toFixed(3)} s, ` +
    `${n} points zero-filled to ${p.size}`;
  return { kind: 'processed', description, evaluate, evaluateGrid, fwhm: (w) => numericFwhm(evaluate, w, 0, 1 / acquisitionTime(p)) };
}

const FOUR_LN2 = 4 * Math.LN2;

/**
 * Pseudo-Voigt line, (1 - mix) Lorentzian + mix Gaussian of the same full width at half height
 * `width` (so its FWHM is exactly `width`). The dispersion part is the Lorentzian dispersion of the
 * same width for both parts: an approximation, used only to absorb small phase errors.
 */
export function pseudoVoigtLine(): LineModel {
  const evaluate = (offsetHz: number, width: number, mix: number, out: Float64Array): void => {
    const x = (2 * offsetHz) / width;
    const l = 1 / (1 + x * x);
    const g = Math.exp(-FOUR_LN2 * (offsetHz / width) ** 2);
    out[0] = (1 - mix) * l + mix * g;
    out[1] = x * l;
  };
  const z = new Float64Array(2);
  const evaluateGrid = (offset0: number, stepHz: number, width: number, mix: number, re: Float64Array, im: Float64Array): void => {
    for (let i = 0; i < re.length; i++) {
      evaluate(offset0 + i * stepHz, width, mix, z);
      re[i] = z[0] ?? 0;
      im[i] = z[1] ?? 0;
    }
  };
  return { kind: 'pseudoVoigt', description: 'Lorentz-Gauss mix', evaluate, evaluateGrid, fwhm: (w) => Math.abs(w) };
}

/** FWHM of the absorption part by stepping out from the maximum at offset 0, then bisection. */
function numericFwhm(
  evaluate: LineModel['evaluate'],
  width: number,
  mix: number,
  scaleHz: number,
): number {
  const out = new Float64Array(2);
  const at = (x: number): number => {
    evaluate(x, width, mix, out);
    return out[0] ?? 0;
  };
  const half = at(0) / 2;
  const step = scaleHz / 50;
  let lo = 0;
  let hi = step;
  for (let i = 0; i < 100_000 && at(hi) > half; i++) {
    lo = hi;
    hi += step;
  }
  for (let i = 0; i < 60; i++) {
    const mid = (lo + hi) / 2;
    if (at(mid) > half) lo = mid;
    else hi = mid;
  }
  return lo + hi;
}
