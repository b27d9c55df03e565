/**
 * Contour geometry per (region, decimation, levels), computed a few levels at a time so that a
 * new view or new levels never block input: the caller runs `step` once per animation frame with
 * a time budget and redraws whatever is done. Least recently used tiles are dropped. Pure (the
 * clock is passed in), tested in Node.
 */
import { contourLevel, maxOf, negate, type LevelRings, type TileData } from './contours';
import type { TilePlan } from './tiles';

export interface CacheEntry {
  readonly plan: TilePlan;
  readonly tile: TileData;
  readonly negated: Float32Array;
  readonly maxPos: number;
  readonly maxNeg: number;
  levelsKey: string;
  /** Work left: magnitudes with their sign, lowest first, positive and negative interleaved. */
  queue: { magnitude: number; sign: 1 | -1 }[];
  done: LevelRings[];
}

export class ContourCache {
  private readonly entries = new Map<string, CacheEntry>();

  constructor(private readonly capacity = 6) {}

  get(key: string): CacheEntry | undefined {
    const e = this.entries.get(key);
    if (e) {
      // Map keeps insertion order: re-inserting marks the entry as most recently used.
      this.entries.delete(key);
      this.entries.set(key, e);
    }
    return e;
  }

  put(plan: TilePlan, tile: TileData, magnitudes: readonly number[], levelsKey: string): CacheEntry {
    const negated = negate(tile.data);
    const e: CacheEntry = { plan, tile, negated, maxPos: maxOf(tile.data), maxNeg: maxOf(negated), levelsKey: '', queue: [], done: [] };
    setLevels(e, magnitudes, levelsKey);
    this.entries.delete(plan.key);
    this.entries.set(plan.key, e);
    while (this.entries.size > this.capacity) {
      const oldest = this.entries.keys().next().value;
      if (oldest === undefined) break;
      this.entries.delete(oldest);
    }
    return e;
  }

  get size(): number {
    return this.entries.size;
  }

  /** Most recent entries first (for drawing a stale tile while the new one is on its way). */
  recent(): CacheEntry[] {
    return [...this.entries.values()].reverse();
  }
}

/** New levels for an entry: its geometry is recomputed (the tile data is kept). */
export function setLevels(e: CacheEntry, magnitudes: readonly number[], levelsKey: string): void {
  if (e.levelsKey === levelsKey) return;
  e.levelsKey = levelsKey;
  e.done = [];
  e.queue = [];
  for (const m of magnitudes) {
    if (m <= e.maxPos) e.queue.push({ magnitude: m, sign: 1 });
    if (m <= e.maxNeg) e.queue.push({ magnitude: m, sign: -1 });
  }
}

/** Contours queued levels until the budget is spent (at least one level); true while work remains. */
export function step(e: CacheEntry, budgetMs: number, now: () => number): boolean {
  const t0 = now();
  do {
    const next = e.queue.shift();
    if (!next) return false;
    e.done.push(contourLevel(e.tile, next.sign > 0 ? e.tile.data : e.negated, next.magnitude, next.sign));
  } while (now() - t0 < budgetMs);
  return e.queue.length > 0;
}
