#!/usr/bin/env node
// UI tests through the browser: code-server with the extension installed (as a user would have it),
// headless chromium driven by playwright-core, the steps of test/e2e/ui/steps.mjs in order. Each step
// leaves a screenshot test-results/ui-<nn>-<step>.png; a failing step leaves ui-<nn>-<step>-FAILED.png
// and the later steps are skipped. Prints "N passed, N failed"; exits 1 on any failure.
import { copyFileSync, existsSync, mkdirSync } from 'node:fs';
import { join } from 'node:path';
import { steps } from '../../test/e2e/ui/steps.mjs';
import { openBrowser } from './browser.mjs';
import { paths, repoRoot } from './paths.mjs';
import { startServer, workbenchUrl } from './server.mjs';
import { setupVscode } from './setupVscode.mjs';
import { makeWorkspace } from './workspace.mjs';

async function main() {
  if (!existsSync(join(repoRoot, 'dist', 'extension.js'))) throw new Error('dist/extension.js is missing: run node scripts/build.mjs first');
  await setupVscode();
  mkdirSync(paths.results, { recursive: true });
  const ws = makeWorkspace();
  const server = await startServer({ installExtension: true, logName: 'ui-code-server.log' });
  const browser = await openBrowser();
  const ctx = { page: browser.page, ws };
  const started = Date.now();
  let passed = 0;
  let failed = 0;
  let skipped = 0;
  try {
    await browser.page.goto(workbenchUrl(server, ws.folder));
    for (const [i, step] of steps.entries()) {
      const shot = join(paths.results, `ui-${String(i + 1).padStart(2, '0')}-${step.name}`);
      if (failed > 0) {
        skipped++;
        console.log(`skip ${step.name}`);
        continue;
      }
      const t0 = Date.now();
      try {
        const note = await step.run(ctx);
        passed++;
        await browser.page.screenshot({ path: `${shot}.png` });
        console.log(`ok   ${step.name} (${Date.now() - t0} ms)${note ? `: ${note}` : ''}`);
      } catch (e) {
        failed++;
        await browser.page.screenshot({ path: `${shot}-FAILED.png` }).catch(() => undefined);
        console.log(`FAIL ${step.name} (${Date.now() - t0} ms): ${e instanceof Error ? e.message : String(e)}\n     screenshot ${shot}-FAILED.png`);
      }
    }
  } finally {
    await browser.close();
    if (failed > 0) copyFileSync(server.log, join(paths.results, 'ui-code-server.log'));
    await server.stop();
    ws.remove();
  }
  console.log(`ui: ${passed} passed, ${failed} failed${skipped ? `, ${skipped} skipped` : ''} (${((Date.now() - started) / 1000).toFixed(1)} s)`);
  return failed === 0 ? 0 : 1;
}

main().then((code) => process.exit(code), (err) => {
  console.error(`ui: ${err instanceof Error ? err.message : String(err)}`);
  console.log('ui: 0 passed, 1 failed');
  process.exit(1);
});
