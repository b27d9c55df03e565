/**
 * Analytic test spectra: sums of products of Gaussian or Lorentzian lines with known centres, so
 * that every position a picker should find is known exactly. Test-only helpers.
 */
import { makeAxis, hzToPoint, type Axis } from '../../../src/core/spectrum/axis';
import { make1D, make2D, type Spectrum1D, type Spectrum2D } from '../../../src/core/spectrum/spectrum';

export const MHZ = 600;

/** Unit-height Gaussian of full width at half height w (same units as x). */
export function gauss(x: number, w: number): number {
  return Math.exp((-4 * Math.LN2 * x * x) / (w * w));
}

/** Unit-height Lorentzian (absorption) of full width at half height w. */
export function lorentz(x: number, w: number): number {
  const u = (2 * x) / w;
  return 1 / (1 + u * u);
}

/** One line of a pattern: offset from the centre (Hz) and signed amplitude. */
export interface PatternLine {
  readonly offsetHz: number;
  readonly amp: number;
}

/**
 * First-order pattern: start from one line and split it by each coupling in turn; an antiphase
 * splitting gives (+1/2 at +J/2, -1/2 at -J/2), an in-phase one (+1/2, +1/2).
 */
export function pattern(couplings: readonly { j: number; antiphase: boolean }[]): PatternLine[] {
  let lines: PatternLine[] = [{ offsetHz: 0, amp: 1 }];
  for (const { j, antiphase } of couplings) {
    lines = lines.flatMap((l) => [
      { offsetHz: l.offsetHz + j / 2, amp: l.amp / 2 },
      { offsetHz: l.offsetHz - j / 2, amp: (antiphase ? -l.amp : l.amp) / 2 },
    ]);
  }
  return lines;
}

/** A 2D multiplet: product of an F2 and an F1 pattern at (f2Hz, f1Hz). */
export interface Peak2D {
  readonly f2Hz: number;
  readonly f1Hz: number;
  readonly f2: readonly PatternLine[];
  readonly f1: readonly PatternLine[];
  readonly amp: number;
}

export interface Grid2D {
  readonly f1: Axis;
  readonly f2: Axis;
  /** Full widths at half height, Hz. */
  readonly w1Hz: number;
  readonly w2Hz: number;
  readonly shape?: 'gauss' | 'lorentz';
}

/** Profile of one pattern sampled along an axis. */
function profile(axis: Axis, centreHz: number, lines: readonly PatternLine[], wHz: number, shape: (x: number, w: number) => number): Float64Array {
  const out = new Float64Array(axis.points);
  const step = (axis.lastHz - axis.firstHz) / (axis.points - 1);
  for (let i = 0; i < axis.points; i++) {
    const hz = axis.firstHz + i * step;
    let v = 0;
    for (const l of lines) v += l.amp * shape(hz - centreHz - l.offsetHz, wHz);
    out[i] = v;
  }
  return out;
}

export function spectrum2D(grid: Grid2D, peaks: readonly Peak2D[], noise?: { sigma: number; seed: number }): Spectrum2D {
  const shape = grid.shape === 'lorentz' ? lorentz : gauss;
  const rows = grid.f1.points;
  const cols = grid.f2.points;
  const data = new Float64Array(rows * cols);
  for (const p of peaks) {
    const a = profile(grid.f2, p.f2Hz, p.f2, grid.w2Hz, shape);
    const b = profile(grid.f1, p.f1Hz, p.f1, grid.w1Hz, shape);
    for (let r = 0; r < rows; r++) {
      const br = (b[r] ?? 0) * p.amp;
      if (br === 0) continue;
      for (let c = 0; c < cols; c++) data[r * cols + c] = (data[r * cols + c] ?? 0) + br * (a[c] ?? 0);
    }
  }
  if (noise) addNoise(data, noise.sigma, noise.seed);
  return make2D('synthetic', data, grid.f1, grid.f2);
}

export function spectrum1D(axis: Axis, peaks: readonly { hz: number; lines: readonly PatternLine[]; amp: number }[], wHz: number, noise?: { sigma: number; seed: number }): Spectrum1D {
  const data = new Float64Array(axis.points);
  for (const p of peaks) {
    const a = profile(axis, p.hz, p.lines, wHz, lorentz);
    for (let i = 0; i < data.length; i++) data[i] = (data[i] ?? 0) + p.amp * (a[i] ?? 0);
  }
  if (noise) addNoise(data, noise.sigma, noise.seed);
  return make1D('synthetic 1D', data, axis);
}

/**
 * Seeded Gaussian noise: mulberry32 uniform generator (public-domain 32-bit generator by
 * T. Ettinger, from memory) and the Box-Muller transform (Box & Muller, Ann. Math. Stat. 29
 * (1958) 610).
 */
export function addNoise(data: Float64Array, sigma: number, seed: number): void {
  let s = seed >>> 0;
  const uniform = (): number => {
    s = (s + 0x6d2b79f5) >>> 0;
    let t = s;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return (((t ^ (t >>> 14)) >>> 0) + 0.5) / 4294967296;
  };
  for (let i = 0; i < data.length; i += 2) {
    const r = Math.sqrt(-2 * Math.log(uniform()));
    const th = 2 * Math.PI * uniform();
    data[i] = (data[i] ?? 0) + sigma * r * Math.cos(th);
    if (i + 1 < data.length) data[i + 1] = (data[i + 1] ?? 0) + sigma * r * Math.sin(th);
  }
}

/** A homonuclear axis from hiPpm down to loPpm with n points. */
export function ppmAxis(n: number, hiPpm: number, loPpm: number): Axis {
  return makeAxis(n, hiPpm * MHZ, loPpm * MHZ, MHZ);
}

/** Fractional point of a Hz value on an axis (for expected positions). */
export function pointOf(axis: Axis, hz: number): number {
  return hzToPoint(axis, hz);
}
