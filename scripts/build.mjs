// Bundles every entry point with esbuild. Type checking is `npm run typecheck` (tsc --noEmit).
import { build } from 'esbuild';
import { existsSync } from 'node:fs';

const entries = [
  { in: 'src/cli.ts', out: 'cli' },
  { in: 'bench/index.ts', out: 'bench' },
  { in: 'scripts/makeSamples.ts', out: 'makeSamples' },
].filter((e) => existsSync(e.in));

await build({
  entryPoints: entries,
  outdir: 'dist',
  bundle: true,
  platform: 'node',
  format: 'cjs',
  target: 'node20',
  sourcemap: true,
  logLevel: 'warning',
  banner: { js: '#!/usr/bin/env node' },
});
