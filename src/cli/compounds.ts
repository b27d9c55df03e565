/** Where the compounds are: sidecar files grouped by their folder (for check and report). */
import { readdirSync, statSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { InputError } from './errors';

export const SIDECAR = '.couplet.yaml';

/** Sidecar files per folder: every one under a directory (hidden folders and node_modules skipped), or the one given. */
export function findCompounds(target: string): Map<string, string[]> {
  let isDir: boolean;
  try {
    isDir = statSync(target).isDirectory();
  } catch {
    throw new InputError(`${target}: no such file or directory`);
  }
  const byFolder = new Map<string, string[]>();
  const add = (file: string): void => {
    byFolder.set(dirname(file), [...(byFolder.get(dirname(file)) ?? []), file]);
  };
  if (!isDir) {
    if (!target.endsWith(SIDECAR)) throw new InputError(`${target}: not a sidecar (expected a name ending in ${SIDECAR})`);
    add(target);
    return byFolder;
  }
  const walk = (d: string): void => {
    for (const name of readdirSync(d).sort()) {
      if (name.startsWith('.') || name === 'node_modules') continue;
      const p = join(d, name);
      if (statSync(p).isDirectory()) walk(p);
      else if (name.endsWith(SIDECAR)) add(p);
    }
  };
  walk(target);
  return byFolder;
}
