/**
 * The NMReDATA record against the published format: NMReDATA tag format 1.1, NMReDATA Initiative wiki
 * (nmredata.org), and Pupier et al., Magn. Reson. Chem. 56 (2018) 703. Each check names the wiki page
 * and section it follows. The record is read back with outside readers: sdf-parser (SD records and
 * `> <TAG>` fields) and openchemlib (the molfile block).
 */
import { Molecule } from 'openchemlib';
import { parse as parseSdf } from 'sdf-parser';
import { describe, expect, it } from 'vitest';
import { compoundReport } from '../../../src/core/report/compound';
import { nmredataExport } from '../../../src/core/report/nmredata';
import { atomShifts } from '../../../src/core/report/siEntries';
import type { Coupling, Pick, Sidecar } from '../../../src/core/sidecar/types';
import { parseMolfile, writeMolfile } from '../../../src/core/structure/molfile';

const HASH = 'b'.repeat(64);
const c = (a: string, b: string, jHz: number, extra: Partial<Coupling> = {}): Coupling =>
  ({ atoms: [a, b], jHz, jSdHz: 0.1, method: 'fit', dimension: 'F2', picks: [], flags: [], ...extra });
const cross = (id: string, f2Ppm: number, f1Ppm: number, label: string[]): Pick => ({ id, f2Ppm, f1Ppm, label, kind: 'cross' });

// Invented fragment CH3(3)-CH2(2)-CH(1)(OH)-CH(5)=CH(6)-CH3(4): heavy atoms numbered by locant, O is 18.
// H atoms: 7 on C1 (H-1), 8/9 on C2 (H-2a/H-2b), 10-12 on C3, 13 on C5 (H-5), 14 on C6 (H-6), 15-17 on C4, 19 on O18.
const symbols = ['C', 'C', 'C', 'C', 'C', 'C', 'H', 'H', 'H', 'H', 'H', 'H', 'H', 'H', 'H', 'H', 'H', 'O', 'H'];
const bondList = [[1, 2], [2, 3], [1, 5], [5, 6, 2], [6, 4], [1, 18], [1, 7], [2, 8], [2, 9], [3, 10], [3, 11], [3, 12], [5, 13], [6, 14], [4, 15], [4, 16], [4, 17], [18, 19]];
const molText = writeMolfile({
  title: 'fragment', program: 'Couplet', comment: 'invented test fragment',
  atoms: symbols.map((symbol, i) => ({ symbol, x: i, y: i % 2, z: 0 })),
  bonds: bondList.map(([a, b, order]) => ({ a: a ?? 0, b: b ?? 0, order: order ?? 1, stereo: 0 })),
});
const atoms = new Map<string, number[]>([['H-1', [7]], ['H-2a', [8]], ['H-2b', [9]], ['H-5', [13]], ['H-6', [14]]]);
const structure = { molfile: parseMolfile(molText, 'fragment.mol'), atoms, file: 'fragment.mol' };

const cosy: Sidecar = {
  schema: 'couplet-sidecar/1', data: { file: 'cosy.jdx', sha256: HASH },
  picks: [
    cross('p1', 4.1, 2.35, ['H-1', 'H-2a']), cross('p2', 2.35, 4.1, ['H-2a', 'H-1']), cross('p3', 4.1, 2.2, ['H-1', 'H-2b']),
    cross('p4', 6.3, 5.9, ['H-5', 'H-6']), cross('p5', 5.9, 6.3, ['H-6', 'H-5']),
  ],
  couplings: [c('H-1', 'H-2a', 7.2), c('H-1', 'H-2b', 6.8), c('H-5', 'H-6', 15.6), c('H-1', 'H-6', 0.7, { flags: ['unresolved'] })],
};
const sources = [{ file: 'cosy.jdx.couplet.yaml', sidecar: cosy }];
const report = compoundReport({ compound: 'fragment', sources, observeMhz: 400.13, solvent: 'CDCl3' });
const withStructure = nmredataExport({ report, shifts: atomShifts(sources), structure, files: { cosy: 'cosy.jdx' } });
const sd = withStructure.record;

/** The value lines of one tag as written (between its header and the empty line). */
function tagLines(text: string, name: string): string[] {
  const start = text.indexOf(`>  <${name}>\n`);
  if (start < 0) return [];
  const body = text.slice(start + name.length + 6);
  return body.slice(0, body.indexOf('\n\n')).split('\n');
}

describe('SD record layout ("Sdf files"; "End-of-line"; "Separator")', () => {
  it('each tag is ">  <NAME>", value lines, one empty line; every value line ends in "\\" (version > 1.0)', () => {
    const afterMol = sd.slice(sd.indexOf('M  END\n') + 7);
    const blocks = afterMol.replace(/\$\$\$\$\n$/, '').split('\n\n').filter((b) => b !== '');
    expect(blocks.length).toBeGreaterThanOrEqual(8);
    for (const b of blocks) {
      const [header, ...values] = b.split('\n');
      expect(header).toMatch(/^> {2}<NMREDATA_[A-Z0-9_]+>$/);
      expect(values.length).toBeGreaterThan(0);
      for (const v of values) expect(v.endsWith('\\')).toBe(true);
    }
    expect(sd.endsWith('\n$$$$\n')).toBe(true);
  });

  it('tag names hold only letters, digits and underscores ("Important note on tag names")', () => {
    for (const m of sd.matchAll(/^> {2}<([^>]*)>$/gm)) expect(m[1]).toMatch(/^[A-Za-z][A-Za-z0-9_]*$/);
  });

  it('an outside SD reader (sdf-parser) finds one record with every tag, and the molfile block (openchemlib) is the structure: 19 atoms, C6H12O', () => {
    const parsed = parseSdf(sd, { dynamicTyping: false });
    expect(parsed.molecules).toHaveLength(1);
    expect(parsed.labels).toEqual(expect.arrayContaining(['NMREDATA_VERSION', 'NMREDATA_LEVEL', 'NMREDATA_ID', 'NMREDATA_FORMULA', 'NMREDATA_SOLVENT',
      'NMREDATA_ASSIGNMENT', 'NMREDATA_J', 'NMREDATA_1D_1H', 'NMREDATA_2D_1H_NJ_1H']));
    const mol = Molecule.fromMolfile(String(parsed.molecules[0]?.molfile));
    expect(mol.getAllAtoms()).toBe(19);
    expect(mol.getMolecularFormula().formula).toBe('C6H12O');
  });
});

describe('header tags ("NMReDATA tag format", Header tags)', () => {
  it('NMREDATA_VERSION 1.1, NMREDATA_LEVEL 0 (no ambiguous or interchangeable assignment), solvent as given', () => {
    expect(tagLines(sd, 'NMREDATA_VERSION')).toEqual(['1.1\\']);
    expect(tagLines(sd, 'NMREDATA_LEVEL')).toEqual(['0\\']);
    expect(tagLines(sd, 'NMREDATA_SOLVENT')).toEqual(['CDCl3\\']);
  });

  it('NMREDATA_FORMULA from the molfile, Hill order (C6H12O)', () => {
    expect(tagLines(sd, 'NMREDATA_FORMULA')).toEqual(['C6H12O\\']);
  });

  it('NMREDATA_TEMPERATURE only when known ("298.0 K" form)', () => {
    expect(sd).not.toContain('NMREDATA_TEMPERATURE');
    expect(nmredataExport({ report, temperatureK: 298 }).record).toContain('>  <NMREDATA_TEMPERATURE>\n298.0 K\\\n');
  });
});

describe('NMREDATA_ASSIGNMENT and NMREDATA_J ("NMReDATA tag format", Agregated data tags)', () => {
  it('label, shift to 4 decimals, then the atom numbers, ", " separated, in descending shift', () => {
    expect(tagLines(sd, 'NMREDATA_ASSIGNMENT')).toEqual([
      'H-5, 6.3000, 13\\', 'H-6, 5.9000, 14\\', 'H-1, 4.1000, 7\\', 'H-2a, 2.3500, 8\\', 'H-2b, 2.2000, 9\\',
    ]);
  });

  it('every assigned label points at an H atom bonded to the carbon of its locant (openchemlib neighbours)', () => {
    // openchemlib moves H atoms to the end; its map takes molfile index -> its own index.
    const { molecule: mol, map } = Molecule.fromMolfileWithAtomMap(structure.molfile.text);
    const toFile = (i: number): number => [...map].indexOf(i) + 1;
    for (const line of tagLines(sd, 'NMREDATA_ASSIGNMENT')) {
      const [label, , ...numbers] = line.replace(/\\$/, '').split(', ');
      const locant = Number(/^H-(\d+)/.exec(label ?? '')?.[1]);
      for (const n of numbers) {
        const i = map[Number(n) - 1] ?? -1;
        expect(mol.getAtomicNo(i)).toBe(1);
        expect(toFile(mol.getConnAtom(i, 0))).toBe(locant);
      }
    }
  });

  it('J lines "a, b, J" with two decimals, magnitudes, nb= bonds from the structure; sd and flags after ";"', () => {
    const js = tagLines(sd, 'NMREDATA_J');
    expect(js).toContain('H-1, H-2a, 7.20, nb=3 ;sd 0.10 Hz, fit\\');
    expect(js).toContain('H-5, H-6, 15.60, nb=3 ;sd 0.10 Hz, fit\\');
    // H-C1-C5=C6-H: four bonds (allylic), flagged.
    expect(js.find((l) => l.startsWith('H-1, H-6, 0.70, nb=4 ;'))).toMatch(/CAUTION unresolved/);
  });

  it('a J above 3 Hz across four or more bonds is flagged as implausible (long-range 4J 1-3 Hz, handbook ranges [mem]); 0.7 Hz across 4 is not', () => {
    const mislabelled: Sidecar = { ...cosy, couplings: [...cosy.couplings, c('H-2a', 'H-6', 8.0)] };
    const src = [{ file: 'cosy.jdx.couplet.yaml', sidecar: mislabelled }];
    const out = nmredataExport({ report: compoundReport({ compound: 'f', sources: src, observeMhz: 400.13, solvent: 'CDCl3' }), structure });
    const js = tagLines(out.record, 'NMREDATA_J');
    expect(js.find((l) => l.startsWith('H-2a, H-6, 8.00, nb=5 ;'))).toMatch(/CAUTION implausible_for_5_bonds/);
    expect(js.find((l) => l.startsWith('H-1, H-6, '))).not.toMatch(/implausible/);
    expect(out.notes.join('\n')).toMatch(/H-2a\/H-6 \(8\.00 Hz across 5 bonds\).*check the labels/);
  });

  it('every J pair names labels the record assigns', () => {
    const assigned = new Set(tagLines(sd, 'NMREDATA_ASSIGNMENT').map((l) => l.split(', ')[0]));
    for (const l of tagLines(sd, 'NMREDATA_J')) {
      const [a, b] = l.split(', ');
      expect(assigned.has(a)).toBe(true);
      expect(assigned.has(b)).toBe(true);
    }
  });
});

describe('spectrum tags ("NMReDATA tag format", Individual spectra tags; "1D attributes"; "2D attributes")', () => {
  it('NMREDATA_1D_1H starts with Larmor=, then signals with S=, J=, N=, L= in the documented order', () => {
    const lines = tagLines(sd, 'NMREDATA_1D_1H');
    expect(lines[0]).toBe('Larmor=400.13 ;no 1D spectrum: signals derived from the DQF-COSY\\');
    expect(lines).toContain('6.3000, S=d, J=15.60(H-6), N=1, L=H-5\\');
    for (const l of lines.slice(1)) {
      const keys = [...l.split(' ;')[0]!.matchAll(/, ([A-Z][A-Za-z0-9]*)=/g)].map((m) => m[1]);
      const order = ['S', 'J', 'N', 'L', 'E'];
      expect(keys.map((k) => order.indexOf(k ?? ''))).toEqual([...keys.map((k) => order.indexOf(k ?? ''))].sort((a, b) => a - b));
      expect(l).toMatch(/^\d+\.\d{4}(-\d+\.\d{4})?, /);
    }
  });

  it('the DQF-COSY is NMREDATA_2D_1H_NJ_1H with Larmor=, CorType=COSY, Jcamp_location= and "a/b, Ja=J" lines', () => {
    const lines = tagLines(sd, 'NMREDATA_2D_1H_NJ_1H');
    expect(lines.slice(0, 3)).toEqual(['Larmor=400.13\\', 'CorType=COSY ;phase-sensitive DQF-COSY\\', 'Jcamp_location=file:./cosy.jdx\\']);
    expect(lines).toContain('H-1/H-2a, Ja=7.20 ;sd 0.10 Hz, fit\\');
  });

  it('labels holding "," "/" or "(" are written inside <"…"> ("Labels including comma or other special characters")', () => {
    const odd: Sidecar = { ...cosy, picks: [cross('q', 4.1, 2.35, ['H-1', 'H-2(ax)'])], couplings: [c('H-1', 'H-2(ax)', 7.2)] };
    const r = compoundReport({ compound: 'odd', sources: [{ file: 'o', sidecar: odd }], observeMhz: 400.13, solvent: 'CDCl3' });
    expect(tagLines(nmredataExport({ report: r }).record, 'NMREDATA_J')[0]).toMatch(/^H-1, <"H-2\(ax\)">, 7\.20 ;/);
  });
});

describe('what the record lacks is said, in the record and to the user', () => {
  const bare = nmredataExport({ report });

  it('without a structure: an empty molfile, no NMREDATA_ASSIGNMENT, and NMREDATA_ID says it is incomplete', () => {
    expect(bare.record.split('\n')[3]).toBe('  0  0  0  0  0  0  0  0  0  0999 V2000');
    expect(bare.record).not.toContain('<NMREDATA_ASSIGNMENT>');
    expect(tagLines(bare.record, 'NMREDATA_ID')[1]).toMatch(/^Comment=incomplete: no structure/);
    expect(bare.notes[0]).toMatch(/^incomplete: no structure/);
  });

  it('a label without atom numbers is left out of NMREDATA_ASSIGNMENT and named in the notes', () => {
    const partial = nmredataExport({ report, structure: { ...structure, atoms: new Map([['H-1', [7]]]) } });
    expect(tagLines(partial.record, 'NMREDATA_ASSIGNMENT')).toEqual(['H-1, 4.1000, 7\\']);
    expect(partial.notes.join('\n')).toMatch(/no atom numbers for H-5, H-6, H-2a, H-2b/);
  });

  it('a note without solvent: no NMREDATA_SOLVENT, and the notes say so', () => {
    const noSolvent = nmredataExport({ report: compoundReport({ compound: 'f', sources, observeMhz: 400.13, solvent: null }) });
    expect(noSolvent.record).not.toContain('<NMREDATA_SOLVENT>');
    expect(noSolvent.notes.join('\n')).toMatch(/no solvent in the structure note/);
  });

  it('flagged couplings and the missing Spectrum_Location are in the notes', () => {
    expect(withStructure.notes.join('\n')).toMatch(/Spectrum_Location/);
    expect(withStructure.notes.join('\n')).toMatch(/flagged J values.*H-1\/H-6/);
  });
});
