/**
 * Which first-order tree explains a multiplet's lineshape: every seed tree is fitted, then the best
 * ones are changed in small steps (one more small coupling; two near-equal J merged into a t/q
 * group; a group split into two J; one partner more or fewer in a group) while a step lowers the
 * information criterion. A tree whose J falls below what the lineshape can hold apart from zero is
 * not kept.
 */
import { fitTree, polish, quickFit, type FitContext, type LineshapeFit, type QuickFit } from './multipletFit';
import { basisOf, dot, residualOf, shapeOf, solveLinear, type TreeSpec } from './multipletModel';

/** A starting tree and its starting centre (Hz). */
export interface Seed {
  tree: TreeSpec;
  centreHz: number;
}

export interface SearchResult {
  best: LineshapeFit;
  /** Screening fits run: how hard the search had to look. */
  tried: number;
  /** Every other plausible fit polished on the way (for the ambiguity check). */
  others: LineshapeFit[];
}

/** At most this many J parameters and coupled protons in one tree (a CH between a CH2 and a CH3 has 5). */
const MAX_GROUPS = 5;
const MAX_PARTNERS = 7;
const MAX_ROUNDS = 4;
const REFINE_FROM = 3;
/** χ²_red below this: the tree explains the data to the noise and the search stops. */
const CHI2_EXPLAINED = 1.5;
/** Trees with more lines than this are not tried (a dddd of 16 lines, a qdd of 16, a tttt of 81 is not first-order practice). */
const MAX_LINES = 48;
/** A budget of screening fits per multiplet: overlapped regions otherwise explore long. */
const MAX_TRIED = 80;

function keyOf(t: TreeSpec): string {
  return t.js.map((j, k) => `${(t.counts[k] ?? 1)}x${j.toFixed(1)}`).sort().join(' ');
}

export function treeOfFit(f: LineshapeFit): TreeSpec {
  return { js: f.groups.map((g) => g.jHz), counts: f.groups.map((g) => g.count) };
}

/**
 * A J must stand clear of zero: above 3 sd (5 sd below half the linewidth) and above a sixth of the
 * linewidth (below that it only broadens the lines); and the lines may not grow wider than maxFwhmHz (a broad hump under a baseline explains anything).
 */
function plausible(f: LineshapeFit, maxFwhmHz: number): boolean {
  // A J below half the linewidth shows only in the lineshape: it must stand out more (5 sd), as the search tries many.
  const clear = (g: LineshapeFit['groups'][number]): boolean => g.jHz > (g.jHz < f.fwhmHz / 2 ? 5 : 3) * g.sdHz && g.jHz > f.fwhmHz / 6;
  return f.groups.every(clear) && Number.isFinite(f.criterion) && f.fwhmHz <= maxFwhmHz;
}

/** Residual sum of squares of a tree at its starting values (amplitudes solved), for ranking many seeds cheaply. */
export function startRss(ctx: FitContext, seed: Seed, width0: number): number {
  const { freqs, data } = ctx.region;
  const theta = [seed.centreHz, ...seed.tree.js, width0, ...(ctx.line.kind === 'pseudoVoigt' ? [-2] : [])];
  const basis = basisOf(shapeOf({ line: ctx.line, counts: seed.tree.counts }, theta, freqs));
  const r = residualOf(basis, solveLinear(basis, data), data);
  return dot(r, r);
}

/** The `keep` seeds with the lowest starting RSS. */
export function bestSeeds(ctx: FitContext, seeds: readonly Seed[], width0: number, keep: number): Seed[] {
  return seeds.map((seed) => ({ seed, rss: startRss(ctx, seed, width0) }))
    .sort((a, b) => a.rss - b.rss).slice(0, keep).map((x) => x.seed);
}

/** The tree with the closest pair of J that are equal within 2 combined sd (or 0.05 Hz) merged, or null when there is none. */
export function equalMerged(f: LineshapeFit): TreeSpec | null {
  const g = f.groups;
  let pick: [number, number] | null = null;
  let closest = Infinity;
  for (let a = 0; a < g.length; a++) {
    for (let b = a + 1; b < g.length; b++) {
      const ga = g[a];
      const gb = g[b];
      if (!ga || !gb || ga.count + gb.count > 4) continue;
      const d = Math.abs(ga.jHz - gb.jHz);
      if (d <= Math.max(0.05, 2 * Math.hypot(ga.sdHz, gb.sdHz)) && d < closest) {
        closest = d;
        pick = [a, b];
      }
    }
  }
  if (!pick) return null;
  const [a, b] = pick;
  const ga = g[a] ?? { jHz: 0, count: 1 };
  const gb = g[b] ?? { jHz: 0, count: 1 };
  const rest = g.filter((_, k) => k !== a && k !== b);
  const n = ga.count + gb.count;
  return { js: [...rest.map((r) => r.jHz), (ga.jHz * ga.count + gb.jHz * gb.count) / n], counts: [...rest.map((r) => r.count), n] };
}

/** Trees one step away: one more small coupling, two near-equal J as one group, a group split in two, a partner more or fewer. */
export function neighbours(t: TreeSpec, fwhmHz: number): TreeSpec[] {
  const out: TreeSpec[] = [];
  const partners = t.counts.reduce((a, n) => a + n, 0);
  if (t.js.length < MAX_GROUPS && partners < MAX_PARTNERS) {
    for (const j0 of [0.6 * fwhmHz, 1.2 * fwhmHz]) out.push({ js: [...t.js, j0], counts: [...t.counts, 1] });
  }
  t.js.forEach((ja, a) => {
    const na = t.counts[a] ?? 1;
    t.js.forEach((jb, b) => {
      const nb = t.counts[b] ?? 1;
      if (b <= a || Math.abs(ja - jb) > fwhmHz || na + nb > 4) return;
      const rest = t.js.map((j, k) => ({ j, n: t.counts[k] ?? 1 })).filter((_, k) => k !== a && k !== b);
      out.push({ js: [...rest.map((r) => r.j), (ja * na + jb * nb) / (na + nb)], counts: [...rest.map((r) => r.n), na + nb] });
    });
    // One partner more or fewer in a group (q ↔ p, d ↔ t): blended lines hide the count.
    if (partners < MAX_PARTNERS && na < 4) out.push({ js: t.js, counts: t.counts.map((n, k) => (k === a ? n + 1 : n)) });
    if (na >= 2) out.push({ js: t.js, counts: t.counts.map((n, k) => (k === a ? n - 1 : n)) });
    if (na >= 2 && t.js.length < MAX_GROUPS) {
      const js = [...t.js];
      const counts = [...t.counts];
      js[a] = ja + 0.3 * fwhmHz;
      counts[a] = na - 1;
      out.push({ js: [...js, ja - 0.3 * fwhmHz], counts: [...counts, 1] });
    }
  });
  return out;
}

/**
 * The best tree by the information criterion, or null when no seed gives a plausible fit. Trees are
 * screened by short fits; only the most promising are fitted to convergence and checked for plausibility.
 */
export function searchTrees(ctx: FitContext, seeds: readonly Seed[], width0: number, maxFwhmHz: number, fwhm0Hz: number): SearchResult | null {
  const seen = new Set<string>();
  const polished: LineshapeFit[] = [];
  let tried = 0;
  const screen = (ts: readonly { tree: TreeSpec; centreHz: number; width: number }[]): QuickFit[] => {
    const out: QuickFit[] = [];
    for (const { tree, centreHz, width } of ts) {
      const key = keyOf(tree);
      const lines = tree.counts.reduce((a, n) => a * (n + 1), 1);
      if (seen.has(key) || tree.js.some((j) => !(j > 0)) || lines > MAX_LINES || tried >= MAX_TRIED) continue;
      seen.add(key);
      tried++;
      const q = quickFit(ctx, tree, centreHz, width);
      if (q) out.push(q);
    }
    return out.sort((x, y) => x.criterion - y.criterion);
  };
  /** The first of the screened fits, in order, that polishes to a plausible fit better than `bar`. */
  const firstGood = (qs: readonly QuickFit[], bar: number, tries: number): LineshapeFit | null => {
    for (const q of qs.slice(0, tries)) {
      const f = collapse(polish(ctx, q));
      if (f && plausible(f, maxFwhmHz)) polished.push(f);
      if (f && plausible(f, maxFwhmHz) && f.criterion < bar) return f;
    }
    return null;
  };
  /**
   * Two J that converged to one value are one group of equivalent partners: refit as such (else their
   * sd blow up), and keep the group when it is no worse by the criterion or the split fit is implausible.
   */
  const collapse = (f: LineshapeFit | null): LineshapeFit | null => {
    const t = f ? equalMerged(f) : null;
    const merged = f && t ? fitTree(ctx, t, f.centreHz, f.widthParam) : null;
    return f && merged && (merged.criterion <= f.criterion || !plausible(f, maxFwhmHz)) ? merged : f;
  };
  const screened = screen(seeds.map((x) => ({ tree: x.tree, centreHz: x.centreHz, width: width0 })));
  // Refine from the few best seeds, not only the best: one greedy path can end in a local minimum.
  let best: LineshapeFit | null = null;
  for (let k = 0; k < Math.min(REFINE_FROM, screened.length); k++) {
    let cur = firstGood(screened.slice(k), Infinity, 1);
    for (let round = 0; cur && round < MAX_ROUNDS; round++) {
      const c = cur;
      // A poor tree fits with lines too broad; its neighbours start from the width the data show, and small J scale with it.
      const width = c.fwhmHz > fwhm0Hz ? width0 : c.widthParam;
      const near = neighbours(treeOfFit(c), Math.min(c.fwhmHz, fwhm0Hz));
      const next = firstGood(screen(near.map((tree) => ({ tree, centreHz: c.centreHz, width }))), c.criterion, 2);
      if (!next) break;
      cur = next;
    }
    if (cur && (!best || cur.criterion < best.criterion)) best = cur;
    // Residuals at the noise level: another start could only add parameters the criterion would refuse.
    if (best && best.chi2Reduced < CHI2_EXPLAINED) break;
  }
  const winner = best;
  return winner ? { best: winner, tried, others: polished.filter((f) => f !== winner) } : null;
}
