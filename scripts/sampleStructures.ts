/**
 * The constitution of each invented sample compound (from its structure note's description) and the
 * label -> H atom numbers that follow from it: heavy atoms numbered by locant (C-3 is atom 3), then
 * the hydrogens, heavy atom by heavy atom, as scripts/makeMolfiles.ts writes them (it checks that the
 * file it writes agrees). Pure data and arithmetic, so the sample notes' generator can use it too.
 */
export interface Spec {
  readonly id: string;
  readonly comment: string;
  /** Heavy atoms in locant order (atom n is C-n, O-n, …). */
  readonly heavy: readonly string[];
  /** [a, b, order, stereo] with 1-based heavy-atom numbers. */
  readonly bonds: readonly (readonly [number, number, number, number])[];
  /** Label -> heavy atom; `a`/`b` labels take the first/second H of that atom, others take all of them. */
  readonly labels: readonly (readonly [string, number])[];
}

export const SPECS: readonly Spec[] = [
  {
    id: 'quellopyranol',
    comment: '2-methyl-6-(hydroxymethyl)oxan-4-ol; constitution only, configuration open (invented compound)',
    heavy: ['O', 'C', 'C', 'C', 'C', 'C', 'C', 'C', 'O', 'O'],
    bonds: [[1, 2, 1, 0], [2, 3, 1, 0], [3, 4, 1, 0], [4, 5, 1, 0], [5, 6, 1, 0], [6, 1, 1, 0], [2, 7, 1, 0], [6, 8, 1, 0], [4, 9, 1, 0], [8, 10, 1, 0]],
    labels: [['H-2', 2], ['H-3a', 3], ['H-3b', 3], ['H-4', 4], ['H-5a', 5], ['H-5b', 5], ['H-6', 6], ['H-7', 7], ['H-8a', 8], ['H-8b', 8]],
  },
  {
    id: 'vantrelenol',
    comment: 'hex-3-en-2-ol; olefin geometry open (stereo 3), invented compound',
    heavy: ['C', 'C', 'C', 'C', 'C', 'C', 'O'],
    bonds: [[1, 2, 1, 0], [2, 3, 1, 0], [3, 4, 2, 3], [4, 5, 1, 0], [5, 6, 1, 0], [2, 7, 1, 0]],
    labels: [['H-1', 1], ['H-2', 2], ['H-3', 3], ['H-4', 4], ['H-5', 5], ['H-6', 6]],
  },
  {
    id: 'brisquarene',
    // The note fixes the OMe at C-1 and H at C-3, C-5, C-6; the other two substituents are our choice.
    comment: '2-bromo-4-chloro-1-methoxybenzene pattern; Br and Cl stand in for the substituents the note leaves open',
    heavy: ['C', 'C', 'C', 'C', 'C', 'C', 'C', 'O', 'Br', 'Cl'],
    bonds: [[1, 2, 2, 0], [2, 3, 1, 0], [3, 4, 2, 0], [4, 5, 1, 0], [5, 6, 2, 0], [6, 1, 1, 0], [1, 8, 1, 0], [8, 7, 1, 0], [2, 9, 1, 0], [4, 10, 1, 0]],
    labels: [['H-3', 3], ['H-5', 5], ['H-6', 6], ['H-7', 7]],
  },
];

const VALENCE: Record<string, number> = { C: 4, O: 2, Cl: 1, Br: 1 };

/** 1-based numbers of the H atoms on each heavy atom (H atoms follow the heavy atoms, in heavy-atom order). */
export function hydrogenNumbers(spec: Spec): number[][] {
  let next = spec.heavy.length + 1;
  return spec.heavy.map((symbol, i) => {
    const used = spec.bonds.reduce((sum, [a, b, order]) => sum + (a === i + 1 || b === i + 1 ? order : 0), 0);
    const count = (VALENCE[symbol] ?? 0) - used;
    return Array.from({ length: Math.max(0, count) }, () => next++);
  });
}

/** Label -> H atom numbers: `a`/`b` labels take the first/second H of their atom, others all of them. */
export function atomMapOf(spec: Spec): [string, number[]][] {
  const hs = hydrogenNumbers(spec);
  return spec.labels.map(([label, heavy]) => {
    const on = hs[heavy - 1] ?? [];
    const which = /[ab]$/.test(label) ? on.slice(label.endsWith('a') ? 0 : 1, label.endsWith('a') ? 1 : 2) : on;
    return [label, which];
  });
}

/** The front-matter lines that point a sample note at its molfile. */
export function structureFrontMatter(id: string): string[] {
  const spec = SPECS.find((s) => s.id === id);
  if (!spec) return [];
  const map = atomMapOf(spec).map(([l, ns]) => `${l}: ${ns.length === 1 ? String(ns[0]) : `[${ns.join(', ')}]`}`);
  return [
    '# Structure for the NMReDATA export (molfile with explicit H from scripts/makeMolfiles.ts); label -> H atom number(s)',
    `structure: ${id}.mol`,
    `atoms: { ${map.join(', ')} }`,
  ];
}
