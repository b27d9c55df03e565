import { resolutionHz } from '../spectrum/axis';
import type { Spectrum2D } from '../spectrum/spectrum';
import { joinHalves } from './fragments';
import type { Extremum } from './types';

export interface LinkOptions {
  /**
   * Largest distance, Hz, between two extrema of one multiplet along each axis (default 22).
   * Adjacent lobes of a first-order multiplet are at most the largest J apart (vicinal and geminal
   * 1H-1H couplings rarely exceed 18 Hz: handbook tables, from memory), so 22 Hz keeps a large
   * multiplet whole while two small cross peaks 40 Hz apart stay separate.
   */
  linkHz?: number;
  /** Link distance in points at least this many points in each dimension (default 2.5), for coarse F1. */
  linkPoints?: number;
}

const DEFAULT_LINK_HZ = 22;
const DEFAULT_LINK_POINTS = 2.5;

/**
 * Groups extrema into multiplets by single linkage: two extrema are linked when they are within
 * the link distance in F2 and, independently, in F1 (a box, not a circle, because the two
 * dimensions have very different digital resolution). Groups are the connected components.
 * Then the two F1 halves of one multiplet, further apart than the link distance, are rejoined
 * (joinHalves in fragments.ts, up to twice the F1 link distance).
 * Returns groups of indices into `extrema`, each in ascending order.
 */
export function linkExtrema(s: Spectrum2D, extrema: readonly Extremum[], opts: LinkOptions = {}): number[][] {
  const linkHz = opts.linkHz ?? DEFAULT_LINK_HZ;
  const linkPoints = opts.linkPoints ?? DEFAULT_LINK_POINTS;
  if (!(linkHz > 0) || !Number.isFinite(linkHz)) throw new RangeError(`option linkHz must be a finite number > 0, got ${linkHz}`);
  if (!(linkPoints >= 0) || !Number.isFinite(linkPoints)) throw new RangeError(`option linkPoints must be a finite number >= 0, got ${linkPoints}`);
  const reach2 = Math.max(linkHz / resolutionHz(s.f2), linkPoints);
  const reach1 = Math.max(linkHz / resolutionHz(s.f1), linkPoints);
  const order = extrema.map((_, i) => i).sort((a, b) => colOf(extrema, a) - colOf(extrema, b));
  const parent = Int32Array.from(order.keys());
  const find = (i: number): number => {
    let root = i;
    while ((parent[root] ?? root) !== root) root = parent[root] ?? root;
    while (i !== root) {
      const next = parent[i] ?? root;
      parent[i] = root;
      i = next;
    }
    return root;
  };
  // Sweep in column order: only extrema within reach2 columns can link.
  for (let a = 0; a < order.length; a++) {
    const ea = extrema[order[a] ?? 0];
    if (!ea) continue;
    for (let b = a + 1; b < order.length; b++) {
      const eb = extrema[order[b] ?? 0];
      if (!eb || eb.col - ea.col > reach2) break;
      if (Math.abs(eb.row - ea.row) <= reach1) parent[find(a)] = find(b);
    }
  }
  const groups = new Map<number, number[]>();
  for (let a = 0; a < order.length; a++) {
    const root = find(a);
    const list = groups.get(root) ?? [];
    list.push(order[a] ?? 0);
    groups.set(root, list);
  }
  const linked = [...groups.values()].map((g) => g.sort((x, y) => x - y));
  return joinHalves(extrema, linked, 2 * reach1, reach2);
}

function colOf(extrema: readonly Extremum[], i: number): number {
  return extrema[i]?.col ?? 0;
}
