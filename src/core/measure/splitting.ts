/**
 * First-order splitting of one line by groups of equivalent partners: a group of n partners with
 * coupling J splits each line into n + 1 lines at (n/2 − m)·J with binomial weights C(n, m)
 * (Pascal's triangle; any NMR text). Shared by the cross-peak model (passive couplings) and the
 * 1D multiplet model.
 */

/** Line offsets from the centre (Hz) and binomial weights of every line of the tree (unmerged). */
export function treeLines(js: readonly number[], counts: readonly number[]): { offsets: number[]; weights: number[] } {
  let offsets = [0];
  let weights = [1];
  js.forEach((j, k) => {
    const n = counts[k] ?? 1;
    const no: number[] = [];
    const nw: number[] = [];
    let c = 1; // C(n, m), updated as m runs
    for (let m = 0; m <= n; m++) {
      offsets.forEach((o, q) => {
        no.push(o + (n / 2 - m) * j);
        nw.push((weights[q] ?? 0) * c);
      });
      c = (c * (n - m)) / (m + 1);
    }
    offsets = no;
    weights = nw;
  });
  return { offsets, weights };
}
