/**
 * The panel's state and actions: view, selection, tiles, contours, measurement. Input handlers
 * (input.ts) and host messages (main.ts) call its methods; drawing happens once per animation
 * frame, and contouring is spread over frames (a few ms each) so input stays responsive.
 */
import type { CompareMessage, ContourSettings, InitMessage, PeakView, PickView, SidecarView, ViewSettings } from '../src/protocol';
import { CancelledReply, type Rpc } from './rpc';
import { step, type CacheEntry } from './contourCache';
import type { Action } from './keys';
import { contourLevels, levelsKey, levelUnit, usableContours } from './levels';
import { MeasureState } from './measureState';
import { MultipletState, multipletLines, regionRequest, regionStatus } from './multipletState';
import type { SavedState } from './savedState';
import { peakAt, pickOn } from './hitTest';
import { layoutFor, type Frame, type Layout } from './frame';
import { drawFrame } from './plot';
import { xScale, type View } from './scales';
import { changeStatus, NO_REVIEW, reviewUpdate, stepChange, type ReviewState } from './review';
import { readPalette, type Palette } from './theme';
import { planTile, type PointWindow, type TilePlan } from './tiles';
import { TileSource } from './tileSource';
import { drawTraces } from './traceView';
import { extentOf, intensityDomain, pointWindowOf } from './viewWindow';
import { boxZoom, centredOn, clampView, pan, step as stepOrder, zoomAt, type Extent } from './viewModel';

export interface Elements {
  readonly canvas: HTMLCanvasElement;
  readonly readout: HTMLElement;
  readonly status: HTMLElement;
  readonly trace: HTMLElement;
  readonly traceCanvas: HTMLCanvasElement;
  readonly traceText: HTMLElement;
}

/** Budget per animation frame for contouring, ms: leaves most of a 16 ms frame for input. */
const FRAME_BUDGET_MS = 6;

export class Panel {
  readonly meta: InitMessage['spectrum'];
  settings: ViewSettings;
  contours: ContourSettings;
  method: 'fit' | 'naive';
  dimension: 'F2' | 'F1';
  peaks: readonly PeakView[];
  sidecar: SidecarView;
  view: View;
  selected: number | null;
  /** The measurement shown and what Accept sends (replies to older requests are dropped). */
  readonly measured = new MeasureState();
  /** 1D: the selected multiplet's analysis (replies to older requests are dropped). */
  readonly multiplet = new MultipletState();
  /** The label field's text (main.ts keeps it current), kept with the view state. */
  labelDraft: string;
  box: Frame['box'] = null;
  /** Changes since another revision (the compare overlay); main.ts lists them beside the plot. */
  review: ReviewState = NO_REVIEW;
  onReview: ((r: ReviewState) => void) | null = null;
  /** 1D: fit the intensity axis to the visible data when the next tile arrives (after F2 zooms). */
  autoY = true;
  readonly extent: Extent;
  private readonly tiles: TileSource;
  private layout: Layout = layoutFor({ width: 300, height: 200 }, 1);
  private palette: Palette;
  private frameQueued = false;
  /** Set when a new `init` replaced this panel: it must not draw any more. */
  private disposed = false;

  constructor(init: InitMessage, private readonly el: Elements, private readonly rpc: Rpc, private readonly save: (s: SavedState) => void, saved: SavedState) {
    this.meta = init.spectrum;
    this.settings = init.settings;
    this.peaks = init.peaks;
    this.sidecar = init.sidecar;
    this.contours = usableContours(saved.contours, init.settings.contours);
    this.method = saved.method ?? init.settings.defaultMethod;
    this.dimension = saved.dimension ?? 'F2';
    this.extent = extentOf(this.meta);
    this.view = clampView(saved.view ?? { x: this.extent.x, y: this.extent.y }, this.extent);
    this.selected = saved.selected ?? null;
    this.labelDraft = saved.labelDraft ?? '';
    this.palette = readPalette();
    this.tiles = new TileSource(rpc, this.meta.dims === 2, {
      // 1D: the intensity axis follows the data after an F2 zoom.
      arrived: (e) => {
        if (this.meta.dims === 1 && this.autoY) this.fitIntensity(e);
      },
      failed: (message) => this.status(message),
      settled: () => this.redraw(),
    });
    this.setContours(this.contours);
    if (saved.shownPeak !== undefined && saved.shownPeak === this.selected) this.measure();
  }

  dispose(): void {
    this.disposed = true;
  }

  persist(): void {
    const shownPeak = this.measured.shown?.peakIndex;
    this.save({
      view: this.view, selected: this.selected, contours: this.contours, method: this.method, dimension: this.dimension,
      ...(shownPeak !== undefined && { shownPeak }), ...(this.labelDraft !== '' && { labelDraft: this.labelDraft }),
    });
  }

  setContours(c: ContourSettings): void {
    this.contours = c;
    const levels = contourLevels(levelUnit(this.meta), c);
    this.tiles.setLevels(levels.magnitudes, levelsKey(levels));
    this.persist();
    this.redraw();
  }

  setSidecar(s: SidecarView): void {
    const wasBlocked = this.sidecar.blocked;
    this.sidecar = s;
    if (s.blocked) this.status(`Sidecar not editable: ${s.blocked}`);
    else if (wasBlocked) this.status('Sidecar readable again.');
    // A region, reference or label may have changed: the host answers from its cache when nothing did.
    this.analyse();
    this.redraw();
  }

  resize(css: { width: number; height: number }): void {
    const dpr = window.devicePixelRatio || 1;
    this.el.canvas.width = Math.round(css.width * dpr);
    this.el.canvas.height = Math.round(css.height * dpr);
    this.layout = layoutFor(css, dpr);
    this.palette = readPalette(); // a theme change also resizes nothing, but costs nothing to re-read here
    this.redraw();
  }

  themeChanged(): void {
    this.palette = readPalette();
    this.redraw();
  }

  status(text: string): void {
    this.el.status.textContent = text;
  }

  get plotLayout(): Layout {
    return this.layout;
  }

  /** 1D: intensity axis fitted to the visible part of a tile. */
  private fitIntensity(e: CacheEntry): void {
    const y = intensityDomain(e.tile, e.plan.region, this.pointWindow());
    if (!y) return;
    this.view = clampView({ x: this.view.x, y }, this.extent);
    this.autoY = false;
    this.persist();
  }

  setView(v: View, autoY = this.meta.dims === 1 && (v.x[0] !== this.view.x[0] || v.x[1] !== this.view.x[1])): void {
    this.autoY = autoY;
    this.view = clampView(v, this.extent);
    this.persist();
    this.redraw();
  }

  redraw(): void {
    if (this.frameQueued || this.disposed) return;
    this.frameQueued = true;
    requestAnimationFrame(() => {
      this.frameQueued = false;
      this.frame();
    });
  }

  private pointWindow(): PointWindow {
    return pointWindowOf(this.meta, this.view);
  }

  private plan(): TilePlan {
    const m = this.meta;
    return planTile(this.pointWindow(), { rows: m.f1?.points ?? 1, cols: m.f2.points }, this.layout.plot);
  }

  private frame(): void {
    const plan = this.plan();
    const win = this.pointWindow();
    this.tiles.ensure(plan);
    const tiles = this.tiles.tilesFor(plan, win);
    const current = tiles[0]?.plan.key === plan.key ? tiles[0] : undefined;
    if (current && this.meta.dims === 1 && this.autoY) this.fitIntensity(current);
    const more = current ? step(current, FRAME_BUDGET_MS, () => performance.now()) : false;
    const ctx = this.el.canvas.getContext('2d');
    if (ctx) drawFrame(ctx, this.frameData(tiles), this.layout, this.palette);
    if (more) this.redraw();
  }

  private frameData(tiles: readonly CacheEntry[]): Frame {
    const multiplet = this.multiplet.shown?.peakIndex === this.selected ? this.multiplet.shown : null;
    return { meta: this.meta, view: this.view, tiles, levelCount: this.contours.levels, peaks: this.peaks, picks: this.sidecar.picks, selected: this.selected, box: this.box, marks: this.review.marks, markFocus: this.review.current, multiplet };
  }

  /** Peak nearest a canvas point (CSS px), in screen distance. */
  peakAt(x: number, y: number): number | null {
    return peakAt(this.frameData([]), this.layout, x, y);
  }

  /** The sidecar pick drawn on a peak, if any. */
  pickFor(peakIndex: number | null): PickView | undefined {
    return pickOn(this.frameData([]), this.layout, peakIndex);
  }

  select(index: number | null): void {
    this.selected = index;
    this.persist();
    this.analyse();
    this.redraw();
  }

  /** 1D: asks the host for the selected multiplet's analysis (which also tells it what the palette commands act on). */
  analyse(): void {
    const idx = this.selected;
    if (idx === null || this.meta.dims !== 1 || this.disposed) return;
    if (this.multiplet.shown?.peakIndex !== idx) this.status('Analysing the multiplet…');
    this.multiplet.request(this.rpc, idx, (error) => {
      this.status(error ?? '');
      if (error === null) this.showMultiplet();
      else this.el.trace.hidden = true;
      this.redraw();
    });
  }

  private showMultiplet(): void {
    const v = this.multiplet.shown;
    if (!v || this.disposed) return;
    this.el.trace.hidden = false;
    this.el.traceCanvas.hidden = true;
    this.el.traceText.textContent = multipletLines(v, this.settings.jDecimals).join('\n');
  }

  /** Shift+drag along a 1D trace (plot x in CSS px): the region of the multiplet there (none is set where no multiplet is). */
  setRegion(x0: number, x1: number): void {
    if (this.sidecar.blocked) return this.status(`Sidecar not editable: ${this.sidecar.blocked}`);
    const xs = xScale(this.view, this.layout.plot);
    const r = regionRequest(xs.invert(x0), xs.invert(x1), this.peaks, this.selected);
    // The host refuses a region on no multiplet: say why here instead of sending it.
    if (r.peakIndex !== null) {
      this.rpc.post(r);
      if (r.peakIndex !== this.selected) this.select(r.peakIndex);
    }
    this.status(regionStatus(r));
  }

  measure(): void {
    const idx = this.selected;
    if (idx === null) return this.status('Select a peak first (click near it, or N / P).');
    this.status('Measuring…');
    const token = this.measured.started();
    const req = this.rpc.requests.send(this.rpc.post, (id) => ({ type: 'measure', id, peakIndex: idx, method: this.method, dimension: this.dimension }));
    req.promise.then(
      (m) => {
        if (m.type !== 'measured') return this.status(`Unexpected reply "${m.type}" to a measurement.`);
        if (!this.measured.measured(token, m.measurement)) return;
        this.status('');
        this.showTrace();
        this.persist();
      },
      (e: unknown) => {
        if (e instanceof CancelledReply) {
          if (this.measured.cancelled(token)) this.status('Measurement cancelled.');
        } else if (this.measured.failed(token, idx)) {
          this.status(`Measurement failed: ${e instanceof Error ? e.message : String(e)} (Accept records the pick without J)`);
        }
      },
    );
  }

  /** New `couplet.*` settings while open: levels and J decimals follow; the method only if still the old default. */
  applySettings(s: ViewSettings): void {
    if (this.method === this.settings.defaultMethod) this.method = s.defaultMethod;
    this.settings = s;
    this.setContours(usableContours(s.contours, this.contours));
    if (this.meta.dims === 1) this.showMultiplet();
    else this.showTrace();
  }

  showTrace(): void {
    const m = this.measured.shown;
    if (!m || this.disposed) return;
    this.el.trace.hidden = false;
    this.el.traceCanvas.hidden = false;
    drawTraces(this.el.traceCanvas, this.el.traceText, m, this.settings.jDecimals, this.palette);
  }

  accept(labels: readonly string[]): void {
    if (this.sidecar.blocked) return this.status(`Sidecar not editable: ${this.sidecar.blocked}`);
    const c = this.measured.accept(this.selected, labels, this.meta.dims, this.method, this.dimension, this.settings.jDecimals);
    if (c.request) this.rpc.post(c.request);
    this.status(c.status);
  }

  setReview(m: CompareMessage): void {
    const u = reviewUpdate(this.review, m);
    this.review = u.state;
    if (u.newComparison) this.status(changeStatus(this.review));
    this.onReview?.(this.review);
    this.redraw();
  }

  /** Centres the view on a place with the given spans; 1D keeps its intensity axis. */
  private centreOn(f2Ppm: number, f1Ppm: number | undefined, sx: number, sy: number): void {
    const c = centredOn(this.extent, f2Ppm, f1Ppm ?? (this.view.y[0] + this.view.y[1]) / 2, sx, sy);
    this.setView(this.meta.f1 ? c : { x: c.x, y: this.view.y });
  }

  /** Focus a change (keyboard or list): centre the view on it, keeping the zoom. */
  focusChange(index: number | null): void {
    this.review = { ...this.review, current: index };
    const m = index === null ? undefined : this.review.marks[index];
    if (m?.f2Ppm !== undefined) this.centreOn(m.f2Ppm, m.f1Ppm, Math.abs(this.view.x[0] - this.view.x[1]), Math.abs(this.view.y[0] - this.view.y[1]));
    this.status(changeStatus(this.review));
    this.onReview?.(this.review);
    this.redraw();
  }

  /** Keyboard and host-command actions that need no text input (label is handled by main). */
  act(a: Action): void {
    const L = this.layout.plot;
    switch (a.kind) {
      case 'pan': return this.setView(pan(this.view, this.extent, L, a.dx * L.width, a.dy * L.height));
      case 'zoom': return this.setView(zoomAt(this.view, this.extent, L, L.width / 2, L.height / 2, a.factor, this.meta.dims === 2 ? 'xy' : 'x'));
      case 'resetZoom': return this.setView({ x: this.extent.x, y: this.extent.y });
      case 'nextPeak': case 'previousPeak': {
        const order = [...this.peaks].sort((p, q) => q.f2Ppm - p.f2Ppm || (q.f1Ppm ?? 0) - (p.f1Ppm ?? 0)).map((p) => p.index);
        return this.select(stepOrder(order, this.selected, a.kind === 'nextPeak' ? 1 : -1));
      }
      case 'zoomToPeak': {
        const k = this.peaks.find((p) => p.index === this.selected);
        if (!k) return this.status('Select a peak first.');
        const sx = Math.max(Math.abs(k.extent.f2FromPpm - k.extent.f2ToPpm) * 3, this.extent.minSpanX * 4);
        const sy = this.meta.f1 ? Math.max(Math.abs((k.extent.f1FromPpm ?? 0) - (k.extent.f1ToPpm ?? 0)) * 3, this.extent.minSpanY * 4) : Math.abs(this.view.y[0] - this.view.y[1]);
        return this.centreOn(k.f2Ppm, k.f1Ppm, sx, sy);
      }
      case 'measure': return this.measure();
      case 'nextChange': case 'previousChange': return this.focusChange(stepChange(this.review, a.kind === 'nextChange' ? 1 : -1));
      case 'cancel': this.rpc.post({ type: 'cancel' }); this.box = null; return this.redraw();
      default: return undefined;
    }
  }

  boxZoom(x0: number, y0: number, x1: number, y1: number): void {
    const v = boxZoom(this.view, this.extent, this.layout.plot, x0, y0, x1, y1);
    this.setView(this.meta.dims === 2 ? v : { x: v.x, y: this.view.y });
  }
}
