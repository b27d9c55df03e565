/**
 * Contour speed of the panel's data path: the host decimates the visible region to the canvas
 * resolution (decimate, 1000 x 700 canvas) and the webview contours that tile (d3-contour, every
 * level on both signs). Baseline in the same run: d3-contour over the full-resolution grid at the
 * same levels. Targets (issue 3): first contours <= 1 s (2048 x 1024) and <= 4 s (4096 x 4096);
 * re-contour of a zoomed view <= 50 ms. Timings only, no assertions.
 */
import { ppmToPoint } from '../src/core/spectrum/axis';
import { decimate } from '../src/core/spectrum/decimate';
import { simulateDqfCosy } from '../src/core/simulate/dqfCosy';
import type { DimensionProcessing } from '../src/core/spectrum/processing';
import type { Spectrum2D } from '../src/core/spectrum/spectrum';
import { COMPOUNDS } from '../scripts/sampleScenario';
import { contourTile } from '../webview/contours';
import { contourLevels } from '../webview/levels';
import { planTile, type PointWindow } from '../webview/tiles';
import { best } from './timing';

export interface ContourRow {
  readonly name: string;
  readonly ms: number;
  readonly targetMs: number;
  readonly baselineMs: number;
  readonly rings: number;
}

const CANVAS = { width: 1000, height: 700 };
const SETTINGS = { lowestLevel: 5, levels: 10, spacing: 1.5 };

function simulate(f2Size: number, f1Size: number): { s: Spectrum2D; noise: number; peak: { row: number; col: number } } {
  const compound = COMPOUNDS[0];
  if (!compound) throw new Error('no sample compound to simulate');
  const p = (base: DimensionProcessing, size: number): DimensionProcessing => ({ ...base, acquiredPoints: size / 2, size });
  const sim = simulateDqfCosy(compound.system, { f1: p(compound.cosy.f1, f1Size), f2: p(compound.cosy.f2, f2Size), noise: { seed: 1, snr: compound.snr2D } });
  const cross = sim.peaks.find((k) => k.kind === 'cross');
  if (!cross) throw new Error('simulated spectrum has no cross peak');
  const peak = { row: ppmToPoint(sim.spectrum.f1, cross.f1Ppm), col: ppmToPoint(sim.spectrum.f2, cross.f2Ppm) };
  return { s: sim.spectrum, noise: sim.noiseSigma, peak };
}

/** Decimate the window for the canvas and contour every level: what the panel does for one view. */
function viewContours(s: Spectrum2D, magnitudes: readonly number[], view: PointWindow): number {
  const plan = planTile(view, { rows: s.f1.points, cols: s.f2.points }, CANVAS);
  const tile = decimate(s, plan.region, plan.maxRows, plan.maxCols);
  return contourTile(tile, magnitudes).reduce((n, l) => n + l.rings.length, 0);
}

function fullResolution(s: Spectrum2D, magnitudes: readonly number[]): number {
  const tile = { rows: s.f1.points, cols: s.f2.points, data: Float32Array.from(s.data) };
  return contourTile(tile, magnitudes).reduce((n, l) => n + l.rings.length, 0);
}

export function runContourBench(repeats = 3): ContourRow[] {
  const rows: ContourRow[] = [];
  for (const [f2, f1, target] of [[2048, 1024, 1000], [4096, 4096, 4000]] as const) {
    const { s, noise, peak } = simulate(f2, f1);
    const magnitudes = contourLevels(noise, SETTINGS).magnitudes;
    const full: PointWindow = { row0: 0, row1: f1 - 1, col0: 0, col1: f2 - 1 };
    let rings = 0;
    const firstMs = best(repeats, () => (rings = viewContours(s, magnitudes, full)));
    const baselineMs = best(1, () => fullResolution(s, magnitudes));
    rows.push({ name: `first contours ${f2}x${f1}`, ms: firstMs, targetMs: target, baselineMs, rings });
    // A zoomed view: an eighth of each axis centred on a cross peak, as after "zoom to peak".
    const half = (n: number): number => n / 16;
    const clamp = (v: number, n: number): number => Math.min(n - 1, Math.max(0, v));
    const zoom: PointWindow = { row0: clamp(peak.row - half(f1), f1), row1: clamp(peak.row + half(f1), f1), col0: clamp(peak.col - half(f2), f2), col1: clamp(peak.col + half(f2), f2) };
    let zr = 0;
    const zoomMs = best(repeats, () => (zr = viewContours(s, magnitudes, zoom)));
    rows.push({ name: `re-contour zoomed 1/8 view ${f2}x${f1}`, ms: zoomMs, targetMs: 50, baselineMs, rings: zr });
  }
  return rows;
}

export function printContourBench(rows: readonly ContourRow[]): void {
  console.log(`${'contours (1000 x 700 canvas)'.padEnd(42)} ${'ms'.padStart(9)} ${'target'.padStart(8)} ${'full-res d3'.padStart(12)} ${'ratio'.padStart(8)} ${'rings'.padStart(6)}`);
  for (const r of rows) {
    console.log(`${r.name.padEnd(42)} ${r.ms.toFixed(1).padStart(9)} ${String(r.targetMs).padStart(8)} ${r.baselineMs.toFixed(0).padStart(12)} ${(r.ms / r.baselineMs).toFixed(3).padStart(8)} ${String(r.rings).padStart(6)}`);
  }
}
