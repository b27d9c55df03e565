/**
 * SiEntry[] for a compound from what Couplet records: atom shifts from the sidecars' picks, J from
 * the coupling network (adopted values), proton counts and observed second-order patterns from
 * the 1D spectrum, and the structure note's labels. Choices, stated once:
 * - shift of an atom: the mean of its one-label picks (1D multiplet, diagonal); for atoms without
 *   one, the mean of the cross peaks' F2 or F1 positions of that atom's label;
 * - signals: atoms whose shift falls in the same 1D multiplet (or the chemist's region) are one
 *   signal (`m` with the range); see signals1D.ts;
 * - proton counts: integral / unit, the unit from the chemist's integral reference pick, else the
 *   largest per-proton integral that makes every signal whole within 0.2 (protonUnit); without a
 *   1D spectrum every atom counts 1;
 * - J of one atom to partners within 0.5 Hz of each other (about a linewidth, so the 1D shows one
 *   splitting) are one group: "t, J = 7.0 Hz" instead of "dd, J = 7.1, 6.9 Hz";
 * - a coupling flagged second_order_suspected, or a 1D multiplet that analyseMultiplet flags
 *   second-order, makes the signal `m` with its range (siLine.ts writes no J for it).
 */
import type { CouplingNetwork, NetworkSource } from '../network/network';
import type { Coupling } from '../sidecar/types';
import type { Spectrum1D } from '../spectrum/spectrum';
import { analyseMultiplet, jAgree, type KnownPartner, type MultipletAnalysis } from './multiplet';
import { integralUnit, signalsFrom, type DerivedSignal } from './signals1D';
import type { SiCoupling, SiEntry } from './siLine';

export interface DeriveInput {
  network: CouplingNetwork;
  sources: readonly NetworkSource[];
  /** The compound's 1D ¹H spectrum, for proton counts and observed multiplets. */
  spectrum1D?: Spectrum1D;
  /** Labels used in the structure note; those no spectrum assigns are reported in notes. */
  noteLabels?: readonly string[];
  /** J values closer than this are one splitting group (default 0.5 Hz). */
  groupHz?: number;
}

export interface DerivedSi {
  entries: SiEntry[];
  signals: DerivedSignal[];
  /** Per-proton integral unit used for the counts (null without a 1D spectrum). */
  protonUnit: number | null;
  /**
   * 1D splittings attributable to one partner (the 1D tree has the letters the recorded couplings
   * predict, and that group has a single partner label): method `1d`, for the network's consistency check.
   */
  oneD: Coupling[];
  notes: string[];
}

const SECOND_ORDER_FLAGS = new Set(['second_order_suspected', 'second-order']);

/** Mean shift per atom label over all picks of all sources. */
export function atomShifts(sources: readonly NetworkSource[]): Map<string, number> {
  const acc = new Map<string, number[]>();
  const add = (label: string | undefined, ppm: number | undefined): void => {
    if (label === undefined || ppm === undefined) return;
    acc.set(label, [...(acc.get(label) ?? []), ppm]);
  };
  const single = new Set<string>();
  for (const { sidecar } of sources) {
    for (const p of sidecar.picks) {
      if (p.label.length === 1 && p.label[0] !== undefined) single.add(p.label[0]);
    }
  }
  for (const { sidecar } of sources) {
    for (const p of sidecar.picks) {
      if (p.label.length === 1) add(p.label[0], p.f2Ppm);
      // A cross peak's centre lies off the shift by the fit's asymmetry; use it only for atoms without their own pick.
      else if (p.label.length === 2) {
        if (!single.has(p.label[0] ?? '')) add(p.label[0], p.f2Ppm);
        if (!single.has(p.label[1] ?? '')) add(p.label[1], p.f1Ppm);
      }
    }
  }
  return new Map([...acc].map(([k, v]) => [k, v.reduce((a, b) => a + b, 0) / v.length]));
}

/** Derive the SI entries (see the module comment for every choice made). */
export function deriveSiEntries(input: DeriveInput): DerivedSi {
  const groupHz = input.groupHz ?? 0.5;
  const shifts = atomShifts(input.sources);
  const notes: string[] = [];
  for (const l of input.noteLabels ?? []) {
    if (!shifts.has(l)) notes.push(`${l}: named in the structure note, but no spectrum assigns it; not in the SI line.`);
  }
  for (const a of input.network.atoms) {
    if (!shifts.has(a)) notes.push(`${a}: has couplings but no pick gives its shift; not in the SI line.`);
  }
  const signals = signalsFrom(shifts, input.spectrum1D, input.sources);
  const unit = input.spectrum1D ? integralUnit(signals, input.sources, notes) : null;
  if (!input.spectrum1D) notes.push('no 1D spectrum: proton counts are not measured; each atom counted as 1 H.');
  const protonsOf = (g: DerivedSignal): number => (g.integral !== null && unit !== null ? Math.max(1, Math.round(g.integral / unit)) : g.labels.length);
  const signalOf = new Map<string, DerivedSignal>();
  signals.forEach((g) => g.labels.forEach((l) => signalOf.set(l, g)));
  if (input.spectrum1D) analyseSignals(input.spectrum1D, signals, input.network, shifts, signalOf, protonsOf);
  const oneD: Coupling[] = [];
  const entries = signals.map((g): SiEntry => {
    const protons = protonsOf(g);
    const recorded = g.labels.length === 1 ? couplingsOf(input.network, g.labels[0] ?? '', signalOf, protonsOf, groupHz) : [];
    collectOneD(g, recorded, oneD);
    const couplings = observed(g, recorded, notes);
    // With the same letters, observed() has already said that the 1D and recorded J differ.
    if (g.analysis && g.analysis.multiplicity !== lettersOf(recorded)) cosyDisagreements(g, notes);
    const secondOrder = couplings.some((c) => (c.flags ?? []).some((f) => SECOND_ORDER_FLAGS.has(f))) ||
      (g.analysis?.flags ?? []).some((f) => f === 'second-order');
    const range: [number, number] | undefined = g.fromPpm !== null && g.toPpm !== null ? [g.fromPpm, g.toPpm] : spanOf(g.ppm, couplings, input.spectrum1D);
    const entry: SiEntry = { labels: g.labels, ppm: g.labels.length === 1 ? (shifts.get(g.labels[0] ?? '') ?? g.ppm) : g.ppm, couplings, protons };
    if (range) entry.rangePpm = range;
    if (g.labels.length > 1) entry.multiplet = true;
    if (g.labels.length === 1 && !secondOrder && (g.analysis?.flags ?? []).includes('not-first-order')) {
      entry.multiplet = true;
      notes.push(`${g.labels[0] ?? ''}: the 1D multiplet fits no first-order splitting tree (overlapping lines or second order); written as m with its range.`);
    }
    if (g.labels.length === 1 && !secondOrder && !entry.multiplet && (g.analysis?.flags ?? []).includes('ambiguous')) {
      entry.multiplet = true;
      const why = g.analysis?.notes.find((n) => n.includes('nearly equally')) ?? 'two first-order trees fit the 1D multiplet about equally; reported as m.';
      notes.push(`${g.labels[0] ?? ''}: ${why}`);
    }
    if (secondOrder) entry.flags = ['second-order'];
    return entry;
  });
  return { entries, signals, protonUnit: unit, notes, oneD };
}

const LETTERS = ['', 'd', 't', 'q', 'p'];

/**
 * The 1D analysis of each signal's region. A one-atom signal passes the atom's coupled partners
 * (shift, adopted J ± sd, protons of the partner's signal): they seed the lineshape fit, are checked
 * against the 1D J, and a shift difference / J below 10 to any of them makes the signal second order.
 */
function analyseSignals(
  s: Spectrum1D, signals: DerivedSignal[], net: CouplingNetwork, shifts: Map<string, number>,
  signalOf: Map<string, DerivedSignal>, protonsOf: (g: DerivedSignal) => number,
): void {
  for (const g of signals) {
    if (!g.region) continue;
    const atom = g.labels.length === 1 ? g.labels[0] : undefined;
    const partners: KnownPartner[] = atom === undefined ? [] : net.pairs.filter((p) => p.atoms.includes(atom)).flatMap((p) => {
      const label = p.atoms[0] === atom ? p.atoms[1] : p.atoms[0];
      const ppm = shifts.get(label);
      const pg = signalOf.get(label);
      const count = pg && pg.labels.length === 1 ? protonsOf(pg) : 1;
      return ppm === undefined ? [] : [{ label, ppm, jHz: p.adopted.jHz, sdHz: p.adopted.sdHz, count }];
    });
    try {
      // Several atoms in one multiplet are written as m anyway: the lineshape search would only cost time.
      g.analysis = analyseMultiplet(s, g.region[0], g.region[1], { partners, lineshape: atom !== undefined });
    } catch {
      g.analysis = null;
    }
  }
}

/** Flags that make the 1D splittings unfit to report ('cosy-disagrees' is handled by the notes below). */
function blocks(a: MultipletAnalysis): boolean {
  return a.flags.some((f) => f !== 'cosy-disagrees') || a.multiplicity === 'm';
}

function lettersOf(cs: readonly SiCoupling[]): string {
  return cs.filter((c) => !(c.flags ?? []).includes('unresolved')).map((c) => LETTERS[c.count ?? 1] ?? '?').join('') || 's';
}

/**
 * Multiplicity as observed: when the 1D multiplet has a clean first-order tree whose letters differ
 * from what the recorded couplings predict (typically couplings not yet measured in the COSY), or
 * whose J values disagree with the recorded ones (jAgree: 3 combined sd, at least 0.2 Hz), the SI line follows the
 * 1D splittings (a direct observation) and a note says so; otherwise the recorded J values stand.
 */
function collectOneD(g: DerivedSignal, recorded: SiCoupling[], out: Coupling[]): void {
  const a = g.analysis;
  const label = g.labels[0];
  if (g.labels.length !== 1 || label === undefined || !a || blocks(a)) return;
  const resolved = recorded.filter((c) => !(c.flags ?? []).includes('unresolved'));
  if (a.multiplicity !== lettersOf(recorded)) return;
  resolved.forEach((c, i) => {
    const o = a.couplings[i];
    const partner = c.partners?.[0];
    if (!o || partner === undefined || (c.partners ?? []).length !== 1) return;
    out.push({ atoms: [label, partner], jHz: o.jHz, jSdHz: o.sdHz, method: '1d', dimension: 'F2', picks: [], flags: [] });
  });
}

function observed(g: DerivedSignal, recorded: SiCoupling[], notes: string[]): SiCoupling[] {
  const a = g.analysis;
  if (g.labels.length !== 1 || !a || blocks(a)) return recorded;
  const js = a.couplings.map((c) => c.jHz.toFixed(1)).join(', ');
  const label = g.labels[0] ?? '';
  if (a.multiplicity === lettersOf(recorded)) {
    const resolved = recorded.filter((c) => !(c.flags ?? []).includes('unresolved'));
    const off = resolved.filter((c, i) => {
      const o = a.couplings[i];
      return o !== undefined && !jAgree(o.jHz, o.sdHz, c.jHz, c.sdHz ?? 0);
    });
    if (off.length === 0) return recorded;
    notes.push(`${label}: the 1D splittings (J = ${js} Hz) and the recorded J (${resolved.map((c) => Math.abs(c.jHz).toFixed(1)).join(', ')} Hz) ` +
      'differ by more than 3 combined sd and 0.2 Hz; the SI line gives the 1D values. Check the COSY measurement.');
  } else {
    const unresolved = recorded.filter((c) => (c.flags ?? []).includes('unresolved')).flatMap((c) => c.partners ?? []);
    const why = unresolved.length > 0 ? ` (J to ${unresolved.join(', ')} flagged unresolved in the COSY)` : '';
    notes.push(`${label}: the 1D multiplet is ${a.multiplicity}${js ? ` (J = ${js} Hz)` : ''}, the recorded couplings give ` +
      `${lettersOf(recorded)}${why}; the SI line follows the 1D spectrum.`);
  }
  const small = a.couplings.filter((c) => c.jHz < a.linewidthHz / 2);
  if (small.length > 0) {
    notes.push(`${label}: J = ${small.map((c) => c.jHz.toFixed(1)).join(', ')} Hz is below half the 1D linewidth (${a.linewidthHz.toFixed(1)} Hz); ` +
      'the lineshape fit sees it as broadening, not as separate lines: confirm it before relying on it.');
  }
  return a.couplings.map((c) => ({ jHz: c.jHz, sdHz: c.sdHz, count: c.count, partners: [], flags: [] }));
}

/** A pair whose COSY J no 1D splitting of `atom`'s first-order multiplet matches (jAgree: 3 combined sd, at least 0.2 Hz). */
export interface OneDDisagreement {
  readonly atom: string;
  readonly partner: string;
  readonly oneDJHz: number;
  readonly oneDSdHz: number;
}

export function oneDDisagreements(d: Pick<DerivedSi, 'signals'>): OneDDisagreement[] {
  return d.signals.flatMap((g) => {
    const a = g.analysis;
    const atom = g.labels[0];
    if (g.labels.length !== 1 || atom === undefined || !a || blocks(a)) return [];
    return a.cosy.filter((c) => !c.agrees).map((c) => ({ atom, partner: c.partner, oneDJHz: c.oneDJHz, oneDSdHz: c.oneDSdHz }));
  });
}

/**
 * A partner's COSY J that no 1D splitting matches (jAgree): said in the report, since
 * the J table and the dihedral estimates still use the COSY value (a first-order 1D multiplet only).
 */
function cosyDisagreements(g: DerivedSignal, notes: string[]): void {
  const a = g.analysis;
  if (g.labels.length !== 1 || !a || blocks(a)) return;
  for (const c of a.cosy.filter((x) => !x.agrees)) {
    notes.push(`${g.labels[0] ?? ''}: J to ${c.partner} is ${Math.abs(c.cosyJHz).toFixed(2)} ± ${c.cosySdHz.toFixed(2)} Hz in the COSY, but the nearest ` +
      `1D splitting is ${c.oneDJHz.toFixed(2)} ± ${c.oneDSdHz.toFixed(2)} Hz (more than 3 combined sd and 0.2 Hz apart); the J table and any dihedral ` +
      'estimate use the COSY value: check that measurement.');
  }
}

function spanOf(ppm: number, cs: SiCoupling[], s: Spectrum1D | undefined): [number, number] | undefined {
  const mhz = s?.axis.observeMhz;
  if (!mhz) return undefined;
  const half = cs.reduce((a, c) => a + (Math.abs(c.jHz) * (c.count ?? 1)) / 2, 0) / mhz;
  return [ppm + half, ppm - half];
}

/** The adopted couplings of one atom, partners with J within groupHz merged into one group. */
function couplingsOf(
  net: CouplingNetwork, atom: string, signalOf: Map<string, DerivedSignal>, protonsOf: (g: DerivedSignal) => number, groupHz: number,
): SiCoupling[] {
  const raw = net.pairs
    .filter((p) => p.atoms.includes(atom))
    .map((p) => {
      const partner = p.atoms[0] === atom ? p.atoms[1] : p.atoms[0];
      const g = signalOf.get(partner);
      // A partner signal of n protons (CH2, CH3) splits by n equal J; one label per proton otherwise.
      const count = g && g.labels.length === 1 ? protonsOf(g) : 1;
      return { jHz: Math.abs(p.adopted.jHz), sdHz: p.adopted.sdHz, count, partners: [partner], flags: p.adopted.flags };
    })
    .sort((a, b) => b.jHz - a.jHz);
  const out: SiCoupling[] = [];
  for (const c of raw) {
    const last = out[out.length - 1];
    const bothResolved = !(c.flags.includes('unresolved') || (last?.flags ?? []).includes('unresolved'));
    if (last && bothResolved && Math.abs((last.jHz) - c.jHz) <= groupHz) {
      const n = (last.count ?? 1) + c.count;
      last.jHz = ((last.jHz) * (last.count ?? 1) + c.jHz * c.count) / n;
      // sd of the count-weighted mean (independent values): √Σ(n_k σ_k)² / n, as mergeNear.
      last.sdHz = Math.hypot((last.sdHz ?? 0) * (last.count ?? 1), c.sdHz * c.count) / n;
      last.count = n;
      last.partners = [...(last.partners ?? []), ...c.partners];
      last.flags = [...new Set([...(last.flags ?? []), ...c.flags])];
    } else {
      out.push({ ...c, flags: [...c.flags] });
    }
  }
  return out;
}
