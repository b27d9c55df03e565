import { readFileSync, readdirSync, statSync } from 'node:fs';
import { basename, join } from 'node:path';
import { parseJcamp } from '../core/jcamp';
import type { Spectrum } from '../core/spectrum/spectrum';
import { InputError } from './errors';

/** What the commands need from the outside world; tests pass their own. */
export interface CliIo {
  readonly out: (text: string) => void;
  readonly err: (text: string) => void;
}

export const SPECTRUM_EXTENSIONS = ['.jdx', '.dx', '.jcamp'];

/** Reads and decodes a JCAMP-DX file; every failure becomes an InputError naming the file. */
export function loadSpectrum(path: string): Spectrum {
  let text: string;
  try {
    // JCAMP-DX is ASCII; latin1 maps every byte to one character so line numbers stay right even in damaged files.
    text = readFileSync(path, 'latin1');
  } catch (e) {
    throw new InputError(`${path}: cannot read file (${(e as NodeJS.ErrnoException).code ?? String(e)})`);
  }
  try {
    return parseJcamp(text, path);
  } catch (e) {
    const message = e instanceof Error ? e.message : String(e);
    // JcampError messages already start with file:line.
    throw new InputError(message.startsWith(path) ? message : `${path}: ${message}`);
  }
}

/** Spectrum files under a directory (recursively, sorted, skipping hidden folders and node_modules). */
export function findSpectra(dir: string): string[] {
  const found: string[] = [];
  const walk = (d: string): void => {
    for (const name of readdirSync(d).sort()) {
      if (name.startsWith('.') || name === 'node_modules') continue;
      const p = join(d, name);
      if (statSync(p).isDirectory()) walk(p);
      else if (SPECTRUM_EXTENSIONS.some((ext) => name.toLowerCase().endsWith(ext))) found.push(p);
    }
  };
  walk(dir);
  return found;
}

/** A single file, or every spectrum file under a directory. */
export function expandInputs(path: string): string[] {
  let isDir: boolean;
  try {
    isDir = statSync(path).isDirectory();
  } catch {
    throw new InputError(`${path}: no such file or directory`);
  }
  if (!isDir) return [path];
  const files = findSpectra(path);
  if (files.length === 0) throw new InputError(`${path}: no JCAMP-DX files (${SPECTRUM_EXTENSIONS.join(', ')}) found`);
  return files;
}

export function displayName(path: string): string {
  return basename(path);
}
