import { describe, expect, it } from 'vitest';
import { parseMolfile, writeMolfile } from '../../../src/core/structure/molfile';
import { checkAtomMap, readStructureRef } from '../../../src/core/structure/structureRef';

// Invented: ethyl-like C1-C2 with explicit H: atoms 3-5 on C1, 6-7 on C2 (only numbers and elements matter here).
const mol = parseMolfile(writeMolfile({
  title: 't', program: 'Couplet', comment: '',
  atoms: ['C', 'C', 'H', 'H', 'H', 'H', 'H'].map((symbol) => ({ symbol, x: 0, y: 0, z: 0 })),
  bonds: [[1, 2], [1, 3], [1, 4], [1, 5], [2, 6], [2, 7]].map(([a, b]) => ({ a: a ?? 0, b: b ?? 0, order: 1, stereo: 0 })),
}), 't.mol');

const note = (fm: string): string => `---\ncompound: t\n${fm}\n---\n\n# T\n`;

describe('structure: and atoms: in a note\'s front matter', () => {
  it('reads the molfile name and each label\'s atom numbers (one number or a list), with their note lines', () => {
    const r = readStructureRef(note('structure: t.mol\natoms:\n  H-1: [3, 4, 5]\n  H-2a: 6\n  H-2b: 7'));
    expect(r.problems).toEqual([]);
    expect(r.structure).toBe('t.mol');
    expect(r.structureLine).toBe(3);
    expect([...r.atoms]).toEqual([['H-1', [3, 4, 5]], ['H-2a', [6]], ['H-2b', [7]]]);
    expect(r.atomLines.get('H-2b')).toBe(7);
    expect(checkAtomMap(r, mol, 't.mol')).toEqual([]);
  });

  it('a note without them has no structure and no problems', () => {
    const r = readStructureRef(note('solvent: CDCl3'));
    expect([r.structure, r.atoms.size, r.problems.length]).toEqual([null, 0, 0]);
  });

  it('a value that is not an atom number is a problem naming the line and field', () => {
    const r = readStructureRef(note('structure: t.mol\natoms: { H-1: three, H-2a: 6 }'));
    expect(r.problems).toEqual([{ line: 4, field: 'atoms.H-1', message: expect.stringMatching(/atom number/) }]);
  });

  it('atoms without structure is a problem', () => {
    expect(readStructureRef(note('atoms: { H-1: 3 }')).problems[0]?.field).toBe('atoms');
  });

  it('against the molfile: a heavy atom, a number past the end and an H given twice are refused', () => {
    const r = readStructureRef(note('structure: t.mol\natoms:\n  H-1: 1\n  H-2a: 42\n  H-2b: [6, 6]'));
    const p = checkAtomMap(r, mol, 't.mol');
    expect(p.map((x) => [x.line, x.field])).toEqual([[5, 'atoms.H-1'], [6, 'atoms.H-2a'], [7, 'atoms.H-2b']]);
    expect(p[0]?.message).toMatch(/atom 1 of t\.mol is C, not H/);
    expect(p[1]?.message).toMatch(/atom 42 does not exist: t\.mol has 7 atoms/);
    expect(p[2]?.message).toMatch(/atom 6 is already given to H-2b/);
  });
});
