/* global document, getComputedStyle -- used only inside page.evaluate callbacks, which run in the webview */
// Reaching into the Couplet webview from Playwright: VS Code puts each webview in an `iframe.webview`
// whose inner iframe gets the element id `active-frame` once loaded (docs/e2e recipe). Frame names
// keep their creation-time value, so the frame is found by its element's live id attribute.
import { setTimeout as sleep } from 'node:timers/promises';

/** @param {import('playwright-core').Page} page @returns {Promise<import('playwright-core').Frame>} */
export async function coupletFrame(page, timeoutMs = 30_000) {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    for (const f of page.frames()) {
      const el = await f.frameElement().catch(() => null);
      if (!el) continue;
      const id = await el.getAttribute('id').catch(() => null);
      if (id !== 'active-frame') continue;
      const hasPlot = await f.locator('canvas#plot').count().catch(() => 0);
      if (hasPlot > 0 && (await f.locator('canvas#plot').isVisible().catch(() => false))) return f;
    }
    await sleep(250);
  }
  throw new Error('no visible Couplet webview (iframe.webview > #active-frame with canvas#plot)');
}

/** Theme colours the panel draws contours with (webview/theme.ts: charts-blue positive, charts-orange negative). */
export async function paletteRgb(frame) {
  return frame.evaluate(() => {
    const probe = (name) => {
      const d = document.createElement('div');
      d.style.color = getComputedStyle(document.body).getPropertyValue(name).trim();
      document.body.appendChild(d);
      const rgb = getComputedStyle(d).color;
      d.remove();
      const m = /rgba?\((\d+),\s*(\d+),\s*(\d+)/.exec(rgb);
      return m ? [Number(m[1]), Number(m[2]), Number(m[3])] : null;
    };
    return { positive: probe('--vscode-charts-blue'), negative: probe('--vscode-charts-orange'), background: probe('--vscode-editor-background') };
  });
}

/**
 * Counts pixels of the plot canvas within `radius` CSS px of (x, y) that match each colour. Contours are
 * drawn with some transparency over the background, so a pixel matches a colour when it lies on the
 * segment between the background and that colour (alpha 0.3..1) within a small tolerance.
 */
export async function colourCounts(frame, x, y, radius, colours) {
  return frame.evaluate(({ x, y, radius, colours }) => {
    const canvas = document.getElementById('plot');
    const r = canvas.getBoundingClientRect();
    const sx = canvas.width / r.width;
    const sy = canvas.height / r.height;
    const x0 = Math.max(0, Math.round((x - radius) * sx));
    const y0 = Math.max(0, Math.round((y - radius) * sy));
    const w = Math.min(canvas.width - x0, Math.round(2 * radius * sx));
    const h = Math.min(canvas.height - y0, Math.round(2 * radius * sy));
    const data = canvas.getContext('2d').getImageData(x0, y0, w, h).data;
    const bg = colours.background;
    const counts = {};
    for (const [name, c] of Object.entries(colours)) {
      if (name === 'background') continue;
      let n = 0;
      for (let i = 0; i < data.length; i += 4) {
        if (data[i + 3] === 0) continue;
        // Composite over the background as the screen would, then solve for alpha along bg -> c.
        const a0 = data[i + 3] / 255;
        const px = [0, 1, 2].map((k) => data[i + k] * a0 + bg[k] * (1 - a0));
        let num = 0;
        let den = 0;
        for (let k = 0; k < 3; k++) {
          num += (px[k] - bg[k]) * (c[k] - bg[k]);
          den += (c[k] - bg[k]) ** 2;
        }
        const a = den > 0 ? num / den : 0;
        if (a < 0.3 || a > 1.05) continue;
        const err = Math.max(...[0, 1, 2].map((k) => Math.abs(bg[k] + a * (c[k] - bg[k]) - px[k])));
        if (err <= 24) n++;
      }
      counts[name] = n;
    }
    return counts;
  }, { x, y, radius, colours });
}

/** Moves the mouse to a point of the plot canvas (CSS px from its top left) and returns the read-out in ppm. */
export async function readoutAt(_page, frame, x, y, timeoutMs = 15_000) {
  const re = /F2 (-?\d+\.\d+) ppm.*F1 (-?\d+\.\d+) ppm/;
  const canvas = frame.locator('canvas#plot');
  const readout = frame.locator('#readout');
  const deadline = Date.now() + timeoutMs;
  // locator.hover, not page.mouse.move; and move off and back each try: the first pointer events into a
  // webview that is still starting up are not always delivered, and a move to the same pixel fires nothing.
  for (;;) {
    await canvas.hover({ position: { x: x + 2, y } });
    await canvas.hover({ position: { x, y } });
    const text = await waitText(readout, re, 500).catch(() => '');
    const m = re.exec(text);
    if (m) return { f2: Number(m[1]), f1: Number(m[2]), text };
    if (Date.now() > deadline) throw new Error(`no ppm read-out at (${x}, ${y}) px of the plot within ${timeoutMs / 1000} s`);
  }
}

/** Linear ppm <-> canvas px maps from two read-outs (the axes are linear in ppm). */
export async function calibrate(page, frame) {
  const box = await frame.locator('canvas#plot').boundingBox();
  const a = { x: box.width * 0.3, y: box.height * 0.3 };
  const b = { x: box.width * 0.7, y: box.height * 0.7 };
  const ra = await readoutAt(page, frame, a.x, a.y);
  const rb = await readoutAt(page, frame, b.x, b.y);
  const kx = (b.x - a.x) / (rb.f2 - ra.f2);
  const ky = (b.y - a.y) / (rb.f1 - ra.f1);
  return {
    toPx: (f2, f1) => ({ x: a.x + (f2 - ra.f2) * kx, y: a.y + (f1 - ra.f1) * ky }),
    f2Range: [ra.f2, rb.f2],
    box,
  };
}

export async function waitText(locator, re, timeoutMs = 30_000) {
  const deadline = Date.now() + timeoutMs;
  let last = '';
  while (Date.now() < deadline) {
    last = (await locator.textContent().catch(() => '')) ?? '';
    if (re.test(last)) return last;
    await sleep(100);
  }
  throw new Error(`timed out waiting for ${re} (last text: ${JSON.stringify(last.slice(0, 200))})`);
}
