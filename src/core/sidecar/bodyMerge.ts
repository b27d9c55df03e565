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

function groups(body: readonly string[], contentIndent: number): { groups: Map<string, Group>; post: string[] } {
  const out = new Map<string, Group>();
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
    } else {
      // A line before any field (e.g. a lone `-`): keep it; the caller's read-back check decides.
      pending.push(line);
      continue;
    }
    pending = [];
  }
  return { groups: out, post: pending };
}

/** Column of the item's fields: after `- ` on the dash line, or of the first field below a lone `-`. */
function fieldIndent(body: readonly string[]): number {
  const first = body[0] ?? '';
  const dashIndent = indentOf(first);
  const afterDash = /^\s*-\s+(?=\S)/.exec(first);
  if (afterDash !== null && !isCommentLine(first.slice(afterDash[0].length))) return afterDash[0].length;
  const next = body.slice(1).find((l) => !isBlankLine(l) && !isCommentLine(l));
  return Math.max(dashIndent + 2, next === undefined ? 0 : indentOf(next));
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
  const afterDash = Math.max(1, contentIndent - dashIndent - 1);
  return first ? `${' '.repeat(dashIndent)}-${' '.repeat(afterDash)}${rest}` : `${' '.repeat(contentIndent)}${rest}`;
}

export function mergeBody(body: readonly string[], dashIndent: number, oldFields: readonly FieldLine[],
  newFields: readonly FieldLine[]): string[] {
  // `-` alone on its line, fields below it: keep that line and put no dash on any field.
  const loneDash = /^\s*-\s*(#.*)?$/.test(body[0] ?? '');
  const contentIndent = fieldIndent(body);
  const { groups: old, post } = groups(loneDash ? body.slice(1) : body, contentIndent);
  const oldText = new Map(oldFields.map((f) => [f.key, f.text]));
  const out: string[] = loneDash ? [body[0] ?? ''] : [];
  newFields.forEach((f, i) => {
    const first = i === 0 && !loneDash;
    const g = old.get(f.key);
    if (g === undefined) {
      out.push(withLead(f.text, first, dashIndent, contentIndent));
      return;
    }
    out.push(...g.pre);
    if (oldText.get(f.key) === f.text) {
      const [firstLine = '', ...rest] = g.lines;
      out.push(withLeadIfMoved(firstLine, first, dashIndent, contentIndent), ...rest);
    } else {
      // A value written over several lines becomes one line; comments on its other lines go above it.
      const [head = '', ...more] = g.lines;
      const moved = more.flatMap((l) => (commentStart(l) < 0 ? [] : [`${' '.repeat(contentIndent)}${l.slice(commentStart(l))}`]));
      out.push(...moved, withLead(f.text, first, dashIndent, contentIndent) + trailingComment(head));
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
