/**
 * A compound's SI data for the editor, through the same core function as `couplet report`
 * (core/report/compound.ts compoundReport), so the inserted line and the CLI's line cannot differ.
 * Pure: the glue (siSource.ts) reads the sidecars, the 1D spectrum and the data files' hashes.
 */
import type { NetworkSource } from '../../core/network';
import { compoundReport, type CompoundReport } from '../../core/report/compound';
import { siSignals } from '../../core/report/siLine';
import { parseSidecar } from '../../core/sidecar';
import type { Spectrum1D } from '../../core/spectrum/spectrum';
import type { SidecarText } from './labelIndex';
import type { NoteLanguage } from './siRegion';

export interface CompoundInput {
  readonly compound: string;
  readonly sidecars: readonly SidecarText[];
  /** The folder's 1D ¹H spectrum, parsed; absent when there is none. */
  readonly spectrum1D?: Spectrum1D;
  /** Its file name (e.g. `1h.jdx`), so 1D splittings are attributed to it in the network. */
  readonly spectrum1DFile?: string;
  /** Observe frequency from a data file's header, used when there is no 1D spectrum. */
  readonly observeMhz?: number;
  readonly solvent: string | null;
  readonly noteLabels: readonly string[];
  /**
   * SHA-256 of each sidecar's data file (by sidecar file name). Given (the insert command), a
   * sidecar with any error, a stale hash included, stops the line, as in `couplet report`: wrong
   * numbers must not reach a manuscript. Absent (the hover), unreadable sidecars are skipped.
   */
  readonly dataHashes?: ReadonlyMap<string, string>;
}

/** The readable sidecars as network sources, and the errors of the others. */
export function readSources(sidecars: readonly SidecarText[], dataHashes?: ReadonlyMap<string, string>): { sources: NetworkSource[]; errors: string[] } {
  const sources: NetworkSource[] = [];
  const errors: string[] = [];
  for (const f of sidecars) {
    const sha = dataHashes?.get(f.fileName);
    const { sidecar, diagnostics } = parseSidecar(f.text, f.fileName, sha ? { dataSha256: sha } : {});
    const bad = diagnostics.filter((d) => d.severity === 'error');
    if (sidecar === null || (dataHashes && bad.length > 0)) {
      errors.push(...(bad.length > 0 ? bad.map((d) => d.message) : [`${f.fileName}: cannot be read as a sidecar`]));
      continue;
    }
    sources.push({ file: f.fileName, sidecar });
  }
  return { sources, errors };
}

export function compoundSi(input: CompoundInput): CompoundReport {
  const { sources, errors } = readSources(input.sidecars, input.dataHashes);
  if (input.dataHashes && errors.length > 0) throw new Error(`not writing SI data from a sidecar with errors: ${errors.join('; ')}`);
  if (sources.length === 0) throw new Error(`no readable sidecar (*.couplet.yaml) beside the ${input.compound} note${errors.length ? `: ${errors.join('; ')}` : ''}`);
  const observeMhz = input.spectrum1D?.axis.observeMhz ?? input.observeMhz;
  if (observeMhz === undefined || !(observeMhz > 0)) throw new Error(`no spectrum beside the ${input.compound} sidecars gives the observe frequency`);
  return compoundReport({
    compound: input.compound, sources, observeMhz, solvent: input.solvent,
    ...(input.spectrum1D && { spectrum1D: input.spectrum1D }),
    ...(input.spectrum1D && input.spectrum1DFile !== undefined && { spectrum1DFile: input.spectrum1DFile }),
    ...(input.noteLabels.length > 0 && { noteLabels: input.noteLabels }),
  });
}

/** The line in the note's format, and every note the report made (flagged values, gaps). */
export function siText(r: CompoundReport, lang: NoteLanguage): { line: string; notes: string[] } {
  return { line: lang === 'latex' ? r.siLine.tex : r.siLine.md, notes: [...r.notes] };
}

/** Multiplicity per label as the SI line writes it (e.g. `dd`, `br d`, `m`). */
export function multiplicities(r: CompoundReport): Map<string, string> {
  return new Map(siSignals(r.derived.entries).flatMap((s) => s.labels.map((l) => [l, s.multiplicity] as const)));
}
