import { resolutionHz } from '../spectrum/axis';
import type { Spectrum2D } from '../spectrum/spectrum';
import type { CrossPeak } from './types';

/** Diagonal tolerance in points of the coarser axis. */
const DIAGONAL_POINTS = 1.5;
/** Partner tolerance in points of the coarser axis. */
const PARTNER_POINTS = 2;

/** Hz per point of the coarser axis (normally F1). */
function coarseHz(s: Spectrum2D): number {
  return Math.max(resolutionHz(s.f1), resolutionHz(s.f2));
}

/**
 * A peak is diagonal when its centre lies on F1 = F2 (same ppm) within 1.5 points of the coarser
 * axis. A first-order diagonal multiplet is symmetric about the diagonal, so its centroid lies on
 * it up to interpolation error (a fraction of a point); a resolved cross peak lies at least its own
 * F1 width away, or it would merge with the diagonal peak.
 */
export function isDiagonal(s: Spectrum2D, p: CrossPeak): boolean {
  const offHz = Math.abs(p.f1Ppm - p.f2Ppm) * s.f2.observeMhz;
  return offHz <= DIAGONAL_POINTS * coarseHz(s);
}

/**
 * A cross peak with no symmetric partner whose centre lies closer to the diagonal (|F1 − F2|) than
 * its own half extent is, in practice, a piece of a diagonal multiplet: a diagonal peak split by
 * its antiphase lobes into separately grouped halves, or the merged diagonals of two protons with
 * overlapping 1D multiplets (a real cross peak has a partner, and one this close to the diagonal
 * belongs to protons whose multiplets overlap, where no first-order J can be read). Such peaks are
 * made diagonal, so they are never measured as couplings. Changes `kind` in place.
 */
export function diagonalFragments(peaks: CrossPeak[]): void {
  for (const p of peaks) {
    if (p.kind !== 'cross' || p.partner !== null) continue;
    const half = Math.max(p.extent.f1FromPpm - p.extent.f1ToPpm, p.extent.f2FromPpm - p.extent.f2ToPpm) / 2;
    if (Math.abs(p.f1Ppm - p.f2Ppm) < half) p.kind = 'diagonal';
  }
}

/**
 * Pairs each cross peak (A in F2, X in F1) with the one at (X, A): both swapped coordinates must
 * agree within 2 points of the coarser axis, since each comparison involves one F1 centre. Pairs are
 * taken greedily, closest first, and are mutual. Diagonal peaks keep partner null. Sets `partner`
 * in place (indices into `peaks`).
 */
export function assignPartners(s: Spectrum2D, peaks: CrossPeak[]): void {
  const tolHz = PARTNER_POINTS * coarseHz(s);
  const mhz = s.f2.observeMhz;
  const pairs: { i: number; j: number; cost: number }[] = [];
  for (let i = 0; i < peaks.length; i++) {
    const a = peaks[i];
    if (!a || a.kind !== 'cross') continue;
    for (let j = i + 1; j < peaks.length; j++) {
      const b = peaks[j];
      if (!b || b.kind !== 'cross') continue;
      const cost = Math.max(Math.abs(a.f2Ppm - b.f1Ppm), Math.abs(a.f1Ppm - b.f2Ppm)) * mhz;
      if (cost <= tolHz) pairs.push({ i, j, cost });
    }
  }
  pairs.sort((x, y) => x.cost - y.cost || x.i - y.i || x.j - y.j);
  for (const p of peaks) p.partner = null;
  for (const { i, j } of pairs) {
    const a = peaks[i];
    const b = peaks[j];
    if (!a || !b || a.partner !== null || b.partner !== null) continue;
    a.partner = j;
    b.partner = i;
  }
}
