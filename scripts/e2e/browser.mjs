// Headless Debian chromium through playwright-core (installed by setupVscode.mjs under .vscode-test/), with a
// fresh profile per run and every non-local request aborted, so a run depends on nothing outside this machine.
import { mkdtempSync, mkdirSync, rmSync, existsSync } from 'node:fs';
import { createRequire } from 'node:module';
import { join } from 'node:path';
import { URL } from 'node:url';
import { paths } from './paths.mjs';

const CHROMIUM_ARGS = [
  '--no-sandbox',
  '--disable-gpu', // canvas drawing still works in software
  '--disable-quic',
  '--no-first-run',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
  '--disable-dev-shm-usage',
];

function loadPlaywright() {
  if (!existsSync(paths.playwrightDir)) throw new Error(`playwright-core missing; run: node scripts/e2e/setupVscode.mjs`);
  const require = createRequire(join(paths.toolsDir, 'package.json'));
  return require('playwright-core');
}

/** @returns {Promise<{ context: import('playwright-core').BrowserContext, page: import('playwright-core').Page, close: () => Promise<void> }>} */
export async function openBrowser(opts = {}) {
  const { chromium } = loadPlaywright();
  mkdirSync(paths.runs, { recursive: true });
  const profile = mkdtempSync(join(paths.runs, 'chromium-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: paths.chromium,
    headless: true,
    args: CHROMIUM_ARGS,
    env: { ...process.env, XDG_CONFIG_HOME: join(profile, 'xdg'), XDG_CACHE_HOME: join(profile, 'xdg-cache') },
    viewport: opts.viewport ?? { width: 1400, height: 900 },
    deviceScaleFactor: 1,
  });
  await context.route('**/*', (route) => {
    const u = new URL(route.request().url());
    const local = u.hostname === '127.0.0.1' || u.hostname === 'localhost' || u.hostname.endsWith('.localhost');
    if (local || u.protocol === 'data:' || u.protocol === 'blob:') return route.continue();
    return route.abort();
  });
  const page = context.pages()[0] ?? (await context.newPage());
  const close = async () => {
    await context.close().catch(() => undefined);
    rmSync(profile, { recursive: true, force: true });
  };
  return { context, page, close };
}
