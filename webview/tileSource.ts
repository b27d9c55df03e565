/**
 * The tiles of the plot: which to ask the host for (one request at a time; the reply's frame asks
 * again for the latest view), and which cached ones to draw while the tile for the view is on its
 * way or still being contoured. Split from panel.ts, which keeps the view and the actions.
 */
import { ContourCache, setLevels, type CacheEntry } from './contourCache';
import type { Rpc } from './rpc';
import { covers, type PointWindow, type TilePlan } from './tiles';

export interface TileEvents {
  /** A tile arrived and is cached (its contours are computed later, a few levels per frame). */
  readonly arrived: (e: CacheEntry) => void;
  readonly failed: (message: string) => void;
  /** The request is over, arrived or not: time for a frame. */
  readonly settled: () => void;
}

export class TileSource {
  private readonly cache = new ContourCache();
  private inflight: string | null = null;
  private magnitudes: readonly number[] = [];
  private key = '';

  /** `contoured` is false for a 1D spectrum: its tile is drawn as a line, without levels. */
  constructor(private readonly rpc: Rpc, private readonly contoured: boolean, private readonly events: TileEvents) {}

  /** New contour levels: cached tiles are contoured again when next drawn. */
  setLevels(magnitudes: readonly number[], levelsKey: string): void {
    this.magnitudes = this.contoured ? magnitudes : [];
    this.key = levelsKey;
  }

  /** Asks for the plan's tile unless it is cached or on its way. */
  ensure(plan: TilePlan): void {
    if (this.cache.get(plan.key) || this.inflight !== null) return;
    this.inflight = plan.key;
    const req = this.rpc.requests.send(this.rpc.post, (id) => ({ type: 'requestTile', id, region: plan.region, maxRows: plan.maxRows, maxCols: plan.maxCols }));
    req.promise.then(
      (t) => {
        if (t.type !== 'tile') return this.events.failed(`Unexpected reply "${t.type}" to a tile request.`);
        this.events.arrived(this.cache.put(plan, { rows: t.rows, cols: t.cols, data: t.data }, this.magnitudes, this.key));
      },
      (e: unknown) => this.events.failed(`Could not load the spectrum region: ${e instanceof Error ? e.message : String(e)}`),
    ).finally(() => {
      this.inflight = null;
      this.events.settled();
    });
  }

  /** The tiles to draw: the one for this view, plus the newest finished one while it is incomplete. */
  tilesFor(plan: TilePlan, win: PointWindow): CacheEntry[] {
    const current = this.cache.get(plan.key);
    if (current && this.contoured) setLevels(current, this.magnitudes, this.key);
    const out: CacheEntry[] = current ? [current] : [];
    if (!current || current.queue.length > 0) {
      const stale = this.cache.recent().find((e) => e !== current && e.levelsKey === this.key && e.queue.length === 0 && (covers(e.plan.region, win) || !current));
      if (stale) out.push(stale);
    }
    return out;
  }
}
