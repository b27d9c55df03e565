/**
 * Fixed-decimal output and the natural sort order used by the sidecar writer.
 *
 * Rounding rule: half away from zero, applied to the shortest decimal string that reads back as
 * the same double (ECMAScript Number::toString, ECMA-262 §6.1.6.1.20). So 1.005 -> "1.01" and
 * -2.675 -> "-2.68", which is what a person reading the number expects, whereas
 * Number.prototype.toFixed rounds the binary value (1.005.toFixed(2) === "1.00"). Negative zero
 * and values that round to zero are written without a sign.
 */

/** Formats `x` with exactly `places` decimals (see the module comment for the rounding rule). */
export function toFixedDecimal(x: number, places: number): string {
  if (!Number.isFinite(x)) throw new RangeError(`cannot write ${String(x)} as a fixed decimal`);
  if (Math.abs(x) >= 1e21) throw new RangeError(`${x} is too large for a fixed decimal`);
  const negative = x < 0;
  const digits = plainDigits(Math.abs(x));
  const dot = digits.indexOf('.');
  const intPart = dot < 0 ? digits : digits.slice(0, dot);
  const fracPart = dot < 0 ? '' : digits.slice(dot + 1);
  const kept = (intPart + fracPart.padEnd(places, '0').slice(0, places)).replace(/^0+(?=\d)/, '');
  const roundUp = (fracPart[places] ?? '0') >= '5';
  const scaled = roundUp ? incrementDecimal(kept) : kept;
  const padded = scaled.padStart(places + 1, '0');
  const whole = padded.slice(0, padded.length - places);
  const frac = padded.slice(padded.length - places);
  const text = places > 0 ? `${whole}.${frac}` : whole;
  const isZero = /^[0.]*$/.test(text);
  return negative && !isZero ? `-${text}` : text;
}

/** The shortest round-trip decimal of a non-negative finite number, without exponent. */
function plainDigits(x: number): string {
  const s = String(x);
  const e = s.indexOf('e');
  if (e < 0) return s;
  // Only tiny values reach here (>= 1e21 is rejected): 1.5e-7 -> 0.00000015.
  const mantissa = s.slice(0, e).replace('.', '');
  const exponent = Number(s.slice(e + 1));
  return `0.${'0'.repeat(-exponent - 1)}${mantissa}`;
}

/** Adds one to a string of decimal digits. */
function incrementDecimal(digits: string): string {
  const out = digits.split('');
  for (let i = out.length - 1; i >= 0; i--) {
    if (out[i] !== '9') {
      out[i] = String(Number(out[i]) + 1);
      return out.join('');
    }
    out[i] = '0';
  }
  return `1${out.join('')}`;
}

/**
 * Natural order: runs of digits compare as whole numbers, everything else by UTF-16 code unit,
 * so H-2 < H-10 and p-9.5000 < p-10.0000. Ties (e.g. leading zeros) fall back to plain code-unit
 * order, which makes the order total and independent of locale.
 */
export function naturalCompare(a: string, b: string): number {
  const ra = a.match(/\d+|\D+/g) ?? [];
  const rb = b.match(/\d+|\D+/g) ?? [];
  const n = Math.min(ra.length, rb.length);
  for (let i = 0; i < n; i++) {
    const c = compareRun(ra[i] ?? '', rb[i] ?? '');
    if (c !== 0) return c;
  }
  if (ra.length !== rb.length) return ra.length - rb.length;
  return a < b ? -1 : a > b ? 1 : 0;
}

function compareRun(x: string, y: string): number {
  const dx = /^\d/.test(x);
  const dy = /^\d/.test(y);
  if (dx && dy) {
    const tx = x.replace(/^0+/, '');
    const ty = y.replace(/^0+/, '');
    if (tx.length !== ty.length) return tx.length - ty.length;
    return tx < ty ? -1 : tx > ty ? 1 : 0;
  }
  return x < y ? -1 : x > y ? 1 : 0;
}
