/* global document -- used only inside page.evaluate callbacks, which run in the webview */
// The UI steps, in order, as a chemist would do them in the browser workbench. Each step may use what the
// previous ones left (ctx). Expected values come from samples/brisquarene/truth.json (the simulation
// parameters of the sample): H-5 7.21 ppm, H-6 6.86 ppm, J(H-5,H-6) = 8.5 Hz.
import { readFileSync, existsSync } from 'node:fs';
import { join } from 'node:path';
import { setTimeout as sleep } from 'node:timers/promises';
import { calibrate, colourCounts, coupletFrame, paletteRgb, readoutAt, waitText } from './webview.mjs';

const H5 = 7.21;
const H6 = 6.86;
const J_H5_H6 = 8.5;

/**
 * Cross peaks of a first-order DQF-COSY: one on each side of the diagonal for every coupling whose J is
 * at least the linewidth (below that the antiphase lobes cancel and nothing rises above the lowest level).
 */
function crossPeaks(truth) {
  const ppm = Object.fromEntries(truth.system.spins.map((s) => [s.label, s.ppm]));
  const width = Object.fromEntries(truth.system.spins.map((s) => [s.label, s.linewidthHz]));
  const visible = truth.system.couplings.filter((c) => c.jHz >= Math.max(width[c.a], width[c.b]));
  return visible.flatMap((c) => [
    { f2: ppm[c.a], f1: ppm[c.b], name: `${c.a}/${c.b}` },
    { f2: ppm[c.b], f1: ppm[c.a], name: `${c.b}/${c.a}` },
  ]);
}

/** @typedef {{ page: import('playwright-core').Page, ws: { folder: string }, frame?: import('playwright-core').Frame, map?: Awaited<ReturnType<typeof calibrate>> }} Ctx */

/** @type {{ name: string, run: (ctx: Ctx) => Promise<string | void> }[]} */
export const steps = [
  {
    name: 'open-from-explorer',
    run: async ({ page }) => {
      await waitForContributions(page);
      const row = (text) => page.locator('.explorer-folders-view .monaco-list-row', { hasText: text }).first();
      await row('brisquarene').waitFor({ timeout: 60_000 });
      await row('brisquarene').click();
      await row('cosy.jdx').waitFor();
      await row('cosy.jdx').dblclick();
      await page.locator('.tab.active', { hasText: 'cosy.jdx' }).waitFor();
      await page.locator('iframe.webview').first().waitFor({ state: 'visible', timeout: 30_000 }).catch(() => {
        throw new Error('cosy.jdx did not open in the Couplet editor (no webview appeared)');
      });
    },
  },
  {
    name: 'contours-drawn',
    run: async (ctx) => {
      ctx.frame = await coupletFrame(ctx.page);
      const colours = await paletteRgb(ctx.frame);
      if (!colours.positive || !colours.negative || !colours.background) throw new Error(`theme colours not readable: ${JSON.stringify(colours)}`);
      ctx.map = await calibrate(ctx.page, ctx.frame);
      const truth = JSON.parse(readFileSync(join(ctx.ws.folder, 'brisquarene', 'truth.json'), 'utf8'));
      const peaks = crossPeaks(truth).filter((p) => p.f2 > 6 && p.f1 > 6); // the aromatic region shown at full view
      const lines = [];
      // Contours are drawn one level per frame; wait until the cross peaks show both signs.
      const deadline = Date.now() + 20_000;
      for (;;) {
        lines.length = 0;
        let bad = 0;
        for (const p of peaks) {
          const at = ctx.map.toPx(p.f2, p.f1);
          const c = await colourCounts(ctx.frame, at.x, at.y, 10, colours);
          lines.push(`${p.name} at (${at.x.toFixed(0)}, ${at.y.toFixed(0)}) px: ${c.positive} positive, ${c.negative} negative`);
          if (c.positive < 3 || c.negative < 3) bad++;
        }
        // Far from every peak (between the rows at 7.0 ppm): no contour pixels at all.
        const empty = ctx.map.toPx(7.05, 7.05 + 0.3);
        const e = await colourCounts(ctx.frame, empty.x, empty.y, 10, colours);
        lines.push(`empty region: ${e.positive} positive, ${e.negative} negative`);
        if (bad === 0 && e.positive + e.negative === 0) return lines.join('; ');
        if (Date.now() > deadline) throw new Error(`contour colours not where expected: ${lines.join('; ')}`);
        await sleep(500);
      }
    },
  },
  {
    name: 'click-cross-peak-trace',
    run: async (ctx) => {
      const at = ctx.map.toPx(H6, H5);
      await ctx.frame.locator('canvas#plot').click({ position: { x: at.x, y: at.y } });
      await ctx.frame.locator('#trace:not([hidden])').waitFor({ timeout: 30_000 });
      const text = await waitText(ctx.frame.locator('#traceText'), /J = -?\d+\.\d+ ± \d+\.\d+ Hz/, 60_000);
      const j = Number(/J = (-?\d+\.\d+)/.exec(text)[1]);
      if (Math.abs(j - J_H5_H6) > 0.1) throw new Error(`fitted J ${j} Hz is not within 0.1 Hz of the simulated ${J_H5_H6} Hz`);
      return text.split('\n')[0];
    },
  },
  {
    name: 'accept-and-save',
    run: async (ctx) => {
      // Atom labels in the panel's label field (F2 atom, F1 atom): a coupling is stored only for labelled picks.
      await ctx.frame.locator('input.label-input').fill('H-6, H-5');
      await ctx.frame.locator('vscode-button', { hasText: /^\s*Accept\s*$/ }).click();
      await waitText(ctx.frame.locator('#status'), /Accepted J = /, 30_000);
      const side = join(ctx.ws.folder, 'brisquarene', 'cosy.jdx.couplet.yaml');
      // Save with the workbench's own key binding (the webview forwards it to the workbench).
      await ctx.frame.locator('canvas#plot').focus();
      await ctx.page.keyboard.press('Control+s');
      const deadline = Date.now() + 20_000;
      while (!existsSync(side) || !/atoms: \[H-5, H-6\]/.test(readFileSync(side, 'utf8'))) {
        if (Date.now() > deadline) throw new Error(`${side} not saved with the coupling H-5/H-6${existsSync(side) ? `:\n${readFileSync(side, 'utf8')}` : ' (no file)'}`);
        await sleep(200);
      }
      // The editor's dirty marker goes once the save went through.
      await ctx.page.locator('.tab.active:not(.dirty)', { hasText: 'cosy.jdx' }).waitFor({ timeout: 10_000 }).catch(() => {
        throw new Error('the sidecar is on disk but the cosy.jdx tab still shows unsaved changes');
      });
      const text = readFileSync(side, 'utf8');
      const j = /^ {4}j_hz: (-?\d+\.\d\d)$/m.exec(text);
      if (!j || Math.abs(Number(j[1]) - J_H5_H6) > 0.1) throw new Error(`saved j_hz ${j?.[1]} is not within 0.1 Hz of ${J_H5_H6}`);
      if (!/^ {4}method: fit$/m.test(text) || !/^ {4}dimension: F2$/m.test(text)) throw new Error(`saved coupling lacks method/dimension:\n${text}`);
      await ctx.frame.locator('canvas#plot').hover();
      return `j_hz ${j[1]} on disk`;
    },
  },
  {
    name: 'ctrl-z-in-panel-undoes-pick',
    run: async (ctx) => {
      // With the webview focused, Ctrl+Z reaches the workbench (the webview forwards undo/redo keys), whose
      // undo goes to the focused custom editor's edit stack: the accepted pick must leave the sidecar.
      const side = join(ctx.ws.folder, 'brisquarene', 'cosy.jdx.couplet.yaml');
      const hasPick = () => existsSync(side) && /atoms: \[H-5, H-6\]/.test(readFileSync(side, 'utf8'));
      const saved = async (want, what) => {
        await ctx.page.keyboard.press('Control+s');
        const deadline = Date.now() + 15_000;
        while (hasPick() !== want) {
          if (Date.now() > deadline) throw new Error(`${what}: ${side} ${want ? 'lacks' : 'still has'} the coupling H-5/H-6`);
          await sleep(200);
        }
      };
      await ctx.frame.locator('canvas#plot').focus();
      await ctx.page.keyboard.press('Control+z');
      await saved(false, 'after Ctrl+Z and save');
      await ctx.frame.locator('canvas#plot').focus();
      await ctx.page.keyboard.press('Control+Shift+z');
      await saved(true, 'after Ctrl+Shift+Z and save');
      await ctx.frame.locator('canvas#plot').hover();
      return 'undo removed the pick, redo brought it back (saved both times)';
    },
  },
  {
    name: 'wheel-zoom-axes',
    run: async (ctx) => {
      const box = ctx.map.box;
      const probe = { x: box.width * 0.25, y: box.height * 0.25 };
      const before = await readoutAt(ctx.page, ctx.frame, probe.x, probe.y);
      const axisBefore = await axisStrip(ctx.frame);
      // Zoom in around the plot centre: three wheel notches.
      await ctx.frame.locator('canvas#plot').hover({ position: { x: box.width * 0.55, y: box.height * 0.5 } });
      for (let i = 0; i < 3; i++) {
        await ctx.page.mouse.wheel(0, -100);
        await sleep(100);
      }
      await sleep(800);
      const after = await readoutAt(ctx.page, ctx.frame, probe.x, probe.y);
      const axisAfter = await axisStrip(ctx.frame);
      // Zooming in around another point moves the probe's ppm towards that point.
      if (Math.abs(after.f2 - before.f2) < 0.01) throw new Error(`read-out at the same pixel did not change: ${before.text} -> ${after.text}`);
      if (axisAfter === axisBefore) throw new Error('the F2 axis strip (tick labels) did not change');
      return `probe F2 ${before.f2} -> ${after.f2} ppm`;
    },
  },
  {
    name: 'note-label-completion',
    run: async ({ page }) => {
      // Last step: it types into the structure note and reverts, so nothing it does reaches the earlier steps.
      // The note's completion (src/extension/notes) offers the compound's atom labels after `H-`; H-5 and H-6
      // are assigned in the sample's sidecars and used in brisquarene.md.
      const row = (text) => page.locator('.explorer-folders-view .monaco-list-row', { hasText: text }).first();
      await row('brisquarene.md').waitFor({ timeout: 30_000 });
      await row('brisquarene.md').dblclick();
      await page.locator('.tab.active', { hasText: 'brisquarene.md' }).waitFor({ timeout: 30_000 });
      const editor = page.locator('.editor-group-container.active .monaco-editor .view-lines').first();
      await editor.waitFor({ timeout: 30_000 });
      await editor.click();
      await page.keyboard.press('Control+End');
      await page.keyboard.press('Enter');
      await page.keyboard.type('H-', { delay: 50 });
      const rows = page.locator('.suggest-widget .monaco-list-row');
      const opened = await rows.first().waitFor({ timeout: 5_000 }).then(() => true, () => false);
      if (!opened) await page.keyboard.press('Control+Space');
      await rows.first().waitFor({ timeout: 15_000 }).catch(() => {
        throw new Error('no suggestion widget after typing "H-" and Ctrl+Space in brisquarene.md');
      });
      const want = ['H-5', 'H-6'];
      let labels = [];
      const deadline = Date.now() + 10_000;
      for (;;) {
        labels = (await page.locator('.suggest-widget .monaco-list-row .label-name').allTextContents()).map((t) => t.trim());
        if (want.every((w) => labels.includes(w))) break;
        if (Date.now() > deadline) throw new Error(`suggestions lack ${want.filter((w) => !labels.includes(w)).join(', ')}: [${labels.join(', ')}]`);
        await sleep(300);
      }
      await page.keyboard.press('Escape');
      await rows.first().waitFor({ state: 'hidden', timeout: 5_000 }).catch(() => undefined);
      // Close without saving: the workbench's own revert-and-close command, so no save dialog comes up.
      await page.keyboard.press('F1');
      const input = page.locator('.quick-input-widget input');
      await input.waitFor({ timeout: 10_000 });
      await input.fill('>Revert and Close Editor');
      await page.locator('.quick-input-list .monaco-list-row', { hasText: 'Revert and Close Editor' }).first().waitFor({ timeout: 10_000 });
      await page.keyboard.press('Enter');
      await page.locator('.tab', { hasText: 'brisquarene.md' }).waitFor({ state: 'detached', timeout: 10_000 }).catch(() => {
        throw new Error('brisquarene.md is still open after "Revert and Close Editor"');
      });
      return `suggested: ${labels.join(', ')}`;
    },
  },
];

/**
 * Waits until the workbench knows the extension's contributions (a file opened earlier opens as text):
 * the command palette lists commands as they were when it opened, so open, look, close, retry.
 */
async function waitForContributions(page, timeoutMs = 60_000) {
  const deadline = Date.now() + timeoutMs;
  await page.locator('.monaco-workbench').waitFor({ timeout: timeoutMs });
  while (Date.now() < deadline) {
    await page.keyboard.press('F1');
    const input = page.locator('.quick-input-widget input');
    await input.waitFor({ timeout: 10_000 });
    await input.fill('>Couplet: Open Spectrum');
    const found = await page.locator('.quick-input-list .monaco-list-row', { hasText: 'Couplet: Open Spectrum' }).first()
      .waitFor({ timeout: 1_500 }).then(() => true, () => false);
    await page.keyboard.press('Escape');
    if (found) return;
    await sleep(500);
  }
  throw new Error('the command palette never listed "Couplet: Open Spectrum": the extension did not load');
}

/** A fingerprint of the canvas rows below the plot, where the F2 tick labels are drawn. */
async function axisStrip(frame) {
  return frame.evaluate(() => {
    const c = document.getElementById('plot');
    const h = Math.round(c.height * 0.06);
    const d = c.getContext('2d').getImageData(0, c.height - h, c.width, h).data;
    let hash = 2166136261;
    for (let i = 0; i < d.length; i++) hash = Math.imul(hash ^ d[i], 16777619) >>> 0;
    return hash;
  });
}
