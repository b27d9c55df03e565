// Where the end-to-end tooling lives: all under .vscode-test/ (ignored by git), keyed by version so an
// upgrade installs beside the old one instead of over it.
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';

/** Newest code-server whose engines accept Node 20 (VS Code 1.100.3; matches engines.vscode ^1.100.0). */
export const CODE_SERVER_VERSION = '4.100.3';
/** Browser driver without a browser download; the browser is Debian's chromium. */
export const PLAYWRIGHT_VERSION = '1.65.1';

export const repoRoot = resolve(dirname(fileURLToPath(import.meta.url)), '..', '..');
const cache = join(repoRoot, '.vscode-test');
const codeServerDir = join(cache, `code-server-${CODE_SERVER_VERSION}`);
const toolsDir = join(cache, `tools-playwright-${PLAYWRIGHT_VERSION}`);

export const paths = {
  cache,
  codeServerDir,
  codeServerBin: join(codeServerDir, 'node_modules', 'code-server', 'out', 'node', 'entry.js'),
  toolsDir,
  playwrightDir: join(toolsDir, 'node_modules', 'playwright-core'),
  marker: join(codeServerDir, '.couplet-setup-complete'),
  chromium: '/usr/bin/chromium',
  runs: join(cache, 'runs'),
  results: join(repoRoot, 'test-results'),
};
