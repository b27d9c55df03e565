/**
 * Canvas drawing of one frame: contours (2D) or the line (1D) with its multiplet regions and the
 * selected multiplet's fit, cross peaks, picks, the selection, the box-zoom rectangle and the axes. Geometry comes from the contour cache in tile coordinates;
 * one affine map per tile takes it to device pixels, so a pan is a redraw, not a re-contour.
 */
import type { CacheEntry } from './contourCache';
import { tileToGrid, type LevelRings } from './contours';
import { screenOf, type Frame, type Layout } from './frame';
import { pointToPixel, xScale, yScale } from './scales';
import { MARK_SHAPE, markColour } from './review';
import { levelAlpha, type Palette } from './theme';

const paths = new WeakMap<LevelRings, Path2D>();

function pathOf(l: LevelRings): Path2D {
  let p = paths.get(l);
  if (!p) {
    p = new Path2D();
    for (const r of l.rings) {
      p.moveTo(r[0] ?? 0, r[1] ?? 0);
      for (let i = 2; i < r.length; i += 2) p.lineTo(r[i] ?? 0, r[i + 1] ?? 0);
      p.closePath();
    }
    paths.set(l, p);
  }
  return p;
}

/** Tile coordinates -> device pixels for one cached tile. */
function tileMatrix(e: CacheEntry, f: Frame, L: Layout): DOMMatrix {
  const r = e.plan.region;
  const gx = tileToGrid(r.col0, r.col1 - r.col0 + 1, e.tile.cols);
  const px = pointToPixel(f.meta.f2, f.view.x, L.plot.width);
  let sy = 1, ey = 0;
  if (f.meta.f1) {
    const gy = tileToGrid(r.row0, r.row1 - r.row0 + 1, e.tile.rows);
    const py = pointToPixel(f.meta.f1, f.view.y, L.plot.height);
    sy = py.scale * gy.scale;
    ey = py.scale * gy.offset + py.offset + L.top;
  }
  const d = L.dpr;
  return new DOMMatrix([d * px.scale * gx.scale, 0, 0, d * sy, d * (px.scale * gx.offset + px.offset + L.left), d * ey]);
}

function drawContours(ctx: CanvasRenderingContext2D, f: Frame, L: Layout, p: Palette): void {
  // Oldest first, so the newest tile is drawn on top of any stale one it replaces.
  for (const e of [...f.tiles].reverse()) {
    const m = tileMatrix(e, f, L);
    const byMagnitude = [...new Set(e.done.map((l) => Math.abs(l.level)))].sort((a, b) => a - b);
    for (const l of e.done) {
      const path = new Path2D();
      path.addPath(pathOf(l), m);
      const k = byMagnitude.indexOf(Math.abs(l.level));
      ctx.globalAlpha = levelAlpha(k, Math.max(f.levelCount, byMagnitude.length), p);
      ctx.strokeStyle = l.level > 0 ? p.positive : p.negative;
      ctx.lineWidth = (p.highContrast ? 1.5 : 1) * L.dpr;
      ctx.setLineDash(l.level < 0 && p.highContrast ? [4 * L.dpr, 3 * L.dpr] : []);
      ctx.stroke(path);
    }
  }
  ctx.globalAlpha = 1;
  ctx.setLineDash([]);
}

function drawLine1D(ctx: CanvasRenderingContext2D, f: Frame, L: Layout, p: Palette): void {
  const ys = yScale(f.view, L.plot);
  for (const e of [...f.tiles].reverse()) {
    const m = tileMatrix(e, f, L);
    ctx.beginPath();
    for (let j = 0; j < e.tile.cols; j++) {
      const x = m.a * (j + 0.5) + m.e;
      const y = L.dpr * (ys(e.tile.data[j] ?? 0) + L.top);
      if (j === 0) ctx.moveTo(x, y);
      else ctx.lineTo(x, y);
    }
    ctx.strokeStyle = p.positive;
    ctx.lineWidth = (p.highContrast ? 1.5 : 1) * L.dpr;
    ctx.stroke();
  }
}

/** A band across the plot between two shifts: filled faintly, outlined (dashed) in high contrast where fills fade. */
function band(ctx: CanvasRenderingContext2D, f: Frame, L: Layout, p: Palette, a: number, b: number, colour: string, alpha: number): void {
  const d = L.dpr;
  const xs = xScale(f.view, L.plot);
  const [x0, x1] = [xs(a) + L.left, xs(b) + L.left].sort((u, v) => u - v) as [number, number];
  ctx.fillStyle = colour;
  ctx.globalAlpha = p.highContrast ? 0 : alpha;
  ctx.fillRect(d * x0, d * L.top, d * (x1 - x0), d * L.plot.height);
  ctx.globalAlpha = 1;
  if (p.highContrast) {
    ctx.strokeStyle = colour;
    ctx.lineWidth = d;
    ctx.setLineDash([4 * d, 3 * d]);
    ctx.strokeRect(d * x0, d * L.top, d * (x1 - x0), d * L.plot.height);
    ctx.setLineDash([]);
  }
}

/** 1D, under the trace: the regions set on picks, and the analysed region of the selected multiplet. */
function drawRegions(ctx: CanvasRenderingContext2D, f: Frame, L: Layout, p: Palette): void {
  for (const k of f.picks) if (k.fromPpm !== undefined && k.toPpm !== undefined) band(ctx, f, L, p, k.fromPpm, k.toPpm, p.pick, 0.08);
  const m = f.multiplet;
  if (m) band(ctx, f, L, p, m.fromPpm, m.toPpm, p.focus, 0.14);
}

/** 1D, over the trace: the fitted lineshape (dashed) and a tick at each fitted line. */
function drawFit(ctx: CanvasRenderingContext2D, f: Frame, L: Layout, p: Palette): void {
  const m = f.multiplet;
  if (!m) return;
  const d = L.dpr;
  const xs = xScale(f.view, L.plot);
  const ys = yScale(f.view, L.plot);
  ctx.strokeStyle = p.fit;
  ctx.lineWidth = (p.highContrast ? 2 : 1.5) * d;
  if (m.fitted) {
    const { fromPpm, toPpm, data } = m.fitted;
    const n = data.length;
    ctx.setLineDash([5 * d, 3 * d]);
    ctx.beginPath();
    for (let k = 0; k < n; k++) {
      const ppm = n > 1 ? fromPpm + ((toPpm - fromPpm) * k) / (n - 1) : fromPpm;
      const x = d * (xs(ppm) + L.left);
      const y = d * (ys(data[k] ?? 0) + L.top);
      if (k === 0) ctx.moveTo(x, y);
      else ctx.lineTo(x, y);
    }
    ctx.stroke();
    ctx.setLineDash([]);
  }
  ctx.beginPath();
  for (const ppm of m.linesPpm) {
    const x = d * (xs(ppm) + L.left);
    ctx.moveTo(x, d * (L.top + 22)); ctx.lineTo(x, d * (L.top + 32));
  }
  ctx.stroke();
}

function drawMarkers(ctx: CanvasRenderingContext2D, f: Frame, L: Layout, p: Palette): void {
  const d = L.dpr;
  ctx.lineWidth = d;
  // Cross peaks the core found: a small, faint plus.
  ctx.strokeStyle = p.muted;
  ctx.globalAlpha = p.highContrast ? 1 : 0.6;
  for (const k of f.peaks) {
    const s = screenOf(f, L, k.f2Ppm, k.f1Ppm);
    ctx.beginPath();
    ctx.moveTo(d * (s.x - 3), d * s.y); ctx.lineTo(d * (s.x + 3), d * s.y);
    ctx.moveTo(d * s.x, d * (s.y - 3)); ctx.lineTo(d * s.x, d * (s.y + 3));
    ctx.stroke();
  }
  ctx.globalAlpha = 1;
  // Picks: an open diamond with its labels beside it.
  ctx.strokeStyle = p.pick;
  ctx.fillStyle = p.pick;
  ctx.font = p.font.replace(/(\d+(\.\d+)?)px/, (_m, n: string) => `${Number(n) * d}px`);
  ctx.lineWidth = 1.5 * d;
  ctx.textAlign = 'left';
  ctx.textBaseline = 'middle';
  for (const k of f.picks) {
    const s = screenOf(f, L, k.f2Ppm, k.f1Ppm);
    ctx.beginPath();
    ctx.moveTo(d * s.x, d * (s.y - 6)); ctx.lineTo(d * (s.x + 6), d * s.y);
    ctx.lineTo(d * s.x, d * (s.y + 6)); ctx.lineTo(d * (s.x - 6), d * s.y);
    ctx.closePath();
    ctx.stroke();
    const text = [k.label.join(' / '), k.protons === undefined ? '' : `ref ${k.protons} H`].filter((t) => t !== '').join('  ');
    if (text !== '') ctx.fillText(text, d * (s.x + 9), d * (s.y - 8));
  }
  const sel = f.peaks.find((k) => k.index === f.selected);
  if (sel) {
    const s = screenOf(f, L, sel.f2Ppm, sel.f1Ppm);
    ctx.strokeStyle = p.focus;
    ctx.lineWidth = 2 * d;
    ctx.beginPath();
    ctx.arc(d * s.x, d * s.y, 10 * d, 0, 2 * Math.PI);
    ctx.stroke();
  }
}

/** The review overlay: one shape per kind of change, an arrow from a moved pick's old place. */
function drawMarks(ctx: CanvasRenderingContext2D, f: Frame, L: Layout, p: Palette): void {
  const d = L.dpr;
  const r = 8;
  (f.marks ?? []).forEach((m, i) => {
    if (m.f2Ppm === undefined) return;
    const s = screenOf(f, L, m.f2Ppm, m.f1Ppm);
    const [x, y] = [d * s.x, d * s.y];
    ctx.strokeStyle = markColour(m.kind, p);
    ctx.fillStyle = ctx.strokeStyle;
    ctx.lineWidth = (i === f.markFocus ? 3 : 1.75) * d;
    ctx.setLineDash([]);
    if (m.fromF2Ppm !== undefined) {
      const o = screenOf(f, L, m.fromF2Ppm, m.fromF1Ppm);
      const [ox, oy] = [d * o.x, d * o.y];
      ctx.setLineDash([3 * d, 2 * d]);
      ctx.strokeRect(ox - d * 5, oy - d * 5, d * 10, d * 10);
      ctx.setLineDash([]);
      ctx.beginPath(); ctx.moveTo(ox, oy); ctx.lineTo(x, y); ctx.stroke();
      const a = Math.atan2(y - oy, x - ox);
      ctx.beginPath();
      ctx.moveTo(x, y);
      ctx.lineTo(x - d * 8 * Math.cos(a - 0.4), y - d * 8 * Math.sin(a - 0.4));
      ctx.lineTo(x - d * 8 * Math.cos(a + 0.4), y - d * 8 * Math.sin(a + 0.4));
      ctx.closePath(); ctx.fill();
    }
    ctx.beginPath();
    switch (MARK_SHAPE[m.kind]) {
      case 'circle': ctx.arc(x, y, d * r, 0, 2 * Math.PI); break;
      case 'crossedCircle':
        ctx.setLineDash([3 * d, 2 * d]);
        ctx.arc(x, y, d * r, 0, 2 * Math.PI); ctx.stroke();
        ctx.setLineDash([]); ctx.beginPath();
        ctx.moveTo(x - d * 5, y - d * 5); ctx.lineTo(x + d * 5, y + d * 5);
        ctx.moveTo(x - d * 5, y + d * 5); ctx.lineTo(x + d * 5, y - d * 5);
        break;
      case 'square': ctx.rect(x - d * r, y - d * r, 2 * d * r, 2 * d * r); break;
      case 'diamond': ctx.moveTo(x, y - d * (r + 2)); ctx.lineTo(x + d * (r + 2), y); ctx.lineTo(x, y + d * (r + 2)); ctx.lineTo(x - d * (r + 2), y); ctx.closePath(); break;
      case 'triangle': ctx.moveTo(x, y - d * (r + 2)); ctx.lineTo(x + d * (r + 2), y + d * r); ctx.lineTo(x - d * (r + 2), y + d * r); ctx.closePath(); break;
      case 'dot': ctx.arc(x, y, d * 3, 0, 2 * Math.PI); break;
    }
    ctx.stroke();
  });
  ctx.lineWidth = d;
}

function drawAxes(ctx: CanvasRenderingContext2D, f: Frame, L: Layout, p: Palette): void {
  const d = L.dpr;
  const xs = xScale(f.view, L.plot);
  const ys = yScale(f.view, L.plot);
  ctx.strokeStyle = p.grid;
  ctx.fillStyle = p.foreground;
  ctx.lineWidth = d;
  ctx.strokeRect(d * L.left, d * L.top, d * L.plot.width, d * L.plot.height);
  ctx.font = p.font.replace(/(\d+(\.\d+)?)px/, (_m, n: string) => `${Number(n) * d}px`);
  ctx.textAlign = 'center';
  ctx.textBaseline = 'top';
  const bottom = L.top + L.plot.height;
  const fx = xs.tickFormat(Math.max(2, Math.floor(L.plot.width / 90)));
  for (const t of xs.ticks(Math.max(2, Math.floor(L.plot.width / 90)))) {
    const x = xs(t) + L.left;
    ctx.beginPath(); ctx.moveTo(d * x, d * bottom); ctx.lineTo(d * x, d * (bottom + 5)); ctx.stroke();
    ctx.fillText(fx(t), d * x, d * (bottom + 7));
  }
  ctx.fillText('F2 (ppm)', d * (L.left + L.plot.width / 2), d * (bottom + 22));
  ctx.textAlign = 'right';
  ctx.textBaseline = 'middle';
  const ny = Math.max(2, Math.floor(L.plot.height / 60));
  const fy = f.meta.dims === 2 ? ys.tickFormat(ny) : ys.tickFormat(ny, '.2~s');
  for (const t of ys.ticks(ny)) {
    const y = ys(t) + L.top;
    ctx.beginPath(); ctx.moveTo(d * (L.left - 5), d * y); ctx.lineTo(d * L.left, d * y); ctx.stroke();
    ctx.fillText(fy(t), d * (L.left - 7), d * y);
  }
  ctx.save();
  ctx.translate(d * 12, d * (L.top + L.plot.height / 2));
  ctx.rotate(-Math.PI / 2);
  ctx.textAlign = 'center';
  ctx.fillText(f.meta.dims === 2 ? 'F1 (ppm)' : 'intensity', 0, 0);
  ctx.restore();
}

export function drawFrame(ctx: CanvasRenderingContext2D, f: Frame, L: Layout, p: Palette): void {
  const d = L.dpr;
  ctx.setTransform(1, 0, 0, 1, 0, 0);
  ctx.clearRect(0, 0, d * L.css.width, d * L.css.height);
  ctx.save();
  ctx.beginPath();
  ctx.rect(d * L.left, d * L.top, d * L.plot.width, d * L.plot.height);
  ctx.clip();
  if (f.meta.dims === 2) drawContours(ctx, f, L, p);
  else {
    drawRegions(ctx, f, L, p);
    drawLine1D(ctx, f, L, p);
    drawFit(ctx, f, L, p);
  }
  drawMarkers(ctx, f, L, p);
  drawMarks(ctx, f, L, p);
  if (f.box) {
    ctx.strokeStyle = p.focus;
    ctx.setLineDash([3 * d, 3 * d]);
    ctx.strokeRect(d * Math.min(f.box.x0, f.box.x1), d * Math.min(f.box.y0, f.box.y1), d * Math.abs(f.box.x1 - f.box.x0), d * Math.abs(f.box.y1 - f.box.y0));
    ctx.setLineDash([]);
  }
  ctx.restore();
  drawAxes(ctx, f, L, p);
}
