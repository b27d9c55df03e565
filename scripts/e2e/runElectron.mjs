#!/usr/bin/env node
// The same in-host suite (test/e2e/inHost) under @vscode/test-electron, for machines that can download a
// desktop VS Code (it fetches one into .vscode-test/ on first use). Where that download is impossible
// (these CI machines reach only the npm registry and Debian's packages) it stops with a clear message:
// use `npm run test:e2e` there, which runs the suite in code-server instead.
import { existsSync } from 'node:fs';
import { join } from 'node:path';
import { runTests } from '@vscode/test-electron';
import { buildInHostTests } from './buildTests.mjs';
import { repoRoot } from './paths.mjs';
import { makeWorkspace } from './workspace.mjs';

/** engines.vscode is ^1.100.0; test against the same release the code-server runner uses. */
const VSCODE_VERSION = process.env.COUPLET_VSCODE_VERSION || '1.100.3';

async function main() {
  if (!existsSync(join(repoRoot, 'dist', 'extension.js'))) throw new Error('dist/extension.js is missing: run node scripts/build.mjs first');
  const bundle = await buildInHostTests();
  const ws = makeWorkspace();
  try {
    await runTests({
      version: VSCODE_VERSION,
      extensionDevelopmentPath: repoRoot,
      extensionTestsPath: bundle,
      launchArgs: [ws.folder, '--disable-extensions', '--disable-workspace-trust', '--skip-welcome', '--skip-release-notes'],
      extensionTestsEnv: { COUPLET_E2E_RESULT: join(ws.root, 'inhost-result.json') },
    });
    console.log('electron: in-host suite passed');
    return 0;
  } catch (err) {
    const msg = err instanceof Error ? err.message : String(err);
    if (/ENOTFOUND|EAI_AGAIN|ECONNREFUSED|ECONNRESET|ETIMEDOUT|getaddrinfo|download|fetch failed|status code/i.test(msg) && !/Test run failed/i.test(msg)) {
      console.error(`electron: could not download VS Code ${VSCODE_VERSION} (${msg.split('\n')[0]}).\n` +
        '  This runner needs access to update.code.visualstudio.com. Without it, run the same suite in\n' +
        '  code-server (npm registry only): npm run test:e2e');
      return 2;
    }
    console.error(`electron: ${msg}`);
    return 1;
  } finally {
    ws.remove();
  }
}

main().then((code) => process.exit(code), (err) => {
  console.error(`electron: ${err instanceof Error ? err.message : String(err)}`);
  process.exit(1);
});
