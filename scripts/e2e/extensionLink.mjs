// Loads the extension into a code-server run without packaging: a symlink named <publisher>.<name>-<version>
// in the run's extensions folder, made before the server first writes its extensions.json (a folder missing
// from an existing manifest is ignored).
import { readFileSync, symlinkSync } from 'node:fs';
import { join } from 'node:path';
import { repoRoot } from './paths.mjs';

export function linkExtension(extensionsDir) {
  const pkg = JSON.parse(readFileSync(join(repoRoot, 'package.json'), 'utf8'));
  const id = `${pkg.publisher}.${pkg.name}-${pkg.version}`;
  symlinkSync(repoRoot, join(extensionsDir, id), 'dir');
  return `${pkg.publisher}.${pkg.name}`;
}
