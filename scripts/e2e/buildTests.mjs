// Bundles the in-host test suite (test/e2e/inHost) to dist/test/inHost.js: CommonJS with `vscode` from the
// host, like the extension itself. Kept out of scripts/build.mjs so the extension build never depends on it.
import { build } from 'esbuild';
import { join } from 'node:path';
import { nodeBundle } from '../bundleOptions.mjs';
import { repoRoot } from './paths.mjs';

export const inHostBundle = join(repoRoot, 'dist', 'test', 'inHost.js');

export async function buildInHostTests() {
  await build({
    entryPoints: [join(repoRoot, 'test', 'e2e', 'inHost', 'index.ts')],
    outfile: inHostBundle,
    ...nodeBundle,
    external: ['vscode'],
  });
  return inHostBundle;
}

if (import.meta.url === `file://${process.argv[1]}`) await buildInHostTests();
