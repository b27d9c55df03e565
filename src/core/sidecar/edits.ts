/**
 * User actions as minimal text edits against the current sidecar text. Each action changes the
 * data, rewrites with `formatSidecar(next, text)` (which keeps every untouched item's exact text)
 * and returns the line diff, so an action touches only the lines of the items it changes plus
 * the sorted insertion point. Offsets are UTF-16 code units, like VS Code's `positionAt`.
 * Every action throws (with the file name and line) when the text must not be overwritten.
 */
import { toFixedDecimal } from './decimal';
import { formatOver } from './format';
import { lineDiffEdits } from './lineDiff';
import { couplingKeyString, normalizeAtoms } from './order';
import { isWritable, readSidecarText, type ParsedText } from './parse';
import type { Coupling, CouplingKey, Pick, Sidecar, TextEdit } from './types';

function current(text: string, fileName: string): { sidecar: Sidecar; parsed: ParsedText } {
  const parsed = readSidecarText(text, fileName);
  const { sidecar, diagnostics } = parsed.result;
  const first = diagnostics.find((d) => d.severity === 'error');
  if (sidecar === null || !isWritable(diagnostics)) {
    throw new Error(`not editing ${fileName}: ${first?.message ?? 'it cannot be read as a sidecar'}`);
  }
  return { sidecar, parsed };
}

function edit(text: string, fileName: string, change: (s: Sidecar) => Sidecar): TextEdit[] {
  const { sidecar, parsed } = current(text, fileName);
  return lineDiffEdits(text, formatOver(change(sidecar), text, parsed));
}

function pickIndex(s: Sidecar, id: string, fileName: string): number {
  const i = s.picks.findIndex((p) => p.id === id);
  if (i < 0) throw new Error(`${fileName}: no pick with id "${id}"`);
  return i;
}

function replacePick(s: Sidecar, id: string, fileName: string, change: (p: Pick) => Pick): Sidecar {
  const i = pickIndex(s, id, fileName);
  return { ...s, picks: s.picks.map((p, k) => (k === i ? change(p) : p)) };
}

/**
 * The id a new pick gets: `p-<f2>` (1D) or `p-<f2>-<f1>` with the positions in ppm (4 decimals)
 * at creation, plus `-2`, `-3`, ... if taken. It never changes afterwards, even when the pick moves.
 */
export function pickIdFor(s: Sidecar, f2Ppm: number, f1Ppm?: number): string {
  const base = `p-${toFixedDecimal(f2Ppm, 4)}${f1Ppm === undefined ? '' : `-${toFixedDecimal(f1Ppm, 4)}`}`;
  const taken = new Set(s.picks.map((p) => p.id));
  let id = base;
  for (let n = 2; taken.has(id); n++) id = `${base}-${n}`;
  return id;
}

export type NewPick = Omit<Pick, 'id'> & { id?: string };

export function addPick(text: string, pick: NewPick, fileName = 'sidecar'): { edits: TextEdit[]; id: string } {
  const { sidecar: s, parsed } = current(text, fileName);
  const id = pick.id ?? pickIdFor(s, pick.f2Ppm, pick.f1Ppm);
  if (s.picks.some((p) => p.id === id)) throw new Error(`${fileName}: a pick with id "${id}" already exists`);
  const next = { ...s, picks: [...s.picks, { ...pick, id }] };
  return { edits: lineDiffEdits(text, formatOver(next, text, parsed)), id };
}

export function movePick(text: string, id: string, to: { f2Ppm: number; f1Ppm?: number }, fileName = 'sidecar'): TextEdit[] {
  return edit(text, fileName, (s) => replacePick(s, id, fileName, (p) => {
    const { f1Ppm: _old, ...rest } = p;
    return { ...rest, f2Ppm: to.f2Ppm, ...(to.f1Ppm !== undefined && { f1Ppm: to.f1Ppm }) };
  }));
}

export function relabelPick(text: string, id: string, label: readonly string[], fileName = 'sidecar'): TextEdit[] {
  if (label.length > 2) throw new Error(`${fileName}: a pick has at most two atom labels, got ${label.length}`);
  return edit(text, fileName, (s) => replacePick(s, id, fileName, (p) => ({ ...p, label: [...label] })));
}

/** Sets (or, with null, clears) a 1D multiplet's region; ends in any order, stored high to low ppm. */
export function setPickRegion(text: string, id: string, region: { fromPpm: number; toPpm: number } | null, fileName = 'sidecar'): TextEdit[] {
  return edit(text, fileName, (s) => replacePick(s, id, fileName, (p) => {
    const { fromPpm: _f, toPpm: _t, ...rest } = p;
    if (region === null) return rest;
    if (p.f1Ppm !== undefined) throw new Error(`${fileName}: pick "${id}" is a 2D peak; a region belongs to a 1D multiplet`);
    const hi = Math.max(region.fromPpm, region.toPpm);
    const lo = Math.min(region.fromPpm, region.toPpm);
    if (!Number.isFinite(hi) || !Number.isFinite(lo) || hi === lo) throw new Error(`${fileName}: region ${region.fromPpm}..${region.toPpm} ppm must be two different shifts`);
    return { ...rest, fromPpm: hi, toPpm: lo };
  }));
}

/** Makes the pick the integral reference holding `protons` protons (clearing any other), or clears it with null. */
export function setIntegralReference(text: string, id: string, protons: number | null, fileName = 'sidecar'): TextEdit[] {
  if (protons !== null && !(Number.isInteger(protons) && protons >= 1 && protons <= 99)) {
    throw new Error(`${fileName}: the reference must hold a whole number of protons from 1 to 99, got ${protons}`);
  }
  return edit(text, fileName, (s) => {
    pickIndex(s, id, fileName);
    return {
      ...s,
      picks: s.picks.map((p) => {
        const { protons: _old, ...rest } = p;
        if (p.id !== id) return p.protons === undefined || protons === null ? p : rest;
        if (protons === null) return rest;
        if (p.f1Ppm !== undefined) throw new Error(`${fileName}: pick "${id}" is a 2D peak; the integral reference is a 1D multiplet`);
        return { ...rest, protons };
      }),
    };
  });
}

/** Removes the pick and its id from the couplings that cite it (their values stay). */
export function removePick(text: string, id: string, fileName = 'sidecar'): TextEdit[] {
  return edit(text, fileName, (s) => {
    pickIndex(s, id, fileName);
    return {
      ...s,
      picks: s.picks.filter((p) => p.id !== id),
      couplings: s.couplings.map((c) => (c.picks.includes(id) ? { ...c, picks: c.picks.filter((x) => x !== id) } : c)),
    };
  });
}

/** Adds the coupling, or replaces the one with the same atom pair, method and dimension. */
export function setCoupling(text: string, coupling: Coupling, fileName = 'sidecar'): TextEdit[] {
  const c = { ...coupling, atoms: normalizeAtoms(coupling.atoms) };
  if (c.atoms[0] === c.atoms[1]) throw new Error(`${fileName}: a coupling needs two different atoms, got ${c.atoms[0]} twice`);
  const key = couplingKeyString(c);
  return edit(text, fileName, (s) => ({ ...s, couplings: [...s.couplings.filter((x) => couplingKeyString(x) !== key), c] }));
}

export function removeCoupling(text: string, which: CouplingKey, fileName = 'sidecar'): TextEdit[] {
  const key = couplingKeyString(which);
  return edit(text, fileName, (s) => {
    if (!s.couplings.some((x) => couplingKeyString(x) === key)) {
      throw new Error(`${fileName}: no ${which.method} ${which.dimension} coupling between ${which.atoms.join(' and ')}`);
    }
    return { ...s, couplings: s.couplings.filter((x) => couplingKeyString(x) !== key) };
  });
}

/** Records a new data hash (after the user confirms the picks still fit the changed data). */
export function setDataHash(text: string, sha256Hex: string, fileName = 'sidecar'): TextEdit[] {
  const sha256 = sha256Hex.toLowerCase();
  if (!/^[0-9a-f]{64}$/.test(sha256)) throw new Error(`${fileName}: "${sha256Hex}" is not a SHA-256 hex digest`);
  return edit(text, fileName, (s) => ({ ...s, data: { ...s.data, sha256 } }));
}
