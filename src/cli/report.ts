/**
 * `couplet report DIR|SIDECAR [--format md|tex|json|csv|nmredata]`: per compound (a folder with
 * sidecars; id and solvent from the structure note's front matter `compound:` / `solvent:`), the SI
 * line, J table, spin systems and consistency diagnostics. The numbers come from src/core/report
 * and src/core/network; this file reads the files and prints.
 */
import { createHash } from 'node:crypto';
import { readdirSync, readFileSync } from 'node:fs';
import { basename, join } from 'node:path';
import { Option, type Command } from 'commander';
import { jTableCsv, jTableMarkdown, type NetworkSource } from '../core/network';
import { compoundReport, compoundReportJson, type CompoundReport } from '../core/report/compound';
import { nmredataRecord } from '../core/report/nmredata';
import { parseSidecar } from '../core/sidecar';
import type { Spectrum, Spectrum1D } from '../core/spectrum/spectrum';
import { labelsInMarkdown } from '../core/notes/labels';
import { readFrontMatter } from '../core/notes/frontMatter';
import { readKarplusRequests, type KarplusRequest } from '../core/notes/karplusRequests';
import { karplusMarkdown, karplusTex } from '../core/report/karplusFormat';
import { findCompounds } from './compounds';
import { nmredataOutput } from './nmredataExport';
import { EXIT_OK, InputError } from './errors';
import { SPECTRUM_EXTENSIONS, loadSpectrum, type CliIo } from './io';

export type ReportFormat = 'md' | 'tex' | 'json' | 'csv' | 'nmredata';

function readBytes(path: string): Buffer {
  try {
    return readFileSync(path);
  } catch (e) {
    throw new InputError(`${path}: cannot read file (${(e as NodeJS.ErrnoException).code ?? String(e)})`);
  }
}

function readSource(folder: string, file: string): NetworkSource {
  const text = readBytes(file).toString('utf8');
  const first = parseSidecar(text, file).sidecar;
  const dataPath = first ? join(folder, first.data.file) : null;
  const sha = dataPath ? createHash('sha256').update(readBytes(dataPath)).digest('hex') : undefined;
  const r = parseSidecar(text, file, sha ? { dataSha256: sha } : {});
  const errors = r.diagnostics.filter((d) => d.severity === 'error');
  // A report from a broken, conflicted or stale sidecar would put wrong numbers in a manuscript.
  if (!r.sidecar || errors.length > 0) {
    throw new InputError(`${file}: cannot report from this sidecar:\n${errors.map((d) => `  ${d.message}`).join('\n')}\n  (couplet check ${file} lists every problem)`);
  }
  return { file: basename(file), sidecar: r.sidecar };
}

interface NoteData { compound: string; solvent: string | null; labels: string[]; karplus: KarplusRequest[] }

function noteOf(folder: string): NoteData {
  for (const name of readdirSync(folder).sort()) {
    if (!/\.(md|markdown)$/i.test(name)) continue;
    const path = join(folder, name);
    const text = readBytes(path).toString('utf8');
    const fm = readFrontMatter(text);
    if (fm.compound === null) continue;
    // A mistyped request must not vanish from the report: stop and say where it is.
    const k = readKarplusRequests(text, path);
    if (k.problems.length > 0) throw new InputError(`${path}: cannot read the karplus requests:\n${k.problems.map((p) => `  ${p.text}`).join('\n')}`);
    return { compound: fm.compound, solvent: fm.solvent, labels: labelsInMarkdown(text.slice(fm.end)), karplus: k.requests };
  }
  return { compound: basename(folder), solvent: null, labels: [], karplus: [] };
}

function spectraOf(folder: string): { name: string; spectrum: Spectrum }[] {
  return readdirSync(folder).sort()
    .filter((n) => SPECTRUM_EXTENSIONS.some((ext) => n.toLowerCase().endsWith(ext)))
    .map((n) => ({ name: n, spectrum: loadSpectrum(join(folder, n)) }));
}

/** The report of every compound folder under the target (or of the one sidecar given). */
export function buildReports(target: string): CompoundReport[] {
  const out: CompoundReport[] = [];
  for (const [folder, files] of findCompounds(target)) {
    const sources = files.map((f) => readSource(folder, f));
    const note = noteOf(folder);
    const spectra = spectraOf(folder);
    const oneDEntry = spectra.find((s) => s.spectrum.dims === 1);
    const oneD = oneDEntry?.spectrum as Spectrum1D | undefined;
    const any = spectra[0]?.spectrum;
    const observeMhz = oneD ? oneD.axis.observeMhz : any && any.dims === 2 ? any.f2.observeMhz : Number.NaN;
    if (!Number.isFinite(observeMhz)) throw new InputError(`${folder}: no spectrum beside the sidecars gives the observe frequency`);
    out.push(compoundReport({
      compound: note.compound, sources, observeMhz, solvent: note.solvent,
      ...(oneD && oneDEntry && { spectrum1D: oneD, spectrum1DFile: oneDEntry.name }),
      ...(note.labels.length > 0 && { noteLabels: note.labels }),
      ...(note.karplus.length > 0 && { karplus: note.karplus }),
    }));
  }
  if (out.length === 0) throw new InputError(`${target}: no sidecars (*.couplet.yaml) found`);
  return out;
}

function markdownOf(r: CompoundReport): string {
  const lines = [`## ${r.compound}`, '', r.siLine.md, ''];
  // Consistency diagnostics get their own section below; the notes keep them for other callers.
  const diagnostics = new Set(r.network.diagnostics.map((d) => d.message));
  const notes = r.notes.filter((n) => !diagnostics.has(n));
  if (notes.length > 0) lines.push('Notes:', '', ...notes.map((n) => `- ${n}`), '');
  lines.push('### J values (Hz; adopted value ± sd, method)', '', jTableMarkdown(r.network));
  lines.push('### Spin systems', '', ...r.network.spinSystems.map((s, i) => `${i + 1}. ${s.join(', ')}`), '');
  lines.push('### Consistency', '');
  if (r.network.diagnostics.length === 0) lines.push('Every pair measured more than once agrees within 3 combined sd.', '');
  else lines.push(...r.network.diagnostics.map((d) => `- ${d.message}`), '');
  if (r.karplus.length > 0) lines.push(karplusMarkdown(r.karplus));
  return lines.join('\n');
}

export function formatReports(rs: readonly CompoundReport[], format: ReportFormat): string {
  switch (format) {
    case 'json': return JSON.stringify({ compounds: rs.map(compoundReportJson) }, null, 2) + '\n';
    case 'tex': return rs.map((r) => [`% ${r.compound}`, r.siLine.tex, ...r.notes.map((n) => `% ${n}`), ...(r.karplus.length > 0 ? ['', karplusTex(r.karplus).trimEnd()] : [])].join('\n') + '\n').join('\n');
    case 'csv': {
      // One header, then every compound's rows with the compound id in front.
      const tables = rs.map((r) => jTableCsv(r.network).split('\r\n').filter((l) => l !== ''));
      const header = `compound,${tables[0]?.[0] ?? ''}`;
      const rows = tables.flatMap((t, i) => t.slice(1).map((l) => `${rs[i]?.compound ?? ''},${l}`));
      return [header, ...rows].join('\r\n') + '\r\n';
    }
    case 'nmredata': return rs.map((r) => nmredataRecord(r)).join('');
    case 'md': return rs.map(markdownOf).join('\n');
  }
}

export function registerReport(program: Command, io: CliIo, setCode: (code: number) => void): void {
  program
    .command('report')
    .description('SI data line, J table, spin systems and consistency per compound (or an NMReDATA export)')
    .argument('<target>', 'a directory searched for sidecars, or one sidecar (*.couplet.yaml)')
    .addOption(new Option('--format <format>', 'md, tex, json, csv (J table) or nmredata (SD file)').choices(['md', 'tex', 'json', 'csv', 'nmredata']).default('md'))
    .action((target: string, o: { format: ReportFormat }) => {
      // NMReDATA needs more than the reports: the notes' structures (checked first), label shifts, data file names.
      io.out(o.format === 'nmredata' ? nmredataOutput(target, () => buildReports(target), io) : formatReports(buildReports(target), o.format));
      setCode(EXIT_OK);
    });
}
