/**
 * Everything `couplet report` and the editor's insert command say about one compound, from data
 * the caller has already read (core does no I/O): the parsed sidecars, the 1D spectrum if any, the
 * structure note's labels and solvent.
 */
import { buildNetwork, type CouplingNetwork, type NetworkSource } from '../network/network';
import { SCHEMA_ID, type Sidecar } from '../sidecar/types';
import type { Spectrum1D } from '../spectrum/spectrum';
import type { KarplusRequest } from '../notes/karplusRequests';
import { karplusJson } from './karplusFormat';
import { karplusEstimates, type KarplusEstimate } from './karplusReport';
import { deriveSiEntries, oneDDisagreements, type DerivedSi } from './siEntries';
import { formatSiLine, siLineJson, siNotes, type SiHeader } from './siLine';

export interface CompoundInput {
  compound: string;
  sources: readonly NetworkSource[];
  spectrum1D?: Spectrum1D;
  /** ¹H frequency, MHz (from the 1D or the COSY file). */
  observeMhz: number;
  /** From the note's front matter `solvent:`; null when not given. */
  solvent: string | null;
  noteLabels?: readonly string[];
  /** Name of the 1D data file, shown as the source of 1D splittings (default `1D spectrum`). */
  spectrum1DFile?: string;
  /** Pairs the note's front matter asks dihedral estimates for (`karplus:`). */
  karplus?: readonly KarplusRequest[];
}

export interface CompoundReport {
  compound: string;
  header: SiHeader;
  network: CouplingNetwork;
  derived: DerivedSi;
  siLine: { md: string; tex: string };
  /** What the line did with flagged values, plus derivation notes: never silent. */
  notes: string[];
  /** Dihedral estimates for the requested pairs, from the adopted J (empty when none requested). */
  karplus: KarplusEstimate[];
}

/** Written in place of the solvent when the note names none, so the gap is visible in the SI. */
export const SOLVENT_MISSING = 'solvent?';

export function compoundReport(input: CompoundInput): CompoundReport {
  const derive = (network: CouplingNetwork): DerivedSi => deriveSiEntries({
    network, sources: input.sources,
    ...(input.spectrum1D && { spectrum1D: input.spectrum1D }),
    ...(input.noteLabels && { noteLabels: input.noteLabels }),
  });
  let network = buildNetwork(input.sources);
  let derived = derive(network);
  // Second pass: the 1D splittings join the network as measurements, so they are checked against the
  // cross-peak values (3 combined sd) and weighted into the adopted J like any other measurement.
  if (derived.oneD.length > 0) {
    const file = `${input.spectrum1DFile ?? '1D spectrum'} (1D multiplets)`;
    const oneD: Sidecar = { schema: SCHEMA_ID, data: { file, sha256: '0'.repeat(64) }, picks: [], couplings: derived.oneD };
    network = buildNetwork([...input.sources, { file, sidecar: oneD }]);
    derived = derive(network);
  }
  const header: SiHeader = { observeMhz: input.observeMhz, solvent: input.solvent ?? SOLVENT_MISSING };
  const notes = [
    ...(input.solvent === null ? ['no solvent: add `solvent: CDCl3` (or the one used) to the structure note\'s front matter.'] : []),
    ...siNotes(derived.entries),
    ...derived.notes,
    ...network.diagnostics.map((d) => d.message),
  ];
  return {
    compound: input.compound, header, network, derived,
    siLine: { md: formatSiLine(header, derived.entries, 'md'), tex: formatSiLine(header, derived.entries, 'tex') },
    notes,
    karplus: karplusEstimates(input.karplus ?? [], network, oneDDisagreements(derived)),
  };
}

/** JSON form (snake_case keys, stable). */
export function compoundReportJson(r: CompoundReport): Record<string, unknown> {
  return {
    compound: r.compound,
    si: siLineJson(r.header, r.derived.entries),
    si_tex: r.siLine.tex,
    proton_unit: r.derived.protonUnit,
    spin_systems: r.network.spinSystems,
    couplings: r.network.pairs.map((p) => ({
      atoms: p.atoms, j_hz: p.adopted.jHz, j_sd_hz: p.adopted.sdHz, method: p.adopted.method, flags: p.adopted.flags,
      source: p.adopted.source, consistent: p.consistent,
      measurements: p.measurements.map((m) => ({ j_hz: m.jHz, j_sd_hz: m.sdHz, method: m.method, dimension: m.dimension, flags: m.flags, file: m.file, picks: m.picks })),
    })),
    diagnostics: r.network.diagnostics.map((d) => ({ severity: d.severity, code: d.code, atoms: d.atoms, message: d.message })),
    notes: r.notes,
    ...(r.karplus.length > 0 && { karplus: karplusJson(r.karplus) }),
  };
}
