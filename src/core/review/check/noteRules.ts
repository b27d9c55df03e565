/**
 * Rules on a structure note's front matter: the karplus requests and the structure reference
 * (`structure:`, `atoms:`), checked against the molfile when the caller could read it. The same
 * readers as `couplet report`, so CI stops a note the report would refuse.
 */
import { readKarplusRequests } from '../../notes/karplusRequests';
import { MolfileError, parseMolfile } from '../../structure/molfile';
import { checkAtomMap, readStructureRef } from '../../structure/structureRef';
import type { NoteInput, Problem } from './types';

const base = (file: string): string => file.split(/[\\/]/).pop() ?? file;

export function frontMatterRule(note: NoteInput): Problem[] {
  if (!/\.(md|markdown)$/i.test(note.file)) return [];
  const at = (line: number, message: string): Problem => ({ file: note.file, line, column: 1, severity: 'error', rule: 'front-matter', message });
  const problems = readKarplusRequests(note.text, base(note.file)).problems.map((p) => at(p.line, `${p.field}: ${p.message}`));
  const ref = readStructureRef(note.text);
  problems.push(...ref.problems.map((p) => at(p.line, `${p.field}: ${p.message}`)));
  if (ref.structure === null || ref.problems.length > 0 || note.molfile === undefined) return problems;
  if (note.molfile.text === null) return [...problems, at(ref.structureLine, `structure: cannot read ${ref.structure} beside the note`)];
  try {
    const mol = parseMolfile(note.molfile.text, note.molfile.file);
    problems.push(...checkAtomMap(ref, mol, base(note.molfile.file)).map((p) => at(p.line, `${p.field}: ${p.message}`)));
  } catch (e) {
    if (!(e instanceof MolfileError)) throw e;
    problems.push(at(ref.structureLine, `structure: ${e.message}`));
  }
  return problems;
}
