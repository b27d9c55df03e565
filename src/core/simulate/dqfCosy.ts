/**
 * Phase-sensitive DQF-COSY of a first-order spin system.
 *
 * Product-operator result for a weakly coupled pair A–X (e.g. Keeler, Understanding NMR
 * Spectroscopy, 2nd ed., Wiley 2010, ch. 8 [mem]): after the double-quantum filter the cross peak
 * at (F1 = nu_A, F2 = nu_X) is modulated by sin(pi J_AX t1) prod_M cos(pi J_AM t1) in t1 and
 * sin(pi J_AX t2) prod_M cos(pi J_XM t2) in t2: antiphase in the active coupling, in-phase in every
 * passive one, pure absorption. Simplifications, stated here so nobody mistakes them for physics:
 * - the diagonal peak at (nu_A, nu_A) is modelled as antiphase absorption in J_AX in both
 *   dimensions, summed over A's partners, with the same sign as the cross peak (common practice;
 *   the small dispersive in-phase residue of a real DQF-COSY diagonal is left out);
 * - a group of n equivalent protons counts as n independent protons: the pair term is scaled by
 *   n_A * n_X, and the other n_X - 1 protons of the active partner split in-phase; multi-spin terms
 *   among equivalent protons are ignored; the overall DQF factor 1/2 is dropped.
 * Each multiplet is a product of an F1 and an F2 pattern, so the spectrum is built as a sum of
 * outer products of processed 1D lineshapes (processFid in each dimension).
 */
import { processedAxis } from './process';
import { makeAxis, type Axis } from '../spectrum/axis';
import type { DimensionProcessing } from '../spectrum/processing';
import { make2D, type Spectrum2D } from '../spectrum/spectrum';
import { checkInWindow, checkProcessing, noiseGain, processedLines } from './lineshape';
import { maxAbs, spectralSigma, type NoiseSpec } from './noise';
import { statesNoise, windowNoiseFast, type GridWindow } from './noise2D';
import { seededRandom } from './random';
import { findSpin, multipletLines, partnersOf, spinCount, splittingsOf, strongCouplingRatio, validateSpinSystem, type SpinSystem } from './spinSystem';

export interface CosyOptions {
  readonly f1: DimensionProcessing;
  readonly f2: DimensionProcessing;
  readonly title?: string;
  readonly noise?: NoiseSpec;
  /** Simulate only this window of the full processed grid (rows = F1 points, cols = F2 points). */
  readonly window?: GridWindow;
  /**
   * 'exact' processes every simulated FID (noise of a window is then the same slice of the full
   * spectrum's noise); 'fast' draws the same distribution from fewer FIDs (windowNoiseFast).
   * Default: 'fast' when the window has fewer rows than 2 x F1 acquired points, else 'exact'.
   */
  readonly noiseMethod?: 'exact' | 'fast';
}

/** What was simulated for one cross or diagonal peak. */
export interface CosyPeakTruth {
  readonly kind: 'cross' | 'diagonal';
  /** Spin at the F1 position and spin at the F2 position (equal for a diagonal peak). */
  readonly f1Spin: string;
  readonly f2Spin: string;
  /** The spin whose coupling to f1Spin is active (for a cross peak, f2Spin). */
  readonly activePartner: string;
  readonly f1Ppm: number;
  readonly f2Ppm: number;
  readonly f1Hz: number;
  readonly f2Hz: number;
  readonly activeJHz: number;
  /** In-phase (passive) splittings of the F1 and F2 multiplets, one entry per coupled proton. */
  readonly passiveF1Hz: readonly number[];
  readonly passiveF2Hz: readonly number[];
  readonly widthF1Hz: number;
  readonly widthF2Hz: number;
  /** Scale of the peak (product of the proton counts). */
  readonly amplitude: number;
  /** |Δν| / |J| of the active pair. */
  readonly shiftToJRatio: number;
}

export interface SimulatedCosy {
  readonly spectrum: Spectrum2D;
  readonly peaks: readonly CosyPeakTruth[];
  /** Where the returned grid sits in the full processed grid. */
  readonly window: GridWindow;
  /** Standard deviation of the noise in the processed spectrum (0 without noise). */
  readonly noiseSigma: number;
}

/** Every cross and diagonal peak of the system, with its truth. */
export function cosyPeaks(system: SpinSystem): CosyPeakTruth[] {
  validateSpinSystem(system);
  const out: CosyPeakTruth[] = [];
  for (const spin of system.spins) {
    for (const partner of partnersOf(system, spin.label)) {
      const other = findSpin(system, partner.label);
      const common = { activeJHz: partner.jHz, amplitude: spinCount(spin) * partner.count, shiftToJRatio: strongCouplingRatio(system, spin.label, other.label) };
      const f1Passive = splittingsOf(system, spin.label, other.label);
      const at = (ppm: number): { ppm: number; hz: number } => ({ ppm, hz: ppm * system.observeMhz });
      const f1 = at(spin.ppm);
      for (const [kind, f2Spin] of [['cross', other], ['diagonal', spin]] as const) {
        const f2 = at(f2Spin.ppm);
        out.push({
          kind, f1Spin: spin.label, f2Spin: f2Spin.label, activePartner: other.label,
          f1Ppm: f1.ppm, f2Ppm: f2.ppm, f1Hz: f1.hz, f2Hz: f2.hz, ...common,
          passiveF1Hz: f1Passive,
          passiveF2Hz: kind === 'cross' ? splittingsOf(system, other.label, spin.label) : f1Passive,
          widthF1Hz: spin.linewidthHz, widthF2Hz: f2Spin.linewidthHz,
        });
      }
    }
  }
  return out;
}

/** The processed antiphase/in-phase pattern of one peak in one dimension, restricted to [from, from+count). */
function patternTrace(centreHz: number, widthHz: number, activeJ: number, passive: readonly number[], p: DimensionProcessing, dim: string, what: string, from: number, count: number): Float64Array {
  const hz = centreHz - p.carrierHz;
  checkInWindow(hz, p, what, dim);
  const lines = multipletLines(passive, activeJ).map((l) => ({ hz: hz + l.offsetHz, amplitude: l.amplitude, widthHz }));
  return processedLines(lines, p).slice(from, from + count);
}

function fullWindow(o: CosyOptions): GridWindow {
  return { row0: 0, rows: o.f1.size, col0: 0, cols: o.f2.size };
}

function checkWindow(w: GridWindow, o: CosyOptions): void {
  const ok = (start: number, n: number, size: number): boolean => Number.isInteger(start) && Number.isInteger(n) && start >= 0 && n >= 2 && start + n <= size;
  if (!ok(w.row0, w.rows, o.f1.size)) throw new RangeError(`window rows ${w.row0}..${w.row0 + w.rows - 1} must lie within F1 points 0..${o.f1.size - 1} (at least 2 rows)`);
  if (!ok(w.col0, w.cols, o.f2.size)) throw new RangeError(`window columns ${w.col0}..${w.col0 + w.cols - 1} must lie within F2 points 0..${o.f2.size - 1} (at least 2 columns)`);
}

/** Noise-free DQF-COSY data on a window of the grid: sum of outer products, F1 trace x F2 trace. */
function cosySignal(peaks: readonly CosyPeakTruth[], o: CosyOptions, w: GridWindow): Float64Array {
  const data = new Float64Array(w.rows * w.cols);
  // Cross and diagonal peaks in the same F1 row share the F1 pattern: add their F2 traces first.
  const byRow = new Map<string, { f1: Float64Array; f2: Float64Array }>();
  for (const pk of peaks) {
    const key = `${pk.f1Spin}\u0000${pk.activePartner}`;
    let acc = byRow.get(key);
    if (!acc) {
      const f1 = patternTrace(pk.f1Hz, pk.widthF1Hz, pk.activeJHz, pk.passiveF1Hz, o.f1, 'F1', `spin ${pk.f1Spin}`, w.row0, w.rows);
      acc = { f1, f2: new Float64Array(w.cols) };
      byRow.set(key, acc);
    }
    const f2 = patternTrace(pk.f2Hz, pk.widthF2Hz, pk.activeJHz, pk.passiveF2Hz, o.f2, 'F2', `spin ${pk.f2Spin}`, w.col0, w.cols);
    for (let c = 0; c < w.cols; c++) acc.f2[c] = (acc.f2[c] ?? 0) + pk.amplitude * (f2[c] ?? 0);
  }
  for (const { f1, f2 } of byRow.values()) {
    for (let r = 0; r < w.rows; r++) {
      const a = f1[r] ?? 0;
      if (a === 0) continue;
      const base = r * w.cols;
      for (let c = 0; c < w.cols; c++) data[base + c] = (data[base + c] ?? 0) + a * (f2[c] ?? 0);
    }
  }
  return data;
}

function useFastNoise(o: CosyOptions, w: GridWindow): boolean {
  return o.noiseMethod ? o.noiseMethod === 'fast' : w.rows < 2 * o.f1.acquiredPoints;
}

function windowAxis(p: DimensionProcessing, observeMhz: number, start: number, count: number): Axis {
  const full = processedAxis(p, observeMhz);
  const step = (full.lastHz - full.firstHz) / (full.points - 1);
  return makeAxis(count, full.firstHz + start * step, full.firstHz + (start + count - 1) * step, observeMhz);
}

/**
 * Simulate a phase-sensitive DQF-COSY (optionally only a window of the processed grid). Noise: see
 * statesNoise; with `snr`, the tallest |value| of the noise-free data returned (the window, when
 * one is given) over the spectral noise sigma equals snr. With a window, the axes cover the window
 * only, while `processing` still describes how the full grid was processed (size = full points).
 */
export function simulateDqfCosy(system: SpinSystem, o: CosyOptions): SimulatedCosy {
  validateSpinSystem(system);
  checkProcessing(o.f1, 'F1');
  checkProcessing(o.f2, 'F2');
  const w = o.window ?? fullWindow(o);
  checkWindow(w, o);
  const peaks = cosyPeaks(system);
  const data = cosySignal(peaks, o, w);
  let noiseSigma = 0;
  if (o.noise) {
    noiseSigma = spectralSigma(o.noise, maxAbs(data));
    const fidSigma = noiseSigma / (noiseGain(o.f1) * noiseGain(o.f2));
    const rng = seededRandom(o.noise.seed);
    const noise = useFastNoise(o, w) ? windowNoiseFast(o.f1, o.f2, fidSigma, rng, w) : statesNoise(o.f1, o.f2, fidSigma, rng, w);
    for (let i = 0; i < data.length; i++) data[i] = (data[i] ?? 0) + (noise[i] ?? 0);
  }
  const spectrum = make2D(o.title ?? 'simulated DQF-COSY', data, windowAxis(o.f1, system.observeMhz, w.row0, w.rows), windowAxis(o.f2, system.observeMhz, w.col0, w.cols), { f1: o.f1, f2: o.f2 });
  return { spectrum, peaks, window: w, noiseSigma };
}

/**
 * A small window (rows x cols points, default 32 x 512) centred on the cross peak at
 * (F1 = nu_f1Spin, F2 = nu_f2Spin), clamped to the grid; fast enough for repeated accuracy studies.
 */
export function simulateCrossPeakRegion(
  system: SpinSystem,
  f1Spin: string,
  f2Spin: string,
  o: Omit<CosyOptions, 'window'> & { readonly rows?: number; readonly cols?: number },
): SimulatedCosy {
  validateSpinSystem(system);
  const rows = Math.min(o.rows ?? 32, o.f1.size);
  const cols = Math.min(o.cols ?? 512, o.f2.size);
  const centre = (p: DimensionProcessing, label: string, n: number): number => {
    const ax = processedAxis(p, system.observeMhz);
    const point = (findSpin(system, label).ppm * system.observeMhz - ax.firstHz) / ((ax.lastHz - ax.firstHz) / (ax.points - 1));
    return Math.min(p.size - n, Math.max(0, Math.round(point - n / 2)));
  };
  const window: GridWindow = { row0: centre(o.f1, f1Spin, rows), rows, col0: centre(o.f2, f2Spin, cols), cols };
  return simulateDqfCosy(system, { ...o, window });
}
