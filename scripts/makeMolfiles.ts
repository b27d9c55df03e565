/**
 * Writes the V2000 molfile of each invented sample compound (samples/<id>/<id>.mol) with explicit
 * hydrogens, checks that its H atoms are the ones the notes name (scripts/sampleStructures.ts),
 * and prints the notes' `structure:` / `atoms:` front-matter lines.
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
import { SPECS, atomMapOf, structureFrontMatter, type Spec } from './sampleStructures';

const Z: Record<string, number> = { C: 6, O: 8, Cl: 17, Br: 35 };

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

/** The H atoms openchemlib bonded to each label's atom must be the ones the notes name (atomMapOf). */
function checkAtomMap(spec: Spec, bonds: readonly MolBond[], atoms: readonly MolAtom[]): void {
  const hOn = (n: number): number[] => bonds
    .flatMap((b) => (b.a === n ? [b.b] : b.b === n ? [b.a] : []))
    .filter((x) => atoms[x - 1]?.symbol === 'H').sort((x, y) => x - y);
  for (const [label, numbers] of atomMapOf(spec)) {
    const heavy = spec.labels.find(([l]) => l === label)?.[1] ?? 0;
    if (!numbers.every((n) => hOn(heavy).includes(n))) throw new Error(`${spec.id}: ${label} should be H atom(s) ${numbers.join(', ')} of atom ${heavy}; the molfile has ${hOn(heavy).join(', ')}`);
  }
}

function main(dir: string): void {
  for (const spec of SPECS) {
    const { atoms, bonds } = build(spec);
    const file = `${spec.id}.mol`;
    writeFileSync(join(dir, spec.id, file), writeMolfile({ title: spec.id, program: 'Couplet', comment: spec.comment, atoms, bonds }));
    checkAtomMap(spec, bonds, atoms);
    process.stdout.write(`${spec.id}:\n${structureFrontMatter(spec.id).join('\n')}\n\n`);
  }
}

main(process.argv[2] ?? 'samples');
