// A throwaway copy of samples/ for a test run, so tests never change the repository's files.
import { cpSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { repoRoot } from './paths.mjs';

/** Sidecars the tests create themselves; removed from the copy should samples/ ever ship them. */
const CREATED_BY_TESTS = ['brisquarene/cosy.jdx.couplet.yaml', 'quellopyranol/cosy.jdx.couplet.yaml', 'vantrelenol/cosy.jdx.couplet.yaml'];

export function makeWorkspace() {
  const root = mkdtempSync(join(tmpdir(), 'couplet-e2e-'));
  const folder = join(root, 'samples');
  cpSync(join(repoRoot, 'samples'), folder, { recursive: true });
  for (const rel of CREATED_BY_TESTS) rmSync(join(folder, rel), { force: true });
  return { root, folder, remove: () => rmSync(root, { recursive: true, force: true }) };
}
