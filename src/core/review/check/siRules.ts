/**
 * Rules on the SI regions of the structure notes: the marked regions the insert command writes
 * (`<!-- couplet:si H1 begin -->` ... `<!-- couplet:si H1 end -->` in markdown, `% couplet:si H1
 * begin` ... in LaTeX; see src/extension/notes/siRegion.ts, which writes them).
 */
import { toFixedDecimal } from '../../sidecar/decimal';
import type { Coupling } from '../../sidecar/types';
import type { CheckedSidecar } from './sidecarRules';
import { lineAt, type NoteInput, type Problem } from './types';

export interface SiRegion {
  readonly file: string;
  readonly kind: string;
  /** Line of the begin marker. */
  readonly line: number;
  readonly body: string;
  /** Offset of the body in the note (for line numbers inside it). */
  readonly bodyOffset: number;
  readonly noteText: string;
}

const MARKER = /^[ \t]*(?:<!--[ \t]*couplet:si[ \t]+([A-Za-z0-9]+)[ \t]+(begin|end)[ \t]*-->|%[ \t]*couplet:si[ \t]+([A-Za-z0-9]+)[ \t]+(begin|end))[ \t]*$/gm;

/** Regions with both markers; unpaired markers are the insert command's business (it names them). */
export function siRegions(note: NoteInput): SiRegion[] {
  const out: SiRegion[] = [];
  const open = new Map<string, { line: number; end: number }>();
  for (const m of note.text.matchAll(MARKER)) {
    const kind = m[1] ?? m[3] ?? '';
    const which = m[2] ?? m[4];
    if (which === 'begin') open.set(kind, { line: lineAt(note.text, m.index), end: m.index + m[0].length });
    else {
      const b = open.get(kind);
      if (b === undefined) continue;
      open.delete(kind);
      out.push({ file: note.file, kind, line: b.line, body: note.text.slice(b.end, m.index), bodyOffset: b.end, noteText: note.text });
    }
  }
  return out;
}

const LABEL = /(?<![\w-])H-\d{1,3}[a-z]?'{0,2}(?![\w'-])/g;
/** `J = 10.2, 4.5 Hz`, also with the J set in italics (`*J*`, `_J_`, `\textit{J}`). */
const J_LIST = /(?:\*J\*|_J_|\\textit\{J\}|J)\s*=\s*([-\d.,\s]+?)\s*Hz/g;

/** Flags under which a J value printed as a number would mislead a reader, and how badly. */
const HIDDEN_FLAGS: readonly { flag: string; severity: 'error' | 'warning'; why: string }[] = [
  { flag: 'unresolved', severity: 'error', why: 'below what the cross peak resolves; report an upper limit or leave it out' },
  { flag: 'second-order', severity: 'warning', why: 'from a possibly second-order pattern; say so or analyse it' },
  { flag: 'second_order_suspected', severity: 'warning', why: 'from a possibly second-order pattern; say so or analyse it' },
];

/**
 * A flagged coupling whose value (to 0.1 Hz, as SI lines print it) appears as a J of one of its
 * two atoms in an SI region: the manuscript states a number the measurement does not support.
 */
export function hiddenFlagRule(regions: readonly SiRegion[], sidecars: readonly CheckedSidecar[]): Problem[] {
  const flagged: { c: Coupling; file: string; line: number; rule: (typeof HIDDEN_FLAGS)[number] }[] = [];
  for (const s of sidecars) {
    for (const c of s.sidecar?.couplings ?? []) {
      const rule = HIDDEN_FLAGS.find((h) => c.flags.includes(h.flag));
      if (rule !== undefined) flagged.push({ c, file: s.input.file, line: s.lines.coupling(c).line, rule });
    }
  }
  const out: Problem[] = [];
  for (const r of regions) {
    // Each parenthesised group of an SI line is one proton: "(dd, J = 10.2, 4.5 Hz, 1H, H-3)".
    for (const g of r.body.matchAll(/\(([^()]*)\)/g)) {
      const labels = new Set(g[1]?.match(LABEL) ?? []);
      const values = [...(g[1] ?? '').matchAll(J_LIST)].flatMap((m) => (m[1] ?? '').split(',').map((v) => v.trim()));
      for (const f of flagged) {
        const shown = toFixedDecimal(Math.abs(f.c.jHz), 1);
        if (!f.c.atoms.some((a) => labels.has(a)) || !values.includes(shown)) continue;
        const offset = r.bodyOffset + g.index;
        out.push({ file: r.file, line: lineAt(r.noteText, offset), column: offset - r.noteText.lastIndexOf('\n', offset - 1),
          severity: f.rule.severity, rule: 'hidden-flags',
          message: `J(${f.c.atoms.join(',')}) = ${shown} Hz is flagged ${f.rule.flag} at ${f.file}:${f.line}: ${f.rule.why}` });
      }
    }
  }
  return out;
}

/**
 * An SI region whose text differs from what the sidecars give now. `expected` makes the line
 * for a region kind (issue 5's SI formatter); undefined when it cannot (then nothing is said).
 * Whitespace differences do not count: the note may be wrapped.
 */
export function staleSiRule(regions: readonly SiRegion[], expected: (kind: string, noteFile: string) => string | undefined): Problem[] {
  const norm = (s: string): string => s.replace(/\s+/g, ' ').trim();
  const out: Problem[] = [];
  for (const r of regions) {
    const want = expected(r.kind, r.file);
    if (want === undefined || norm(want) === norm(r.body)) continue;
    out.push({ file: r.file, line: r.line, column: 1, severity: 'error', rule: 'stale-si',
      message: `SI region "${r.kind}" differs from what the sidecars give now; re-run "Insert ¹H NMR Data" to update it` });
  }
  return out;
}
