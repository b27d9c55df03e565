// Starts code-server (the test VS Code) on 127.0.0.1 with a fresh user-data and extensions folder per run,
// waits for /healthz, and stops it again. Webviews need a service worker, which needs a secure context:
// 127.0.0.1 counts as one, a LAN address does not.
import { spawn } from 'node:child_process';
import { mkdirSync, mkdtempSync, writeFileSync, createWriteStream, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import { join } from 'node:path';
import { setTimeout, clearTimeout } from 'node:timers';
import { URLSearchParams } from 'node:url';
import { paths } from './paths.mjs';
import { linkExtension } from './extensionLink.mjs';

/** Settings that keep the workbench quiet and deterministic: no trust prompt, welcome page, tips or network. */
export const userSettings = {
  'security.workspace.trust.enabled': false,
  'security.workspace.trust.startupPrompt': 'never',
  'workbench.startupEditor': 'none',
  'workbench.tips.enabled': false,
  'workbench.enableExperiments': false,
  'workbench.welcomePage.walkthroughs.openOnInstall': false,
  'telemetry.telemetryLevel': 'off',
  'update.mode': 'none',
  'extensions.ignoreRecommendations': true,
  'extensions.autoCheckUpdates': false,
  'extensions.autoUpdate': false,
  'git.enabled': false,
  'window.restoreWindows': 'none',
  'files.hotExit': 'off',
};

export function freePort() {
  return new Promise((resolvePort, reject) => {
    const srv = createServer();
    srv.unref();
    srv.on('error', reject);
    srv.listen(0, '127.0.0.1', () => {
      const addr = srv.address();
      const port = typeof addr === 'object' && addr ? addr.port : 0;
      srv.close(() => resolvePort(port));
    });
  });
}

async function waitForHealth(url, proc, timeoutMs) {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    if (proc.exitCode !== null) throw new Error(`code-server exited early with code ${proc.exitCode}`);
    try {
      const res = await globalThis.fetch(`${url}/healthz`);
      if (res.ok) return;
    } catch {
      // not listening yet
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`code-server did not answer ${url}/healthz within ${timeoutMs / 1000} s`);
}

/**
 * @param {{ settings?: Record<string, unknown>, logName?: string, quiet?: boolean, keepState?: boolean, installExtension?: boolean, env?: Record<string, string> }} [opts]
 *   installExtension: load this repository as an installed extension (symlink), for runs without a payload URL.
 * @returns {Promise<{ url: string, port: number, dir: string, log: string, stop: () => Promise<void> }>}
 */
export async function startServer(opts = {}) {
  mkdirSync(paths.runs, { recursive: true });
  const dir = mkdtempSync(join(paths.runs, 'run-'));
  const userData = join(dir, 'user-data');
  const extensions = join(dir, 'extensions');
  mkdirSync(join(userData, 'User'), { recursive: true });
  mkdirSync(extensions, { recursive: true });
  if (opts.installExtension) linkExtension(extensions);
  writeFileSync(join(userData, 'User', 'settings.json'), JSON.stringify({ ...userSettings, ...(opts.settings ?? {}) }, null, 2));
  // Always pass --config: without it code-server writes a config with a password into the home folder.
  const config = join(dir, 'config.yaml');
  writeFileSync(config, '');
  const port = await freePort();
  const url = `http://127.0.0.1:${port}`;
  const log = join(dir, opts.logName ?? 'code-server.log');
  const out = createWriteStream(log);
  const args = [
    paths.codeServerBin,
    '--bind-addr', `127.0.0.1:${port}`,
    '--auth', 'none',
    '--user-data-dir', userData,
    '--extensions-dir', extensions,
    '--config', config,
    '--disable-telemetry',
    '--disable-update-check',
    '--disable-workspace-trust',
    '--disable-getting-started-override',
    '--ignore-last-opened',
    '--disable-proxy',
  ];
  const proc = spawn(process.execPath, args, { stdio: ['ignore', 'pipe', 'pipe'], env: { ...process.env, ...(opts.env ?? {}) } });
  proc.stdout.pipe(out);
  proc.stderr.pipe(out);
  if (!opts.quiet) console.log(`[server] code-server ${url} (log ${log})`);
  const stop = async () => {
    if (proc.exitCode === null) {
      const exited = new Promise((r) => proc.once('exit', r));
      proc.kill('SIGTERM');
      const timer = setTimeout(() => proc.kill('SIGKILL'), 5000);
      await exited;
      clearTimeout(timer);
    }
    if (!opts.keepState) rmSync(dir, { recursive: true, force: true });
  };
  try {
    await waitForHealth(url, proc, 60_000);
  } catch (err) {
    await stop();
    throw new Error(`${err instanceof Error ? err.message : String(err)}; see ${log}`);
  }
  return { url, port, dir, log, stop };
}

/** Workbench URL that opens `folder` and, optionally, loads an extension under development and a test module. */
export function workbenchUrl(server, folder, payload) {
  const params = new URLSearchParams({ folder });
  if (payload) {
    const origin = `vscode-remote://127.0.0.1:${server.port}`;
    const entries = [];
    if (payload.extensionDevelopmentPath) entries.push(['extensionDevelopmentPath', origin + payload.extensionDevelopmentPath]);
    if (payload.extensionTestsPath) entries.push(['extensionTestsPath', origin + payload.extensionTestsPath]);
    params.set('payload', JSON.stringify(entries));
  }
  return `${server.url}/?${params.toString()}`;
}
