/**
 * ASDF encoding of integer ordinates (JCAMP-DX, McDonald & Wilks 1988 [from memory]); the inverse
 * of asdf.ts. DIFDUP lines: X, the first ordinate in SQZ form, then differences in DIF form with
 * runs of equal differences folded into a DUP count. Each new line repeats the last ordinate of the
 * previous line as its first value (the Y-value check), and the page ends with a line holding only
 * X and that check value, as the standard's own test files do. Lines never exceed 80 characters.
 */
export const MAX_LINE = 80;

export type Encoding = 'DIFDUP' | 'AFFN';

/** One character for the leading digit, then the other digits: SQZ, DIF and DUP share this shape. */
function pseudoDigit(v: number, pos: string, neg: string, zero: string): string {
  if (v === 0) return zero;
  const s = String(Math.abs(v));
  const d = s.charCodeAt(0) - 49; // leading digit 1..9 -> 0..8
  return (v > 0 ? pos : neg).charAt(d) + s.slice(1);
}

export function sqz(v: number): string {
  return pseudoDigit(v, 'ABCDEFGHI', 'abcdefghi', '@');
}

export function dif(v: number): string {
  return pseudoDigit(v, 'JKLMNOPQR', 'jklmnopqr', '%');
}

/** DUP count (>= 2): S..Z for 1..8, s for 9 as the leading digit. */
export function dup(count: number): string {
  return pseudoDigit(count, 'STUVWXYZs', '', '');
}

/** Data lines for one table of integer ordinates `q`; `x(i)` is the abscissa text of point i. */
export function encodeLines(q: Int32Array | readonly number[], x: (i: number) => string, encoding: Encoding): string[] {
  return encoding === 'AFFN' ? encodeAffn(q, x) : encodeDifDup(q, x);
}

function encodeAffn(q: ArrayLike<number>, x: (i: number) => string): string[] {
  const lines: string[] = [];
  let line = '';
  for (let i = 0; i < q.length; i++) {
    const token = ` ${q[i] ?? 0}`;
    if (line !== '' && line.length + token.length > MAX_LINE) {
      lines.push(line);
      line = '';
    }
    if (line === '') line = x(i);
    line += token;
  }
  if (line !== '') lines.push(line);
  return lines;
}

function encodeDifDup(q: ArrayLike<number>, x: (i: number) => string): string[] {
  const n = q.length;
  const lines: string[] = [];
  if (n === 0) return lines;
  let line = x(0) + sqz(q[0] ?? 0);
  let i = 1;
  while (i < n) {
    const d = (q[i] ?? 0) - (q[i - 1] ?? 0);
    let run = 1;
    while (i + run < n && (q[i + run] ?? 0) - (q[i + run - 1] ?? 0) === d) run++;
    const token = dif(d) + (run > 1 ? dup(run) : '');
    if (line.length + token.length > MAX_LINE) {
      lines.push(line);
      // The next line restarts at the last point written: its X and its value (the Y check).
      line = x(i - 1) + sqz(q[i - 1] ?? 0);
      continue;
    }
    line += token;
    i += run;
  }
  lines.push(line);
  if (n > 1) lines.push(x(n - 1) + sqz(q[n - 1] ?? 0));
  return lines;
}
