import { JcampError } from './errors';

/** A number from a label value; anything else is an error naming the label and line. */
export function parseNumber(text: string, file: string, line: number, field: string): number {
  const t = text.trim();
  const v = t === '' ? Number.NaN : Number(t);
  if (!Number.isFinite(v)) {
    throw new JcampError(file, line, `expected a number, found "${t.slice(0, 40)}"`, field);
  }
  return v;
}

/** Unit of the last decimal written in a number (`24038.50` -> 0.01, `1.5E-03` -> 1e-4), or 0 if unknown. */
export function lastDigitUnit(text: string): number {
  const t = text.trim();
  const m = /^[+-]?(\d*)(?:\.(\d*))?(?:[eE]([+-]?\d+))?$/.exec(t);
  if (!m) return 0;
  const decimals = m[2]?.length ?? 0;
  const exp = m[3] ? Number(m[3]) : 0;
  return 10 ** (exp - decimals);
}

/**
 * True when `written` (a value printed to some precision) agrees with `exact`: within one unit of
 * its last written digit (rounding and truncating writers both pass) plus a relative 1e-9 for
 * arithmetic in the writer and here.
 */
export function agreesToPrecision(written: number, unit: number, exact: number): boolean {
  const tol = unit + 1e-9 * Math.max(Math.abs(written), Math.abs(exact));
  return Math.abs(written - exact) <= tol;
}
