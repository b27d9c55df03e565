import { Molecule } from 'openchemlib';
import { describe, expect, it } from 'vitest';
import { MolfileError, bondsBetween, formulaOf, neighbours, parseMolfile, writeMolfile, type MolBond } from '../../../src/core/structure/molfile';

// Invented: ethanol-shaped C1-C2-O3 with explicit H (atoms 4-9), all at the origin (coordinates play no part here).
const atoms = ['C', 'C', 'O', 'H', 'H', 'H', 'H', 'H', 'H'].map((symbol) => ({ symbol, x: 0, y: 0, z: 0 }));
const bonds: MolBond[] = [[1, 2], [2, 3], [1, 4], [1, 5], [1, 6], [2, 7], [2, 8], [3, 9]].map(([a, b]) => ({ a: a ?? 0, b: b ?? 0, order: 1, stereo: 0 }));
const text = writeMolfile({ title: 'ethanol-like', program: 'Couplet', comment: 'test', atoms, bonds });

function errorOf(f: () => unknown): MolfileError {
  try {
    f();
  } catch (e) {
    if (e instanceof MolfileError) return e;
    throw e;
  }
  throw new Error('expected a MolfileError');
}

describe('V2000 molfiles: written and read back', () => {
  it('an outside reader (openchemlib Molecule.fromMolfile) reads what we write: 9 atoms, 8 bonds, C2H6O', () => {
    const m = Molecule.fromMolfile(text);
    expect(m.getAllAtoms()).toBe(9);
    expect(m.getAllBonds()).toBe(8);
    expect(m.getMolecularFormula().formula).toBe('C2H6O');
  });

  it('reads atoms, bonds and header; formula in Hill order (C, H, then alphabetical: Hill, J. Am. Chem. Soc. 22 (1900) 478 [mem])', () => {
    const mol = parseMolfile(text, 'x.mol');
    expect(mol.title).toBe('ethanol-like');
    expect(mol.atoms.map((a) => a.symbol).join('')).toBe('CCOHHHHHH');
    expect(mol.bonds).toHaveLength(8);
    expect(formulaOf(mol)).toBe('C2H6O');
    expect(neighbours(mol, 2).sort((a, b) => a - b)).toEqual([1, 3, 7, 8]);
    expect(mol.text.endsWith('M  END\n')).toBe(true);
  });

  it('counts bonds between atoms: H4 to H9 is H-C1-C2-O3-H, 4 bonds', () => {
    const mol = parseMolfile(text, 'x.mol');
    expect(bondsBetween(mol, 4, 7)).toBe(3);
    expect(bondsBetween(mol, 4, 9)).toBe(4);
    expect(bondsBetween(mol, 4, 4)).toBe(0);
  });

  it('keeps the counts line in the CTfile columns: atoms 1-3, bonds 4-6, V2000 at 35-39', () => {
    const counts = text.split('\n')[3] ?? '';
    expect(counts.slice(0, 3)).toBe('  9');
    expect(counts.slice(3, 6)).toBe('  8');
    expect(counts.slice(34, 39)).toBe('V2000');
  });
});

describe('bad molfiles: errors name the file, the line and the field', () => {
  const lines = text.split('\n');
  const edit = (i: number, line: string): string => lines.map((l, k) => (k === i ? line : l)).join('\n');

  it('a counts line without V2000', () => {
    const e = errorOf(() => parseMolfile(edit(3, '  9  8'), 'bad.mol'));
    expect(e.message).toMatch(/^bad\.mol:4: counts line: expected "V2000"/);
  });

  it('a V3000 file is refused with a hint', () => {
    expect(errorOf(() => parseMolfile(edit(3, '  0  0  0     0  0            999 V3000'), 'v3.mol')).message).toMatch(/v3\.mol:4: counts line: V3000 .*V2000/);
  });

  it('a bond to an atom that does not exist', () => {
    const bondLine = 4 + 9; // first bond line (0-based)
    const e = errorOf(() => parseMolfile(edit(bondLine, ' 1 42  1  0  0  0  0'), 'b.mol'));
    expect([e.line, e.field]).toEqual([bondLine + 1, 'bond second atom']);
    expect(e.message).toMatch(/atom 42 does not exist \(the counts line declares 9 atoms\)/);
  });

  it('an atom line with a number where the symbol belongs', () => {
    const e = errorOf(() => parseMolfile(edit(5, '    0.0000    0.0000    0.0000 12  0  0'), 'a.mol'));
    expect(e.message).toMatch(/^a\.mol:6: atom symbol:/);
  });

  it('fewer atom lines than the counts line declares, and a missing M  END', () => {
    expect(errorOf(() => parseMolfile(lines.slice(0, 8).join('\n'), 'short.mol')).message).toMatch(/short\.mol:9: atom 5: the file ends here/);
    expect(errorOf(() => parseMolfile(text.replace('M  END', ''), 'end.mol')).field).toBe('M  END');
  });
});
