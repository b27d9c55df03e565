/**
 * The canonical writer. Without previous text it writes the canonical layout:
 *
 *   schema, data          block mapping
 *   (blank line)
 *   picks:                one item per pick, fields one per line, a blank line between items
 *   (blank line)
 *   couplings:            likewise; an empty list is written `[]` on the key line
 *
 * The blank line between items matters for merging: git's three-way merge (and `git merge-file`)
 * conflicts only where both sides changed the same or touching lines, so two picks inserted at
 * different sorted positions give separate hunks with unchanged lines between them.
 *
 * With previous text, the layout of that text is kept (see layout.ts): unchanged items keep their
 * exact text and the comments around them, changed items are rewritten field by field
 * (bodyMerge.ts), new items go to their sorted position in canonical form.
 */
import { couplingFields, headLines, itemLines, listKeyLine, pickFields, type FieldLine } from './emit';
import { mergeBody } from './bodyMerge';
import { buildLayout, commentStart, isBlankLine, isCommentLine, splitLines, type Layout, type ListLayout } from './layout';
import { compareCouplings, comparePicks, couplingKeyString, normalizeAtoms } from './order';
import { isWritable, parseYaml, readSidecarText, type ParsedText } from './parse';
import { validateDocument } from './validate';
import { SCHEMA_ID, type Pick, type Sidecar } from './types';

/** Sorted lists and normalized atom pairs: the form every writer path starts from. */
export function normalizeSidecar(s: Sidecar): Sidecar {
  return {
    schema: SCHEMA_ID,
    data: { ...s.data },
    picks: [...s.picks].sort(comparePicks),
    couplings: s.couplings.map((c) => ({ ...c, atoms: normalizeAtoms(c.atoms) })).sort(compareCouplings),
  };
}

/** Throws when the sidecar cannot be written as valid schema v1 text, naming the item and field. */
function checkWritable(s: Sidecar): string {
  s.picks.forEach((p) => finite(`pick ${p.id}`, { f2_ppm: p.f2Ppm, f1_ppm: p.f1Ppm, from_ppm: p.fromPpm, to_ppm: p.toPpm, protons: p.protons }));
  s.couplings.forEach((c) => finite(`coupling ${c.atoms.join('/')} ${c.method} ${c.dimension}`,
    { j_hz: c.jHz, j_sd_hz: c.jSdHz, linewidth_hz: c.linewidthHz, ...Object.fromEntries((c.passiveHz ?? []).map((v, i) => [`passive_hz[${i}]`, v])) }));
  const text = canonicalText(s);
  const { doc, sink } = parseYaml(text, 'sidecar');
  if (doc.errors.length === 0) validateDocument(doc, sink);
  const errors = sink.list.filter((d) => d.severity === 'error');
  if (errors.length > 0) {
    throw new Error(`cannot write the sidecar: ${errors.map((d) => `${d.field ?? ''}: ${d.message.replace(/^[^:]*:\d+: /, '')}`).join('; ')}`);
  }
  return text;
}

function finite(what: string, values: Record<string, number | undefined>): void {
  for (const [key, v] of Object.entries(values)) {
    if (v !== undefined && !Number.isFinite(v)) throw new Error(`cannot write the sidecar: ${what}: ${key} is ${String(v)}`);
  }
}

export function formatSidecar(sidecar: Sidecar, previousText?: string): string {
  const s = normalizeSidecar(sidecar);
  if (previousText === undefined) return checkWritable(s);
  return formatOver(s, previousText, readSidecarText(previousText, 'previous text'));
}

/** formatSidecar over a previous text that the caller has already parsed. */
export function formatOver(sidecar: Sidecar, previousText: string, parsed: ParsedText): string {
  const s = normalizeSidecar(sidecar);
  const old = parsed.result.sidecar;
  const { doc, lines } = parsed;
  if (old === null || doc === null || lines === null || !isWritable(parsed.result.diagnostics)) {
    const first = parsed.result.diagnostics.find((d) => d.severity === 'error');
    throw new Error(`cannot rewrite over a sidecar with errors: ${first?.message ?? 'unreadable'}`);
  }
  const canonical = checkWritable(s);
  const layout = buildLayout(previousText, doc, lines);
  const kept = layout === null ? null : assemble(s, normalizeSidecar(old), layout);
  if (kept !== null && readsBackAs(kept, canonical)) return kept;
  // Layout not understood, or the result would not read back: canonical text, with every comment
  // (full-line or end-of-line) moved to the top so that nothing people wrote is lost.
  const comments = allComments(splitLines(previousText).lines);
  return (comments.length > 0 ? `${comments.join('\n')}\n` : '') + canonical;
}

function allComments(lines: readonly string[]): string[] {
  return lines.flatMap((line) => {
    const at = commentStart(line);
    return at < 0 ? [] : [line.slice(at)];
  });
}

function canonicalText(s: Sidecar): string {
  const out = [...headLines(s.data), ''];
  out.push(...canonicalList('picks', s.picks.map(pickFields)), '');
  out.push(...canonicalList('couplings', s.couplings.map(couplingFields)));
  return `${out.join('\n')}\n`;
}

function canonicalList(key: string, items: FieldLine[][]): string[] {
  const out = [listKeyLine(key, items.length === 0)];
  items.forEach((fields, i) => out.push(...(i > 0 ? [''] : []), ...itemLines(fields, 2)));
  return out;
}

function readsBackAs(text: string, canonical: string): boolean {
  const { doc, sink } = parseYaml(text, 'rewritten text');
  const back = doc.errors.length === 0 ? validateDocument(doc, sink) : null;
  return back !== null && isWritable(sink.list) && canonicalText(normalizeSidecar(back)) === canonical;
}

function assemble(s: Sidecar, old: Sidecar, layout: Layout): string {
  const head = sameData(s, old) ? layout.head : rewriteHead(layout.head, s);
  const out = [
    ...head,
    ...assembleList('picks', layout.picks, old.picks, s.picks, (p: Pick) => p.id, pickFields),
    ...assembleList('couplings', layout.couplings, old.couplings, s.couplings, couplingKeyString, couplingFields),
  ];
  return `${out.join(layout.eol)}${layout.eol}`;
}

const sameData = (a: Sidecar, b: Sidecar): boolean => a.data.file === b.data.file && a.data.sha256 === b.data.sha256;

/** Replaces the values of `file:` and `sha256:` in place, keeping comments; canonical if not found. */
function rewriteHead(head: readonly string[], s: Sidecar): string[] {
  const canon = headLines(s.data);
  const want = new Map([['file', canon[2] ?? ''], ['sha256', canon[3] ?? '']]);
  const found = new Set<string>();
  const out = head.map((line) => {
    const m = /^(\s+)(file|sha256)\s*:/.exec(line);
    const repl = m === null ? undefined : want.get(m[2] ?? '');
    if (m === null || repl === undefined) return line;
    found.add(m[2] ?? '');
    return `${m[1] ?? ''}${repl.trimStart()}${keepComment(line)}`;
  });
  if (found.size === 2) return out;
  return [...head.filter(isCommentLine), ...canon, ''];
}

function keepComment(line: string): string {
  const at = commentStart(line);
  return at <= 0 ? '' : line.slice(line.slice(0, at).trimEnd().length);
}

function assembleList<T>(key: string, layout: ListLayout, oldItems: readonly T[], newItems: readonly T[],
  idOf: (item: T) => string, fields: (item: T) => FieldLine[]): string[] {
  const empty = newItems.length === 0;
  const oldEmpty = layout.items.length === 0;
  const keyLine = empty === oldEmpty ? layout.keyLine : listKeyLine(key, empty) + keepComment(layout.keyLine);
  const out = [keyLine];
  const oldIndex = new Map(oldItems.map((item, k) => [idOf(item), k]));
  const dashIndent = layout.items[0]?.dashIndent ?? 2;
  // New items are separated like the existing ones (canonical: one blank line).
  const sep = layout.items[1]?.gap;
  const newGap = sep !== undefined && sep.every(isBlankLine) ? sep : [''];
  newItems.forEach((item, i) => {
    const k = oldIndex.get(idOf(item));
    const block = k === undefined ? undefined : layout.items[k];
    const old = k === undefined ? undefined : oldItems[k];
    const gap = i === 0 ? (layout.items[0]?.gap ?? []) : k !== undefined && k > 0 && block !== undefined ? block.gap : newGap;
    out.push(...gap);
    if (block === undefined || old === undefined) {
      out.push(...itemLines(fields(item), dashIndent));
      return;
    }
    const oldFields = fields(old);
    const newFields = fields(item);
    const same = oldFields.map((f) => f.text).join('\n') === newFields.map((f) => f.text).join('\n');
    out.push(...block.lead, ...(same ? block.body : mergeBody(block.body, block.dashIndent, oldFields, newFields)));
  });
  out.push(...layout.tail);
  return out;
}
