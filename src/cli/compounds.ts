/** Where the compounds are: sidecar files grouped by their folder (for check and report), and the structure a note names. */
import { readFileSync, readdirSync, statSync } from 'node:fs';
import { basename, dirname, join } from 'node:path';
import type { NmredataStructure } from '../core/report/nmredata';
import { MolfileError, parseMolfile } from '../core/structure/molfile';
import { checkAtomMap, readStructureRef, type NoteProblem } from '../core/structure/structureRef';
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

/** The structure a note names (`structure:`, `atoms:`), read and checked; null when it names none. */
export function readNoteStructure(notePath: string, noteText: string): NmredataStructure | null {
  const ref = readStructureRef(noteText);
  const fail = (problems: readonly NoteProblem[]): never => {
    throw new InputError(problems.map((p) => `${notePath}:${p.line}: ${p.field}: ${p.message}`).join('\n'));
  };
  if (ref.problems.length > 0) fail(ref.problems);
  if (ref.structure === null) return null;
  const molPath = join(dirname(notePath), ref.structure);
  let text: string;
  try {
    text = readFileSync(molPath, 'utf8');
  } catch (e) {
    return fail([{ line: ref.structureLine, field: 'structure', message: `cannot read ${molPath} (${(e as NodeJS.ErrnoException).code ?? String(e)})` }]);
  }
  let molfile;
  try {
    molfile = parseMolfile(text, molPath);
  } catch (e) {
    if (e instanceof MolfileError) throw new InputError(e.message);
    throw e;
  }
  const problems = checkAtomMap(ref, molfile, basename(molPath));
  if (problems.length > 0) fail(problems);
  return { molfile, atoms: ref.atoms, file: basename(molPath) };
}
