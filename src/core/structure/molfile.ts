/**
 * Reading, checking and writing V2000 molfiles (CTfile formats, the fixed-column layout of the
 * header block, the counts line `aaabbb…vvvvvv`, the atom block `xxxxx.xxxxyyyyy.yyyyzzzzz.zzzz aaa`
 * and the bond block `111222tttsss`; from memory of the published CTfile description). Only what
 * an NMReDATA record needs: the atoms with their elements, the bonds, the text to embed.
 * Every problem is a MolfileError naming the file, the 1-based line and the field.
 */

export class MolfileError extends Error {
  readonly file: string;
  readonly line: number;
  readonly field: string;

  constructor(file: string, line: number, field: string, message: string) {
    super(`${file}:${line}: ${field}: ${message}`);
    this.name = 'MolfileError';
    this.file = file;
    this.line = line;
    this.field = field;
  }
}

export interface MolAtom {
  /** Element symbol as written (e.g. `C`, `H`, `Br`). */
  readonly symbol: string;
  readonly x: number;
  readonly y: number;
  readonly z: number;
}

export interface MolBond {
  /** 1-based atom numbers. */
  readonly a: number;
  readonly b: number;
  /** 1 single, 2 double, 3 triple, 4 aromatic. */
  readonly order: number;
  /** Bond stereo field: 0 none, 1 up, 6 down, 4 either (single); 3 cis or trans unknown (double). */
  readonly stereo: number;
}

export interface Molfile {
  /** Header line 1 (the molecule's name). */
  readonly title: string;
  /** Header line 3 (free comment). */
  readonly comment: string;
  readonly atoms: readonly MolAtom[];
  readonly bonds: readonly MolBond[];
  /** The text from the first header line to `M  END` inclusive, `\n` line ends (what an SD record embeds). */
  readonly text: string;
}

function intField(file: string, lineNo: number, line: string, from: number, to: number, field: string): number {
  const raw = line.slice(from, to).trim();
  if (!/^-?\d+$/.test(raw)) throw new MolfileError(file, lineNo, field, `expected a whole number in columns ${from + 1}-${to}, found "${raw}"`);
  return Number(raw);
}

function realField(file: string, lineNo: number, line: string, from: number, to: number, field: string): number {
  const raw = line.slice(from, to).trim();
  if (!/^-?\d*\.?\d+$/.test(raw)) throw new MolfileError(file, lineNo, field, `expected a number in columns ${from + 1}-${to}, found "${raw}"`);
  return Number(raw);
}

function atomLine(file: string, lineNo: number, line: string): MolAtom {
  const symbol = line.slice(31, 34).trim();
  if (!/^[A-Z][a-z]?$/.test(symbol)) throw new MolfileError(file, lineNo, 'atom symbol', `expected an element symbol in columns 32-34, found "${symbol}"`);
  return {
    x: realField(file, lineNo, line, 0, 10, 'atom x'),
    y: realField(file, lineNo, line, 10, 20, 'atom y'),
    z: realField(file, lineNo, line, 20, 30, 'atom z'),
    symbol,
  };
}

function bondLine(file: string, lineNo: number, line: string, atomCount: number): MolBond {
  const a = intField(file, lineNo, line, 0, 3, 'bond first atom');
  const b = intField(file, lineNo, line, 3, 6, 'bond second atom');
  for (const [n, field] of [[a, 'bond first atom'], [b, 'bond second atom']] as const) {
    if (n < 1 || n > atomCount) throw new MolfileError(file, lineNo, field, `atom ${n} does not exist (the counts line declares ${atomCount} atoms)`);
  }
  const order = intField(file, lineNo, line, 6, 9, 'bond type');
  if (order < 1 || order > 8) throw new MolfileError(file, lineNo, 'bond type', `expected 1-8, found ${order}`);
  const stereo = line.length > 9 ? intField(file, lineNo, line.padEnd(12), 9, 12, 'bond stereo') : 0;
  return { a, b, order, stereo };
}

/** Parses a V2000 molfile; throws MolfileError (file, line, field) on anything it cannot read. */
export function parseMolfile(text: string, file: string): Molfile {
  const lines = text.replace(/\r\n?/g, '\n').split('\n');
  const at = (i: number, field: string): string => {
    const l = lines[i];
    if (l === undefined) throw new MolfileError(file, i + 1, field, 'the file ends here; a complete V2000 molfile was expected');
    return l;
  };
  const counts = at(3, 'counts line');
  if (/V3000/.test(counts)) throw new MolfileError(file, 4, 'counts line', 'V3000 molfiles are not read; save the structure as V2000');
  if (counts.slice(33, 39).trim() !== 'V2000') {
    throw new MolfileError(file, 4, 'counts line', `expected "V2000" in columns 35-39, found "${counts.slice(33, 39).trim()}" (is line 4 the counts line?)`);
  }
  const atomCount = intField(file, 4, counts, 0, 3, 'counts line atoms');
  const bondCount = intField(file, 4, counts, 3, 6, 'counts line bonds');
  const atoms: MolAtom[] = [];
  for (let i = 0; i < atomCount; i++) atoms.push(atomLine(file, 5 + i, at(4 + i, `atom ${i + 1}`)));
  const bonds: MolBond[] = [];
  for (let i = 0; i < bondCount; i++) bonds.push(bondLine(file, 5 + atomCount + i, at(4 + atomCount + i, `bond ${i + 1}`), atomCount));
  let end = 4 + atomCount + bondCount;
  while (end < lines.length && !/^M {2}END\s*$/.test(lines[end] ?? '')) end++;
  if (end >= lines.length) throw new MolfileError(file, lines.length, 'M  END', 'missing: the properties block must end with "M  END"');
  return {
    title: lines[0] ?? '', comment: lines[2] ?? '', atoms, bonds,
    text: `${lines.slice(0, end + 1).join('\n')}\n`,
  };
}

/** 1-based numbers of the atoms bonded to atom `n`. */
export function neighbours(mol: Molfile, n: number): number[] {
  return mol.bonds.flatMap((b) => (b.a === n ? [b.b] : b.b === n ? [b.a] : []));
}

/** Bonds on the shortest path between two atoms (breadth-first), or null if they are not connected. */
export function bondsBetween(mol: Molfile, from: number, to: number): number | null {
  const dist = new Map<number, number>([[from, 0]]);
  const queue = [from];
  for (let i = 0; i < queue.length; i++) {
    const n = queue[i] as number;
    if (n === to) return dist.get(n) ?? null;
    for (const m of neighbours(mol, n)) {
      if (!dist.has(m)) {
        dist.set(m, (dist.get(n) ?? 0) + 1);
        queue.push(m);
      }
    }
  }
  return null;
}

/** Molecular formula in Hill order (C, then H, then the rest alphabetically; without C all alphabetically). */
export function formulaOf(mol: Molfile): string {
  const count = new Map<string, number>();
  for (const a of mol.atoms) count.set(a.symbol, (count.get(a.symbol) ?? 0) + 1);
  const rest = [...count.keys()].filter((s) => !count.has('C') || (s !== 'C' && s !== 'H')).sort();
  const order = count.has('C') ? ['C', ...(count.has('H') ? ['H'] : []), ...rest] : rest;
  return order.map((s) => `${s}${count.get(s) === 1 ? '' : String(count.get(s))}`).join('');
}

const pad = (s: string | number, n: number): string => String(s).padStart(n);
/** Coordinate to 4 decimals, never `-0.0000`. */
const coord = (v: number): string => pad((Math.abs(v) < 5e-5 ? 0 : v).toFixed(4), 10);

/** Writes a V2000 molfile (no charges or isotopes: what the sample structures need). */
export function writeMolfile(m: { title: string; program: string; comment: string; atoms: readonly MolAtom[]; bonds: readonly MolBond[] }): string {
  // Header line 2: user initials (2), program (8), date (10, left blank so the file is reproducible), "2D".
  const header = [m.title, `  ${m.program.slice(0, 8).padEnd(8)}${' '.repeat(10)}2D`, m.comment];
  const counts = `${pad(m.atoms.length, 3)}${pad(m.bonds.length, 3)}  0  0  0  0  0  0  0  0999 V2000`;
  const atoms = m.atoms.map((a) => `${coord(a.x)}${coord(a.y)}${coord(a.z)} ${a.symbol.padEnd(3)} 0  0  0  0  0  0  0  0  0  0  0  0`);
  const bonds = m.bonds.map((b) => `${pad(b.a, 3)}${pad(b.b, 3)}${pad(b.order, 3)}${pad(b.stereo, 3)}  0  0  0`);
  return [...header, counts, ...atoms, ...bonds, 'M  END', ''].join('\n');
}
