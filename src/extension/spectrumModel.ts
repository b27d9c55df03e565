/**
 * The opened spectrum as the panel needs it: parsed data, picked peaks, and the views sent in
 * `init` and `tile`. Pure (text and hash in); the glue reads the file and hashes it.
 */
import { parseJcamp } from '../core/jcamp';
import { nearestCrossPeak, pickCrossPeaks, pickMultiplets1D, type CrossPeak, type Multiplet1D } from '../core/peaks';
import type { Axis } from '../core/spectrum/axis';
import { decimate } from '../core/spectrum/decimate';
import type { Spectrum } from '../core/spectrum/spectrum';
import type { AxisMeta, GridRegion, PeakView, SpectrumMeta, TileMessage } from '../protocol';

export interface SpectrumModel {
  /** Base name of the data file, e.g. `cosy.jdx`. */
  readonly fileName: string;
  readonly sha256: string;
  readonly spectrum: Spectrum;
  readonly noise: number;
  /** 2D: grouped cross and diagonal peaks in the core's order; empty for 1D. */
  readonly crossPeaks: readonly CrossPeak[];
  /** 1D: multiplets; empty for 2D. */
  readonly multiplets: readonly Multiplet1D[];
}

/**
 * Parses and picks. Throws the core's error (JcampError messages start with `file:line`), so the
 * caller can show it as it is.
 */
export function loadSpectrumModel(text: string, fileName: string, sha256: string): SpectrumModel {
  const spectrum = parseJcamp(text, fileName);
  if (spectrum.dims === 2) {
    const { peaks, noise } = pickCrossPeaks(spectrum);
    return { fileName, sha256, spectrum, noise, crossPeaks: peaks, multiplets: [] };
  }
  const { multiplets, noise } = pickMultiplets1D(spectrum);
  return { fileName, sha256, spectrum, noise, crossPeaks: [], multiplets };
}

const axisMeta = (a: Axis): AxisMeta => ({ points: a.points, firstHz: a.firstHz, lastHz: a.lastHz, observeMhz: a.observeMhz });

function range(data: Float64Array): [number, number] {
  let min = Infinity;
  let max = -Infinity;
  for (const v of data) {
    if (v < min) min = v;
    if (v > max) max = v;
  }
  return data.length ? [min, max] : [0, 0];
}

export function spectrumMeta(m: SpectrumModel): SpectrumMeta {
  const s = m.spectrum;
  const [min, max] = range(s.data);
  const common = { fileName: m.fileName, title: s.title, noise: m.noise, min, max };
  return s.dims === 2
    ? { ...common, dims: 2, f1: axisMeta(s.f1), f2: axisMeta(s.f2) }
    : { ...common, dims: 1, f2: axisMeta(s.axis) };
}

export function peakViews(m: SpectrumModel): PeakView[] {
  if (m.spectrum.dims === 2) {
    return m.crossPeaks.map((p, index) => ({
      index, kind: p.kind, f2Ppm: p.f2Ppm, f1Ppm: p.f1Ppm, partner: p.partner,
      extent: { f2FromPpm: p.extent.f2FromPpm, f2ToPpm: p.extent.f2ToPpm, f1FromPpm: p.extent.f1FromPpm, f1ToPpm: p.extent.f1ToPpm },
    }));
  }
  return m.multiplets.map((p, index) => ({
    index, kind: 'multiplet', f2Ppm: p.ppm, partner: null, extent: { f2FromPpm: p.fromPpm, f2ToPpm: p.toPpm },
  }));
}

/** Grid size (rows, cols); a 1D spectrum is one row. */
export function gridSize(s: Spectrum): { rows: number; cols: number } {
  return s.dims === 2 ? { rows: s.f1.points, cols: s.f2.points } : { rows: 1, cols: s.axis.points };
}

/** The `tile` reply: the requested region decimated to the view's resolution (throws RangeError outside the grid). */
export function tileFor(m: SpectrumModel, inReplyTo: number, region: GridRegion, maxRows: number, maxCols: number): TileMessage {
  const t = decimate(m.spectrum, region, maxRows, maxCols);
  return { type: 'tile', inReplyTo, region, rows: t.rows, cols: t.cols, data: t.data };
}

/** Farthest a 1D position may lie outside a multiplet's range and still mean it, ppm (as the 2D snap). */
const MAX_1D_DISTANCE_PPM = 0.1;

/**
 * The peak a position means (for commands and tests that name a place instead of an index): the
 * core's nearestCrossPeak in 2D; in 1D the multiplet whose range is nearest. Null when none is near.
 */
export function nearestPeakIndex(m: SpectrumModel, f2Ppm: number, f1Ppm?: number): number | null {
  if (m.spectrum.dims === 2) return f1Ppm === undefined ? null : nearestCrossPeak(m.crossPeaks, f2Ppm, f1Ppm);
  let best: number | null = null;
  let bestDistance = MAX_1D_DISTANCE_PPM;
  m.multiplets.forEach((p, i) => {
    const d = f2Ppm > p.fromPpm ? f2Ppm - p.fromPpm : f2Ppm < p.toPpm ? p.toPpm - f2Ppm : 0;
    if (d < bestDistance || (d === 0 && best === null)) {
      best = i;
      bestDistance = d;
    }
  });
  return best;
}
