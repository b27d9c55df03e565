/**
 * Starting trees for the lineshape fit when the line maxima do not show every line (partly
 * resolved splittings). Lines are located as maxima of the negative second difference, which
 * separates lines closer than the linewidth (resolution enhancement by the second derivative,
 * common practice); then, as in a first-order multiplet every J is the distance from an outer line
 * to some other line and Σ n_k J_k spans the outer lines, trees are built from those distances.
 */
import { J_MAX_HZ } from '../measure/model';
import { treeLines, type TreeSpec } from './multipletModel';

const MAX_GROUPS = 4;
const MAX_PARTNERS = 7;
const MAX_CANDIDATES = 16;
/** Trees passed on for ranking, simplest first. */
const MAX_TREES = 120;
/** With four groups, the three chosen J come from this many smallest distances (the count of trees grows as its cube). */
const COMPLETE_FROM = 10;

/**
 * Positions (Hz) of the maxima of −(y[i−h] − 2y[i] + y[i+h]), h about a quarter linewidth, that
 * stand above 4 % of the largest one and above 4 noise sd of the difference.
 */
export function enhancedLines(freqs: Float64Array, data: Float64Array, fwhmHz: number, noise: number): number[] {
  const m = data.length;
  const step = m > 1 ? Math.abs((freqs[1] ?? 0) - (freqs[0] ?? 0)) : 1;
  const h = Math.max(1, Math.round((0.25 * fwhmHz) / step));
  const d2 = new Float64Array(m);
  for (let i = h; i < m - h; i++) d2[i] = 2 * (data[i] ?? 0) - (data[i - h] ?? 0) - (data[i + h] ?? 0);
  let top = 0;
  for (const v of d2) top = Math.max(top, v);
  const level = Math.max(0.04 * top, 4 * Math.sqrt(6) * noise);
  const out: number[] = [];
  for (let i = h + 1; i < m - h - 1; i++) {
    const v = d2[i] ?? 0;
    if (v > level && v > (d2[i - 1] ?? 0) && v >= (d2[i + 1] ?? 0)) out.push(freqs[i] ?? 0);
  }
  return out;
}

function countVectors(g: number): number[][] {
  if (g === 0) return [[]];
  return countVectors(g - 1).flatMap((v) => [1, 2, 3].map((n) => [...v, n]));
}

function combinations(n: number, k: number, start = 0): number[][] {
  if (k === 0) return [[]];
  const out: number[][] = [];
  for (let i = start; i < n; i++) for (const rest of combinations(n, k - 1, i + 1)) out.push([i, ...rest]);
  return out;
}

/**
 * Trees whose J are outer-line distances, all of them, or all but one, that one completed from the
 * span (Σ n_k J_k = outer-line distance; a J hidden by blending shows no distance of its own).
 * Ranked by how well their lines meet the observed ones; with the centre.
 */
export function spanSeeds(positions: readonly number[], tolHz: number, minJHz: number, fwhmHz: number): { centreHz: number; trees: TreeSpec[] } {
  const xs = [...positions].sort((a, b) => b - a);
  const first = xs[0] ?? 0;
  const last = xs[xs.length - 1] ?? 0;
  const span = first - last;
  const centre = (first + last) / 2;
  const raw = xs.flatMap((x) => [first - x, x - last]).filter((d) => d > minJHz && d <= span + tolHz).sort((a, b) => a - b);
  const cands: number[] = [];
  for (const d of raw) if (cands.every((c) => Math.abs(c - d) > 0.1)) cands.push(d);
  // Keep the distances to the lines nearest the outer ones: they are the smaller J, which any tree needs.
  const js = cands.slice(0, MAX_CANDIDATES);
  const trees: { tree: TreeSpec; score: number }[] = [];
  const add = (sel: number[], counts: number[]): void => {
    if (sel.some((j) => !(j > minJHz && j <= J_MAX_HZ))) return;
    const tree = { js: sel, counts };
    trees.push({ tree, score: positionScore(tree, xs.map((x) => x - centre), fwhmHz) });
  };
  for (let g = 1; g <= MAX_GROUPS; g++) {
    for (const counts of countVectors(g)) {
      if (counts.reduce((a, n) => a + n, 0) > MAX_PARTNERS) continue;
      const nLast = counts[g - 1] ?? 1;
      for (const idx of combinations(Math.min(js.length, g === MAX_GROUPS ? COMPLETE_FROM : js.length), g - 1)) {
        const sel = idx.map((i) => js[i] ?? 0);
        const rest = span - sel.reduce((a, j, k) => a + j * (counts[k] ?? 1), 0);
        add([...sel, rest / nLast], counts);
      }
    }
  }
  trees.sort((a, b) => a.score - b.score);
  return { centreHz: centre, trees: trees.slice(0, MAX_TREES).map((t) => t.tree) };
}

/** Mean squared distance (capped at the linewidth) from each predicted line to the nearest observed one, and back. */
function positionScore(tree: TreeSpec, observed: readonly number[], fwhmHz: number): number {
  const { offsets } = treeLines(tree.js, tree.counts);
  const near = (x: number, ys: readonly number[]): number => Math.min(fwhmHz, ...ys.map((y) => Math.abs(x - y))) ** 2;
  const fwd = offsets.reduce((a, o) => a + near(o, observed), 0) / Math.max(1, offsets.length);
  const back = observed.reduce((a, o) => a + near(o, offsets), 0) / Math.max(1, observed.length);
  return fwd + back;
}
