/**
 * The 1D signals of a compound: which atoms share a 1D multiplet, the region each is analysed and
 * integrated over, and the per-proton integral unit. A region the chemist set on a 1D pick
 * (`from_ppm`/`to_ppm`) wins over the automatic one (multipletRegion.ts); a pick marked as the
 * integral reference (`protons: N`) fixes the unit, else the unit is inferred (protonUnit).
 */
import type { NetworkSource } from '../network/network';
import { pickMultiplets1D } from '../peaks/multiplets1D';
import type { Multiplet1D } from '../peaks/types';
import { naturalCompare } from '../sidecar/decimal';
import type { Pick } from '../sidecar/types';
import type { Spectrum1D } from '../spectrum/spectrum';
import { integrateRegion, type MultipletAnalysis } from './multiplet';
import { TAIL_HZ, autoRegion } from './multipletRegion';

export interface DerivedSignal {
  labels: string[];
  ppm: number;
  /** The range an `m` is written with: the multiplet's outer lines (the chemist's region when no lines were picked there). */
  fromPpm: number | null;
  toPpm: number | null;
  integral: number | null;
  analysis: MultipletAnalysis | null;
  /** The analysed and integrated 1D region (ppm, high to low), when the signal has one. */
  region?: [number, number];
  /** True when the region is the chemist's own (a pick's from_ppm/to_ppm). */
  regionSet?: boolean;
}

type RegionPick = Pick & { fromPpm: number; toPpm: number };

/** 1D picks (no F1) of every source. */
function picks1D(sources: readonly NetworkSource[]): Pick[] {
  return sources.flatMap((s) => s.sidecar.picks.filter((p) => p.f1Ppm === undefined));
}

const within = (x: number, hi: number, lo: number): boolean => x <= hi && x >= lo;

/** The chemist's region for an automatic multiplet: a region pick lying on it, or whose region holds its centre. */
function ownRegion(m: Multiplet1D, picks: readonly RegionPick[], tail: number): RegionPick | undefined {
  return picks.find((p) => within(p.f2Ppm, m.fromPpm + tail, m.toPpm - tail) || within(m.ppm, p.fromPpm, p.toPpm));
}

/** Signals: one per automatic multiplet holding an atom's shift, one per own region holding no multiplet, one per atom left over. */
export function signalsFrom(shifts: Map<string, number>, s: Spectrum1D | undefined, sources: readonly NetworkSource[]): DerivedSignal[] {
  const atoms = [...shifts.keys()].sort(naturalCompare);
  const alone = (a: string): DerivedSignal => ({ labels: [a], ppm: shifts.get(a) ?? 0, fromPpm: null, toPpm: null, integral: null, analysis: null });
  if (!s) return atoms.map(alone);
  const { multiplets } = pickMultiplets1D(s);
  const tail = TAIL_HZ / s.axis.observeMhz;
  const regionPicks = picks1D(sources).filter((p): p is RegionPick => p.fromPpm !== undefined && p.toPpm !== undefined);
  const usedPicks = new Set<RegionPick>();
  const used = new Set<string>();
  const out: DerivedSignal[] = [];
  const add = (region: [number, number], ppm: number, range: [number, number], regionSet: boolean): void => {
    const labels = atoms.filter((a) => !used.has(a) && within(shifts.get(a) ?? Number.NaN, region[0], region[1]));
    if (labels.length === 0) return;
    labels.forEach((l) => used.add(l));
    out.push({ labels, ppm, fromPpm: range[0], toPpm: range[1], integral: integrateRegion(s, region[0], region[1]), analysis: null, region, regionSet });
  };
  multiplets.forEach((m, i) => {
    const own = ownRegion(m, regionPicks, tail);
    if (own) usedPicks.add(own);
    add(own ? [own.fromPpm, own.toPpm] : autoRegion(multiplets, i, s.axis.observeMhz), m.ppm, [m.fromPpm, m.toPpm], own !== undefined);
  });
  // A region around lines too weak for the automatic picking: the chemist's region is all there is.
  for (const p of regionPicks) {
    if (!usedPicks.has(p)) add([p.fromPpm, p.toPpm], p.f2Ppm, [p.fromPpm, p.toPpm], true);
  }
  return [...out, ...atoms.filter((a) => !used.has(a)).map(alone)].sort((a, b) => b.ppm - a.ppm);
}

/**
 * The largest per-proton unit u such that every integral / u is within 0.2 of a whole number ≥ 1;
 * candidates are each integral divided by 1..6. Null when none fits.
 */
export function protonUnit(integrals: readonly number[]): number | null {
  const pos = integrals.filter((x) => x > 0);
  const cands = pos.flatMap((x) => [1, 2, 3, 4, 5, 6].map((n) => x / n)).sort((a, b) => b - a);
  for (const u of cands) {
    if (pos.every((x) => x / u >= 0.8 && Math.abs(x / u - Math.round(x / u)) <= 0.2)) return u;
  }
  return null;
}

/**
 * The per-proton integral: from the chemist's reference pick when there is one (its signal's
 * integral over its protons), else inferred from all integrals. Notes say which, and when a signal
 * is far from a whole number of protons against a chosen reference (overlap, a region too narrow).
 */
export function integralUnit(signals: readonly DerivedSignal[], sources: readonly NetworkSource[], notes: string[]): number | null {
  const ref = picks1D(sources).find((p) => p.protons !== undefined);
  const measured = signals.map((g) => g.integral).filter((x): x is number => x !== null);
  if (ref?.protons === undefined) {
    const unit = protonUnit(measured);
    if (unit === null) notes.push('the 1D integrals do not fit whole proton counts; each atom counted as 1 H.');
    return unit;
  }
  const home = signals.find((g) => g.region && g.integral !== null && within(ref.f2Ppm, g.region[0], g.region[1]));
  if (!home || home.integral === null || !(home.integral > 0)) {
    notes.push(`the integral reference (pick ${ref.id}, ${ref.protons} H) lies in no 1D multiplet; counts inferred from the integrals instead.`);
    return protonUnit(measured);
  }
  const unit = home.integral / ref.protons;
  notes.push(`proton counts against the integral reference ${home.labels.join(', ')} = ${ref.protons} H (pick ${ref.id}).`);
  for (const g of signals) {
    if (g === home || g.integral === null) continue;
    const n = g.integral / unit;
    if (Math.abs(n - Math.round(n)) > 0.2 || n < 0.8) {
      notes.push(`${g.labels.join(', ')}: integrates to ${n.toFixed(2)} H against the reference; written as ${Math.max(1, Math.round(n))}H (overlap or a region too narrow?).`);
    }
  }
  return unit;
}
