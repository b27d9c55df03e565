/**
 * What changed between two versions of a sidecar, as a reviewer reads a pull request: picks
 * matched by their id (which never changes, SCHEMA.md), couplings by atom pair, method and
 * dimension (the schema's identity of a coupling). Values are compared at the precision the
 * sidecar stores (ppm 4 decimals, Hz 2), so re-writing the same number is not a change.
 */
import { naturalCompare, toFixedDecimal } from '../sidecar/decimal';
import { compareCouplings, couplingKeyString } from '../sidecar/order';
import type { Coupling, Pick, Sidecar } from '../sidecar/types';

export interface Position {
  readonly f2Ppm: number;
  readonly f1Ppm?: number;
}

export type PickChange =
  | { readonly kind: 'added'; readonly id: string; readonly pick: Pick }
  | { readonly kind: 'removed'; readonly id: string; readonly pick: Pick }
  | { readonly kind: 'moved'; readonly id: string; readonly from: Position; readonly to: Position; readonly pick: Pick }
  | { readonly kind: 'relabelled'; readonly id: string; readonly from: readonly string[]; readonly to: readonly string[]; readonly pick: Pick }
  /** Kind or note changed (nothing a reviewer sees on the spectrum). */
  | { readonly kind: 'annotated'; readonly id: string; readonly fields: readonly ('kind' | 'note')[]; readonly pick: Pick };

export interface Measured {
  readonly jHz: number;
  readonly jSdHz: number;
}

export type CouplingChange =
  | { readonly kind: 'added'; readonly coupling: Coupling }
  | { readonly kind: 'removed'; readonly coupling: Coupling }
  | { readonly kind: 're-measured'; readonly from: Measured; readonly to: Measured; readonly coupling: Coupling }
  /** Flags, picks, passive couplings, linewidth or note changed while J and sigma stayed. */
  | { readonly kind: 'amended'; readonly fields: readonly string[]; readonly coupling: Coupling };

export interface SidecarChanges {
  /** True when the recorded data file or its hash differs. */
  readonly dataChanged: boolean;
  /** Sorted by pick id; a pick both moved and relabelled gives two entries. */
  readonly picks: readonly PickChange[];
  /** Sorted in the sidecar's coupling order. */
  readonly couplings: readonly CouplingChange[];
}

const ppm = (v: number | undefined): string => (v === undefined ? '' : toFixedDecimal(v, 4));
const hz = (v: number | undefined): string => (v === undefined ? '' : toFixedDecimal(v, 2));
const list = (v: readonly string[]): string => v.join('\u0000');
const hzList = (v: readonly number[] | undefined): string => (v === undefined ? '' : v.map(hz).join(','));

function position(p: Pick): Position {
  return p.f1Ppm === undefined ? { f2Ppm: p.f2Ppm } : { f2Ppm: p.f2Ppm, f1Ppm: p.f1Ppm };
}

function pickChanges(a: Pick, b: Pick): PickChange[] {
  const out: PickChange[] = [];
  if (ppm(a.f2Ppm) !== ppm(b.f2Ppm) || ppm(a.f1Ppm) !== ppm(b.f1Ppm)) {
    out.push({ kind: 'moved', id: b.id, from: position(a), to: position(b), pick: b });
  }
  if (list(a.label) !== list(b.label)) out.push({ kind: 'relabelled', id: b.id, from: a.label, to: b.label, pick: b });
  const fields = (['kind', 'note'] as const).filter((f) => a[f] !== b[f]);
  if (fields.length > 0) out.push({ kind: 'annotated', id: b.id, fields, pick: b });
  return out;
}

function couplingChange(a: Coupling, b: Coupling): CouplingChange | undefined {
  if (hz(a.jHz) !== hz(b.jHz) || hz(a.jSdHz) !== hz(b.jSdHz)) {
    return { kind: 're-measured', from: { jHz: a.jHz, jSdHz: a.jSdHz }, to: { jHz: b.jHz, jSdHz: b.jSdHz }, coupling: b };
  }
  const fields: string[] = [];
  if (list([...a.flags].sort()) !== list([...b.flags].sort())) fields.push('flags');
  if (list(a.picks) !== list(b.picks)) fields.push('picks');
  if (hzList(a.passiveHz) !== hzList(b.passiveHz)) fields.push('passive_hz');
  if (hz(a.linewidthHz) !== hz(b.linewidthHz)) fields.push('linewidth_hz');
  if (a.note !== b.note) fields.push('note');
  return fields.length > 0 ? { kind: 'amended', fields, coupling: b } : undefined;
}

/** Changes from `before` to `after`; `before` null means the file is new (everything added). */
export function compareSidecars(before: Sidecar | null, after: Sidecar): SidecarChanges {
  const oldPicks = new Map((before?.picks ?? []).map((p) => [p.id, p]));
  const newPicks = new Map(after.picks.map((p) => [p.id, p]));
  const picks: PickChange[] = [];
  for (const id of [...new Set([...oldPicks.keys(), ...newPicks.keys()])].sort(naturalCompare)) {
    const a = oldPicks.get(id);
    const b = newPicks.get(id);
    if (a === undefined && b !== undefined) picks.push({ kind: 'added', id, pick: b });
    else if (a !== undefined && b === undefined) picks.push({ kind: 'removed', id, pick: a });
    else if (a !== undefined && b !== undefined) picks.push(...pickChanges(a, b));
  }
  const oldC = new Map((before?.couplings ?? []).map((c) => [couplingKeyString(c), c]));
  const newC = new Map(after.couplings.map((c) => [couplingKeyString(c), c]));
  const couplings: CouplingChange[] = [];
  const all = [...oldC.values(), ...[...newC.entries()].filter(([k]) => !oldC.has(k)).map(([, c]) => c)].sort(compareCouplings);
  for (const c of all) {
    const key = couplingKeyString(c);
    const a = oldC.get(key);
    const b = newC.get(key);
    if (a === undefined && b !== undefined) couplings.push({ kind: 'added', coupling: b });
    else if (a !== undefined && b === undefined) couplings.push({ kind: 'removed', coupling: a });
    else if (a !== undefined && b !== undefined) {
      const ch = couplingChange(a, b);
      if (ch !== undefined) couplings.push(ch);
    }
  }
  const dataChanged = before !== null && (before.data.file !== after.data.file || before.data.sha256 !== after.data.sha256);
  return { dataChanged, picks, couplings };
}

export function hasChanges(c: SidecarChanges): boolean {
  return c.dataChanged || c.picks.length > 0 || c.couplings.length > 0;
}
