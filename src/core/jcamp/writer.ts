import { hzPerPoint, type Axis } from '../spectrum/axis';
import type { DimensionProcessing } from '../spectrum/processing';
import type { Spectrum1D, Spectrum2D } from '../spectrum/spectrum';
import { encodeLines, MAX_LINE, type Encoding } from './asdfEncode';
import { formatProcessing, PROCESSING_RAW_LABEL } from './processingLabel';

export interface JcampWriteOptions {
  /** Ordinate form: DIFDUP (default, compact) or AFFN (plain integers). */
  readonly encoding?: 'DIFDUP' | 'AFFN';
  /** Defaults to the spectrum's title. */
  readonly title?: string;
  readonly origin?: string;
  readonly owner?: string;
}

/**
 * Ordinates are written as integers q with one FACTOR per file: FACTOR = max|y| / 2^20, so the
 * largest value is written as +-1048576 and the quantisation error is at most FACTOR / 2 (about
 * 5e-7 of the largest value). Reading the file back gives exactly q * FACTOR (FACTOR is printed in
 * the shortest form that parses to the same double), and writing that again gives the same text.
 */
const FULL_SCALE = 2 ** 20;

interface Quantised {
  readonly q: Int32Array;
  readonly factor: number;
}

function quantise(data: Float64Array): Quantised {
  let max = 0;
  for (let i = 0; i < data.length; i++) {
    const v = data[i] ?? Number.NaN;
    if (!Number.isFinite(v)) throw new RangeError(`cannot write JCAMP-DX: value ${v} at index ${i} is not finite`);
    max = Math.max(max, Math.abs(v));
  }
  const factor = max > 0 ? max / FULL_SCALE : 1;
  const q = new Int32Array(data.length);
  for (let i = 0; i < data.length; i++) q[i] = Math.round((data[i] ?? 0) / factor);
  return { q, factor };
}

/** A label and value, wrapped at blanks onto continuation lines to keep lines within 80 characters. */
function record(rawLabel: string, value: string): string[] {
  const clean = value.replace(/\s*[\r\n]+\s*/g, ' ').replace(/\$\$/g, '$ $').trim();
  const lines: string[] = [];
  let line = `##${rawLabel}=`;
  for (const word of clean.split(/ +/)) {
    if (line.length + 1 + word.length > MAX_LINE) {
      lines.push(line);
      line = word;
    } else line = `${line} ${word}`;
  }
  lines.push(line);
  return lines;
}

/** Decimals for X values: a hundredth of a point spacing, so the X check is meaningful. */
function xDecimals(axis: Axis): number {
  const step = Math.abs(hzPerPoint(axis));
  return Math.min(10, Math.max(0, Math.ceil(-Math.log10(step / 100))));
}

function xText(axis: Axis): (i: number) => string {
  const d = xDecimals(axis);
  const step = hzPerPoint(axis);
  return (i) => (i === axis.points - 1 ? axis.lastHz : axis.firstHz + i * step).toFixed(d);
}

function commonHeader(title: string, version: string, dataType: string, opts: JcampWriteOptions | undefined, mhz: number): string[] {
  return [
    ...record('TITLE', title),
    `##JCAMP-DX= ${version}`,
    `##DATA TYPE= ${dataType}`,
    ...record('ORIGIN', opts?.origin ?? 'Couplet JCAMP-DX writer'),
    ...record('OWNER', opts?.owner ?? ''),
    `##.OBSERVE FREQUENCY= ${mhz}`,
    '##.OBSERVE NUCLEUS= ^1H',
  ];
}

function processingLines(suffix: string, p: DimensionProcessing | undefined): string[] {
  return p ? record(`${PROCESSING_RAW_LABEL}${suffix}`, formatProcessing(p)) : [];
}

/** A 1D spectrum as `##XYDATA= (X++(Y..Y))` in Hz (JCAMP-DX 5.01 NMR form, Davies & Lampen 1993 [from memory]). */
export function writeJcamp1D(s: Spectrum1D, opts?: JcampWriteOptions): string {
  const encoding: Encoding = opts?.encoding ?? 'DIFDUP';
  const { q, factor } = quantise(s.data);
  const a = s.axis;
  const lines = [
    ...commonHeader(opts?.title ?? s.title, '5.01', 'NMR SPECTRUM', opts, a.observeMhz),
    '##DATA CLASS= XYDATA',
    ...processingLines('', s.processing),
    '##XUNITS= HZ',
    '##YUNITS= ARBITRARY UNITS',
    '##XFACTOR= 1',
    `##YFACTOR= ${factor}`,
    `##FIRSTX= ${a.firstHz}`,
    `##LASTX= ${a.lastHz}`,
    `##DELTAX= ${hzPerPoint(a)}`,
    `##NPOINTS= ${a.points}`,
    `##FIRSTY= ${(q[0] ?? 0) * factor}`,
    '##XYDATA= (X++(Y..Y))',
    ...encodeLines(q, xText(a), encoding),
    '##END=',
  ];
  return `${lines.join('\n')}\n`;
}

/**
 * A 2D spectrum as nD NMR NTUPLES (JCAMP-DX 6.00, Lampen et al. 1999 [from memory]): one
 * `##PAGE= F1=<Hz>` per row, each `##DATA TABLE= (F2++(Y..Y)), SPECTRUM`, all in Hz.
 */
export function writeJcamp2D(s: Spectrum2D, opts?: JcampWriteOptions): string {
  const encoding: Encoding = opts?.encoding ?? 'DIFDUP';
  const { q, factor } = quantise(s.data);
  const { f1, f2 } = s;
  const n2 = f2.points;
  const yFirst = (q[0] ?? 0) * factor;
  const yLast = (q[q.length - 1] ?? 0) * factor;
  const lines = [
    ...commonHeader(opts?.title ?? s.title, '6.00', 'nD NMR SPECTRUM', opts, f2.observeMhz),
    '##DATA CLASS= NTUPLES',
    '##NUM DIM= 2',
    ...processingLines(' F1', s.processing?.f1),
    ...processingLines(' F2', s.processing?.f2),
    '##NTUPLES= nD NMR SPECTRUM',
    '##VAR_NAME= FREQUENCY1, FREQUENCY2, SPECTRUM',
    '##SYMBOL= F1, F2, Y',
    '##.NUCLEUS= ^1H, ^1H',
    '##VAR_TYPE= INDEPENDENT, INDEPENDENT, DEPENDENT',
    `##VAR_FORM= AFFN, AFFN, ${encoding === 'AFFN' ? 'AFFN' : 'ASDF'}`,
    `##VAR_DIM= ${f1.points}, ${n2}, ${n2}`,
    '##UNITS= HZ, HZ, ARBITRARY UNITS',
    ...record('FACTOR', `1, 1, ${factor}`),
    ...record('FIRST', `${f1.firstHz}, ${f2.firstHz}, ${yFirst}`),
    ...record('LAST', `${f1.lastHz}, ${f2.lastHz}, ${yLast}`),
  ];
  const step1 = hzPerPoint(f1);
  const x = xText(f2);
  for (let r = 0; r < f1.points; r++) {
    const f1Hz = r === f1.points - 1 ? f1.lastHz : f1.firstHz + r * step1;
    lines.push(`##PAGE= F1=${f1Hz}`, '##DATA TABLE= (F2++(Y..Y)), SPECTRUM');
    const rowQ = q.subarray(r * n2, (r + 1) * n2);
    for (const l of encodeLines(rowQ, x, encoding)) lines.push(l);
  }
  lines.push('##END NTUPLES= nD NMR SPECTRUM', '##END=');
  return `${lines.join('\n')}\n`;
}
