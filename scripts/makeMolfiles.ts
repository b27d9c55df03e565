/**
 * Writes the V2000 molfile of each invented sample compound (samples/<id>/<id>.mol) with explicit
 * hydrogens, and prints the `structure:` / `atoms:` front-matter lines for its structure note.
 *
 *   npx esbuild scripts/makeMolfiles.ts --bundle --platform=node --outfile=dist/makeMolfiles.js
 *   node dist/makeMolfiles.js samples
 *
 * The constitution is ours (from each note's description); openchemlib only lays out 2D
 * coordinates and places the hydrogens; src/core/structure/molfile.ts writes the file, so the
 * header and the bond stereo fields are exactly what we state here (openchemlib would add wedges).
 * Heavy atoms are numbered by their locant (C-3 is atom 3), so label H-3a sits on atom 3.
 * No configuration is drawn: which H of a CH2 is axial, or the olefin geometry, is what the
 * couplings are measured to decide, so the files leave it open (a double bond of unknown
 * geometry has stereo 3, "either").
 */
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { Molecule } from 'openchemlib';
import { writeMolfile, type MolAtom, type MolBond } from '../src/core/structure/molfile';

interface Spec {
  readonly id: string;
  readonly comment: string;
  /** Heavy atoms in locant order (atom n is C-n, O-n, …). */
  readonly heavy: readonly string[];
  /** [a, b, order, stereo] with 1-based heavy-atom numbers. */
  readonly bonds: readonly (readonly [number, number, number, number])[];
  /** Label -> heavy atom; `a`/`b` labels take the first/second H of that atom, others take all of them. */
  readonly labels: readonly (readonly [string, number])[];
}

const Z: Record<string, number> = { C: 6, O: 8, Cl: 17, Br: 35 };

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

function build(spec: Spec): { atoms: MolAtom[]; bonds: MolBond[] } {
  const m = new Molecule(0, 0);
  for (const s of spec.heavy) m.addAtom(Z[s] ?? 0);
  for (const [a, b, order] of spec.bonds) {
    m.addOrChangeBond(a - 1, b - 1, order === 2 ? Molecule.cBondTypeDouble : Molecule.cBondTypeSingle);
  }
  m.inventCoordinates();
  m.addImplicitHydrogens();
  const atoms: MolAtom[] = [];
  // openchemlib's y axis points down; a molfile's points up.
  for (let i = 0; i < m.getAllAtoms(); i++) atoms.push({ symbol: m.getAtomLabel(i), x: m.getAtomX(i), y: -m.getAtomY(i), z: 0 });
  spec.heavy.forEach((s, i) => {
    if (atoms[i]?.symbol !== s) throw new Error(`${spec.id}: atom ${i + 1} should be ${s}, openchemlib gave ${atoms[i]?.symbol}`);
  });
  const bonds: MolBond[] = spec.bonds.map(([a, b, order, stereo]) => ({ a, b, order, stereo }));
  for (let k = 0; k < m.getAllBonds(); k++) {
    const a = m.getBondAtom(0, k) + 1;
    const b = m.getBondAtom(1, k) + 1;
    if (a > spec.heavy.length || b > spec.heavy.length) bonds.push({ a: Math.min(a, b), b: Math.max(a, b), order: 1, stereo: 0 });
  }
  return { atoms, bonds };
}

/** Label -> H atom numbers: the H atoms bonded to the label's heavy atom, split a/b in atom-number order. */
function atomMap(spec: Spec, bonds: readonly MolBond[], atoms: readonly MolAtom[]): [string, number[]][] {
  const hOn = (n: number): number[] => bonds
    .flatMap((b) => (b.a === n ? [b.b] : b.b === n ? [b.a] : []))
    .filter((x) => atoms[x - 1]?.symbol === 'H').sort((x, y) => x - y);
  return spec.labels.map(([label, heavy]) => {
    const hs = hOn(heavy);
    const which = /[ab]$/.test(label) ? hs.slice(label.endsWith('a') ? 0 : 1, label.endsWith('a') ? 1 : 2) : hs;
    return [label, which];
  });
}

function main(dir: string): void {
  for (const spec of SPECS) {
    const { atoms, bonds } = build(spec);
    const file = `${spec.id}.mol`;
    writeFileSync(join(dir, spec.id, file), writeMolfile({ title: spec.id, program: 'Couplet', comment: spec.comment, atoms, bonds }));
    const map = atomMap(spec, bonds, atoms).map(([l, ns]) => `${l}: ${ns.length === 1 ? String(ns[0]) : `[${ns.join(', ')}]`}`);
    process.stdout.write(`${spec.id}:\nstructure: ${file}\natoms: { ${map.join(', ')} }\n\n`);
  }
}

main(process.argv[2] ?? 'samples');
