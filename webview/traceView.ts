/**
 * Bottom strip after `measured`: each F2 (or F1) trace the measurement used, with the fitted
 * model over it and the residual below, side by side; the numbers as plain text beside it.
 */
import type { MeasurementView } from '../src/protocol';
import type { Palette } from './theme';
import { measurementLines } from './traceText';

function line(ctx: CanvasRenderingContext2D, ys: Float32Array, x0: number, w: number, y0: number, h: number, lo: number, hi: number): void {
  const n = ys.length;
  ctx.beginPath();
  for (let i = 0; i < n; i++) {
    const x = x0 + (n > 1 ? (i / (n - 1)) * w : w / 2);
    const y = y0 + h - (((ys[i] ?? 0) - lo) / (hi - lo || 1)) * h;
    if (i === 0) ctx.moveTo(x, y);
    else ctx.lineTo(x, y);
  }
  ctx.stroke();
}

export function drawTraces(canvas: HTMLCanvasElement, text: HTMLElement, m: MeasurementView, jDecimals: number, p: Palette): void {
  const dpr = window.devicePixelRatio || 1;
  const w = canvas.clientWidth;
  const h = canvas.clientHeight;
  canvas.width = Math.round(w * dpr);
  canvas.height = Math.round(h * dpr);
  const ctx = canvas.getContext('2d');
  text.textContent = measurementLines(m, jDecimals).join('\n');
  if (!ctx) return;
  ctx.setTransform(dpr, 0, 0, dpr, 0, 0);
  ctx.clearRect(0, 0, w, h);
  const n = Math.max(1, m.traces.length);
  const gap = 10;
  const cw = (w - gap * (n + 1)) / n;
  ctx.font = p.font;
  m.traces.forEach((t, i) => {
    let lo = Infinity, hi = -Infinity;
    for (const a of [t.data, t.fitted]) for (const v of a) { lo = Math.min(lo, v); hi = Math.max(hi, v); }
    const x0 = gap + i * (cw + gap);
    const top = h * 0.68;
    ctx.lineWidth = 1;
    ctx.strokeStyle = p.foreground;
    line(ctx, t.data, x0, cw, 16, top - 16, lo, hi);
    ctx.strokeStyle = p.fit;
    ctx.lineWidth = p.highContrast ? 2 : 1.5;
    ctx.setLineDash([5, 3]);
    line(ctx, t.fitted, x0, cw, 16, top - 16, lo, hi);
    ctx.setLineDash([]);
    // Residual at the same intensity per pixel as the trace above it, so its size reads against the peak.
    const traceH = top - 16;
    const resH = h - top - 4;
    const half = ((hi - lo) * resH) / traceH / 2;
    ctx.strokeStyle = p.residual;
    ctx.lineWidth = 1;
    line(ctx, t.residual, x0, cw, top, resH, -half, half);
    ctx.fillStyle = p.muted;
    ctx.textBaseline = 'top';
    ctx.textAlign = 'left';
    ctx.fillText(`F1 ${t.f1Ppm.toFixed(3)} ppm: ${t.fromPpm.toFixed(3)}–${t.toPpm.toFixed(3)}`, x0, 2);
  });
}
