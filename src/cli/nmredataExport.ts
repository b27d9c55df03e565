/**
 * `couplet report --format nmredata`: the NMReDATA SD file of every compound, with the structure its
 * note names (`structure:`, `atoms:`), the label shifts from the sidecars and the data file names.
 * What a record lacks (no structure, labels without atom numbers, Spectrum_Location) goes to stderr too.
 */
import { closeSync, openSync, readFileSync, readSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import type { NetworkSource } from '../core/network';
import { readFrontMatter } from '../core/notes/frontMatter';
import { nmredataExport } from '../core/report/nmredata';
import { atomShifts } from '../core/report/siEntries';
import { parseSidecar } from '../core/sidecar';
import { findCompounds, readNoteStructure } from './compounds';
import { SPECTRUM_EXTENSIONS, type CliIo } from './io';
import type { CompoundReport } from '../core/report/compound';

/** JCAMP-DX 2D files are NTUPLES (##DATA CLASS= NTUPLES); the header tells, without reading the data. */
function isTwoD(path: string): boolean {
  const fd = openSync(path, 'r');
  try {
    const buf = Buffer.alloc(16384);
    const n = readSync(fd, buf, 0, buf.length, 0);
    return /##DATA\s*CLASS\s*=\s*NTUPLES/i.test(buf.subarray(0, n).toString('latin1'));
  } finally {
    closeSync(fd);
  }
}

function dataFiles(folder: string): { oneD?: string; cosy?: string } {
  const names = readdirSync(folder).sort().filter((n) => SPECTRUM_EXTENSIONS.some((ext) => n.toLowerCase().endsWith(ext)));
  const oneD = names.find((n) => !isTwoD(join(folder, n)));
  const cosy = names.find((n) => isTwoD(join(folder, n)));
  return { ...(oneD !== undefined && { oneD }), ...(cosy !== undefined && { cosy }) };
}

/** The folder's structure note: the first markdown file whose front matter names a compound (as buildReports picks it). */
function noteIn(folder: string): { path: string; text: string } | null {
  for (const name of readdirSync(folder).sort()) {
    if (!/\.(md|markdown)$/i.test(name)) continue;
    const path = join(folder, name);
    const text = readFileSync(path, 'utf8');
    if (readFrontMatter(text).compound !== null) return { path, text };
  }
  return null;
}

/**
 * The SD file for the target; notes go to io.err prefixed with the compound id. `build` is
 * buildReports(target): it validates every sidecar and yields one report per folder of
 * findCompounds(target), in that order. The notes' structures are read and checked before it runs,
 * so a mistyped atom number stops the export at once.
 */
export function nmredataOutput(target: string, build: () => readonly CompoundReport[], io: CliIo): string {
  const folders = [...findCompounds(target)].map(([folder, files]) => {
    const note = noteIn(folder);
    return { folder, files, structure: note ? readNoteStructure(note.path, note.text) : null };
  });
  return build().map((report, i) => {
    const { folder, files, structure } = folders[i] ?? { folder: '.', files: [], structure: null };
    const sources: NetworkSource[] = files.flatMap((f) => {
      const sidecar = parseSidecar(readFileSync(f, 'utf8'), f).sidecar;
      return sidecar ? [{ file: f, sidecar }] : [];
    });
    const out = nmredataExport({
      report, shifts: atomShifts(sources), files: dataFiles(folder),
      ...(structure && { structure }),
    });
    for (const n of out.notes) io.err(`${report.compound}: ${n}\n`);
    return out.record;
  }).join('');
}
