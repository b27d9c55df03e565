/** Paths to the shared check files and small test-only helpers (no expected values in here). */
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { JcampError } from '../../../src/core/jcamp';

/** Repository root, from this file's location (test/core/jcamp). */
const REPO_ROOT = path.resolve(__dirname, '..', '..', '..');

/** A file under ../shared/checks beside the repository (the CI clone has the same layout). */
export function checkPath(...parts: string[]): string {
  return path.resolve(REPO_ROOT, '..', 'shared', 'checks', ...parts);
}

export function readCheck(...parts: string[]): string {
  // JCAMP-DX is ASCII; latin1 keeps one character per byte.
  return readFileSync(checkPath(...parts), 'latin1');
}

/** Run f, which must throw a JcampError; return it for assertions. */
export function jcampErrorOf(f: () => unknown): JcampError {
  try {
    f();
  } catch (e) {
    if (e instanceof JcampError) return e;
    throw new Error(`expected a JcampError, got ${String(e)}`);
  }
  throw new Error('expected a JcampError, nothing was thrown');
}

/** Seeded uniform numbers in [0, 1) (mulberry32), so test data is the same on every run. */
export function seeded(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Value of the first `##LABEL=` line in a text (test-side, independent of the reader's tokenizer). */
export function headerValue(text: string, label: string): string | undefined {
  const re = new RegExp(`^\\s*##${label}\\s*=([^\\r\\n]*)`, 'm');
  const m = re.exec(text);
  return m?.[1]?.replace(/\$\$.*$/, '').trim();
}

/**
 * A hand-written 1D file whose data decode by hand (ASDF rules, McDonald & Wilks 1988 [from memory])
 * to 1 2 3 3 2 1 0 -1 -2 -3 at X = 10.0 ... 1.0 Hz; one entry per line, line numbers in the comments.
 */
export const TINY_1D: readonly string[] = [
  '##TITLE= tiny', //                       1
  '##JCAMP-DX= 5.01', //                    2
  '##DATA TYPE= NMR SPECTRUM', //           3
  '##ORIGIN= hand-written test fixture', // 4
  '##OWNER= public domain', //              5
  '##.OBSERVE FREQUENCY= 400.0', //         6
  '##XUNITS= HZ', //                        7
  '##YUNITS= ARBITRARY UNITS', //           8
  '##XFACTOR= 1', //                        9
  '##YFACTOR= 1', //                       10
  '##FIRSTX= 10.0', //                     11
  '##LASTX= 1.0', //                       12
  '##NPOINTS= 10', //                      13
  '##FIRSTY= 1', //                        14
  '##XYDATA= (X++(Y..Y))', //              15
  '10.0AJT%j', //                          16
  '6.0BjW', //                             17
  '1.0c', //                               18
  '##END=', //                             19
];
