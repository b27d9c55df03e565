/**
 * Export of a compound's assignments and J values as an NMReDATA record: an SD record whose molfile
 * is the compound's structure, followed by NMREDATA_* tags. Layout checked against the NMReDATA tag
 * format 1.1 (NMReDATA Initiative wiki, nmredata.org, pages "NMReDATA tag format", "1D attributes",
 * "2D attributes", "Separator", "End-of-line") and Pupier et al., Magn. Reson. Chem. 56 (2018) 703.
 *
 * Choices the format leaves to the writer:
 * - J values are magnitudes: a DQF-COSY antiphase splitting or a 1D line spacing does not give the
 *   sign ("NMREDATA_J": "otherwise the absolute values are listed");
 * - sd, method and quality flags of a J value go into a `;` comment (the format has no field for
 *   them); flagged values carry "CAUTION …" there, and second-order or overlapping 1D signals are
 *   `S=m` with their range ("1D attributes", S=);
 * - NMREDATA_LEVEL is 0: Couplet's assignments are unambiguous labels (levels 1-3 are for
 *   interchangeable or ambiguous assignments, not for uncertain values);
 * - without a structure the molfile is empty and NMREDATA_ASSIGNMENT is left out (its lines must
 *   name atoms); shifts stay in NMREDATA_1D_1H and J in NMREDATA_J, and NMREDATA_ID says the record
 *   is incomplete;
 * - Spectrum_Location (the spectrometer's own data, required by the format) is unknown to Couplet;
 *   the JCAMP-DX files are named with the wiki's draft `Jcamp_location=file:` line and NMREDATA_ID
 *   says what is missing;
 * - NMREDATA_TEMPERATURE is written only when known (Couplet does not know it yet).
 */
import { bondsBetween, formulaOf, type Molfile } from '../structure/molfile';
import type { PairEntry } from '../network/network';
import { siSignals, type SiSignal } from './siLine';
import type { CompoundReport } from './compound';
import { SEP, emptyMolfile, hzText, jComment, labelText, ppmText, sdTag, withComment } from './nmredataFormat';

export interface NmredataStructure {
  readonly molfile: Molfile;
  /** Label -> 1-based numbers of its H atoms in the molfile (checked by checkAtomMap). */
  readonly atoms: ReadonlyMap<string, readonly number[]>;
  /** The molfile's name, for comments. */
  readonly file: string;
}

export interface NmredataInput {
  readonly report: CompoundReport;
  /** Shift of each label, ppm (atomShifts of the sidecars); a label without one takes its signal's shift. */
  readonly shifts?: ReadonlyMap<string, number>;
  readonly structure?: NmredataStructure;
  /** Data file names relative to the compound folder (for Jcamp_location=). */
  readonly files?: { readonly oneD?: string; readonly cosy?: string };
  /** Temperature in K, when known. */
  readonly temperatureK?: number;
}

export interface NmredataExport {
  readonly record: string;
  /** What the record lacks or flags, for the user (stderr); also written into NMREDATA_ID. */
  readonly notes: string[];
}

const absJ = (p: PairEntry): number => Math.abs(p.adopted.jHz);

/** NMREDATA_ASSIGNMENT ("Agregated data tags"): `label, shift, atom, atom…`, one line per mapped label. */
function assignmentLines(input: NmredataInput, signals: readonly SiSignal[], notes: string[]): string[] {
  const s = input.structure;
  if (!s) return [];
  const rows: { ppm: number; line: string }[] = [];
  const missing: string[] = [];
  for (const sig of signals) {
    for (const label of sig.labels) {
      const atoms = s.atoms.get(label);
      const ppm = input.shifts?.get(label) ?? sig.ppm;
      if (!atoms) missing.push(label);
      else rows.push({ ppm, line: [labelText(label), ppmText(ppm), ...atoms.map(String)].join(SEP) });
    }
  }
  // Each label's own shift, descending (a multi-label signal's members need not be in shift order).
  const lines = rows.sort((a, b) => b.ppm - a.ppm).map((r) => r.line);
  if (missing.length > 0) notes.push(`no atom numbers for ${missing.join(', ')}: left out of NMREDATA_ASSIGNMENT (add them under atoms: in the structure note).`);
  return lines;
}

/** Long-range (4 or more bonds) H,H couplings rarely exceed this (handbook ranges: allylic, W-type 1-3 Hz [mem]). */
const LONG_RANGE_MAX_HZ = 3;

/**
 * NMREDATA_J: `a, b, J[, nb=n]` with `nb=` (bonds between the two H atoms) when the structure gives it.
 * A large J across four or more bonds more likely means a wrong label than a real coupling: flagged.
 */
function jLines(input: NmredataInput, notes: string[]): string[] {
  const implausible: string[] = [];
  const lines = input.report.network.pairs.map((p) => {
    const [a, b] = p.atoms;
    const fields = [labelText(a), labelText(b), hzText(absJ(p))];
    const ha = input.structure?.atoms.get(a)?.[0];
    const hb = input.structure?.atoms.get(b)?.[0];
    const nb = input.structure && ha !== undefined && hb !== undefined ? bondsBetween(input.structure.molfile, ha, hb) : null;
    if (nb !== null) fields.push(`nb=${nb}`);
    const flags = [...p.adopted.flags];
    if (nb !== null && nb >= 4 && absJ(p) > LONG_RANGE_MAX_HZ) {
      flags.push(`implausible_for_${nb}_bonds`);
      implausible.push(`${a}/${b} (${hzText(absJ(p))} Hz across ${nb} bonds)`);
    }
    return withComment(fields.join(SEP), jComment(p.adopted.sdHz, p.adopted.method, flags));
  });
  if (implausible.length > 0) {
    notes.push(`J larger than ${LONG_RANGE_MAX_HZ} Hz across four or more bonds in the structure: ${implausible.join(', ')}; check the labels of these cross peaks.`);
  }
  return lines;
}

/** "1D attributes": S= apparent multiplicity (s d t q … bs m); `br` is not one of its letters. */
function multiplicityText(m: string): string {
  if (m === 'br s') return 'bs';
  return m.replace(/^br /, '');
}

/** One NMREDATA_1D_1H signal: shift (or range), then S=, J=, N=, L=, E= in the order "1D attributes" asks. */
function signalLine(sig: SiSignal, input: NmredataInput): string {
  const r = input.report;
  const range = sig.multiplicity === 'm' && sig.rangePpm;
  const fields = [range ? `${ppmText(sig.rangePpm?.[0] ?? sig.ppm)}-${ppmText(sig.rangePpm?.[1] ?? sig.ppm)}` : ppmText(sig.ppm)];
  fields.push(`S=${multiplicityText(sig.multiplicity)}`);
  const label = sig.labels[0];
  if (sig.labels.length === 1 && label !== undefined && sig.couplings.length > 0) {
    // Assigned couplings: J(label, partner) from the coupling network, "J=9.32(b), 4.80(c)".
    // One value per letter ("S=td, J=9.30, 4.81": the first makes the triplet); assigned when the
    // splitting has one partner; several equivalent partners stay unassigned (their J are in NMREDATA_J).
    const js = sig.couplings.map((c) => {
      const partner = c.partners.length === 1 ? c.partners[0] : undefined;
      const pair = partner === undefined ? undefined : r.network.pairs.find((p) => p.atoms.includes(label) && p.atoms.includes(partner));
      return partner === undefined ? hzText(c.jHz) : `${hzText(pair ? absJ(pair) : c.jHz)}(${labelText(partner)})`;
    });
    if (js.length > 0) fields.push(`J=${js.join(SEP)}`);
  }
  fields.push(`N=${sig.protons}`, `L=${sig.labels.map(labelText).join(SEP)}`);
  const derived = r.derived.signals.find((g) => g.labels.join('\u0000') === sig.labels.join('\u0000'));
  if (derived?.integral != null && r.derived.protonUnit !== null && r.derived.protonUnit > 0) {
    // E= is the measured integral, not rounded (scaled so that one proton is 1.00).
    fields.push(`E=${hzText(derived.integral / r.derived.protonUnit)}`);
  }
  const comment = [sig.multiplicity.startsWith('br ') ? 'broad' : '', ...sig.notes.map((n) => n.replace(/^[^:]*: /, ''))].filter((x) => x !== '').join(' ');
  return withComment(fields.join(SEP), comment === '' ? null : comment);
}

/** The value a DQF-COSY gave for the pair (Ja): the adopted one, or the best cross-peak measurement when a 1D value joined it. */
function cosyValue(p: PairEntry): { jHz: number; sdHz: number; method: string; flags: string[] } | null {
  const cosy = p.measurements.filter((m) => m.method !== '1d');
  if (cosy.length === 0) return null;
  if (cosy.length === p.measurements.length) return { jHz: absJ(p), sdHz: p.adopted.sdHz, method: p.adopted.method, flags: p.adopted.flags };
  const pool = cosy.some((m) => m.method !== 'naive') ? cosy.filter((m) => m.method !== 'naive') : cosy;
  const best = pool.reduce((a, b) => (b.sdHz < a.sdHz ? b : a));
  return { jHz: Math.abs(best.jHz), sdHz: best.sdHz, method: best.method, flags: best.flags };
}

/** The wiki's draft line for a JCAMP-DX copy of the spectrum (path relative to the compound folder). */
function location(file: string | undefined): string[] {
  return file === undefined ? [] : [`Jcamp_location=file:./${file}`];
}

/** NMREDATA_2D_1H_NJ_1H ("Naming tags for nD": COSY/DQF-COSY): `a/b, Ja=…` per measured pair. */
function cosyTag(input: NmredataInput): string {
  const r = input.report;
  const lines = r.network.pairs.flatMap((p) => {
    const v = cosyValue(p);
    // A COSY is symmetric: both a/b and b/a cross peaks exist, so the pair's order is a valid F1/F2 order.
    return v ? [withComment(`${labelText(p.atoms[0])}/${labelText(p.atoms[1])}${SEP}Ja=${hzText(v.jHz)}`, jComment(v.sdHz, v.method, v.flags))] : [];
  });
  return sdTag('NMREDATA_2D_1H_NJ_1H', [
    `Larmor=${hzText(r.header.observeMhz)}`,
    // CorType's list is tentative in the wiki; "COSY" is in it, the DQF variant goes into the comment.
    'CorType=COSY ;phase-sensitive DQF-COSY',
    ...location(input.files?.cosy),
    ...lines,
  ]);
}

function idTag(r: CompoundReport, notes: readonly string[]): string {
  return sdTag('NMREDATA_ID', [`Title=${r.compound}`, ...notes.map((n, i) => `Comment${i === 0 ? '' : String(i)}=${n.replace(/[\\\n\r;]/g, ',')}`)]);
}

/** One SD record (ends with `$$$$`) and the notes on what it lacks; records concatenate into one SD file. */
export function nmredataExport(input: NmredataInput): NmredataExport {
  const r = input.report;
  const notes: string[] = [];
  if (!input.structure) notes.push('incomplete: no structure (add structure: and atoms: to the structure note), so the molfile is empty and NMREDATA_ASSIGNMENT is left out.');
  const signals = siSignals(r.derived.entries);
  const assignment = assignmentLines(input, signals, notes);
  const js = jLines(input, notes);
  notes.push('Spectrum_Location (the spectrometer data the format requires) is not known to Couplet: add it to the NMREDATA_1D_1H and NMREDATA_2D_1H_NJ_1H tags.');
  const solventKnown = !r.header.solvent.endsWith('?');
  if (!solventKnown) notes.push('no solvent in the structure note (solvent: CDCl3 or the one used): NMREDATA_SOLVENT left out.');
  const flagged = r.network.pairs.filter((p) => p.adopted.flags.length > 0).map((p) => `${p.atoms[0]}/${p.atoms[1]}`);
  if (flagged.length > 0) notes.push(`flagged J values, marked CAUTION in the comments (check them before using them for an assignment): ${flagged.join(', ')}.`);
  let out = input.structure ? input.structure.molfile.text : emptyMolfile(r.compound);
  out += sdTag('NMREDATA_VERSION', ['1.1']);
  out += sdTag('NMREDATA_LEVEL', ['0']);
  out += idTag(r, notes);
  if (input.structure) out += sdTag('NMREDATA_FORMULA', [formulaOf(input.structure.molfile)]);
  if (solventKnown) out += sdTag('NMREDATA_SOLVENT', [r.header.solvent]);
  if (input.temperatureK !== undefined) out += sdTag('NMREDATA_TEMPERATURE', [`${input.temperatureK.toFixed(1)} K`]);
  if (assignment.length > 0) out += sdTag('NMREDATA_ASSIGNMENT', assignment);
  if (js.length > 0) out += sdTag('NMREDATA_J', js);
  out += sdTag('NMREDATA_1D_1H', [
    withComment(`Larmor=${hzText(r.header.observeMhz)}`, input.files && input.files.oneD === undefined ? 'no 1D spectrum: signals derived from the DQF-COSY' : null),
    ...location(input.files?.oneD),
    ...signals.map((s) => signalLine(s, input)),
  ]);
  if (r.network.pairs.some((p) => cosyValue(p) !== null)) out += cosyTag(input);
  return { record: `${out}$$$$\n`, notes };
}

/** The record alone (no structure unless given); kept for callers that only want the text. */
export function nmredataRecord(r: CompoundReport, opts: Omit<NmredataInput, 'report'> = {}): string {
  return nmredataExport({ report: r, ...opts }).record;
}

