/**
 * First-order splitting trees for a 1D multiplet: which set of couplings (J_k, n_k equivalent
 * partners each) explains the observed line positions and heights. A group of n equivalent
 * partners splits each line into n + 1 lines with binomial intensities C(n, m) (Pascal's triangle;
 * any NMR text), at offsets (n/2 − m)·J. Lines closer than `mergeHz` are seen as one.
 *
 * Search: in a first-order multiplet every single J_k is the distance from the outermost line to
 * some other line (flip that one spin), so the candidate J values are those distances; a tree must
 * also span the multiplet (Σ n_k J_k = outer-line distance). Each candidate tree that predicts as
 * many lines as observed is refined by linear least squares on the positions (centre and J's are
 * linear in the positions) and scored on positions and relative intensities together.
 */
import { Matrix, inverse } from 'ml-matrix';

export interface ObservedLine {
  hz: number;
  height: number;
}

export interface TreeGroup {
  jHz: number;
  sdHz: number;
  /** Equivalent partners with this J: 1 → d, 2 → t, 3 → q, 4 → p. */
  count: number;
}

export interface TreeFit {
  /** Largest J first. */
  groups: TreeGroup[];
  centreHz: number;
  /** RMS of observed − predicted line positions, Hz. */
  positionRmsHz: number;
  /** RMS of observed − predicted relative intensities (each set normalised to sum 1), over the mean. */
  intensityRms: number;
  /** Predicted lines (merged), high to low frequency, intensities summing to 1. */
  predicted: { hz: number; intensity: number }[];
  multiplicity: string;
}

export interface TreeOptions {
  /** Lines closer than this are one observed line (default 0.5 Hz). */
  mergeHz?: number;
  /** Expected position precision, Hz: scales the position term of the score (default 0.1). */
  positionTolHz?: number;
  /** Relative intensity precision: scales the intensity term (default 0.15). */
  intensityTol?: number;
  /** Floor for the position sd used in the J uncertainties, Hz (default 0.02). */
  positionSdFloorHz?: number;
  maxGroups?: number;
  maxCount?: number;
}

interface Component {
  offset: number;
  weight: number;
  coef: number[];
}

const LETTERS = ['', 'd', 't', 'q', 'p'];
const MAX_LINES = 16;
/** At most this many coupled protons in one tree (a CH between a CH2 and a CH3 has 5). */
const MAX_PARTNERS = 6;

function binomial(n: number, k: number): number {
  let r = 1;
  for (let i = 1; i <= k; i++) r = (r * (n - k + i)) / i;
  return r;
}

/** The merged pattern of a tree: position, intensity and the mean coefficient vector of its components. */
export function treePattern(js: readonly number[], counts: readonly number[], mergeHz: number): Component[] {
  let comps: Component[] = [{ offset: 0, weight: 1, coef: js.map(() => 0) }];
  js.forEach((j, k) => {
    const n = counts[k] ?? 1;
    const next: Component[] = [];
    for (const c of comps) {
      for (let m = 0; m <= n; m++) {
        const coef = [...c.coef];
        coef[k] = n / 2 - m;
        next.push({ offset: c.offset + (n / 2 - m) * j, weight: c.weight * binomial(n, m), coef });
      }
    }
    comps = next;
  });
  comps.sort((a, b) => b.offset - a.offset);
  const merged: Component[] = [];
  let group: Component[] = [];
  const flush = (): void => {
    if (group.length === 0) return;
    const w = group.reduce((s, c) => s + c.weight, 0);
    merged.push({
      offset: group.reduce((s, c) => s + c.offset * c.weight, 0) / w,
      weight: w,
      coef: js.map((_, k) => group.reduce((s, c) => s + (c.coef[k] ?? 0) * c.weight, 0) / w),
    });
    group = [];
  };
  for (const c of comps) {
    const first = group[0];
    if (first && first.offset - c.offset > mergeHz) flush();
    group.push(c);
  }
  flush();
  const total = merged.reduce((s, c) => s + c.weight, 0);
  return merged.map((c) => ({ ...c, weight: c.weight / total }));
}

interface Scored extends TreeFit {
  score: number;
}

/** Linear least squares of positions on (centre, J_1..J_g); returns null when singular. */
function refine(xs: number[], pattern: Component[], g: number, sdFloor: number): { params: number[]; sds: number[]; rms: number } | null {
  const a = new Matrix(xs.length, g + 1);
  pattern.forEach((c, i) => {
    a.set(i, 0, 1);
    c.coef.forEach((v, k) => a.set(i, k + 1, v));
  });
  const b = Matrix.columnVector(xs);
  let cov: Matrix;
  try {
    cov = inverse(a.transpose().mmul(a));
  } catch {
    return null;
  }
  const params = cov.mmul(a.transpose()).mmul(b).getColumn(0);
  if (params.some((p) => !Number.isFinite(p))) return null;
  const res = a.mmul(Matrix.columnVector(params)).sub(b).getColumn(0);
  const rss = res.reduce((s, r) => s + r * r, 0);
  const dof = xs.length - g - 1;
  const s = Math.max(dof > 0 ? Math.sqrt(rss / dof) : 0, sdFloor);
  const sds = params.map((_, k) => s * Math.sqrt(Math.max(0, cov.get(k, k))));
  return { params, sds, rms: Math.sqrt(rss / xs.length) };
}

function combinations(n: number, k: number): number[][] {
  const out: number[][] = [];
  const rec = (start: number, acc: number[]): void => {
    if (acc.length === k) {
      out.push([...acc]);
      return;
    }
    for (let i = start; i < n; i++) rec(i + 1, [...acc, i]);
  };
  rec(0, []);
  return out;
}

function countVectors(g: number, max: number): number[][] {
  if (g === 0) return [[]];
  return countVectors(g - 1, max).flatMap((v) => Array.from({ length: max }, (_, i) => [...v, i + 1]));
}

/** Best first-order tree for the lines (any order), or null when none predicts the observed line count (or more than 16 lines). */
export function fitSplittingTree(lines: readonly ObservedLine[], opts: TreeOptions = {}): TreeFit | null {
  const mergeHz = opts.mergeHz ?? 0.5;
  const posTol = opts.positionTolHz ?? 0.1;
  const intTol = opts.intensityTol ?? 0.15;
  const sdFloor = opts.positionSdFloorHz ?? 0.02;
  const maxGroups = opts.maxGroups ?? 4;
  const maxCount = opts.maxCount ?? 4;
  const obs = [...lines].sort((a, b) => b.hz - a.hz);
  const xs = obs.map((l) => l.hz);
  const hsum = obs.reduce((s, l) => s + l.height, 0);
  const rel = obs.map((l) => l.height / hsum);
  const first = xs[0];
  if (first === undefined) return null;
  // Beyond this many lines the search grows past a second and such multiplets are rarely first order anyway.
  if (obs.length > MAX_LINES) return null;
  if (obs.length === 1) {
    return { groups: [], centreHz: first, positionRmsHz: 0, intensityRms: 0, predicted: [{ hz: first, intensity: 1 }], multiplicity: 's' };
  }
  const span = first - (xs[xs.length - 1] ?? first);
  const cands = xs.slice(1).map((x) => first - x);
  const spanTol = Math.max(mergeHz, 5 * posTol);
  let best: Scored | null = null;
  for (let g = 1; g <= maxGroups; g++) {
    const vectors = countVectors(g, maxCount)
      .filter((counts) => counts.reduce((p, n) => p * (n + 1), 1) >= obs.length && counts.reduce((a, n) => a + n, 0) <= MAX_PARTNERS);
    for (const idx of combinations(cands.length, g)) {
      const js0 = idx.map((i) => cands[i] ?? 0);
      for (const counts of vectors) {
        if (Math.abs(js0.reduce((s, j, k) => s + j * (counts[k] ?? 1), 0) - span) > spanTol) continue;
        const fit = scoreTree(xs, rel, js0, counts, { mergeHz, posTol, intTol, sdFloor });
        // Fewer groups win ties: a small penalty per group (Occam), well below a real misfit.
        if (fit && (best === null || fit.score + 0.5 * g < best.score + 0.5 * best.groups.length)) best = fit;
      }
    }
  }
  if (!best) return null;
  const { score: _score, ...tree } = best;
  return tree;
}

function scoreTree(
  xs: number[], rel: number[], js0: number[], counts: number[],
  o: { mergeHz: number; posTol: number; intTol: number; sdFloor: number },
): Scored | null {
  let js = js0;
  let fit: ReturnType<typeof refine> = null;
  let pattern: Component[] = [];
  for (let iter = 0; iter < 3; iter++) {
    pattern = treePattern(js, counts, o.mergeHz);
    if (pattern.length !== xs.length) return null;
    fit = refine(xs, pattern, js.length, o.sdFloor);
    if (!fit) return null;
    js = fit.params.slice(1);
  }
  if (!fit || js.some((j) => !(j > 0))) return null;
  pattern = treePattern(js, counts, o.mergeHz);
  if (pattern.length !== xs.length) return null;
  const mean = 1 / xs.length;
  const intensityRms = Math.sqrt(pattern.reduce((s, c, i) => s + ((rel[i] ?? 0) - c.weight) ** 2, 0) / xs.length) / mean;
  const centre = fit.params[0] ?? 0;
  const groups = js.map((j, k) => ({ jHz: j, sdHz: fit?.sds[k + 1] ?? 0, count: counts[k] ?? 1 })).sort((a, b) => b.jHz - a.jHz);
  return {
    groups,
    centreHz: centre,
    positionRmsHz: fit.rms,
    intensityRms,
    predicted: pattern.map((c) => ({ hz: centre + c.offset, intensity: c.weight })),
    multiplicity: groups.map((gr) => LETTERS[gr.count] ?? '?').join(''),
    score: (fit.rms / o.posTol) ** 2 + (intensityRms / o.intTol) ** 2,
  };
}
