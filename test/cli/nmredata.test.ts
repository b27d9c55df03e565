/**
 * `couplet report --format nmredata` on the samples: the SD file read back with outside readers
 * (sdf-parser for the records and tags, openchemlib for the molfiles), checked against the NMReDATA
 * tag format 1.1 (NMReDATA Initiative wiki, nmredata.org, and Pupier et al., Magn. Reson. Chem. 56
 * (2018) 703), and pinned as a snapshot.
 */
import { cpSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { Molecule } from 'openchemlib';
import { parse as parseSdf } from 'sdf-parser';
import { afterAll, describe, expect, it } from 'vitest';
import { expectSnapshot, run } from './helpers';

const repo = resolve(__dirname, '..', '..');
const samples = join(repo, 'samples');


/** Value lines of a tag as sdf-parser returns it, without the `\` terminators ("End-of-line"). */
const valueLines = (v: unknown): string[] => String(v).split('\n').map((l) => l.replace(/\\$/, '')).filter((l) => l !== '');

/** Element -> count of a formula such as C7H6BrClO. */
const elements = (f: string): Record<string, number> =>
  Object.fromEntries([...f.matchAll(/([A-Z][a-z]?)(\d*)/g)].map((m) => [m[1], Number(m[2] || '1')]).sort());

const FORMULA: Record<string, string> = {
  // From each note's description (invented compounds; brisquarene's Br and Cl are the molfile's choice).
  quellopyranol: 'C7H14O3', // 2-methyl-6-(hydroxymethyl)oxan-4-ol
  vantrelenol: 'C6H12O', // CH3-CH(OH)-CH=CH-CH2-CH3
  brisquarene: 'C7H6BrClO', // 1-OMe, 2-Br, 4-Cl benzene
};

describe('couplet report --format nmredata on the samples', () => {
  const r = run('report', samples, '--format', 'nmredata');
  const parsed = parseSdf(r.out, { dynamicTyping: false });

  it('exits 0 with one SD record per compound, every NMREDATA tag present (sdf-parser)', () => {
    expect(r.code).toBe(0);
    expect(parsed.molecules.map((m) => String(m.molfile).split('\n')[0])).toEqual(['brisquarene', 'quellopyranol', 'vantrelenol']);
    for (const m of parsed.molecules) {
      for (const t of ['NMREDATA_VERSION', 'NMREDATA_LEVEL', 'NMREDATA_FORMULA', 'NMREDATA_SOLVENT', 'NMREDATA_ASSIGNMENT', 'NMREDATA_J', 'NMREDATA_1D_1H', 'NMREDATA_2D_1H_NJ_1H']) {
        expect(m[t], `${String(m.molfile).split('\n')[0]} ${t}`).toBeDefined();
      }
    }
  });

  it('each molfile block is the compound (openchemlib): formula, explicit H, and NMREDATA_FORMULA agrees', () => {
    for (const m of parsed.molecules) {
      const id = String(m.molfile).split('\n')[0] ?? '';
      const mol = Molecule.fromMolfile(String(m.molfile));
      // openchemlib orders elements its own way; compare element counts.
      expect(elements(mol.getMolecularFormula().formula)).toEqual(elements(FORMULA[id] ?? ''));
      expect(valueLines(m.NMREDATA_FORMULA)).toEqual([FORMULA[id]]);
      // Explicit H: every H is an atom of the file, none implicit.
      const h = Array.from({ length: mol.getAllAtoms() }, (_, i) => mol.getAtomicNo(i)).filter((z) => z === 1).length;
      expect(h).toBe(Number(/H(\d+)/.exec(FORMULA[id] ?? '')?.[1]));
    }
  });

  it('every assigned label maps to H atoms bonded to the carbon of its locant (H-3a on C-3; heavy atoms numbered by locant)', () => {
    for (const m of parsed.molecules) {
      const { molecule: mol, map } = Molecule.fromMolfileWithAtomMap(String(m.molfile));
      const toFile = (i: number): number => [...map].indexOf(i) + 1;
      const lines = valueLines(m.NMREDATA_ASSIGNMENT);
      expect(lines.length).toBeGreaterThan(3);
      for (const line of lines) {
        const [label, shift, ...numbers] = line.split(', ');
        expect(shift).toMatch(/^\d+\.\d{4}$/);
        const locant = Number(/^H-(\d+)[ab]?$/.exec(label ?? '')?.[1]);
        for (const n of numbers) {
          const i = map[Number(n) - 1] ?? -1;
          expect(mol.getAtomicNo(i), `${label} atom ${n}`).toBe(1);
          expect(toFile(mol.getConnAtom(i, 0)), `${label} atom ${n}`).toBe(locant);
        }
      }
    }
  });

  it('NMREDATA_J pairs reference assigned labels; geminal pairs have nb=2, vicinal nb=3', () => {
    for (const m of parsed.molecules) {
      const assigned = new Set(valueLines(m.NMREDATA_ASSIGNMENT).map((l) => l.split(', ')[0]));
      for (const line of valueLines(m.NMREDATA_J)) {
        const [a, b, j, nb] = line.split(' ;')[0]!.split(', ');
        expect(assigned.has(a) && assigned.has(b), line).toBe(true);
        expect(j).toMatch(/^\d+\.\d{2}$/);
        const sameCarbon = a?.replace(/[ab]$/, '') === b?.replace(/[ab]$/, '');
        if (sameCarbon) expect(nb).toBe('nb=2');
      }
    }
    const q = parsed.molecules.find((m) => String(m.molfile).startsWith('quellopyranol'));
    expect(valueLines(q?.NMREDATA_J).find((l) => l.startsWith('H-3a, H-4, '))).toMatch(/, nb=3 ;/);
  });

  it('1D signals give one J per multiplicity letter ("1D attributes", J=: "S=td, J=9.30, 4.81"), none for s, bs and m', () => {
    let checked = 0;
    for (const m of parsed.molecules) {
      for (const line of valueLines(m.NMREDATA_1D_1H).filter((l) => /^\d/.test(l))) {
        const s = /, S=([a-z]+)/.exec(line)?.[1] ?? '';
        const j = /, J=(.*?), N=/.exec(line)?.[1];
        if (['s', 'bs', 'm'].includes(s)) expect(j, line).toBeUndefined();
        else {
          expect(j?.split(', ')).toHaveLength(s.length);
          checked++;
        }
      }
    }
    expect(checked).toBeGreaterThan(3);
  });

  it('every tag value line ends in "\\" and tags are separated by one empty line ("End-of-line", "Sdf files")', () => {
    const tagText = r.out.split('$$$$\n').map((rec) => rec.slice(rec.indexOf('M  END\n') + 7)).join('');
    for (const line of tagText.split('\n')) {
      if (line === '' || line.startsWith('>  <')) continue;
      expect(line.endsWith('\\'), line).toBe(true);
    }
  });

  it('stderr says what the format needs and Couplet cannot give (Spectrum_Location) and which J values are flagged', () => {
    expect(r.err).toMatch(/^quellopyranol: Spectrum_Location .* not known/m);
    expect(r.err).toMatch(/^vantrelenol: flagged J values/m);
    expect(r.err).not.toMatch(/incomplete/);
  });

  it('matches the pinned export (snapshot; regenerate after changing samples or the SI derivation)', () => {
    expectSnapshot('report-samples.nmredata', 'sdf', r.out, 'NMReDATA export');
  });
});

describe('couplet report --format nmredata: bad structures stop with the file, line and field', () => {
  const dir = mkdtempSync(join(tmpdir(), 'couplet-nmredata-'));
  afterAll(() => rmSync(dir, { recursive: true, force: true }));
  const copy = (name: string): string => {
    const d = join(dir, name);
    cpSync(join(samples, 'vantrelenol'), d, { recursive: true });
    return d;
  };
  const note = (d: string): string => join(d, 'vantrelenol.md');
  const edit = (path: string, from: string | RegExp, to: string): void => writeFileSync(path, readFileSync(path, 'utf8').replace(from, to));

  it('an atom number that is a carbon: exit 2, note line and field named', () => {
    const d = copy('carbon');
    edit(note(d), 'H-2: 11', 'H-2: 2');
    const res = run('report', d, '--format', 'nmredata');
    expect(res.code).toBe(2);
    expect(res.err).toMatch(/vantrelenol\.md:6: atoms\.H-2: atom 2 of vantrelenol\.mol is C, not H/);
  });

  it('a broken counts line in the molfile: exit 2, molfile line 4 named', () => {
    const d = copy('counts');
    edit(join(d, 'vantrelenol.mol'), ' V2000', ' V2001');
    const res = run('report', d, '--format', 'nmredata');
    expect(res.code).toBe(2);
    expect(res.err).toMatch(/vantrelenol\.mol:4: counts line: expected "V2000"/);
  });

  it('a missing molfile: exit 2, the structure: line named', () => {
    const d = copy('missing');
    rmSync(join(d, 'vantrelenol.mol'));
    const res = run('report', d, '--format', 'nmredata');
    expect(res.code).toBe(2);
    expect(res.err).toMatch(/vantrelenol\.md:5: structure: cannot read .*vantrelenol\.mol \(ENOENT\)/);
  });

  it('without structure: and atoms: the export still runs and says it is incomplete (record and stderr)', () => {
    // brisquarene's DQF-COSY alone (no 1D spectrum): the smallest data set, so the test stays quick.
    const d = join(dir, 'bare');
    cpSync(join(samples, 'brisquarene'), d, { recursive: true });
    for (const f of ['1h.jdx', '1h.jdx.couplet.yaml']) rmSync(join(d, f));
    edit(join(d, 'brisquarene.md'), /^structure:.*\natoms:.*\n/m, '');
    const res = run('report', d, '--format', 'nmredata');
    expect(res.code).toBe(0);
    expect(res.err).toMatch(/^brisquarene: incomplete: no structure/m);
    expect(res.out).toMatch(/^Comment=incomplete: no structure/m);
    expect(res.out).not.toContain('<NMREDATA_ASSIGNMENT>');
  });
});
