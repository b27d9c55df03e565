#!/usr/bin/env node
// `npm start`: opens samples/ with Couplet loaded. In the desktop VS Code (extension development host) when
// `code` is on the PATH; otherwise in the test VS Code in the browser (code-server, installed on first use),
// serving on a 127.0.0.1 URL printed here until Ctrl-C.
import { spawnSync } from 'node:child_process';
import { join } from 'node:path';
import { repoRoot } from './paths.mjs';

function onPath(cmd) {
  return spawnSync('sh', ['-c', `command -v ${cmd}`], { stdio: 'ignore' }).status === 0;
}

const samples = join(repoRoot, 'samples');
const forceBrowser = process.argv.includes('--browser') || process.env.COUPLET_START_BROWSER === '1';

if (!forceBrowser && onPath('code')) {
  console.log('Opening samples/ in VS Code with Couplet loaded (extension development host)…');
  const r = spawnSync('code', [`--extensionDevelopmentPath=${repoRoot}`, samples], { stdio: 'inherit' });
  process.exit(r.status ?? 1);
}

const { setupVscode } = await import('./setupVscode.mjs');
const { startServer, workbenchUrl } = await import('./server.mjs');
await setupVscode();
const server = await startServer({ installExtension: true, quiet: true });
const url = workbenchUrl(server, samples);
console.log('');
console.log('Couplet is loaded in VS Code in the browser. Open:');
console.log('');
console.log(`  ${url}`);
console.log('');
console.log('(code-server on 127.0.0.1 only; Ctrl-C stops it)');
let stopping = false;
const shutdown = async () => {
  if (stopping) return;
  stopping = true;
  await server.stop();
  process.exit(0);
};
process.on('SIGINT', shutdown);
process.on('SIGTERM', shutdown);
