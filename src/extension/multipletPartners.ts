/**
 * The known partners of a 1D multiplet's atom, for the COSY check and to seed the lineshape fit:
 * every coupling of that atom recorded in the compound's sidecars (the other sidecars in the
 * spectrum's folder: its DQF-COSY), with the partner's shift. Pure (texts in).
 *
 * Choices, kept simple: a pair's value is the first by method fit, naive, manual (a `1d` value is
 * never checked against the 1D itself), F2 before F1; the partner's shift is that of its 1D
 * multiplet pick when one is labelled with it, else the F2 (or F1) shift of a cross pick naming it.
 */
import type { KnownPartner } from '../core/report/multiplet';
import { parseSidecar, type Coupling, type Pick } from '../core/sidecar';

export interface SidecarSource {
  readonly fileName: string;
  readonly text: string;
}

const METHOD_ORDER = ['fit', 'naive', 'manual'];

function rank(c: Coupling): number {
  const m = METHOD_ORDER.indexOf(c.method);
  return (m < 0 ? 99 : m) * 2 + (c.dimension === 'F2' ? 0 : 1);
}

/** Shift of an atom from the picks: a 1D pick labelled with it first, else a cross pick naming it. */
export function shiftOf(atom: string, picks: readonly Pick[]): number | undefined {
  const oneD = picks.find((p) => p.f1Ppm === undefined && p.label.length === 1 && p.label[0] === atom);
  if (oneD) return oneD.f2Ppm;
  for (const p of picks) {
    if (p.f1Ppm === undefined) continue;
    if (p.label[0] === atom) return p.f2Ppm;
    if (p.label[1] === atom) return p.f1Ppm;
  }
  return undefined;
}

/** Partners of `atom` (its couplings in the sources, with shifts); unreadable sources are skipped. */
export function partnersFor(atom: string, sources: readonly SidecarSource[]): KnownPartner[] {
  const picks: Pick[] = [];
  const couplings: Coupling[] = [];
  for (const s of sources) {
    const parsed = parseSidecar(s.text, s.fileName).sidecar;
    if (!parsed) continue;
    picks.push(...parsed.picks);
    couplings.push(...parsed.couplings.filter((c) => c.method !== '1d' && c.atoms.includes(atom) && c.atoms[0] !== c.atoms[1]));
  }
  const best = new Map<string, Coupling>();
  for (const c of couplings) {
    const other = c.atoms[0] === atom ? c.atoms[1] : c.atoms[0];
    const known = best.get(other);
    if (!known || rank(c) < rank(known)) best.set(other, c);
  }
  const out: KnownPartner[] = [];
  for (const [label, c] of [...best].sort(([a], [b]) => a.localeCompare(b))) {
    const ppm = shiftOf(label, picks);
    if (ppm !== undefined) out.push({ label, ppm, jHz: c.jHz, sdHz: c.jSdHz });
  }
  return out;
}
