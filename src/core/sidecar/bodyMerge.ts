/**
 * Rewriting one changed list item while keeping what people wrote in it: fields whose value did
 * not change keep their exact line (with its end-of-line comment); a changed field gets its
 * canonical line and keeps the old line's end-of-line comment; comment lines stay above the field
 * they were above; comments at the end of the item stay at the end.
 */
import { type FieldLine } from './emit';
import { commentStart, indentOf, isBlankLine, isCommentLine } from './layout';

interface Group {
  key: string;
  pre: string[];
  lines: string[];
}

const KEY_AT_START = /^\s*(?:-\s+)?([A-Za-z0-9_]+)\s*:(?:\s|$)/;

function groups(body: readonly string[]): { groups: Map<string, Group>; post: string[]; contentIndent: number } {
  const out = new Map<string, Group>();
  const first = body[0] ?? '';
  const contentIndent = first.length - first.replace(/^\s*-\s+/, '').length;
  let pending: string[] = [];
  let current: Group | undefined;
  for (const line of body) {
    if (isBlankLine(line) || isCommentLine(line)) {
      pending.push(line);
      continue;
    }
    const key = KEY_AT_START.exec(line)?.[1];
    const startsField = current === undefined || (key !== undefined && indentOf(line.replace(/^(\s*)-\s/, '$1  ')) <= contentIndent);
    if (startsField && key !== undefined) {
      current = { key, pre: pending, lines: [line] };
      out.set(key, current);
    } else if (current !== undefined) {
      current.lines.push(...pending, line);
    }
    pending = [];
  }
  return { groups: out, post: pending, contentIndent };
}

/** The end-of-line comment of a line (with the space before it), or ''. */
function trailingComment(line: string): string {
  const at = commentStart(line);
  if (at <= 0) return '';
  const before = line.slice(0, at);
  return line.slice(before.trimEnd().length);
}

/** Puts `- ` in front of the first field line and removes it from the others. */
function withLead(line: string, first: boolean, dashIndent: number, contentIndent: number): string {
  const rest = line.replace(/^\s*(?:-\s+)?/, '');
  return first ? `${' '.repeat(dashIndent)}-${' '.repeat(contentIndent - dashIndent - 1)}${rest}` : `${' '.repeat(contentIndent)}${rest}`;
}

export function mergeBody(body: readonly string[], dashIndent: number, oldFields: readonly FieldLine[],
  newFields: readonly FieldLine[]): string[] {
  const { groups: old, post, contentIndent } = groups(body);
  const oldText = new Map(oldFields.map((f) => [f.key, f.text]));
  const out: string[] = [];
  newFields.forEach((f, i) => {
    const g = old.get(f.key);
    if (g === undefined) {
      out.push(withLead(f.text, i === 0, dashIndent, contentIndent));
      return;
    }
    out.push(...g.pre);
    if (oldText.get(f.key) === f.text) {
      const [firstLine = '', ...rest] = g.lines;
      out.push(withLeadIfMoved(firstLine, i === 0, dashIndent, contentIndent), ...rest);
    } else {
      out.push(withLead(f.text, i === 0, dashIndent, contentIndent) + trailingComment(g.lines[0] ?? ''));
    }
  });
  const kept = new Set(newFields.map((f) => f.key));
  for (const g of old.values()) if (!kept.has(g.key)) out.push(...g.pre.filter(isCommentLine));
  out.push(...post);
  return out;
}

/** Keeps an unchanged line as it is unless it has to gain or lose the item's dash. */
function withLeadIfMoved(line: string, first: boolean, dashIndent: number, contentIndent: number): string {
  const hasDash = /^\s*-\s/.test(line);
  return hasDash === first ? line : withLead(line, first, dashIndent, contentIndent);
}
