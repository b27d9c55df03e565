/**
 * The 1D multiplet analysis as the panel shows it: numbers, a plain-language note per flag (the
 * analysis' own notes follow), the reference named, and the fitted curve and line positions for
 * drawing. Pure; the worker's MultipletAnalysis in, a MultipletView out.
 */
import { treeLines } from '../core/report/multipletModel';
import type { MultipletAnalysis, MultipletFlag } from '../core/report/multiplet';
import type { Axis } from '../core/spectrum/axis';
import { pointToPpm, ppmToPoint } from '../core/spectrum/axis';
import type { MultipletView } from '../protocol';

/** What the flags mean, for a chemist deciding whether to trust the numbers (a Record: a new core flag needs its note here). */
export const FLAG_NOTES: Readonly<Record<MultipletFlag, string>> = {
  'second-order': 'Second order: a coupled partner is less than about 10 × J away, so line spacings are not coupling constants; no first-order J is given.',
  roofing: 'Roofing: the lines lean toward a strongly coupled partner (the roof effect).',
  'not-first-order': 'Not first order: no first-order splitting tree explains these lines (strong coupling or overlap); no J is given. Judge it by eye or by simulation.',
  ambiguous: 'Ambiguous: two different splitting trees explain the lines about equally well (both named below); no J is given. The COSY values or a better-resolved spectrum can decide.',
  'cosy-disagrees': 'COSY disagrees: a J measured in the DQF-COSY differs from the nearest 1D splitting by more than 3 combined sd and 0.2 Hz; check the assignment before using either.',
};

export interface ViewContext {
  readonly peakIndex: number;
  readonly pickId: string | null;
  readonly label: readonly string[];
  readonly regionSet: boolean;
  readonly axis: Axis;
  /** The sidecar's integral reference, if any. */
  readonly reference: { readonly pickId: string; readonly label: readonly string[]; readonly protons: number } | null;
  readonly partners: readonly string[];
}

function referenceText(c: ViewContext): string {
  const r = c.reference;
  if (!r) return 'no reference (set one with Couplet: Set Integral Reference…)';
  if (r.pickId === c.pickId) return `this pick is the integral reference (${r.protons} H)`;
  return `reference ${r.pickId}${r.label.length ? ` (${r.label.join(', ')})` : ''} = ${r.protons} H`;
}

/** The fitted curve over the points the analysis used, as analyseMultiplet picks them (`fit.model` holds the baseline already). */
function fittedCurve(a: MultipletAnalysis, axis: Axis): MultipletView['fitted'] {
  if (!a.fit) return null;
  const p = [a.fromPpm, a.toPpm].map((v) => Math.round(ppmToPoint(axis, v)));
  const i0 = Math.max(1, Math.min(...p));
  const i1 = Math.min(axis.points - 2, Math.max(...p));
  const n = a.fit.model.length;
  if (i1 - i0 + 1 !== n || a.fit.baseline.length !== n) return null; // not the expected points: draw no curve rather than a shifted one
  const data = new Float32Array(n);
  for (let k = 0; k < n; k++) data[k] = a.fit.model[k] ?? 0;
  return { fromPpm: pointToPpm(axis, i0), toPpm: pointToPpm(axis, i1), data };
}

function linePositions(a: MultipletAnalysis, mhz: number): number[] {
  if (a.fit) {
    const { offsets } = treeLines(a.fit.groups.map((g) => g.jHz), a.fit.groups.map((g) => g.count));
    const centre = a.fit.centreHz;
    return offsets.map((o) => (centre + o) / mhz).sort((x, y) => y - x);
  }
  return a.tree ? a.tree.predicted.map((l) => l.hz / mhz) : [];
}

export function multipletView(a: MultipletAnalysis, c: ViewContext): MultipletView {
  const flagNotes = a.flags.map((f) => FLAG_NOTES[f] ?? f);
  return {
    peakIndex: c.peakIndex, pickId: c.pickId, label: [...c.label], centrePpm: a.centrePpm,
    fromPpm: Math.max(a.fromPpm, a.toPpm), toPpm: Math.min(a.fromPpm, a.toPpm), regionSet: c.regionSet,
    integral: a.integral, protons: a.protons, reference: referenceText(c), multiplicity: a.multiplicity,
    couplings: a.couplings.map((g) => ({ jHz: g.jHz, sdHz: g.sdHz, count: g.count })),
    flags: [...a.flags], notes: [...flagNotes, ...a.notes], cosy: a.cosy.map((k) => ({ ...k })), partners: [...c.partners],
    // Ticks would read as couplings: only for a first-order result (the misfit curve still shows why not).
    linesPpm: a.couplings.length > 0 ? linePositions(a, c.axis.observeMhz) : [], fitted: fittedCurve(a, c.axis),
  };
}
