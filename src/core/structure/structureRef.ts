/**
 * The structure a note points to, from its front matter:
 *
 *   structure: quellopyranol.mol      # V2000 molfile with explicit H, relative to the note
 *   atoms: { H-2: 12, H-7: [16, 17, 18] }   # label -> number(s) of its H atom(s) in that molfile
 *
 * Explicit H atom numbers (not "H on heavy atom n"): NMReDATA allows implicit-H references, but then
 * the two protons of a CH2 cannot be told apart (NMReDATA tag format 1.1, NMREDATA_ASSIGNMENT,
 * NMReDATA Initiative wiki, nmredata.org), and diastereotopic pairs (H-3a/H-3b) are what Couplet
 * measures. Pure: text in, data and problems (with the note's 1-based line) out.
 */
import { LineCounter, isMap, isScalar, isSeq, parseDocument, type Node } from 'yaml';
import { FRONT_MATTER } from '../notes/frontMatter';
import type { Molfile } from './molfile';

export interface NoteProblem {
  /** 1-based line in the note. */
  readonly line: number;
  /** e.g. `structure`, `atoms.H-3a`. */
  readonly field: string;
  readonly message: string;
}

export interface StructureRef {
  /** The molfile path as written (relative to the note), or null when the note names none. */
  readonly structure: string | null;
  readonly structureLine: number;
  /** Label -> 1-based atom numbers, in the order written. */
  readonly atoms: ReadonlyMap<string, readonly number[]>;
  readonly atomLines: ReadonlyMap<string, number>;
  readonly problems: readonly NoteProblem[];
}

const EMPTY: StructureRef = { structure: null, structureLine: 0, atoms: new Map(), atomLines: new Map(), problems: [] };

function atomNumbers(node: unknown): number[] | null {
  const one = (n: unknown): number | null => {
    const v = isScalar(n) ? n.value : null;
    return typeof v === 'number' && Number.isInteger(v) && v >= 1 ? v : null;
  };
  if (isSeq(node)) {
    const xs = node.items.map(one);
    return xs.length > 0 && xs.every((x): x is number => x !== null) ? xs : null;
  }
  const x = one(node);
  return x === null ? null : [x];
}

/** Reads `structure:` and `atoms:` from a note's front matter. */
export function readStructureRef(noteText: string): StructureRef {
  const m = FRONT_MATTER.exec(noteText);
  if (!m) return EMPTY;
  const counter = new LineCounter();
  const doc = parseDocument(m[1] ?? '', { lineCounter: counter });
  // The front matter's first line is the note's line 2 (line 1 is `---`).
  const lineOf = (n: Node | null | undefined): number => (n?.range ? counter.linePos(n.range[0]).line : 1);
  if (doc.errors.length > 0 || !isMap(doc.contents)) return EMPTY; // readFrontMatter reports YAML errors
  const problems: NoteProblem[] = [];
  let structure: string | null = null;
  let structureLine = 0;
  const atoms = new Map<string, number[]>();
  const atomLines = new Map<string, number>();
  for (const pair of doc.contents.items) {
    const key = isScalar(pair.key) ? String(pair.key.value) : '';
    const line = lineOf(pair.key as Node) + 1;
    if (key === 'structure') {
      structureLine = line;
      const v = isScalar(pair.value) ? pair.value.value : null;
      if (typeof v === 'string' && v.trim() !== '') structure = v.trim();
      else problems.push({ line, field: 'structure', message: 'should name a molfile relative to the note, e.g. `structure: compound.mol`' });
    } else if (key === 'atoms') {
      if (!isMap(pair.value)) {
        problems.push({ line, field: 'atoms', message: 'should map each label to its H atom number(s), e.g. `atoms: { H-2: 12, H-7: [16, 17, 18] }`' });
        continue;
      }
      for (const item of pair.value.items) {
        const label = isScalar(item.key) ? String(item.key.value) : '';
        const itemLine = lineOf(item.key as Node) + 1;
        const numbers = atomNumbers(item.value);
        if (numbers === null) problems.push({ line: itemLine, field: `atoms.${label}`, message: 'expected an atom number (1, 2, ...) or a list of them' });
        else if (atoms.has(label)) problems.push({ line: itemLine, field: `atoms.${label}`, message: 'label given twice' });
        else {
          atoms.set(label, numbers);
          atomLines.set(label, itemLine);
        }
      }
    }
  }
  if (atoms.size > 0 && structure === null && !problems.some((p) => p.field === 'structure')) {
    problems.push({ line: atomLines.values().next().value ?? 1, field: 'atoms', message: 'atom numbers without `structure:` (the molfile they refer to)' });
  }
  return { structure, structureLine, atoms, atomLines, problems };
}

/** Checks the atom numbers against the molfile: each exists, is an H atom, and belongs to one label only. */
export function checkAtomMap(ref: StructureRef, mol: Molfile, molName: string): NoteProblem[] {
  const problems: NoteProblem[] = [];
  const owner = new Map<number, string>();
  for (const [label, numbers] of ref.atoms) {
    const line = ref.atomLines.get(label) ?? ref.structureLine;
    const field = `atoms.${label}`;
    for (const n of numbers) {
      const atom = mol.atoms[n - 1];
      if (atom === undefined) {
        problems.push({ line, field, message: `atom ${n} does not exist: ${molName} has ${mol.atoms.length} atoms` });
      } else if (atom.symbol !== 'H') {
        problems.push({ line, field, message: `atom ${n} of ${molName} is ${atom.symbol}, not H: give the number of the explicit H atom (the molfile needs explicit hydrogens)` });
      } else if (owner.has(n)) {
        problems.push({ line, field, message: `atom ${n} is already given to ${owner.get(n) ?? ''}` });
      } else owner.set(n, label);
    }
  }
  return problems;
}
