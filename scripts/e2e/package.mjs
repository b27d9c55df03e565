#!/usr/bin/env node
// `npm run package`: couplet-<version>.vsix with @vscode/vsce, run through npx at a pinned version (the
// newest whose engines accept Node 20) so it stays out of the project's dependencies. The extension's
// dependencies are bundled into dist/, hence --no-dependencies; .vscodeignore lists what goes in.
import { spawnSync } from 'node:child_process';
import { readFileSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { repoRoot } from './paths.mjs';

const VSCE = '@vscode/vsce@3.9.2';
const pkg = JSON.parse(readFileSync(join(repoRoot, 'package.json'), 'utf8'));
const out = join(repoRoot, `${pkg.name}-${pkg.version}.vsix`);
const args = ['--yes', VSCE, 'package', '--no-dependencies', '--out', out, ...process.argv.slice(2)];
// No repository field yet: relative links in README.md would point nowhere, so vsce needs a base URL.
if (!pkg.repository) args.push('--allow-missing-repository', '--baseContentUrl', 'https://couplet.invalid/', '--baseImagesUrl', 'https://couplet.invalid/', '--skip-license');
const r = spawnSync('npx', args, { cwd: repoRoot, stdio: 'inherit' });
if (r.status !== 0) process.exit(r.status ?? 1);
console.log(`package: ${out} (${(statSync(out).size / 1024).toFixed(0)} KiB)`);
