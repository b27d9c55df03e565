import { JcampError } from './errors';

/**
 * ASDF ordinate decoding (JCAMP-DX, McDonald & Wilks, Appl. Spectrosc. 42 (1988) 151 [from memory]).
 * Each data line is `X Y Y Y ...`: X in AFFN, ordinates in any mix of
 *   AFFN/PAC  plain numbers separated by blanks, commas or their own sign (`+12-3`);
 *   SQZ       first digit as a letter, sign included: @ A-I (0, 1..9), a-i (-1..-9);
 *   DIF       difference from the previous ordinate: % J-R (0, 1..9), j-r (-1..-9);
 *   DUP       repeat count of the previous token (count includes it): S-Z (1..8), s (9).
 * When a line ends with a DIF token, the next line starts with that last ordinate again (the
 * Y-value check); it is compared and dropped. `?` (missing value) is rejected: our spectra have
 * no holes, and a NaN would silently poison every sum downstream.
 * AFFN exponents are recognised only as `E`/`e` followed by a sign (`1.5E-03`), because a bare
 * `E1` after a number is a SQZ ordinate (`0E1` = X 0, Y 51).
 * The loop works on char codes without regexes or per-token strings, for multi-megabyte 2D files.
 */
const NONE = 0;
const AFFN = 1;
const SQZ = 2;
const DIF = 3;
const DUP = 4;

const KIND = new Uint8Array(128);
const DIGIT = new Int8Array(128);
(function buildTables(): void {
  const set = (ch: string, kind: number, digit: number): void => {
    KIND[ch.charCodeAt(0)] = kind;
    DIGIT[ch.charCodeAt(0)] = digit;
  };
  for (let d = 0; d <= 9; d++) set(String(d), AFFN, d);
  set('+', AFFN, 0);
  set('-', AFFN, 0);
  set('.', AFFN, 0);
  set('@', SQZ, 0);
  set('%', DIF, 0);
  for (let d = 1; d <= 9; d++) {
    set(String.fromCharCode(64 + d), SQZ, d); // A-I
    set(String.fromCharCode(96 + d), SQZ, -d); // a-i
    set(String.fromCharCode(73 + d), DIF, d); // J-R
    set(String.fromCharCode(105 + d), DIF, -d); // j-r
  }
  for (let d = 1; d <= 8; d++) set(String.fromCharCode(82 + d), DUP, d); // S-Z
  set('s', DUP, 9);
})();

/** Ordinates of one data table, unscaled, plus the X value that starts each data line. */
export interface DecodedOrdinates {
  readonly values: Float64Array;
  /** Per data line: 1-based line number, X as written, decimals written in X (-1: exponent form),
   * and the index of the ordinate that X belongs to (the Y-check point for a checked line). */
  readonly lineNos: number[];
  readonly lineX: number[];
  readonly lineDecimals: number[];
  readonly lineIndex: number[];
}

/** Scratch state for the number reader, to avoid allocating a result object per token. */
let numEnd = 0;
let numDecimals = 0;

function isDigit(c: number): boolean {
  return c >= 48 && c <= 57;
}

/** Read digits and one optional '.' from `p`, starting from magnitude `m`; sets numEnd/numDecimals. */
function readMagnitude(src: string, p: number, end: number, m: number): number {
  let decimals = 0;
  let dot = false;
  let q = p;
  for (; q < end; q++) {
    const c = src.charCodeAt(q);
    if (c >= 48 && c <= 57) {
      m = m * 10 + (c - 48);
      if (dot) decimals++;
    } else if (c === 46 && !dot) dot = true;
    else break;
  }
  numEnd = q;
  numDecimals = decimals;
  // One correctly rounded division, exact as Number(text) for m < 2^53 and up to 22 decimals.
  return decimals === 0 ? m : m / 10 ** decimals;
}

/** Read an AFFN number at `p` (sign, digits, '.', exponent with sign); NaN if none is there. */
function readAffn(src: string, p: number, end: number): number {
  let q = p;
  const c0 = src.charCodeAt(q);
  const neg = c0 === 45;
  if (c0 === 43 || c0 === 45) q++;
  const startDigits = q;
  const m = readMagnitude(src, q, end, 0);
  if (numEnd === startDigits || (numEnd === startDigits + 1 && src.charCodeAt(startDigits) === 46)) {
    numEnd = p;
    return Number.NaN;
  }
  q = numEnd;
  const e = src.charCodeAt(q);
  const s = src.charCodeAt(q + 1);
  if ((e === 69 || e === 101) && (s === 43 || s === 45) && isDigit(src.charCodeAt(q + 2))) {
    let r = q + 2;
    while (r < end && isDigit(src.charCodeAt(r))) r++;
    numEnd = r;
    numDecimals = -1;
    return Number(src.slice(p, r));
  }
  return neg ? -m : m;
}

function describe(src: string, at: number): string {
  const c = src.charCodeAt(at);
  return c >= 32 && c < 127 ? `"${src[at]}"` : `byte 0x${c.toString(16).padStart(2, '0')}`;
}

/**
 * Decode the data lines in src[start, end) (the body of an XYDATA or DATA TABLE record) into
 * exactly `expected` ordinates. Line numbers in errors count from `firstLine` at `start`.
 */
export function decodeAsdf(src: string, start: number, end: number, firstLine: number, expected: number, file: string): DecodedOrdinates {
  const values = new Float64Array(expected);
  const out: DecodedOrdinates = { values, lineNos: [], lineX: [], lineDecimals: [], lineIndex: [] };
  let count = 0;
  let last = Number.NaN; // last ordinate stored
  let lastKind = NONE; // kind of the last token, for DUP and the Y check
  let lastDiff = 0;
  let lineNo = firstLine - 1;
  const tooMany = (): JcampError => new JcampError(file, lineNo, `more ordinates than the ${expected} points declared (NPOINTS/VAR_DIM)`);
  for (let pos = start; pos < end; ) {
    lineNo++;
    const nl = src.indexOf('\n', pos);
    const lineEnd = nl < 0 || nl >= end ? end : nl;
    const next = lineEnd + 1;
    let p = pos;
    while (p < lineEnd && (src.charCodeAt(p) <= 32 || src.charCodeAt(p) === 44)) p++;
    if (p >= lineEnd || src.startsWith('$$', p)) {
      pos = next;
      continue;
    }
    const x = readAffn(src, p, lineEnd);
    if (Number.isNaN(x)) {
      throw new JcampError(file, lineNo, `data line does not start with an X value (found ${describe(src, p)})`);
    }
    out.lineNos.push(lineNo);
    out.lineX.push(x);
    out.lineDecimals.push(numDecimals);
    p = numEnd;
    const checkPending = lastKind === DIF;
    out.lineIndex.push(checkPending ? count - 1 : count);
    let first = true;
    while (p < lineEnd) {
      const c = src.charCodeAt(p);
      if (c === 32 || c === 9 || c === 44 || c === 13) {
        p++;
        continue;
      }
      if (c === 36 && src.charCodeAt(p + 1) === 36) break;
      const kind = c < 128 ? (KIND[c] ?? NONE) : NONE;
      if (kind === NONE) {
        if (c === 63) throw new JcampError(file, lineNo, 'missing ordinate "?" is not supported: every point needs a value');
        throw new JcampError(file, lineNo, `unexpected character ${describe(src, p)} in a data line`);
      }
      let v: number;
      if (kind === AFFN) {
        v = readAffn(src, p, lineEnd);
        if (Number.isNaN(v)) throw new JcampError(file, lineNo, `malformed number at ${describe(src, p)}`);
      } else {
        // Pseudo-digit then plain digits: the common case, read inline without the decimal path.
        const d = DIGIT[c] ?? 0;
        let m = d < 0 ? -d : d;
        let q = p + 1;
        let cq = q < lineEnd ? src.charCodeAt(q) : 0;
        while (cq >= 48 && cq <= 57) {
          m = m * 10 + (cq - 48);
          cq = ++q < lineEnd ? src.charCodeAt(q) : 0;
        }
        if (cq === 46) m = readMagnitude(src, p + 1, lineEnd, d < 0 ? -d : d);
        else numEnd = q;
        v = d < 0 ? -m : m;
      }
      p = numEnd;
      if (kind === DUP) {
        if (lastKind === NONE || lastKind === DUP) throw new JcampError(file, lineNo, 'DUP count with no value to repeat');
        const step = lastKind === DIF ? lastDiff : 0;
        if (count + v - 1 > expected) throw tooMany();
        for (let k = 1; k < v; k++) values[count++] = last += step;
        lastKind = lastKind === DIF ? DIF : SQZ;
      } else if (kind === DIF) {
        if (Number.isNaN(last)) throw new JcampError(file, lineNo, 'DIF value with no preceding ordinate');
        if (first && checkPending) throw new JcampError(file, lineNo, 'expected the DIF Y-check value (an absolute ordinate) at the start of the line');
        lastDiff = v;
        if (count >= expected) throw tooMany();
        values[count++] = last += v;
        lastKind = DIF;
      } else if (first && checkPending) {
        if (Math.abs(v - last) > 1e-9 * Math.max(1, Math.abs(last))) {
          throw new JcampError(file, lineNo, `DIF Y-value check failed: line starts with ${v}, previous line ended with ${last}`);
        }
        lastKind = SQZ; // the check value stands for the stored point; a DUP after it repeats it
      } else {
        if (count >= expected) throw tooMany();
        values[count++] = last = v;
        lastKind = SQZ;
      }
      first = false;
    }
    pos = next;
  }
  if (count !== expected) {
    throw new JcampError(file, lineNo, `found ${count} ordinates, NPOINTS/VAR_DIM declares ${expected} (wrong point count or truncated page)`);
  }
  return out;
}
