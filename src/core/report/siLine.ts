/**
 * The ¹H NMR data line of a Supporting Information, in the usual journal style (common practice,
 * ../shared/checks/references.md): `¹H NMR (600 MHz, CDCl₃) δ 4.12 (dd, J = 10.2, 4.5 Hz, 1H, H-3), …`
 *
 * - shifts to 0.01 ppm, entries in descending shift order (by the entry's `ppm`);
 * - multiplicity letters from the resolved coupling groups, largest J first (d, t, q, p for 1–4
 *   equivalent partners: "td" is a triplet of the larger J, then a doublet); the J list follows the
 *   letters, to 0.1 Hz, as magnitudes (a 1D line spacing does not show the sign);
 * - `m` with a shift range when the entry is marked multiplet (unresolved, overlapping or second order);
 * - `br` in front when a coupling is flagged unresolved (policy, see below) or the entry is broad;
 * - proton count from the integral, then the atom label(s).
 *
 * Flagged values (our choice, stated once here and in the returned notes): a coupling flagged
 * `unresolved` is NOT written to 0.1 Hz: it is left out of the letters and the J list and the
 * entry gets `br` ("br d, J = 8.4 Hz"), with a note naming the pair. An entry flagged
 * `second-order` (or `second_order_suspected`) is written `m` with its range and no J, with a note.
 */
import { toFixedDecimal } from '../sidecar/decimal';

export type SiFormat = 'md' | 'tex';

/** One resolved splitting: `count` equivalent partners with the same J (1 → d, 2 → t, 3 → q, 4 → p). */
export interface SiCoupling {
  jHz: number;
  sdHz?: number;
  count?: number;
  /** The partner label(s), for notes and JSON. */
  partners?: string[];
  /** e.g. `unresolved`: see the module comment for what the line does with it. */
  flags?: string[];
}

export interface SiEntry {
  /** Atom labels of this signal (one, or several equivalent/overlapping ones). */
  labels: string[];
  /** Centre of the signal, ppm. */
  ppm: number;
  /** Shift range [high, low] of the signal, ppm: written for `m`. */
  rangePpm?: [number, number];
  /** Force `m` (overlap, unresolved) regardless of the couplings. */
  multiplet?: boolean;
  /** Broad signal (exchange, unresolved small couplings). */
  broad?: boolean;
  couplings: SiCoupling[];
  /** Protons from the integral (a whole number). */
  protons: number;
  /** Entry-level flags, e.g. `second-order`. */
  flags?: string[];
}

export interface SiHeader {
  /** Spectrometer ¹H frequency, MHz (written rounded to a whole number: 600.13 → 600). */
  observeMhz: number;
  /** Solvent as typed, e.g. `CDCl3`; digits become subscripts. */
  solvent: string;
}

/** A signal as written: the parts of one parenthesis, ready for any output format. */
export interface SiSignal {
  labels: string[];
  ppm: number;
  /** `7.26` or `3.62–3.50` (ASCII hyphen-minus never; en dash in md, `--` in tex). */
  shift: string;
  rangePpm: [number, number] | null;
  multiplicity: string;
  /** J values as written (0.1 Hz), in the order of the multiplicity letters. */
  j: string[];
  /** The J values and σ behind `j`, same order. */
  couplings: { jHz: number; sdHz: number | null; count: number; partners: string[] }[];
  protons: number;
  notes: string[];
}

const LETTERS = ['', 'd', 't', 'q', 'p'];
const SECOND_ORDER = new Set(['second-order', 'second_order_suspected']);
const SUBSCRIPT = '₀₁₂₃₄₅₆₇₈₉';

function shiftText(x: number): string {
  return toFixedDecimal(x, 2);
}

/** Builds the written form of each entry, sorted by shift, descending. */
export function siSignals(entries: readonly SiEntry[]): SiSignal[] {
  entries.forEach(checkEntry);
  return [...entries].sort((a, b) => b.ppm - a.ppm).map(signalOf);
}

function checkEntry(e: SiEntry, i: number): void {
  const where = `SI entry ${i} (${e.labels.join(', ') || 'no label'})`;
  if (e.labels.length === 0) throw new RangeError(`${where}: labels is empty`);
  if (!Number.isFinite(e.ppm)) throw new RangeError(`${where}: ppm must be finite, got ${e.ppm}`);
  if (!Number.isInteger(e.protons) || e.protons < 1) throw new RangeError(`${where}: protons must be a whole number >= 1, got ${e.protons}`);
  e.couplings.forEach((c, k) => {
    if (!Number.isFinite(c.jHz)) throw new RangeError(`${where}: couplings[${k}].jHz must be finite, got ${c.jHz}`);
    const n = c.count ?? 1;
    if (!Number.isInteger(n) || n < 1) throw new RangeError(`${where}: couplings[${k}].count must be a whole number >= 1, got ${n}`);
  });
}

function signalOf(e: SiEntry): SiSignal {
  const notes: string[] = [];
  const who = e.labels.join(', ');
  const secondOrder = (e.flags ?? []).some((f) => SECOND_ORDER.has(f));
  const resolved = e.couplings.filter((c) => !(c.flags ?? []).includes('unresolved'));
  for (const c of e.couplings) {
    if (resolved.includes(c)) continue;
    notes.push(`${who}: J to ${(c.partners ?? ['a partner']).join(', ')} is unresolved (${toFixedDecimal(Math.abs(c.jHz), 1)} Hz measured); left out of the multiplicity, signal marked br.`);
  }
  const sorted = [...resolved].sort((a, b) => Math.abs(b.jHz) - Math.abs(a.jHz));
  const tooMany = sorted.some((c) => (c.count ?? 1) >= LETTERS.length);
  const asM = e.multiplet === true || secondOrder || tooMany;
  if (secondOrder) notes.push(`${who}: possible second-order pattern; written as m without J (line spacings need not be couplings).`);
  if (tooMany) notes.push(`${who}: more than four equivalent partners; written as m.`);
  const range = e.rangePpm ? ([Math.max(...e.rangePpm), Math.min(...e.rangePpm)] as [number, number]) : null;
  const broad = e.broad === true || resolved.length < e.couplings.length;
  let letters = asM ? 'm' : sorted.map((c) => LETTERS[c.count ?? 1] ?? '').join('') || 's';
  if (broad) letters = `br ${letters}`;
  const shown = asM ? [] : sorted;
  return {
    labels: [...e.labels],
    ppm: e.ppm,
    shift: asM && range ? `${shiftText(range[0])}–${shiftText(range[1])}` : shiftText(e.ppm),
    rangePpm: range,
    multiplicity: letters,
    j: shown.map((c) => toFixedDecimal(Math.abs(c.jHz), 1)),
    couplings: shown.map((c) => ({ jHz: Math.abs(c.jHz), sdHz: c.sdHz ?? null, count: c.count ?? 1, partners: c.partners ?? [] })),
    protons: e.protons,
    notes,
  };
}

function subscriptDigits(s: string, format: SiFormat): string {
  if (format === 'tex') return s.replace(/\d+/g, (d) => `$_{${d}}$`);
  return s.replace(/\d/g, (d) => SUBSCRIPT[Number(d)] ?? d);
}

function signalText(s: SiSignal, format: SiFormat): string {
  const parts = [s.multiplicity];
  if (s.j.length > 0) {
    parts.push(format === 'tex' ? `\\textit{J} = ${s.j.join(', ')}\\,Hz` : `J = ${s.j.join(', ')} Hz`);
  }
  parts.push(`${s.protons}H`, s.labels.join(', '));
  const shift = format === 'tex' ? s.shift.replace('–', '--') : s.shift;
  return `${shift} (${parts.join(', ')})`;
}

/** The full line, e.g. `¹H NMR (600 MHz, CDCl₃) δ 7.26 (d, J = 8.4 Hz, 2H, H-2), …` (md is plain Unicode). */
export function formatSiLine(header: SiHeader, entries: readonly SiEntry[], format: SiFormat = 'md'): string {
  if (!(header.observeMhz > 0)) throw new RangeError(`observe frequency must be positive, got ${header.observeMhz} MHz`);
  if (header.solvent.trim() === '') throw new RangeError('solvent is empty');
  const signals = siSignals(entries).map((s) => signalText(s, format)).join(', ');
  const mhz = Math.round(header.observeMhz);
  const solvent = subscriptDigits(header.solvent.trim(), format);
  if (format === 'tex') return `$^{1}$H NMR (${mhz}\\,MHz, ${solvent}) $\\delta$ ${signals}.`;
  return `¹H NMR (${mhz} MHz, ${solvent}) δ ${signals}.`;
}

/** Every note (flagged values and what the line did with them), in the line's order. */
export function siNotes(entries: readonly SiEntry[]): string[] {
  return siSignals(entries).flatMap((s) => s.notes);
}

/** JSON form: header, the signals as written and the numbers behind them (snake_case keys, stable). */
export function siLineJson(header: SiHeader, entries: readonly SiEntry[]): Record<string, unknown> {
  return {
    nucleus: '1H',
    observe_mhz: header.observeMhz,
    solvent: header.solvent,
    line: formatSiLine(header, entries, 'md'),
    signals: siSignals(entries).map((s) => ({
      labels: s.labels,
      ppm: Number(toFixedDecimal(s.ppm, 4)),
      shift: s.shift,
      range_ppm: s.rangePpm,
      multiplicity: s.multiplicity,
      j_hz: s.couplings.map((c) => Number(toFixedDecimal(c.jHz, 2))),
      j_sd_hz: s.couplings.map((c) => (c.sdHz === null ? null : Number(toFixedDecimal(c.sdHz, 2)))),
      j_partners: s.couplings.map((c) => c.partners),
      protons: s.protons,
      notes: s.notes,
    })),
  };
}
