/**
 * A 1D ¹H multiplet region: its lines, centre, integral (optionally normalised to a reference), a
 * first-order splitting tree of the line maxima (splittingTree.ts), then a fit of the whole
 * lineshape as a first-order tree (multipletLineshape.ts), which also gives partly resolved
 * splittings; a check against COSY J values of known partners; and second-order and misfit
 * warnings that replace the first-order J instead of reporting a wrong one.
 */
import { hzPerPoint, hzToPoint, ppmToPoint, pointToHz, pointToPpm, resolutionHz } from '../spectrum/axis';
import { estimateNoise } from '../spectrum/noise';
import type { Spectrum1D } from '../spectrum/spectrum';
import { lorentzianPeak } from '../peaks/interpolate';
import type { LineshapeFit } from './multipletFit';
import { analyseLineshape, type LineshapeResult } from './multipletLineshape';
import { fitSplittingTree, type TreeFit, type TreeGroup, type TreeOptions } from './splittingTree';

export type MultipletFlag = 'second-order' | 'roofing' | 'not-first-order' | 'ambiguous' | 'cosy-disagrees';

/** A partner proton known from elsewhere (e.g. the DQF-COSY): its shift and, if measured, J ± σ. */
export interface KnownPartner {
  label: string;
  ppm: number;
  jHz?: number;
  sdHz?: number;
  /** Equivalent protons of the partner (a CH3 splits by 3 equal J; default 1). */
  count?: number;
}

export interface MultipletOptions {
  /** Noise sd of the spectrum (default: estimateNoise over the whole spectrum). */
  noise?: number;
  /** Lines must exceed threshold × noise (default 8) ... */
  threshold?: number;
  /** ... and this fraction of the tallest line (default 0.05: binomial lines go down to 1/6 of the tallest in a quintet, while truncation ripples and ¹³C satellites stay at a few per cent). */
  minRelativeHeight?: number;
  /** Normalisation: an integral known to hold `protons` protons (e.g. a reference multiplet's). */
  reference?: { integral: number; protons: number };
  partners?: KnownPartner[];
  tree?: TreeOptions;
  /** Fit the lineshape as a first-order tree (default true); false keeps the maxima-only analysis. */
  lineshape?: boolean;
}

export interface CosyCheck {
  partner: string;
  cosyJHz: number;
  cosySdHz: number;
  oneDJHz: number;
  oneDSdHz: number;
  /** |ΔJ| ≤ max(3·√(σ1² + σ2²), 0.2 Hz): within three combined standard deviations, or below what J is reported to. */
  agrees: boolean;
}

export interface MultipletAnalysis {
  fromPpm: number;
  toPpm: number;
  centreHz: number;
  centrePpm: number;
  /** Σ intensity × |Hz per point| over the region. */
  integral: number;
  /** integral / (reference integral per proton); null without a reference. */
  protons: number | null;
  lines: { hz: number; ppm: number; height: number }[];
  /** Full width at half height, Hz: of one fitted line when the lineshape was fitted (`fit`), else of the tallest line. */
  linewidthHz: number;
  /** The best first-order tree for the line maxima alone, kept for inspection even when flagged. */
  tree: TreeFit | null;
  /** The lineshape fit of the best first-order tree (one J per modelled coupling), kept even when flagged. */
  fit: LineshapeFit | null;
  /**
   * What may be reported: the lineshape fit's couplings with near-equal J as one group (else the
   * maxima tree's groups), or [] when a flag says the first-order J would be wrong.
   */
  couplings: TreeGroup[];
  multiplicity: string;
  flags: MultipletFlag[];
  notes: string[];
  cosy: CosyCheck[];
}

/** Relative height asymmetry (first half − second half) above which lines lean: about Δν/J < 10 for an AB pair. */
const ROOF_ASYMMETRY = 0.1;
/** Largest acceptable relative intensity misfit of a first-order tree (clean simulated multiplets: below 0.05; the AB quartet at Δν/J = 2 against a dd: 0.45). */
const MAX_INTENSITY_RMS = 0.15;
const SECOND_ORDER_RATIO = 10;
/** 1D and COSY J closer than this agree whatever their σ (see checkPartners). */
const AGREE_FLOOR_HZ = 0.2;
/** Maxima above this many noise sd seed the lineshape fit (8 for the reported lines). */
const SEED_LEVEL_NOISE = 4;
/** A lineshape misfit is flagged when χ²_red exceeds this ... */
const MAX_CHI2_REDUCED = 2;
/** ... and the misfit beyond noise exceeds this fraction of the tallest line (rms over the region). */
const MAX_EXCESS_MISFIT = 0.01;
/** A line must rise above its surroundings by this many noise sd ... */
const PROMINENCE_NOISE = 4;
/** ... and by this fraction of its own height (two equal Lorentzians w/√3 apart, the limit of resolution, dip 0 %; 0.7 w apart, 5 %). */
const PROMINENCE_FRACTION = 0.03;

/** Σ y·|Δν| over the points between two shifts (rectangle rule; the points are equally spaced). */
export function integrateRegion(s: Spectrum1D, fromPpm: number, toPpm: number): number {
  const [i0, i1] = pointRange(s, fromPpm, toPpm);
  let sum = 0;
  for (let i = i0; i <= i1; i++) sum += s.data[i] ?? 0;
  return sum * resolutionHz(s.axis);
}

function pointRange(s: Spectrum1D, fromPpm: number, toPpm: number): [number, number] {
  if (!Number.isFinite(fromPpm) || !Number.isFinite(toPpm) || fromPpm === toPpm) {
    throw new RangeError(`multiplet region ${fromPpm}..${toPpm} ppm must be two different finite shifts`);
  }
  const a = Math.round(ppmToPoint(s.axis, fromPpm));
  const b = Math.round(ppmToPoint(s.axis, toPpm));
  const i0 = Math.max(1, Math.min(a, b));
  const i1 = Math.min(s.axis.points - 2, Math.max(a, b));
  if (i1 - i0 < 2) throw new RangeError(`multiplet region ${fromPpm}..${toPpm} ppm holds fewer than 3 points of '${s.title}'`);
  return [i0, i1];
}

/** How far the data fall from point i in one direction before rising above it (or leaving the region). */
function fall(d: Float64Array, i: number, step: 1 | -1, i0: number, i1: number): number {
  const h = d[i] ?? 0;
  let min = h;
  for (let j = i + step; j >= i0 - 1 && j <= i1 + 1; j += step) {
    const v = d[j] ?? 0;
    if (v > h) break;
    min = Math.min(min, v);
  }
  return h - min;
}

/**
 * Local maxima above the level that stand out from their surroundings: noise riding on the flat
 * tails between two lines makes tiny maxima, so a line must also rise by prominence above the
 * lowest point on each side before a higher one.
 */
function pickLines(s: Spectrum1D, i0: number, i1: number, level: number, noise: number, prominenceNoise = PROMINENCE_NOISE): MultipletAnalysis['lines'] {
  const d = s.data;
  const out: MultipletAnalysis['lines'] = [];
  for (let i = i0; i <= i1; i++) {
    const v = d[i] ?? 0;
    const l = d[i - 1] ?? 0;
    const r = d[i + 1] ?? 0;
    if (!(v > level && v > l && v >= r)) continue;
    const prominence = Math.max(prominenceNoise * noise, PROMINENCE_FRACTION * v);
    if (Math.min(fall(d, i, -1, i0, i1), fall(d, i, 1, i0, i1)) < prominence) continue;
    const { offset, height } = lorentzianPeak(l, v, r);
    out.push({ hz: pointToHz(s.axis, i + offset), ppm: pointToPpm(s.axis, i + offset), height });
  }
  return out;
}

/**
 * Full width at half height around point i, linear interpolation between points; with `side`, twice
 * the half width on that side only (the outer flank of an outermost line, where no other line blends in).
 */
function widthAt(s: Spectrum1D, hz: number, height: number, side?: 1 | -1): number {
  const d = s.data;
  const x = (hz - s.axis.firstHz) / ((s.axis.lastHz - s.axis.firstHz) / (s.axis.points - 1));
  const i = Math.round(x);
  const half = height / 2;
  const walk = (step: 1 | -1): number => {
    let j = i;
    while (j + step >= 0 && j + step < d.length && (d[j + step] ?? 0) > half) j += step;
    const a = d[j] ?? 0;
    const b = d[j + step] ?? 0;
    return j + (a === b ? 0 : (step * (a - half)) / (a - b));
  };
  const points = side === undefined ? Math.abs(walk(1) - walk(-1)) : 2 * Math.abs(walk(side) - x);
  return points * resolutionHz(s.axis);
}

/** Analyse the multiplet between two shifts of a 1D spectrum (see the module comment). */
export function analyseMultiplet(s: Spectrum1D, fromPpm: number, toPpm: number, opts: MultipletOptions = {}): MultipletAnalysis {
  const [i0, i1] = pointRange(s, fromPpm, toPpm);
  const noise = opts.noise ?? estimateNoise(s.data);
  let top = 0;
  for (let i = i0; i <= i1; i++) top = Math.max(top, s.data[i] ?? 0);
  const level = Math.max((opts.threshold ?? 8) * noise, (opts.minRelativeHeight ?? 0.05) * top);
  const lines = pickLines(s, i0, i1, level, noise);
  const integral = integrateRegion(s, fromPpm, toPpm);
  const protons = opts.reference ? integral / (opts.reference.integral / opts.reference.protons) : null;
  const base = { fromPpm: Math.max(fromPpm, toPpm), toPpm: Math.min(fromPpm, toPpm), integral, protons, lines };
  const tallest = lines.reduce<(typeof lines)[number] | undefined>((m, l) => (m && m.height >= l.height ? m : l), undefined);
  if (!tallest) {
    const mid = (fromPpm + toPpm) / 2;
    return {
      ...base, centreHz: mid * s.axis.observeMhz, centrePpm: mid, linewidthHz: 0, tree: null, fit: null, couplings: [], multiplicity: 'm',
      flags: ['not-first-order'], notes: [`no line above ${level.toExponential(2)} (noise ${noise.toExponential(2)}) in the region`], cosy: [],
    };
  }
  const linewidthHz = widthAt(s, tallest.hz, tallest.height);
  // Two equal Lorentzians show a single maximum when closer than w/√3 (derived: the second derivative at the midpoint).
  const tree = fitSplittingTree(lines, {
    mergeHz: linewidthHz / Math.sqrt(3),
    positionTolHz: Math.max(0.05, resolutionHz(s.axis) / 4),
    ...opts.tree,
  });
  const partners = opts.partners ?? [];
  // Weaker maxima (4 noise sd, prominence 2 sd) only seed the lineshape fit, which decides whether they are lines.
  const weak = pickLines(s, i0, i1, Math.max(SEED_LEVEL_NOISE * noise, 0.02 * top), noise, SEED_LEVEL_NOISE / 2);
  // The outermost lines of a first-order multiplet are single lines; the tallest is often a blend.
  const ends = [[lines[0], -1] as const, [lines[lines.length - 1], 1] as const].map(([l, side]) => (l ? widthAt(s, l.hz, l.height, side) : Infinity));
  const shape = opts.lineshape === false ? null : analyseLineshape(s, {
    i0, i1, noise, lines, weakLines: weak.map((l) => l.hz), linewidthHz: Math.min(linewidthHz, ...ends), maximaTree: tree,
    partners: partners.filter((p) => p.jHz !== undefined).map((p) => ({ jHz: Math.abs(p.jHz ?? 0), count: p.count ?? 1 })),
  });
  const w = lines.reduce((a, l) => a + l.height, 0);
  const centreHz = shape ? shape.fit.centreHz : tree ? tree.centreHz : lines.reduce((a, l) => a + l.hz * l.height, 0) / w;
  const flags: MultipletFlag[] = [];
  const notes: string[] = [];
  if (shape) judgeFit(shape, flags, notes);
  else judgeTree(tree, lines, flags, notes);
  judgeRoofing(lines, shape ? areaAsymmetry(s, i0, shape.fit) : null, flags, notes);
  const resolved = shape ? shape.fit.groups : tree?.groups ?? [];
  const cosy = checkPartners(centreHz / s.axis.observeMhz, s.axis.observeMhz, resolved, partners, flags, notes);
  const couplings = shape ? shape.couplings : tree?.groups ?? [];
  const reportable = (shape !== null || tree !== null) && !flags.some((f) => f === 'second-order' || f === 'not-first-order' || f === 'ambiguous');
  const multiplicity = shape ? shape.multiplicity : tree?.multiplicity ?? 'm';
  if (shape && reportable) noteSmallJ(shape.couplings, shape.fit.fwhmHz, shape.lineModel, notes);
  return {
    ...base, centreHz, centrePpm: centreHz / s.axis.observeMhz, linewidthHz: shape ? shape.fit.fwhmHz : linewidthHz, tree,
    fit: shape?.fit ?? null, couplings: reportable ? couplings : [], multiplicity: reportable ? multiplicity : 'm', flags, notes, cosy,
  };
}

/** Couplings below half the linewidth show as broadening, not as lines: their value rests on the lineshape model. */
function noteSmallJ(couplings: readonly TreeGroup[], fwhmHz: number, lineModel: string, notes: string[]): void {
  const small = couplings.filter((c) => c.jHz < fwhmHz / 2);
  if (small.length === 0) return;
  notes.push(`J = ${small.map((c) => c.jHz.toFixed(1)).join(', ')} Hz ${small.length > 1 ? 'are' : 'is'} below half the linewidth ` +
    `(${fwhmHz.toFixed(1)} Hz): seen in the lineshape (${lineModel}), not as separate lines; confirm before relying on it.`);
}

/**
 * A lineshape misfit beyond the noise means the data are not one first-order multiplet (second
 * order, overlap, a baseline artefact): flagged, so that no line spacing is reported as a J. A tree
 * of another description that fits nearly as well (weak outer lines lost in the noise) is flagged too.
 */
function judgeFit(shape: LineshapeResult, flags: MultipletFlag[], notes: string[]): void {
  const { fit, multiplicity, rival } = shape;
  if (fit.chi2Reduced > MAX_CHI2_REDUCED && fit.excessMisfit > MAX_EXCESS_MISFIT) {
    flags.push('not-first-order');
    notes.push(`the best first-order lineshape (${multiplicity}) misses the data by ${(100 * fit.excessMisfit).toFixed(1)} % of the tallest line ` +
      `beyond the noise (χ²_red ${fit.chi2Reduced.toFixed(1)}): second-order (strong coupling) or overlap; line spacings need not be couplings, so no J is reported.`);
  } else if (rival) {
    const js = (cs: readonly TreeGroup[]): string => cs.map((c) => c.jHz.toFixed(1)).join(', ');
    flags.push('ambiguous');
    notes.push(`the lineshape fits ${multiplicity} (J = ${js(shape.couplings)} Hz) and ${rival.multiplicity} (J = ${js(rival.couplings)} Hz) ` +
      `nearly equally well (criterion ${(rival.fit.criterion - fit.criterion).toFixed(1)} apart): reported as m; a higher signal-to-noise or resolution could decide.`);
  }
}

function judgeTree(tree: TreeFit | null, lines: MultipletAnalysis['lines'], flags: MultipletFlag[], notes: string[]): void {
  if (!tree) {
    flags.push('not-first-order');
    notes.push(`no first-order splitting tree (up to 4 groups of 1-4 equivalent partners) predicts these ${lines.length} lines; reported as m.`);
    return;
  }
  if (tree.intensityRms > MAX_INTENSITY_RMS) {
    flags.push('not-first-order');
    notes.push(`the best first-order tree (${tree.multiplicity}) misses the binomial intensities by ${(100 * tree.intensityRms).toFixed(0)} % rms: ` +
      'second-order (strong coupling) or overlap; line spacings need not be couplings, so no J is reported.');
  }
}

function judgeRoofing(lines: MultipletAnalysis['lines'], asymmetry: number | null, flags: MultipletFlag[], notes: string[]): void {
  // Binomial patterns are symmetric: heights leaning to one side are the roof effect of a strongly coupled partner.
  const hs = [...lines].sort((a, b) => b.hz - a.hz).map((l) => l.height);
  const n = Math.floor(hs.length / 2);
  const total = hs.reduce((a, h) => a + h, 0);
  const asym = asymmetry ?? (hs.slice(0, n).reduce((a, h) => a + h, 0) - hs.slice(hs.length - n).reduce((a, h) => a + h, 0)) / total;
  if (Math.abs(asym) > ROOF_ASYMMETRY) {
    flags.push('roofing');
    if (!flags.includes('second-order')) flags.push('second-order');
    notes.push(`the lines lean toward ${asym > 0 ? 'higher' : 'lower'} frequency (asymmetry ${asym.toFixed(2)}): roofing toward a strongly ` +
      'coupled partner (shift difference / J below about 10); the first-order J would be wrong, so none is reported.');
  }
}

/**
 * (area above the centre − area below) / total, over a window symmetric about the fitted centre,
 * less the fitted baseline's level at the centre (not its slope, which would absorb part of a lean):
 * the lean of the whole multiplet, less noisy than line heights.
 */
export function areaAsymmetry(s: Spectrum1D, i0: number, fit: LineshapeFit): number {
  const c = hzToPoint(s.axis, fit.centreHz) - i0;
  const m = fit.baseline.length;
  const half = Math.min(c, m - 1 - c);
  const level = fit.baseline[Math.max(0, Math.min(m - 1, Math.round(c)))] ?? 0;
  let hi = 0;
  let lo = 0;
  for (let k = 0; k < m; k++) {
    if (Math.abs(k - c) > half) continue;
    const v = (s.data[i0 + k] ?? 0) - level;
    // The axis may run either way: point index up means frequency down when hzPerPoint < 0.
    if ((k - c) * Math.sign(hzPerPoint(s.axis)) > 0) hi += v;
    else if (k !== c) lo += v;
  }
  return hi + lo > 0 ? (hi - lo) / (hi + lo) : 0;
}

/**
 * A 1D and a COSY J agree when |ΔJ| ≤ max(3·√(σ1² + σ2²), AGREE_FLOOR_HZ). Neither σ holds model error
 * (near-equal J fitted as one group, lineshape), and J is reported to 0.1 Hz (common practice): a
 * difference below the floor is no disagreement worth a flag. Magnitudes are compared.
 */
export function jAgree(aHz: number, aSdHz: number, bHz: number, bSdHz: number): boolean {
  return Math.abs(Math.abs(aHz) - Math.abs(bHz)) <= Math.max(3 * Math.hypot(aSdHz, bSdHz), AGREE_FLOOR_HZ);
}

function checkPartners(
  centrePpm: number, mhz: number, groups: readonly TreeGroup[], partners: readonly KnownPartner[], flags: MultipletFlag[], notes: string[],
): CosyCheck[] {
  const checks: CosyCheck[] = [];
  for (const p of partners) {
    const dnu = Math.abs(p.ppm - centrePpm) * mhz;
    const nearest = p.jHz === undefined ? undefined
      : groups.reduce<TreeGroup | undefined>((m, g) => (m && Math.abs(m.jHz - Math.abs(p.jHz ?? 0)) <= Math.abs(g.jHz - Math.abs(p.jHz ?? 0)) ? m : g), undefined);
    const j = Math.abs(p.jHz ?? nearest?.jHz ?? 0);
    if (j > 0 && dnu / j < SECOND_ORDER_RATIO) {
      if (!flags.includes('second-order')) flags.push('second-order');
      notes.push(`shift difference to ${p.label} / J = ${(dnu / j).toFixed(1)} (< ${SECOND_ORDER_RATIO}): second-order effects expected.`);
    }
    if (p.jHz === undefined || !nearest) continue;
    const sd = p.sdHz ?? 0;
    const agrees = jAgree(nearest.jHz, nearest.sdHz, p.jHz, sd);
    checks.push({ partner: p.label, cosyJHz: p.jHz, cosySdHz: sd, oneDJHz: nearest.jHz, oneDSdHz: nearest.sdHz, agrees });
    if (!agrees) {
      if (!flags.includes('cosy-disagrees')) flags.push('cosy-disagrees');
      notes.push(`J to ${p.label}: COSY ${Math.abs(p.jHz).toFixed(2)} ± ${sd.toFixed(2)} Hz, nearest 1D splitting ${nearest.jHz.toFixed(2)} ± ` +
        `${nearest.sdHz.toFixed(2)} Hz: they differ by more than 3 combined sd and ${AGREE_FLOOR_HZ} Hz.`);
    }
  }
  return checks;
}
