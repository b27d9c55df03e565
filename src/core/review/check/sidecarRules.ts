/** Rules on one sidecar: schema and syntax (the parser's diagnostics), the data file's hash, labels. */
import { readSidecarText } from '../../sidecar/parse';
import type { Sidecar } from '../../sidecar/types';
import { sidecarLines, type SidecarLines } from './locate';
import type { Problem, SidecarInput } from './types';

export interface CheckedSidecar {
  readonly input: SidecarInput;
  /** Null when it cannot be read as schema v1 (the problems say why). */
  readonly sidecar: Sidecar | null;
  readonly lines: SidecarLines;
  readonly problems: readonly Problem[];
}

/**
 * Schema, syntax and data-hash problems, straight from the parser (its lines and columns). Info
 * diagnostics (an unsorted list: a rewrite sorts it) are not problems for CI.
 */
export function schemaAndHashRule(input: SidecarInput): CheckedSidecar {
  const parsed = readSidecarText(input.text, input.file, input.dataSha256 === null ? {} : { dataSha256: input.dataSha256 });
  const lines = sidecarLines(parsed.doc, parsed.lines);
  const problems: Problem[] = [];
  for (const d of parsed.result.diagnostics) {
    if (d.severity === 'info') continue;
    const prefix = `${d.file}:${d.line}: `;
    problems.push({
      file: input.file, line: d.line, column: d.column, severity: d.severity,
      rule: d.code === 'data-hash-mismatch' ? 'data-hash' : 'schema',
      message: d.message.startsWith(prefix) ? d.message.slice(prefix.length) : d.message,
    });
  }
  const sidecar = parsed.result.sidecar;
  if (sidecar !== null && input.dataSha256 === null) {
    const at = lines.field(['data', 'file']);
    problems.push({ ...at, file: input.file, severity: 'error', rule: 'data-hash',
      message: `data.file: ${sidecar.data.file} is not beside the sidecar, so its hash cannot be checked` });
  }
  return { input, sidecar, lines, problems };
}

/** Every atom label of picks and couplings must be one the structure notes define. */
export function labelRule(checked: CheckedSidecar, known: ReadonlySet<string>, notesNamed: string): Problem[] {
  const s = checked.sidecar;
  if (s === null) return [];
  const out: Problem[] = [];
  const report = (at: { line: number; column: number }, label: string, where: string): void => {
    out.push({ ...at, file: checked.input.file, severity: 'error', rule: 'labels',
      message: `${where}: label ${label} is not in the structure notes (${notesNamed})` });
  };
  for (const p of s.picks) {
    for (const l of p.label) if (!known.has(l)) report(checked.lines.pick(p.id), l, `pick ${p.id}`);
  }
  for (const c of s.couplings) {
    for (const l of c.atoms) if (!known.has(l)) report(checked.lines.coupling(c), l, `coupling ${c.atoms.join('/')} ${c.method} ${c.dimension}`);
  }
  return out;
}
