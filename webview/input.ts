/**
 * Pointer, wheel and keyboard input on the plot canvas. Drag pans; Shift+drag draws a zoom box
 * (1D: sets the multiplet region there instead, the wheel zooms); the wheel zooms around the cursor
 * (1D: along F2; Shift+wheel: intensity); a click snaps to the nearest peak (a cross peak is
 * measured, a 1D multiplet analysed). Keys go through keys.ts.
 */
import { keyAction } from './keys';
import type { Panel } from './panel';
import { ppmToHz, xScale, yScale } from './scales';
import { pan, zoomAt } from './viewModel';

/** Pointer travel below which a press counts as a click, CSS px. */
const CLICK_PX = 4;

export interface KeyHandlers {
  readonly label: () => void;
  readonly accept: () => void;
  readonly removePick: () => void;
}

export function bindInput(canvas: HTMLCanvasElement, readout: HTMLElement, current: () => Panel | null, keys: KeyHandlers): void {
  let down: { x: number; y: number; box: boolean; moved: boolean } | null = null;
  const local = (panel: Panel, e: MouseEvent): { x: number; y: number } => {
    const r = canvas.getBoundingClientRect();
    const L = panel.plotLayout;
    return { x: e.clientX - r.left - L.left, y: e.clientY - r.top - L.top };
  };

  const showReadout = (panel: Panel, x: number, y: number): void => {
    const L = panel.plotLayout.plot;
    if (x < 0 || y < 0 || x > L.width || y > L.height) return void (readout.textContent = '');
    const f2 = xScale(panel.view, L).invert(x);
    const parts = [`F2 ${f2.toFixed(4)} ppm  ${ppmToHz(panel.meta.f2, f2).toFixed(1)} Hz`];
    if (panel.meta.f1) {
      const f1 = yScale(panel.view, L).invert(y);
      parts.push(`F1 ${f1.toFixed(4)} ppm  ${ppmToHz(panel.meta.f1, f1).toFixed(1)} Hz`);
    } else {
      parts.push(`intensity ${yScale(panel.view, L).invert(y).toPrecision(4)}`);
    }
    readout.textContent = parts.join('   ');
  };

  canvas.addEventListener('pointerdown', (e) => {
    const panel = current();
    if (e.button !== 0 || !panel) return;
    canvas.focus();
    canvas.setPointerCapture(e.pointerId);
    const p = local(panel, e);
    down = { ...p, box: e.shiftKey, moved: false };
  });

  canvas.addEventListener('pointermove', (e) => {
    const panel = current();
    if (!panel) return;
    const p = local(panel, e);
    showReadout(panel, p.x, p.y);
    if (!down) return;
    if (Math.hypot(p.x - down.x, p.y - down.y) >= CLICK_PX) down.moved = true;
    if (!down.moved) return;
    if (down.box) {
      const L = panel.plotLayout;
      // 1D: the region spans the whole height (only its F2 ends count).
      const [y0, y1] = panel.meta.dims === 2 ? [down.y, p.y] : [0, L.plot.height];
      panel.box = { x0: down.x + L.left, y0: y0 + L.top, x1: p.x + L.left, y1: y1 + L.top };
      panel.redraw();
    } else {
      const v = pan(panel.view, panel.extent, panel.plotLayout.plot, p.x - down.x, panel.meta.dims === 2 ? p.y - down.y : 0);
      down.x = p.x;
      down.y = p.y;
      panel.setView(v);
    }
  });

  const finish = (e: PointerEvent): void => {
    const panel = current();
    if (!down || !panel) return;
    const p = local(panel, e);
    if (down.box && down.moved) {
      if (panel.meta.dims === 2) panel.boxZoom(down.x, down.y, p.x, p.y);
      else panel.setRegion(down.x, p.x);
    }
    else if (!down.moved) {
      const L = panel.plotLayout;
      const hit = panel.peakAt(p.x + L.left, p.y + L.top);
      if (hit !== null) {
        panel.select(hit);
        // Only cross peaks carry an antiphase J; a diagonal peak or a 1D multiplet is just selected.
        if (panel.peaks.find((k) => k.index === hit)?.kind === 'cross') panel.measure();
      }
    }
    down = null;
    panel.box = null;
    panel.redraw();
  };
  canvas.addEventListener('pointerup', finish);
  canvas.addEventListener('pointercancel', () => {
    down = null;
    const panel = current();
    if (panel) {
      panel.box = null;
      panel.redraw();
    }
  });
  canvas.addEventListener('pointerleave', () => void (readout.textContent = ''));

  canvas.addEventListener('wheel', (e) => {
    const panel = current();
    if (!panel) return;
    e.preventDefault();
    const p = local(panel, e);
    // deltaY of one wheel notch is about 100 px in Chromium: 1.2x zoom per notch.
    const factor = Math.exp(-e.deltaY * 0.0018);
    const axes = panel.meta.dims === 2 ? 'xy' : e.shiftKey ? 'y' : 'x';
    panel.setView(zoomAt(panel.view, panel.extent, panel.plotLayout.plot, p.x, p.y, factor, axes));
  }, { passive: false });

  canvas.addEventListener('keydown', (e) => {
    const panel = current();
    const a = keyAction(e);
    if (!a || !panel) return;
    e.preventDefault();
    if (a.kind === 'label' || a.kind === 'accept' || a.kind === 'removePick') keys[a.kind]();
    else panel.act(a);
  });
}

