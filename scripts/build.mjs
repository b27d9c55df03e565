// Bundles every entry point with esbuild. Type checking is `npm run typecheck` (tsc --noEmit).
import { build } from 'esbuild';
import { existsSync } from 'node:fs';
import { nodeBundle } from './bundleOptions.mjs';

const entries = [
  { in: 'src/cli.ts', out: 'cli' },
  { in: 'bench/index.ts', out: 'bench' },
  { in: 'scripts/makeSamples.ts', out: 'makeSamples' },
  { in: 'scripts/makeSidecars.ts', out: 'makeSidecars' },
].filter((e) => existsSync(e.in));

await build({
  entryPoints: entries,
  outdir: 'dist',
  ...nodeBundle,
  banner: { js: '#!/usr/bin/env node' },
  // A native module (prebuilt binary from its optional dependencies): required at run time, not bundled.
  external: ['@resvg/resvg-js'],
});

// The extension host bundle and its fit worker: CommonJS for VS Code's loader, `vscode` provided by the host.
const hostEntries = [
  { in: 'src/extension/extension.ts', out: 'extension' },
  { in: 'src/extension/fitWorker.ts', out: 'fitWorker' },
].filter((e) => existsSync(e.in));

if (hostEntries.length > 0) {
  await build({
    entryPoints: hostEntries,
    outdir: 'dist',
    ...nodeBundle,
    external: ['vscode'],
  });
}

// The webview: one browser bundle (d3 and the webview toolkit included), loaded under a nonce CSP.
if (existsSync('webview/main.ts')) {
  await build({
    entryPoints: [{ in: 'webview/main.ts', out: 'webview' }],
    outdir: 'dist',
    bundle: true,
    platform: 'browser',
    format: 'iife',
    target: 'chrome120',
    sourcemap: true,
    logLevel: 'warning',
  });
}
