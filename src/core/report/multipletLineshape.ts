/**
 * Glue between analyseMultiplet and the lineshape fit: the fit window and line model of a 1D
 * spectrum, the seed trees (line maxima, known COSY partners, outer-line distances, a singlet), the search, and the
 * couplings written the way chemists write nearly equal ones (one t/q group with their mean).
 */
import { correlationFromProcessing, estimateCorrelation, type NoiseCorrelation } from '../measure/correlation';
import { processedLine, pseudoVoigtLine } from '../measure/lineshape';
import { pointToHz } from '../spectrum/axis';
import type { Spectrum1D } from '../spectrum/spectrum';
import type { FitContext, LineshapeFit } from './multipletFit';
import type { TreeSpec } from './multipletModel';
import { bestSeeds, searchTrees, type Seed } from './multipletSearch';
import { enhancedLines, spanSeeds } from './multipletSeeds';
import { fitSplittingTree, type ObservedLine, type TreeFit, type TreeGroup } from './splittingTree';

const LETTERS = ['', 'd', 't', 'q', 'p'];
/** Lags of noise correlation used (zero-filling and windows correlate only near neighbours). */
const MAX_LAG = 32;
/** Span-based trees fitted after ranking by their starting misfit. */
const SPAN_SEEDS = 6;
/** Couplings differing by less than this fraction of their mean (and unresolved) are one group. */
const NEARLY_EQUAL = 0.2;
/** Fitted lines may be at most this many times the linewidth seen at the outer lines (plus 1 Hz). */
const MAX_FWHM_FACTOR = 3;
/**
 * Two descriptions whose criteria differ by less than this are both supported by the data (an
 * evidence ratio below e^5 ≈ 150 on the BIC scale; Kass & Raftery, JASA 90 (1995) 773 [mem] call
 * differences above 10 very strong).
 */
const AMBIGUOUS = 10;

export interface LineshapeInput {
  i0: number;
  i1: number;
  noise: number;
  lines: readonly ObservedLine[];
  /** Positions (Hz) of weaker maxima, for seeding only. */
  weakLines: readonly number[];
  /** FWHM (Hz) seen at the outer flanks of the outermost lines (single lines in a first-order multiplet). */
  linewidthHz: number;
  maximaTree: TreeFit | null;
  /** Known couplings (|J|, equivalent protons) of the atom, e.g. from the DQF-COSY. */
  partners: readonly { jHz: number; count: number }[];
}

export interface LineshapeResult {
  fit: LineshapeFit;
  /** A fit of another description that the data support nearly as well (criterion within AMBIGUOUS), if any. */
  rival: { fit: LineshapeFit; couplings: TreeGroup[]; multiplicity: string } | null;
  /** What may be reported: near-equal J merged into one group (largest J first). */
  couplings: TreeGroup[];
  multiplicity: string;
  tried: number;
  lineModel: string;
}

export function fitContextFor(s: Spectrum1D, i0: number, i1: number, noise: number): FitContext {
  const m = i1 - i0 + 1;
  const freqs = Float64Array.from({ length: m }, (_, k) => pointToHz(s.axis, i0 + k));
  const data = s.data.slice(i0, i1 + 1);
  let top = 0;
  for (const v of data) top = Math.max(top, Math.abs(v));
  const line = s.processing ? processedLine(s.processing) : pseudoVoigtLine();
  const rho = noiseCorrelation(s);
  // A noise-free (synthetic) spectrum still needs a finite noise scale for the criterion.
  return { region: { freqs, data }, line, sigma: Math.max(noise, 1e-6 * top), rho };
}

/** Noise correlation of a spectrum, computed once per spectrum (it costs acquired points × lags cosines). */
const correlations = new WeakMap<Spectrum1D, NoiseCorrelation>();

function noiseCorrelation(s: Spectrum1D): NoiseCorrelation {
  let rho = correlations.get(s);
  if (!rho) {
    rho = s.processing ? correlationFromProcessing(s.processing, MAX_LAG) : estimateCorrelation([s.data], MAX_LAG);
    correlations.set(s, rho);
  }
  return rho;
}

/** Seeds: the maxima tree, the known partners (one J each, and near-equal ones as one group), a singlet. */
export function seedTrees(inp: LineshapeInput): TreeSpec[] {
  const seeds: TreeSpec[] = [];
  if (inp.maximaTree) seeds.push(specOf(inp.maximaTree.groups));
  // Coarser merging lets trees whose small splittings did not show as maxima match the line count.
  for (const f of [1, 1.6]) {
    const t = fitSplittingTree(inp.lines, { mergeHz: f * inp.linewidthHz });
    if (t) seeds.push(specOf(t.groups));
  }
  const ps = inp.partners.filter((p) => p.jHz > inp.linewidthHz / 6).sort((a, b) => b.jHz - a.jHz);
  if (ps.length > 0) {
    seeds.push({ js: ps.map((p) => p.jHz), counts: ps.map((p) => p.count) });
    const grouped = mergeNear(ps.map((p) => ({ jHz: p.jHz, sdHz: 0, count: p.count })), inp.linewidthHz);
    seeds.push(specOf(grouped));
  }
  seeds.push({ js: [], counts: [] });
  return seeds;
}

function specOf(groups: readonly TreeGroup[]): TreeSpec {
  return { js: groups.map((g) => g.jHz), counts: groups.map((g) => g.count) };
}

/**
 * Couplings closer than `withinHz` as one group with their count-weighted mean (common practice:
 * "tt, J = 11.2, 4.5 Hz" for 11.0 and 11.3 Hz to two partners that the lines do not resolve); at most 4 partners per group.
 */
export function mergeNear(groups: readonly TreeGroup[], withinHz: number, relative = Infinity): TreeGroup[] {
  const out: TreeGroup[] = [];
  for (const g of [...groups].sort((a, b) => b.jHz - a.jHz)) {
    const last = out[out.length - 1];
    const near = last && Math.abs(last.jHz - g.jHz) < Math.min(withinHz, relative * (last.jHz + g.jHz) / 2);
    if (last && near && last.count + g.count <= 4) {
      const n = last.count + g.count;
      last.jHz = (last.jHz * last.count + g.jHz * g.count) / n;
      last.sdHz = Math.hypot(last.sdHz * last.count, g.sdHz * g.count) / n;
      last.count = n;
    } else {
      out.push({ ...g });
    }
  }
  return out;
}

export function lettersOf(groups: readonly TreeGroup[]): string {
  return groups.map((g) => LETTERS[g.count] ?? '?').join('') || 's';
}

/** Results per spectrum and input: a report derives its entries twice (before and after the 1D J join the network). */
const memo = new WeakMap<Spectrum1D, Map<string, LineshapeResult | null>>();

/** The lineshape analysis of the region, or null when no tree gives a plausible fit (memoised: the result depends only on the input). */
export function analyseLineshape(s: Spectrum1D, inp: LineshapeInput): LineshapeResult | null {
  // Partner J only seed the search: rounded to 0.1 Hz, a re-adopted J that moved by a few mHz hits the memo.
  const rounded = { ...inp, partners: inp.partners.map((p) => ({ jHz: Math.round(p.jHz * 10) / 10, count: p.count })) };
  // The seeds (lines, width, maxima tree) follow from the region unless the caller's picking options
  // (threshold, tree) change them: they are part of the key, so other options never get a stale fit.
  const seeds = [inp.lines.map((l) => [l.hz, l.height]), inp.weakLines, inp.linewidthHz, inp.maximaTree && specOf(inp.maximaTree.groups)];
  const key = JSON.stringify([rounded.i0, rounded.i1, rounded.noise, rounded.partners, seeds]);
  let bySpectrum = memo.get(s);
  if (!bySpectrum) memo.set(s, (bySpectrum = new Map()));
  if (bySpectrum.has(key)) return bySpectrum.get(key) ?? null;
  const out = searchLineshape(s, rounded);
  bySpectrum.set(key, out);
  return out;
}

function searchLineshape(s: Spectrum1D, inp: LineshapeInput): LineshapeResult | null {
  const ctx = fitContextFor(s, inp.i0, inp.i1, inp.noise);
  const w0 = ctx.line.kind === 'processed' ? Math.max(0.05, inp.linewidthHz - ctx.line.fwhm(0, 0)) : inp.linewidthHz;
  const centre0 = inp.maximaTree?.centreHz ?? centroid(inp.lines);
  const seeds: Seed[] = seedTrees(inp).map((tree) => ({ tree, centreHz: centre0 }));
  const enhanced = enhancedLines(ctx.region.freqs, ctx.region.data, inp.linewidthHz, ctx.sigma);
  const spanned: Seed[] = [];
  for (const positions of [inp.lines.map((l) => l.hz), union(inp.weakLines, enhanced, inp.linewidthHz / 4)]) {
    const spans = spanSeeds(positions, Math.max(0.3, 0.6 * inp.linewidthHz), inp.linewidthHz / 6, inp.linewidthHz);
    spanned.push(...spans.trees.map((tree) => ({ tree, centreHz: spans.centreHz })));
  }
  seeds.push(...bestSeeds(ctx, spanned, w0, SPAN_SEEDS));
  const found = searchTrees(ctx, seeds, w0, MAX_FWHM_FACTOR * inp.linewidthHz + 1, inp.linewidthHz);
  if (!found) return null;
  // Two equal lines closer than w/√3 show one maximum (derived: the second derivative at the midpoint), so
  // nearly equal couplings (within a fifth of their size) that differ by less than that are written as one group.
  const report = (f: LineshapeFit): TreeGroup[] => mergeNear(f.groups, f.fwhmHz / Math.sqrt(3), NEARLY_EQUAL);
  const couplings = report(found.best);
  const key = describe(couplings, found.best.fwhmHz);
  const rivalFit = found.others
    .filter((f) => f.criterion - found.best.criterion < AMBIGUOUS && describe(report(f), f.fwhmHz) !== key)
    .sort((a, b) => a.criterion - b.criterion)[0];
  const rival = rivalFit ? { fit: rivalFit, couplings: report(rivalFit), multiplicity: lettersOf(report(rivalFit)) } : null;
  return { fit: found.best, rival, couplings, multiplicity: lettersOf(couplings), tried: found.tried,
    lineModel: ctx.line.kind === 'processed' ? 'exact line of the recorded processing' : 'Lorentz-Gauss line, no processing recorded' };
}

/**
 * What a chemist would read from the couplings: letters and J to 0.5 Hz of those at least one
 * linewidth (below it a J shows as shoulders or broadening, and a d, t or q of it fit about alike).
 */
function describe(couplings: readonly TreeGroup[], fwhmHz: number): string {
  return couplings.filter((c) => c.jHz >= fwhmHz).map((c) => `${LETTERS[c.count] ?? '?'}${Math.round(c.jHz * 2) / 2}`).join(' ');
}

/** Positions of both lists, those within tolHz of an earlier one dropped. */
function union(a: readonly number[], b: readonly number[], tolHz: number): number[] {
  const out: number[] = [];
  for (const x of [...a, ...b]) if (out.every((y) => Math.abs(y - x) > tolHz)) out.push(x);
  return out;
}

function centroid(lines: readonly ObservedLine[]): number {
  const w = lines.reduce((a, l) => a + l.height, 0);
  return w > 0 ? lines.reduce((a, l) => a + l.hz * l.height, 0) / w : 0;
}
