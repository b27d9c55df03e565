/**
 * The panel's actions as sidecar text transformations: text in, text out, built only from the
 * core's edit functions (so every write is canonical and minimal). The glue turns the difference
 * into one WorkspaceEdit, which makes each action one undo step. Throws (with file and reason) when
 * the sidecar must not be written; the text is then left as it is.
 */
import {
  addPick, applyEdits, formatSidecar, newSidecar, parseSidecar, relabelPick, removeCoupling, removePick, setCoupling,
  toFixedDecimal, type Coupling, type PickKind, type Sidecar,
} from '../core/sidecar';
import { isBlank } from './sidecarState';

/** The measured values a coupling records. */
export interface CouplingValues {
  readonly jHz: number;
  readonly jSdHz: number;
  readonly method: 'fit' | 'naive';
  readonly dimension: 'F2' | 'F1';
  readonly flags: readonly string[];
  readonly passiveHz: readonly number[];
  readonly linewidthHz: number;
}

export interface AcceptInput {
  readonly dataFileName: string;
  readonly sha256: string;
  readonly f2Ppm: number;
  readonly f1Ppm?: number;
  readonly kind: PickKind;
  readonly labels: readonly string[];
  /** Absent for a 1D multiplet pick (no J measured there yet). */
  readonly values?: CouplingValues;
}

export interface AcceptResult {
  readonly text: string;
  readonly pickId: string;
  /** True when a coupling was written (two different labels and a measurement). */
  readonly coupled: boolean;
}

/** Labels as typed: trimmed, empties dropped, at most two (F2 atom, F1 atom). */
export function cleanLabels(labels: readonly string[]): string[] {
  return labels.map((l) => l.trim()).filter((l) => l !== '').slice(0, 2);
}

function readable(text: string, fileName: string): Sidecar {
  const { sidecar, diagnostics } = parseSidecar(text, fileName);
  const first = diagnostics.find((d) => d.severity === 'error');
  if (sidecar === null || first) throw new Error(`not editing ${fileName}: ${first?.message ?? 'it cannot be read as a sidecar'}`);
  return sidecar;
}

const samePpm = (a: number | undefined, b: number | undefined): boolean =>
  a === undefined || b === undefined ? a === b : toFixedDecimal(a, 4) === toFixedDecimal(b, 4);

function couplingOf(atoms: readonly [string, string], v: CouplingValues, pickId: string): Coupling {
  return {
    atoms: [atoms[0], atoms[1]], jHz: v.jHz, jSdHz: v.jSdHz, method: v.method, dimension: v.dimension,
    picks: [pickId], flags: [...new Set(v.flags)],
    ...(v.passiveHz.length > 0 && { passiveHz: [...v.passiveHz] }),
    ...(v.linewidthHz > 0 && { linewidthHz: v.linewidthHz }),
  };
}

const pair = (labels: readonly string[]): [string, string] | null => {
  const [a, b] = labels;
  return a !== undefined && b !== undefined && a !== b ? [a, b] : null;
};

/**
 * Records a pick at the peak (reusing the pick already at that position, 4 decimals) and, with two
 * labels and a measurement, the coupling citing it. Creates the sidecar text when there is none.
 */
export function acceptText(text: string | null, sidecarName: string, a: AcceptInput): AcceptResult {
  let t = text === null || isBlank(text) ? formatSidecar(newSidecar(a.dataFileName, a.sha256)) : text;
  const labels = cleanLabels(a.labels);
  const existing = readable(t, sidecarName).picks.find((p) => p.kind === a.kind && samePpm(p.f2Ppm, a.f2Ppm) && samePpm(p.f1Ppm, a.f1Ppm));
  let pickId: string;
  if (existing) {
    pickId = existing.id;
    if (labels.length > 0 && labels.join('\n') !== existing.label.join('\n')) t = applyEdits(t, relabelPick(t, pickId, labels, sidecarName));
  } else {
    const added = addPick(t, { f2Ppm: a.f2Ppm, ...(a.f1Ppm !== undefined && { f1Ppm: a.f1Ppm }), label: labels, kind: a.kind }, sidecarName);
    t = applyEdits(t, added.edits);
    pickId = added.id;
  }
  const atoms = pair(labels.length > 0 ? labels : existing?.label ?? []);
  if (atoms === null || a.values === undefined) return { text: t, pickId, coupled: false };
  t = applyEdits(t, setCoupling(t, couplingOf(atoms, a.values, pickId), sidecarName));
  return { text: t, pickId, coupled: true };
}

/**
 * New labels for a pick. Couplings citing it follow when the pick has two different labels (the
 * atom pair is what identifies a coupling, so the old entry is replaced). `pending` is a
 * measurement accepted before the pick was labelled: it becomes a coupling once two labels exist.
 */
export function labelText(text: string, sidecarName: string, pickId: string, labels: readonly string[], pending?: CouplingValues): string {
  const clean = cleanLabels(labels);
  let t = applyEdits(text, relabelPick(text, pickId, clean, sidecarName));
  const atoms = pair(clean);
  if (atoms === null) return t;
  const citing = readable(t, sidecarName).couplings.filter((c) => c.picks.includes(pickId));
  for (const c of citing) {
    const moved: Coupling = { ...c, atoms };
    t = applyEdits(t, removeCoupling(t, c, sidecarName));
    t = applyEdits(t, setCoupling(t, moved, sidecarName));
  }
  if (citing.length === 0 && pending) t = applyEdits(t, setCoupling(t, couplingOf(atoms, pending, pickId), sidecarName));
  return t;
}

export interface RemoveResult {
  readonly text: string;
  /** Couplings removed with the pick, as `H-1–H-2 (fit F2, J = 7.10 Hz)`, for the message to the user. */
  readonly removedCouplings: readonly string[];
}

/**
 * Removes a pick. A coupling that cited only this pick goes with it, in the same change (one undo
 * step brings both back): a measured J whose cross peak was deleted has lost its evidence, and
 * keeping it with `picks: []` would make it look like a manual value. Couplings that cite other
 * picks too keep their values and lose only this id; manual couplings without picks are untouched.
 */
export function removePickText(text: string, sidecarName: string, pickId: string): RemoveResult {
  const orphans = readable(text, sidecarName).couplings.filter((c) => c.picks.length === 1 && c.picks[0] === pickId);
  let t = text;
  for (const c of orphans) t = applyEdits(t, removeCoupling(t, c, sidecarName));
  t = applyEdits(t, removePick(t, pickId, sidecarName));
  const removedCouplings = orphans.map((c) => `${c.atoms[0]}–${c.atoms[1]} (${c.method} ${c.dimension}, J = ${toFixedDecimal(c.jHz, 2)} Hz)`);
  return { text: t, removedCouplings };
}
