#!/usr/bin/env node
// Runs test/e2e/inHost inside code-server's real extension host: the workbench is opened in headless
// chromium with a payload naming this repository as the extension under development and the bundled
// suite as its tests; the suite writes a result file, which this script waits for and reports.
// Prints "N passed, N failed"; exits 1 on any failure. Needs `node scripts/build.mjs` first (npm run test:e2e does it).
import { copyFileSync, existsSync, mkdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { setTimeout as sleep } from 'node:timers/promises';
import { openBrowser } from './browser.mjs';
import { buildInHostTests } from './buildTests.mjs';
import { paths, repoRoot } from './paths.mjs';
import { startServer, workbenchUrl } from './server.mjs';
import { setupVscode } from './setupVscode.mjs';
import { makeWorkspace } from './workspace.mjs';

const TIMEOUT_MS = 5 * 60_000;

async function main() {
  if (!existsSync(join(repoRoot, 'dist', 'extension.js'))) throw new Error('dist/extension.js is missing: run node scripts/build.mjs first');
  await setupVscode();
  const bundle = await buildInHostTests();
  const ws = makeWorkspace();
  const resultFile = join(ws.root, 'inhost-result.json');
  // VS Code in the browser saves dirty files after 1 s by default (files.autoSave "afterDelay"); the
  // steps check the dirty/undo/save sequence as the desktop default ("off") has it. The UI tests keep
  // the browser default, so the auto-saved path is exercised there.
  const settings = { 'files.autoSave': 'off', ...JSON.parse(process.env.COUPLET_E2E_SETTINGS || '{}') };
  const server = await startServer({ env: { COUPLET_E2E_RESULT: resultFile }, logName: 'inhost-code-server.log', settings });
  const browser = await openBrowser();
  const started = Date.now();
  let summary;
  try {
    await browser.page.goto(workbenchUrl(server, ws.folder, { extensionDevelopmentPath: repoRoot, extensionTestsPath: bundle }));
    while (!existsSync(resultFile)) {
      if (Date.now() - started > TIMEOUT_MS) throw new Error(`no result from the in-host suite after ${TIMEOUT_MS / 1000} s`);
      await sleep(250);
    }
    await sleep(100); // the file is written in one call; give the write a moment to land
    summary = JSON.parse(readFileSync(resultFile, 'utf8'));
  } finally {
    const failed = !summary || summary.failed > 0;
    if (failed) {
      mkdirSync(paths.results, { recursive: true });
      await browser.page.screenshot({ path: join(paths.results, 'inhost-failure.png') }).catch(() => undefined);
    }
    await browser.close();
    if (failed) copyFileSync(server.log, join(paths.results, 'inhost-code-server.log'));
    await server.stop();
    ws.remove();
  }
  for (const r of summary.results) console.log(`${r.ok ? 'ok  ' : 'FAIL'} ${r.name} (${r.ms} ms)${r.ok ? '' : `\n     ${r.error.replace(/\n/g, '\n     ')}`}`);
  console.log(`in-host: ${summary.passed} passed, ${summary.failed} failed (${((Date.now() - started) / 1000).toFixed(1)} s)`);
  return summary.failed === 0 ? 0 : 1;
}

main().then((code) => process.exit(code), (err) => {
  console.error(`in-host: ${err instanceof Error ? err.message : String(err)}`);
  console.log('in-host: 0 passed, 1 failed');
  process.exit(1);
});
