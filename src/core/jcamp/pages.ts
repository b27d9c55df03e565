import { decodeAsdf } from './asdf';
import { JcampError } from './errors';
import { agreesToPrecision, lastDigitUnit, parseNumber } from './numbers';
import type { LabelledRecord } from './tokenize';

/** One decoded `(X++(Y..Y))` table: an XYDATA record or one NTUPLES page. */
export interface DecodedPage {
  /** Line of the `##PAGE=` record (or of `##XYDATA=`). */
  readonly line: number;
  /** The `##PAGE=` value as written (e.g. `N=1`, `F1=2946.94`); '' for XYDATA. */
  readonly page: string;
  /** Symbols of the abscissa and ordinate columns (`X`/`Y` for XYDATA; e.g. `F2`/`Y`, `X`/`R`). */
  readonly xSymbol: string;
  readonly ySymbol: string;
  /** Units as written in the file, upper case (`HZ`, `PPM`, `SECONDS`, `1/CM`, ...). */
  readonly xUnits: string;
  readonly yUnits: string;
  /** Abscissa of the first and last point, in xUnits (FIRSTX/LASTX or the column's FIRST/LAST). */
  readonly firstX: number;
  readonly lastX: number;
  readonly xFactor: number;
  readonly yFactor: number;
  /** Ordinates times yFactor. */
  readonly values: Float64Array;
}

/** Labels of a scope (a block header, or header plus page), with their lines; later ones win. */
export class LabelScope {
  private readonly map = new Map<string, LabelledRecord>();
  constructor(
    readonly file: string,
    readonly line: number,
    parent?: LabelScope,
  ) {
    if (parent) for (const [k, v] of parent.map) this.map.set(k, v);
  }
  set(r: LabelledRecord): void {
    this.map.set(r.label, r);
  }
  get(label: string): LabelledRecord | undefined {
    return this.map.get(label);
  }
  require(label: string, why: string): LabelledRecord {
    const r = this.map.get(label);
    if (!r) throw new JcampError(this.file, this.line, `missing required ##${label}= (${why})`);
    return r;
  }
  number(label: string, why: string): number {
    const r = this.require(label, why);
    return parseNumber(r.value, this.file, r.line, label);
  }
}

/** Everything needed to decode one table besides the data lines. */
export interface TableSpec {
  readonly xSymbol: string;
  readonly ySymbol: string;
  readonly xUnits: string;
  readonly yUnits: string;
  readonly first: number;
  readonly firstText: string;
  readonly last: number;
  readonly points: number;
  readonly xFactor: number;
  readonly yFactor: number;
  /** The declared first ordinate (FIRSTY or the Y column's FIRST) with its text, when given. */
  readonly firstY?: { readonly value: number; readonly text: string; readonly line: number; readonly field: string };
}

/** Decode a table's data lines and apply the X check, point count and FIRSTY rules of the standard. */
export function decodeTable(src: string, data: LabelledRecord, spec: TableSpec, page: string, pageLine: number, file: string): DecodedPage {
  if (!Number.isInteger(spec.points) || spec.points < 1) {
    throw new JcampError(file, data.line, `point count must be a positive integer, found ${spec.points}`);
  }
  const raw = decodeAsdf(src, data.body.start, data.body.end, data.body.line, spec.points, file);
  checkX(raw.lineNos, raw.lineX, raw.lineDecimals, raw.lineIndex, spec, file);
  const values = raw.values;
  if (spec.firstY) checkFirstY(values[0] ?? Number.NaN, spec, file);
  if (spec.yFactor !== 1) for (let i = 0; i < values.length; i++) values[i] = (values[i] ?? 0) * spec.yFactor;
  return {
    line: pageLine,
    page,
    xSymbol: spec.xSymbol,
    ySymbol: spec.ySymbol,
    xUnits: spec.xUnits,
    yUnits: spec.yUnits,
    firstX: spec.first,
    lastX: spec.last,
    xFactor: spec.xFactor,
    yFactor: spec.yFactor,
    values,
  };
}

/**
 * The X check: the abscissa written at the start of each data line, times the X factor, equals
 * FIRST + index * (LAST - FIRST) / (NPOINTS - 1) (JCAMP-DX, McDonald & Wilks 1988 [from memory]).
 * Tolerance: the precision written (one unit of the last digit of the line's X or of FIRST), but
 * never less than half a point spacing. The check exists to catch lost or doubled points, which
 * move X by a whole spacing; writers round X differently (single precision, a rounded DELTAX summed
 * along the line), and the standard's own test files drift by up to 0.1 Hz at 0.34 Hz spacing.
 */
function checkX(lineNos: number[], xs: number[], decimals: number[], index: number[], spec: TableSpec, file: string): void {
  const step = spec.points > 1 ? (spec.last - spec.first) / (spec.points - 1) : 0;
  const firstUnit = lastDigitUnit(spec.firstText);
  const f = Math.abs(spec.xFactor);
  for (let i = 0; i < xs.length; i++) {
    const d = decimals[i] ?? 0;
    const written = (xs[i] ?? 0) * spec.xFactor;
    const idx = index[i] ?? 0;
    const expected = spec.first + idx * step;
    const unit = Math.max(d >= 0 ? 10 ** -d * f : 0, firstUnit, 0.5 * Math.abs(step));
    if (!agreesToPrecision(written, unit, expected)) {
      throw new JcampError(
        file,
        lineNos[i] ?? 0,
        `X check failed: line starts at X = ${xs[i]} (x factor ${spec.xFactor} gives ${round(written)}), point ${idx} should be at ${round(expected)}`,
      );
    }
  }
}

/** FIRSTY is the true first ordinate; the stored integer may differ by up to one quantum (YFACTOR). */
function checkFirstY(y0: number, spec: TableSpec, file: string): void {
  const fy = spec.firstY;
  if (!fy) return;
  const scaled = y0 * spec.yFactor;
  const unit = Math.abs(spec.yFactor) + lastDigitUnit(fy.text);
  if (!agreesToPrecision(fy.value, unit, scaled)) {
    throw new JcampError(
      file,
      fy.line,
      `first ordinate ${y0} x factor ${spec.yFactor} = ${round(scaled)} does not match the declared ${fy.value}`,
      fy.field,
    );
  }
}

function round(v: number): string {
  return String(Number(v.toPrecision(10)));
}
