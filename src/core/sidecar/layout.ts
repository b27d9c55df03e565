/**
 * The line layout of an existing sidecar, so that a rewrite can keep people's comments and the
 * exact text of unchanged items. A file is cut into:
 *   head     every line before `picks:` (schema, data, header comments)
 *   per list (picks, couplings): its key line, then per item
 *     gap    blank lines (and comments not touching the item) since the previous item
 *     lead   comment lines directly above the item's `- ` line: they belong to the item
 *     body   the item's own lines, plus deeper-indented comment lines right after it
 *   tail     what follows the last item up to the next section (comments at the end stay there)
 */
import { isMap, isScalar, isSeq, type Document, type LineCounter, type Node, type Pair } from 'yaml';

export interface ItemBlock {
  gap: string[];
  lead: string[];
  body: string[];
  /** Column of the item's `- `. */
  dashIndent: number;
}

export interface ListLayout {
  keyLine: string;
  items: ItemBlock[];
  tail: string[];
}

export interface Layout {
  head: string[];
  picks: ListLayout;
  couplings: ListLayout;
  eol: string;
}

export function splitLines(text: string): { lines: string[]; eol: string } {
  const eol = /\r\n/.test(text) ? '\r\n' : '\n';
  const lines = text.split(/\r?\n/);
  if (lines.length > 0 && lines[lines.length - 1] === '') lines.pop();
  return { lines, eol };
}

export const isCommentLine = (line: string): boolean => line.trimStart().startsWith('#');
export const isBlankLine = (line: string): boolean => line.trim() === '';
export const indentOf = (line: string): number => line.length - line.trimStart().length;

/** The layout, or null when the file is not in the block layout this module understands. */
export function buildLayout(text: string, doc: Document, counter: LineCounter): Layout | null {
  const root = doc.contents;
  if (!isMap(root)) return null;
  const { lines, eol } = splitLines(text);
  const lineOf = (offset: number): number => counter.linePos(offset).line - 1;
  const keyLine = (name: string): number => {
    const pair = root.items.find((p: Pair) => isScalar(p.key) && p.key.value === name);
    const start = (pair?.key as Node | undefined)?.range?.[0];
    return start === undefined ? -1 : lineOf(start);
  };
  const [schemaAt, dataAt, picksAt, couplingsAt] = ['schema', 'data', 'picks', 'couplings'].map(keyLine);
  if (schemaAt === undefined || dataAt === undefined || picksAt === undefined || couplingsAt === undefined) return null;
  if (schemaAt < 0 || dataAt < 0 || picksAt <= Math.max(schemaAt, dataAt) || couplingsAt <= picksAt) return null;
  const picks = listLayout(lines, root.get('picks', true), picksAt, couplingsAt, text, lineOf);
  const couplings = listLayout(lines, root.get('couplings', true), couplingsAt, lines.length, text, lineOf);
  if (picks === null || couplings === null) return null;
  return { head: lines.slice(0, picksAt), picks, couplings, eol };
}

function listLayout(lines: string[], seq: unknown, keyAt: number, end: number, text: string,
  lineOf: (offset: number) => number): ListLayout | null {
  if (!isSeq(seq)) return null;
  const keyLine = lines[keyAt] ?? '';
  if (seq.flow === true) {
    if (seq.items.length > 0 || lineOf(seq.range?.[0] ?? 0) !== keyAt) return null;
    return { keyLine, items: [], tail: lines.slice(keyAt + 1, end) };
  }
  const items: ItemBlock[] = [];
  let prevEnd = keyAt;
  for (const item of seq.items as Node[]) {
    const range = item.range;
    if (!isMap(item) || range === undefined || range === null) return null;
    const dash = dashBefore(text, range[0]);
    if (dash < 0) return null;
    const dashLine = lineOf(dash);
    const dashIndent = dash - (text.lastIndexOf('\n', dash) + 1);
    let bodyEnd = Math.max(dashLine, lineOf(Math.max(range[0], range[1] - 1)));
    while (bodyEnd + 1 < end && isCommentLine(lines[bodyEnd + 1] ?? '') && indentOf(lines[bodyEnd + 1] ?? '') > dashIndent) bodyEnd++;
    let leadStart = dashLine;
    while (leadStart - 1 > prevEnd && isCommentLine(lines[leadStart - 1] ?? '')) leadStart--;
    items.push({
      gap: lines.slice(prevEnd + 1, leadStart),
      lead: lines.slice(leadStart, dashLine),
      body: lines.slice(dashLine, bodyEnd + 1),
      dashIndent,
    });
    prevEnd = bodyEnd;
  }
  return { keyLine, items, tail: lines.slice(prevEnd + 1, end) };
}

/** Offset of the `-` that introduces the list item starting at `start`, or -1. */
function dashBefore(text: string, start: number): number {
  let i = start - 1;
  while (i >= 0 && /[ \t\r\n]/.test(text[i] ?? '')) i--;
  return text[i] === '-' ? i : -1;
}

/** A quote opens a quoted scalar only where a scalar can start (after `: `, `- `, `[`, `, `). */
const QUOTE_OPENS = /(^\s*|[:,-]\s+|[[{,]\s*)$/;

/**
 * Where the comment on a line starts, or -1. A `#` starts a comment when it is at the start of
 * the line or follows white space, outside quotes (YAML 1.2.2 §6.6 and §7.3).
 */
export function commentStart(line: string): number {
  let quote: string | null = null;
  for (let i = 0; i < line.length; i++) {
    const ch = line[i];
    if (quote === '"') {
      if (ch === '\\') i++;
      else if (ch === '"') quote = null;
    } else if (quote === "'") {
      if (ch === "'") quote = null;
    } else if ((ch === '"' || ch === "'") && QUOTE_OPENS.test(line.slice(0, i))) {
      quote = ch;
    } else if (ch === '#' && (i === 0 || /[ \t]/.test(line[i - 1] ?? ''))) {
      return i;
    }
  }
  return -1;
}
