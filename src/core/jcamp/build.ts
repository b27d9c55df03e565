import { makeAxis, type Axis } from '../spectrum/axis';
import type { DimensionProcessing } from '../spectrum/processing';
import { make1D, make2D, type Spectrum, type Spectrum1D, type Spectrum2D } from '../spectrum/spectrum';
import { findLabel, type JcampBlock } from './blocks';
import { JcampError } from './errors';
import { splitList } from './labels';
import { agreesToPrecision, lastDigitUnit, parseNumber } from './numbers';
import type { DecodedPage } from './pages';
import { parseProcessing, PROCESSING_LABEL } from './processingLabel';

/**
 * From a decoded block to the spectrum model. Frequencies: HZ as written, PPM times the observe
 * frequency (ppm = Hz / MHz). The Hz values of an NMR file are taken as relative to the shift
 * reference (0 Hz = 0 ppm), as the files in the JCAMP-DX NMR test sets are written.
 * `##.SHIFT REFERENCE= (type, compound, point, ppm)` (Davies & Lampen 1993 [from memory]; point
 * 1-based) is applied to 1D spectra when it names a point inside the data: the axis is moved so that
 * point has that shift. A point number of 0 or outside the data means "not given" and is ignored
 * (the public test files write `INTERNAL, TMS, 0, 0`). 2D files: not applied (no per-dimension form).
 */
export function buildSpectrum(block: JcampBlock, file: string): Spectrum {
  checkDataType(block, file);
  const mhz = observeMhz(block, file);
  const numDim = findLabel(block, 'NUMDIM');
  const dims = numDim ? parseNumber(numDim.value, file, numDim.line, 'NUMDIM') : independentColumns(block);
  if (dims === 2) return build2D(block, mhz, file);
  if (dims !== 1) throw new JcampError(file, numDim?.line ?? block.line, `${dims} dimensions: only 1D and 2D spectra are read`, 'NUMDIM');
  return build1D(block, mhz, file);
}

export function isNmrSpectrum(block: JcampBlock): boolean {
  return /\bNMR SPECTRUM\b/.test(block.dataType) && block.pages.length > 0;
}

/** Without ##NUM DIM=, the number of INDEPENDENT NTUPLES columns (1 for XYDATA). */
function independentColumns(block: JcampBlock): number {
  const types = findLabel(block, 'VARTYPE');
  if (!types) return 1;
  return Math.max(1, splitList(types.value).filter((t) => t.toUpperCase() === 'INDEPENDENT').length);
}

function checkDataType(block: JcampBlock, file: string): void {
  const r = findLabel(block, 'DATATYPE');
  if (!r) throw new JcampError(file, block.line, 'missing required ##DATA TYPE= (e.g. NMR SPECTRUM)');
  const t = block.dataType;
  if (/\bNMR FID\b/.test(t)) throw new JcampError(file, r.line, `"${r.value}" is a time-domain FID: only processed spectra are read`, 'DATATYPE');
  if (!/\bNMR\b/.test(t)) throw new JcampError(file, r.line, `"${r.value}" is not an NMR spectrum`, 'DATATYPE');
  if (!/\bNMR SPECTRUM\b/.test(t)) throw new JcampError(file, r.line, `"${r.value}" is not an NMR spectrum (no spectrum data)`, 'DATATYPE');
  if (block.pages.length === 0) throw new JcampError(file, block.line, 'block has no ##XYDATA= or ##DATA TABLE= with spectrum data');
}

function observeMhz(block: JcampBlock, file: string): number {
  const r = findLabel(block, '.OBSERVEFREQUENCY');
  if (!r) throw new JcampError(file, block.line, 'missing required ##.OBSERVE FREQUENCY= (MHz; needed for ppm)');
  const v = parseNumber(r.value, file, r.line, '.OBSERVEFREQUENCY');
  if (!(v > 0)) throw new JcampError(file, r.line, `observe frequency must be positive, found ${v}`, '.OBSERVEFREQUENCY');
  return v;
}

/** A frequency in the page's units converted to Hz. */
function toHz(v: number, units: string, mhz: number, file: string, line: number): number {
  if (units === 'HZ') return v;
  if (units === 'PPM') return v * mhz;
  throw new JcampError(file, line, `abscissa units "${units || '(none)'}" are not HZ or PPM`);
}

function pageAxis(p: DecodedPage, mhz: number, file: string): Axis {
  const first = toHz(p.firstX, p.xUnits, mhz, file, p.line);
  const last = toHz(p.lastX, p.xUnits, mhz, file, p.line);
  if (p.values.length < 2 || first === last) {
    throw new JcampError(file, p.line, `a spectrum axis needs at least 2 points and distinct FIRST/LAST (found ${p.values.length} points, ${first} to ${last} Hz)`);
  }
  return makeAxis(p.values.length, first, last, mhz);
}

/** Symbol of the first DEPENDENT column (the real part in complex NTUPLES), or of the first page. */
function mainSymbol(block: JcampBlock): string {
  const types = findLabel(block, 'VARTYPE');
  const symbols = findLabel(block, 'SYMBOL');
  if (types && symbols) {
    const t = splitList(types.value).map((s) => s.toUpperCase());
    const s = splitList(symbols.value).map((v) => v.toUpperCase());
    const i = t.indexOf('DEPENDENT');
    if (i >= 0 && s[i]) return s[i] ?? '';
  }
  return block.pages[0]?.ySymbol ?? '';
}

function processingOf(block: JcampBlock, suffix: string, file: string): DimensionProcessing | undefined {
  const r = findLabel(block, PROCESSING_LABEL + suffix);
  return r ? parseProcessing(r.value, file, r.line, PROCESSING_LABEL + suffix) : undefined;
}

function build1D(block: JcampBlock, mhz: number, file: string): Spectrum1D {
  const sym = mainSymbol(block);
  const pages = block.pages.filter((p) => p.ySymbol === sym);
  const page = pages[0];
  if (!page) throw new JcampError(file, block.line, 'no spectrum data');
  if (pages.length > 1) {
    // Several pages of one ordinate without a second independent variable: not one 1D spectrum.
    throw new JcampError(file, pages[1]?.line ?? page.line, `${pages.length} pages of ${sym} in a 1D block: add ##NUM DIM= 2 for a 2D spectrum`);
  }
  let axis = pageAxis(page, mhz, file);
  axis = applyShiftReference(block, axis, file);
  return make1D(block.title, page.values, axis, processingOf(block, '', file));
}

function applyShiftReference(block: JcampBlock, axis: Axis, file: string): Axis {
  const r = findLabel(block, '.SHIFTREFERENCE');
  if (!r) return axis;
  const parts = splitList(r.value.replace(/^\(|\)$/g, ''));
  if (parts.length < 4) throw new JcampError(file, r.line, `expected (type, compound, point, ppm), found "${r.value}"`, '.SHIFTREFERENCE');
  const point = parseNumber(parts[2] ?? '', file, r.line, '.SHIFTREFERENCE');
  const ppm = parseNumber(parts[3] ?? '', file, r.line, '.SHIFTREFERENCE');
  if (!Number.isInteger(point) || point < 1 || point > axis.points) return axis;
  const step = (axis.lastHz - axis.firstHz) / (axis.points - 1);
  const shift = ppm * axis.observeMhz - (axis.firstHz + (point - 1) * step);
  return shift === 0 ? axis : makeAxis(axis.points, axis.firstHz + shift, axis.lastHz + shift, axis.observeMhz);
}

function build2D(block: JcampBlock, mhz: number, file: string): Spectrum2D {
  const sym = mainSymbol(block);
  const pages = block.pages.filter((p) => p.ySymbol === sym);
  const p0 = pages[0];
  if (!p0) throw new JcampError(file, block.line, 'no ##PAGE= with spectrum data');
  const f2 = pageAxis(p0, mhz, file);
  for (const p of pages) {
    if (p.values.length !== f2.points || p.firstX !== p0.firstX || p.lastX !== p0.lastX || p.xUnits !== p0.xUnits) {
      throw new JcampError(file, p.line, `page has ${p.values.length} points from ${p.firstX} to ${p.lastX} ${p.xUnits}; the first page has ${f2.points} from ${p0.firstX} to ${p0.lastX} ${p0.xUnits}`);
    }
  }
  const f1 = f1Axis(block, pages, p0.xSymbol, mhz, file);
  const data = new Float64Array(f1.points * f2.points);
  pages.forEach((p, r) => data.set(p.values, r * f2.points));
  const pf1 = processingOf(block, 'F1', file);
  const pf2 = processingOf(block, 'F2', file);
  const processing = pf1 || pf2 ? { ...(pf1 ? { f1: pf1 } : {}), ...(pf2 ? { f2: pf2 } : {}) } : undefined;
  return make2D(block.title, data, f1, f2, processing);
}

/**
 * The F1 axis: from the F1 column's FIRST/LAST (the independent column that is not the pages'
 * abscissa), else from the first and last page values. Every page value (`F1=<v>`) must sit on that
 * axis to the precision written (or within half a point), and the page count must match VAR_DIM.
 */
function f1Axis(block: JcampBlock, pages: DecodedPage[], f2Symbol: string, mhz: number, file: string): Axis {
  const symbols = splitList(findLabel(block, 'SYMBOL')?.value ?? '').map((s) => s.toUpperCase());
  const types = splitList(findLabel(block, 'VARTYPE')?.value ?? '').map((s) => s.toUpperCase());
  const i = types.findIndex((t, k) => t === 'INDEPENDENT' && symbols[k] !== f2Symbol);
  const sym = symbols[i] ?? 'F1';
  const values = pages.map((p) => pageValue(p, sym, file));
  const entry = (label: string): string | undefined => (i >= 0 ? splitList(findLabel(block, label)?.value ?? '')[i] : undefined) || undefined;
  const units = (entry('UNITS') ?? 'HZ').toUpperCase();
  const line = findLabel(block, 'SYMBOL')?.line ?? block.line;
  const dimText = entry('VARDIM');
  if (dimText !== undefined && parseNumber(dimText, file, line, 'VARDIM') !== pages.length) {
    throw new JcampError(file, line, `VAR_DIM gives ${dimText} ${sym} points but the file has ${pages.length} pages: truncated?`, 'VARDIM');
  }
  const firstText = entry('FIRST');
  const lastText = entry('LAST');
  const first = firstText !== undefined ? parseNumber(firstText, file, line, 'FIRST') : (values[0]?.v ?? 0);
  const last = lastText !== undefined ? parseNumber(lastText, file, line, 'LAST') : (values[values.length - 1]?.v ?? 0);
  const n = pages.length;
  const step = n > 1 ? (last - first) / (n - 1) : 0;
  values.forEach((pv, r) => {
    const unit = Math.max(pv.unit, 0.5 * Math.abs(step));
    if (!agreesToPrecision(pv.v, unit, first + r * step)) {
      throw new JcampError(file, pages[r]?.line ?? line, `page ${sym}=${pv.v} is not row ${r} of the ${sym} axis (${first + r * step} expected from FIRST/LAST)`, 'PAGE');
    }
  });
  if (n < 2 || first === last) {
    throw new JcampError(file, line, `a 2D spectrum needs at least 2 pages and distinct ${sym} FIRST/LAST (found ${n} pages, ${first} to ${last})`);
  }
  return makeAxis(n, toHz(first, units, mhz, file, line), toHz(last, units, mhz, file, line), mhz);
}

function pageValue(p: DecodedPage, sym: string, file: string): { v: number; unit: number } {
  const m = /^\s*\(?\s*([A-Za-z][A-Za-z0-9]*)\s*=\s*([^)\s]+)\s*\)?\s*$/.exec(p.page);
  if (!m || (m[1] ?? '').toUpperCase() !== sym) throw new JcampError(file, p.line, `expected "##PAGE= ${sym}=<value>", found "${p.page}"`, 'PAGE');
  const text = m[2] ?? '';
  return { v: parseNumber(text, file, p.line, 'PAGE'), unit: lastDigitUnit(text) };
}
