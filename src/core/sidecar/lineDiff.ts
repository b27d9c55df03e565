/**
 * Minimal text edits between two versions of a file, line by line: a longest-common-subsequence
 * line diff (the classic dynamic programme, e.g. Cormen et al., "Introduction to Algorithms",
 * §15.4) on the part that differs after trimming the common prefix and suffix. Each run of
 * changed lines becomes one edit, so an editor applying them touches only those lines.
 */
import type { TextEdit } from './types';

/** Lines with their terminators, so that concatenating them gives the text back. */
function linesOf(text: string): string[] {
  return text.match(/[^\n]*\n|[^\n]+$/g) ?? [];
}

/** Above this many cells the middle part is replaced as one edit (still correct, less minimal). */
const MAX_CELLS = 4_000_000;

export function lineDiffEdits(oldText: string, newText: string): TextEdit[] {
  const a = linesOf(oldText);
  const b = linesOf(newText);
  let pre = 0;
  while (pre < a.length && pre < b.length && a[pre] === b[pre]) pre++;
  let suf = 0;
  while (suf < a.length - pre && suf < b.length - pre && a[a.length - 1 - suf] === b[b.length - 1 - suf]) suf++;
  const midA = a.slice(pre, a.length - suf);
  const midB = b.slice(pre, b.length - suf);
  const offsets = [0];
  for (const line of a) offsets.push((offsets[offsets.length - 1] ?? 0) + line.length);
  const at = (i: number): number => offsets[i] ?? oldText.length;
  if (midA.length === 0 && midB.length === 0) return [];
  if ((midA.length + 1) * (midB.length + 1) > MAX_CELLS) {
    return [{ offset: at(pre), length: at(a.length - suf) - at(pre), text: midB.join('') }];
  }
  return hunks(midA, midB).map((h) => ({
    offset: at(pre + h.aStart),
    length: at(pre + h.aEnd) - at(pre + h.aStart),
    text: midB.slice(h.bStart, h.bEnd).join(''),
  }));
}

interface Hunk {
  aStart: number;
  aEnd: number;
  bStart: number;
  bEnd: number;
}

function hunks(a: readonly string[], b: readonly string[]): Hunk[] {
  const n = a.length;
  const m = b.length;
  const w = m + 1;
  // lcs[i*w + j] = length of the LCS of a[i..] and b[j..].
  const lcs = new Uint32Array((n + 1) * w);
  for (let i = n - 1; i >= 0; i--) {
    for (let j = m - 1; j >= 0; j--) {
      lcs[i * w + j] = a[i] === b[j] ? (lcs[(i + 1) * w + j + 1] ?? 0) + 1
        : Math.max(lcs[(i + 1) * w + j] ?? 0, lcs[i * w + j + 1] ?? 0);
    }
  }
  const out: Hunk[] = [];
  let i = 0;
  let j = 0;
  let open: Hunk | null = null;
  while (i < n || j < m) {
    if (i < n && j < m && a[i] === b[j]) {
      if (open !== null) out.push(open);
      open = null;
      i++;
      j++;
      continue;
    }
    open ??= { aStart: i, aEnd: i, bStart: j, bEnd: j };
    if (j < m && (i >= n || (lcs[i * w + j + 1] ?? 0) >= (lcs[(i + 1) * w + j] ?? 0))) open.bEnd = ++j;
    else open.aEnd = ++i;
  }
  if (open !== null) out.push(open);
  return out;
}

/** Applies non-overlapping edits (in any order) to `text`; throws on overlap or out-of-range edits. */
export function applyEdits(text: string, edits: readonly TextEdit[]): string {
  const sorted = [...edits].sort((x, y) => x.offset - y.offset);
  let out = '';
  let pos = 0;
  for (const e of sorted) {
    if (!Number.isInteger(e.offset) || !Number.isInteger(e.length) || e.offset < 0 || e.length < 0
      || e.offset + e.length > text.length) {
      throw new RangeError(`edit at offset ${e.offset} (length ${e.length}) is outside the text (length ${text.length})`);
    }
    if (e.offset < pos) throw new RangeError(`edit at offset ${e.offset} overlaps the previous edit (which ends at ${pos})`);
    out += text.slice(pos, e.offset) + e.text;
    pos = e.offset + e.length;
  }
  return out + text.slice(pos);
}
