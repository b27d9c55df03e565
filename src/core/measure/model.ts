import type { LineModel } from './lineshape';
import { treeLines } from './splitting';

/**
 * The F2 (or F1) pattern of one cross-peak multiplet: the 2^(1+p) lines at
 * centre + s0 J/2 + sum_i s_i Jp_i/2 (s = ±1), each with the sign s0 of the active coupling
 * (antiphase in J, in-phase in the passive couplings; first-order DQF-COSY cross peak), of one
 * line shape, phase-rotated by phi: Re(e^{i phi} X).
 *
 * Parameter vector (internal, unbounded): [centre Hz, J Hz, width, phi rad, (mix), Jp_1..Jp_p].
 * width: natural Lorentzian width w (Hz) for the processed line, left unbounded: the window and
 * truncation keep the line finite even for small negative w, and a bound at 0 would bias J and
 * break the covariance when the true width is near 0 (window-dominated lines); log of the FWHM
 * for the pseudo-Voigt line (keeps it positive). mix: logit of the Gaussian fraction (keeps it in 0..1).
 * The sign of J or Jp only flips or keeps the pattern, so they are left free and reported as |J|.
 */
export interface ModelSpec {
  readonly line: LineModel;
  readonly passives: number;
  /**
   * Number of equivalent protons behind each passive coupling (1..3; absent: all 1). A group of n
   * splits in-phase into n + 1 lines at (n/2 - k) Jp with binomial weights C(n, k) (first-order
   * multiplet rule, e.g. a CH3 partner gives a 1:3:3:1 quartet).
   */
  readonly groups?: readonly number[];
}

/** Equivalent protons behind passive coupling i (1 when the spec has no groups). */
export function groupSize(spec: ModelSpec, i: number): number {
  return spec.groups?.[i] ?? 1;
}

/** In-phase lines of the passive couplings: offsets from the centre (Hz) and binomial weights. */
function passiveLines(spec: ModelSpec, theta: ArrayLike<number>): { offsets: number[]; weights: number[] } {
  const js = Array.from({ length: spec.passives }, (_, i) => boundedCoupling(theta[passiveIndex(spec, i)] ?? 0));
  return treeLines(js, js.map((_, i) => groupSize(spec, i)));
}

export function hasMix(spec: ModelSpec): boolean {
  return spec.line.kind === 'pseudoVoigt';
}

export function passiveIndex(spec: ModelSpec, i: number): number {
  return (hasMix(spec) ? 5 : 4) + i;
}

export function paramCount(spec: ModelSpec): number {
  return passiveIndex(spec, spec.passives);
}

/**
 * Largest |J(H,H)| a coupling may take, Hz: handbook ranges (geminal -10 to -15, vicinal up to ~13,
 * trans-olefinic up to 18; /work/shared/checks/references.md) with a margin.
 */
export const J_MAX_HZ = 20;
/** Below this |value| the internal parameter is the coupling itself (the bound changes nothing there). */
const J_SOFT_HZ = 16;

/**
 * A coupling from its internal (unbounded) parameter u: u itself while |u| <= 16 Hz, then
 * 16 + 4 tanh((|u| - 16) / 4) with u's sign, so |J| < 20 Hz and J is smooth (value and slope
 * continuous) in u. The fit then stays inside the physical range without a constrained optimiser.
 */
export function boundedCoupling(u: number): number {
  const a = Math.abs(u);
  if (a <= J_SOFT_HZ) return u;
  const span = J_MAX_HZ - J_SOFT_HZ;
  return Math.sign(u) * (J_SOFT_HZ + span * Math.tanh((a - J_SOFT_HZ) / span));
}

/** dJ/du of boundedCoupling, for the standard deviation of J from that of u (delta method). */
export function boundedSlope(u: number): number {
  const a = Math.abs(u);
  if (a <= J_SOFT_HZ) return 1;
  const t = Math.tanh((a - J_SOFT_HZ) / (J_MAX_HZ - J_SOFT_HZ));
  return 1 - t * t;
}

/** True when the fit pushes the coupling into the top of the range (it wants more than the bound allows). */
export function atBound(u: number): boolean {
  return Math.abs(u) > J_MAX_HZ;
}

/** The width parameter of the line model (natural width, or FWHM for pseudo-Voigt). */
export function lineWidth(spec: ModelSpec, theta: ArrayLike<number>): number {
  const w = theta[2] ?? 0;
  return spec.line.kind === 'pseudoVoigt' ? Math.exp(w) : w;
}

export function mixFraction(spec: ModelSpec, theta: ArrayLike<number>): number {
  return hasMix(spec) ? 1 / (1 + Math.exp(-(theta[4] ?? 0))) : 0;
}

/** Apparent FWHM of one line in the processed spectrum for these parameters. */
export function apparentFwhm(spec: ModelSpec, theta: ArrayLike<number>): number {
  return spec.line.fwhm(lineWidth(spec, theta), mixFraction(spec, theta));
}

export function makeTheta(spec: ModelSpec, centre: number, j: number, width: number, passives: number[]): Float64Array {
  const th = new Float64Array(paramCount(spec));
  th[0] = centre;
  th[1] = j;
  th[2] = spec.line.kind === 'pseudoVoigt' ? Math.log(width) : width;
  th[3] = 0;
  if (hasMix(spec)) th[4] = 0;
  passives.forEach((v, i) => (th[passiveIndex(spec, i)] = v));
  return th;
}

/** The pattern at the given frequencies (Hz, a uniform axis), written into out. */
export function pattern(spec: ModelSpec, theta: ArrayLike<number>, freqs: Float64Array, out: Float64Array): void {
  const centre = theta[0] ?? 0;
  const j = boundedCoupling(theta[1] ?? 0);
  const width = lineWidth(spec, theta);
  const mix = mixFraction(spec, theta);
  const cp = Math.cos(theta[3] ?? 0);
  const sp = Math.sin(theta[3] ?? 0);
  const offsets: number[] = [];
  const weights: number[] = [];
  const pl = passiveLines(spec, theta);
  for (const s0 of [1, -1]) {
    pl.offsets.forEach((o, q) => {
      offsets.push(centre + (s0 * j) / 2 + o);
      weights.push(s0 * (pl.weights[q] ?? 0));
    });
  }
  const m = freqs.length;
  const step = m > 1 ? (freqs[1] ?? 0) - (freqs[0] ?? 0) : 0;
  const re = new Float64Array(m);
  const im = new Float64Array(m);
  out.fill(0);
  for (let k = 0; k < offsets.length; k++) {
    // offset nu - f_i = (nu - f_0) - i * step on the uniform axis
    spec.line.evaluateGrid((offsets[k] ?? 0) - (freqs[0] ?? 0), -step, width, mix, re, im);
    const wt = weights[k] ?? 0;
    for (let i = 0; i < m; i++) out[i] = (out[i] ?? 0) + wt * (cp * (re[i] ?? 0) - sp * (im[i] ?? 0));
  }
}
