/**
 * ASDF encoding of integer ordinates (JCAMP-DX, McDonald & Wilks 1988 [from memory]); the inverse
 * of asdf.ts. DIFDUP lines: X, the first ordinate in SQZ form, then differences in DIF form with
 * runs of equal differences folded into a DUP count. Each new line repeats the last ordinate of the
 * previous line as its first value (the Y-value check), and the page ends with a line holding only
 * X and that check value, as the standard's own test files do. Lines never exceed 80 characters.
 * Lines are assembled as char codes in a scratch buffer: a 2D spectrum has millions of tokens.
 */
export const MAX_LINE = 80;

export type Encoding = 'DIFDUP' | 'AFFN';

const SQZ_POS = 65; // 'A' = 1
const SQZ_NEG = 97; // 'a' = -1
const SQZ_ZERO = 64; // '@'
const DIF_POS = 74; // 'J' = 1
const DIF_NEG = 106; // 'j' = -1
const DIF_ZERO = 37; // '%'
const DUP_BASE = 83; // 'S' = 1 ... 'Z' = 8
const DUP_NINE = 115; // 's' = 9

/** One output line under construction (X, at most ~25 characters, plus tokens up to 80). */
const buf: number[] = [];
let len = 0;

function digitCount(a: number): number {
  let n = 1;
  for (let x = a; x >= 10; x = Math.floor(x / 10)) n++;
  return n;
}

/** Characters needed for v as a pseudo-digit token (SQZ, DIF or DUP). */
function tokenLength(v: number): number {
  return v === 0 ? 1 : digitCount(Math.abs(v));
}

/** Append v with its leading digit (and sign) as one character: `pos`/`neg` are the codes for 1/-1. */
function putPseudo(v: number, pos: number, neg: number, zero: number): void {
  if (v === 0) {
    buf[len++] = zero;
    return;
  }
  let x = Math.abs(v);
  const n = digitCount(x);
  for (let k = n - 1; k >= 1; k--) {
    buf[len + k] = 48 + (x % 10);
    x = Math.floor(x / 10);
  }
  buf[len] = (v > 0 ? pos : neg) + x - 1;
  len += n;
}

function putDigits(a: number): void {
  const n = digitCount(a);
  let x = a;
  for (let k = n - 1; k >= 0; k--) {
    buf[len + k] = 48 + (x % 10);
    x = Math.floor(x / 10);
  }
  len += n;
}

function putDup(count: number): void {
  const start = len;
  putPseudo(count, DUP_BASE, DUP_BASE, DUP_BASE);
  if (buf[start] === DUP_BASE + 8) buf[start] = DUP_NINE; // leading 9 is 's', not the character after 'Z'
}

function putText(s: string): void {
  for (let i = 0; i < s.length; i++) buf[len++] = s.charCodeAt(i);
}

function takeLine(): string {
  buf.length = len;
  const s = String.fromCharCode.apply(null, buf);
  len = 0;
  return s;
}

function asString(put: () => void): string {
  len = 0;
  put();
  return takeLine();
}

export const sqz = (v: number): string => asString(() => putPseudo(v, SQZ_POS, SQZ_NEG, SQZ_ZERO));
export const dif = (v: number): string => asString(() => putPseudo(v, DIF_POS, DIF_NEG, DIF_ZERO));
/** DUP count (>= 2): S..Z for 1..8, s for 9 as the leading digit. */
export const dup = (count: number): string => asString(() => putDup(count));

/** Data lines for one table of integer ordinates `q`; `x(i)` is the abscissa text of point i. */
export function encodeLines(q: Int32Array | readonly number[], x: (i: number) => string, encoding: Encoding): string[] {
  len = 0;
  return encoding === 'AFFN' ? encodeAffn(q, x) : encodeDifDup(q, x);
}

function encodeAffn(q: ArrayLike<number>, x: (i: number) => string): string[] {
  const lines: string[] = [];
  for (let i = 0; i < q.length; i++) {
    const v = q[i] ?? 0;
    const need = 1 + (v < 0 ? 1 : 0) + digitCount(Math.abs(v));
    if (len > 0 && len + need > MAX_LINE) lines.push(takeLine());
    if (len === 0) putText(x(i));
    buf[len++] = 32;
    if (v < 0) buf[len++] = 45;
    putDigits(Math.abs(v));
  }
  if (len > 0) lines.push(takeLine());
  return lines;
}

function encodeDifDup(q: ArrayLike<number>, x: (i: number) => string): string[] {
  const n = q.length;
  const lines: string[] = [];
  if (n === 0) return lines;
  putText(x(0));
  putPseudo(q[0] ?? 0, SQZ_POS, SQZ_NEG, SQZ_ZERO);
  let i = 1;
  while (i < n) {
    const d = (q[i] ?? 0) - (q[i - 1] ?? 0);
    let run = 1;
    while (i + run < n && (q[i + run] ?? 0) - (q[i + run - 1] ?? 0) === d) run++;
    const need = tokenLength(d) + (run > 1 ? tokenLength(run) : 0);
    if (len + need > MAX_LINE) {
      lines.push(takeLine());
      // The next line restarts at the last point written: its X and its value (the Y check).
      putText(x(i - 1));
      putPseudo(q[i - 1] ?? 0, SQZ_POS, SQZ_NEG, SQZ_ZERO);
      continue;
    }
    putPseudo(d, DIF_POS, DIF_NEG, DIF_ZERO);
    if (run > 1) putDup(run);
    i += run;
  }
  lines.push(takeLine());
  if (n > 1) {
    putText(x(n - 1));
    putPseudo(q[n - 1] ?? 0, SQZ_POS, SQZ_NEG, SQZ_ZERO);
    lines.push(takeLine());
  }
  return lines;
}
