/**
 * Problems of a structure note: atom labels that no spectrum assigns, unreadable sidecars and
 * front matter. Pure: offsets into the note's text; the glue turns them into VS Code ranges.
 */
import { labelMatches } from '../../core/notes/labels';
import type { FrontMatter } from '../../core/notes/frontMatter';
import type { KarplusProblem } from '../../core/notes/karplusRequests';
import type { NoteProblem as StructureProblem } from '../../core/structure/structureRef';
import type { LabelIndex } from './labelIndex';

export interface NoteProblem {
  readonly offset: number;
  readonly length: number;
  readonly severity: 'error' | 'warning' | 'info';
  readonly message: string;
  readonly code: 'unassigned-label' | 'unreadable-sidecar' | 'front-matter' | 'inconsistent-j' | 'karplus-request' | 'structure';
}

/** A disagreement the coupling network found (core/network: two measurements of one pair differ). */
export interface PairProblem {
  readonly atoms: readonly [string, string];
  readonly message: string;
}

/** Offset of the start of a 1-based line (the end of the text past the last line). */
function lineStart(text: string, line: number): number {
  let at = 0;
  for (let l = 1; l < line; l++) {
    const next = text.indexOf('\n', at);
    if (next < 0) return text.length;
    at = next + 1;
  }
  return at;
}

/**
 * One problem per unassigned label, at its first mention (every mention would bury the note).
 * A warning once a 1D spectrum has picks (its multiplets should name every proton); before that
 * only information, because a DQF-COSY alone cannot assign an uncoupled proton such as a methoxy.
 */
export function noteProblems(
  text: string, front: FrontMatter, index: LabelIndex, pairs: readonly PairProblem[] = [], karplus: readonly KarplusProblem[] = [],
  structure: readonly StructureProblem[] = [],
): NoteProblem[] {
  const out: NoteProblem[] = [];
  // `structure:`/`atoms:` problems stop the NMReDATA export (couplet report exits 2): shown on their line.
  for (const p of structure) {
    const start = lineStart(text, p.line);
    const end = text.indexOf('\n', start);
    out.push({ offset: start, length: (end < 0 ? text.length : end) - start, severity: 'error', message: `${p.field}: ${p.message}`, code: 'structure' });
  }
  if (front.problem !== null) out.push({ offset: 0, length: 3, severity: 'warning', message: front.problem, code: 'front-matter' });
  // An error, as in `couplet report` (exit 2): a mistyped request would otherwise give no angles, silently.
  for (const k of karplus) out.push({ offset: k.offset, length: k.length, severity: 'error', message: `${k.field}: ${k.message}`, code: 'karplus-request' });
  if (front.compound === null) return out;
  for (const u of index.unreadable) {
    out.push({ offset: 0, length: 3, severity: 'warning', message: `${u} (its labels are not checked)`, code: 'unreadable-sidecar' });
  }
  const first = new Map<string, { offset: number; count: number }>();
  for (const m of labelMatches(text)) {
    if (m.offset < front.end) continue;
    const seen = first.get(m.label);
    if (seen) seen.count++;
    else first.set(m.label, { offset: m.offset, count: 1 });
  }
  const where = index.sidecarCount === 0 ? 'no spectrum of this compound has a sidecar yet' : 'no pick or coupling in this folder\'s sidecars names it';
  // Inconsistent J values: a warning at the first mention of either atom (else at the front matter).
  for (const p of pairs) {
    const at = first.get(p.atoms[0]) ?? first.get(p.atoms[1]);
    const label = first.has(p.atoms[0]) ? p.atoms[0] : p.atoms[1];
    out.push({ offset: at?.offset ?? 0, length: at ? label.length : 3, severity: 'warning', message: p.message, code: 'inconsistent-j' });
  }
  for (const [label, { offset, count }] of first) {
    if (index.get(label)) continue;
    out.push({
      offset, length: label.length, code: 'unassigned-label',
      severity: index.has1D ? 'warning' : 'info',
      message: `${label} is not assigned: ${where}${count > 1 ? ` (mentioned ${count} times)` : ''}`,
    });
  }
  return out;
}
