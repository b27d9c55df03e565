/**
 * The coupling network of a compound: atoms as nodes, every recorded J as an edge, from all the
 * compound's sidecars. Spin systems are the connected components; each atom pair gets an adopted
 * value and a consistency check across its measurements.
 *
 * Consistency (stated rule): two measurements of one pair agree when ||J1| − |J2|| ≤ 3·√(σ1² + σ2²)
 * (three combined standard deviations, the rule the symmetric-partner check in measure/pair.ts
 * uses; magnitudes, because a 1D line spacing carries no sign while a fitted geminal J may). `naive` values (antiphase peak distance) are kept in the table for comparison but take
 * part in neither the check nor the adopted value: they overestimate small J by construction.
 * Adopted value: the inverse-variance weighted mean of the other measurements when all agree;
 * otherwise the one with the smallest σ, and a diagnostic names both disagreeing sources.
 */
import { naturalCompare } from '../sidecar/decimal';
import type { Coupling, Sidecar } from '../sidecar/types';

export const AGREE_SIGMAS = 3;

export interface NetworkSource {
  /** Sidecar file name (shown in tables and diagnostics). */
  file: string;
  sidecar: Sidecar;
}

export interface Measured {
  atoms: [string, string];
  jHz: number;
  sdHz: number;
  method: Coupling['method'];
  dimension: Coupling['dimension'];
  flags: string[];
  file: string;
  picks: string[];
}

export interface PairValue {
  jHz: number;
  sdHz: number;
  /** e.g. `fit`, or `fit+1d` for a weighted mean of several methods. */
  method: string;
  flags: string[];
  /** Where it came from: `file (method dimension)`, joined by `; `. */
  source: string;
}

export interface PairEntry {
  atoms: [string, string];
  measurements: Measured[];
  adopted: PairValue;
  consistent: boolean;
}

export interface NetworkDiagnostic {
  severity: 'warning';
  code: 'inconsistent-j';
  atoms: [string, string];
  message: string;
}

export interface CouplingNetwork {
  /** Every atom label seen in picks or couplings, natural order. */
  atoms: string[];
  /** Sorted by the atom pair (natural order). */
  pairs: PairEntry[];
  /** Connected components by couplings (atoms without couplings are their own), each in natural order. */
  spinSystems: string[][];
  diagnostics: NetworkDiagnostic[];
}

function pairKey(a: string, b: string): string {
  return `${a}\u0000${b}`;
}

function ordered(a: string, b: string): [string, string] {
  return naturalCompare(a, b) <= 0 ? [a, b] : [b, a];
}

function describe(m: Measured): string {
  return `${m.file} (${m.method} ${m.dimension}): ${m.jHz.toFixed(2)} ± ${m.sdHz.toFixed(2)} Hz`;
}

export function agree(a: { jHz: number; sdHz: number }, b: { jHz: number; sdHz: number }): boolean {
  return Math.abs(Math.abs(a.jHz) - Math.abs(b.jHz)) <= AGREE_SIGMAS * Math.hypot(a.sdHz, b.sdHz);
}

/** Builds the network from every coupling of every source (see the module comment for the rules). */
export function buildNetwork(sources: readonly NetworkSource[]): CouplingNetwork {
  const atoms = new Set<string>();
  const byPair = new Map<string, Measured[]>();
  for (const { file, sidecar } of sources) {
    for (const p of sidecar.picks) p.label.forEach((l) => atoms.add(l));
    for (const c of sidecar.couplings) {
      const key = ordered(c.atoms[0], c.atoms[1]);
      key.forEach((l) => atoms.add(l));
      const m: Measured = {
        atoms: key, jHz: c.jHz, sdHz: c.jSdHz, method: c.method, dimension: c.dimension, flags: [...c.flags], file, picks: [...c.picks],
      };
      const k = pairKey(...key);
      byPair.set(k, [...(byPair.get(k) ?? []), m]);
    }
  }
  const diagnostics: NetworkDiagnostic[] = [];
  const pairs = [...byPair.values()].map((ms) => pairEntry(ms, diagnostics));
  pairs.sort((x, y) => naturalCompare(x.atoms[0], y.atoms[0]) || naturalCompare(x.atoms[1], y.atoms[1]));
  const sortedAtoms = [...atoms].sort(naturalCompare);
  return { atoms: sortedAtoms, pairs, spinSystems: components(sortedAtoms, pairs), diagnostics };
}

function pairEntry(ms: Measured[], diagnostics: NetworkDiagnostic[]): PairEntry {
  const atoms = ms[0]?.atoms ?? ['?', '?'];
  const usable = ms.filter((m) => m.method !== 'naive');
  const pool = usable.length > 0 ? usable : ms;
  let consistent = true;
  for (let i = 0; i < usable.length; i++) {
    for (let j = i + 1; j < usable.length; j++) {
      const a = usable[i];
      const b = usable[j];
      if (!a || !b || agree(a, b)) continue;
      consistent = false;
      diagnostics.push({
        severity: 'warning', code: 'inconsistent-j', atoms,
        message: `J(${atoms[0]}, ${atoms[1]}): ${describe(a)} and ${describe(b)} differ by more than ${AGREE_SIGMAS} combined sd ` +
          `(|ΔJ| = ${Math.abs(Math.abs(a.jHz) - Math.abs(b.jHz)).toFixed(2)} Hz > ${(AGREE_SIGMAS * Math.hypot(a.sdHz, b.sdHz)).toFixed(2)} Hz).`,
      });
    }
  }
  return { atoms, measurements: ms, adopted: adopt(pool, consistent), consistent };
}

function adopt(pool: Measured[], consistent: boolean): PairValue {
  const src = (ms: Measured[]): string => ms.map((m) => `${m.file} (${m.method} ${m.dimension})`).join('; ');
  const flags = (ms: Measured[]): string[] => [...new Set(ms.flatMap((m) => m.flags))].sort();
  if (consistent && pool.length > 1 && pool.every((m) => m.sdHz > 0)) {
    const w = pool.map((m) => 1 / m.sdHz ** 2);
    const sw = w.reduce((a, b) => a + b, 0);
    // Signs: a 1D splitting is a magnitude; keep the sign the 2D measurement recorded when any is negative.
    const sign = pool.some((m) => m.jHz < 0) ? -1 : 1;
    const j = pool.reduce((a, m, i) => a + (w[i] ?? 0) * Math.abs(m.jHz), 0) / sw;
    return { jHz: sign * j, sdHz: 1 / Math.sqrt(sw), method: [...new Set(pool.map((m) => m.method))].join('+'), flags: flags(pool), source: src(pool) };
  }
  const best = pool.reduce((a, b) => (b.sdHz < a.sdHz ? b : a));
  return { jHz: best.jHz, sdHz: best.sdHz, method: best.method, flags: [...best.flags].sort(), source: src([best]) };
}

/** Connected components by union-find over the coupled pairs. */
function components(atoms: string[], pairs: PairEntry[]): string[][] {
  const parent = new Map(atoms.map((a) => [a, a]));
  const find = (a: string): string => {
    let r = a;
    while (parent.get(r) !== r) r = parent.get(r) ?? r;
    parent.set(a, r);
    return r;
  };
  for (const p of pairs) {
    const [ra, rb] = [find(p.atoms[0]), find(p.atoms[1])];
    if (ra !== rb) parent.set(naturalCompare(ra, rb) <= 0 ? rb : ra, naturalCompare(ra, rb) <= 0 ? ra : rb);
  }
  const groups = new Map<string, string[]>();
  for (const a of atoms) groups.set(find(a), [...(groups.get(find(a)) ?? []), a]);
  return [...groups.values()].sort((x, y) => naturalCompare(x[0] ?? '', y[0] ?? ''));
}
