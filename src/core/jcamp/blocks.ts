import { JcampError } from './errors';
import { splitList } from './labels';
import { parseNumber } from './numbers';
import { decodeTable, LabelScope, type DecodedPage, type TableSpec } from './pages';
import { tokenizeBlocks, type LabelledRecord, type RawBlock } from './tokenize';

/** One data block with its labels and every `(X++(Y..Y))` table decoded. */
export interface JcampBlock {
  /** Position among the file's data blocks (LINK blocks are containers and not counted), from 0. */
  readonly index: number;
  readonly title: string;
  readonly line: number;
  readonly endLine: number;
  /** `##BLOCK_ID=` as written, if any. */
  readonly blockId: string | undefined;
  /** `##DATA TYPE=` in upper case, '' if absent. */
  readonly dataType: string;
  readonly records: readonly LabelledRecord[];
  /** XYDATA, or the NTUPLES pages in file order (e.g. real and imaginary pages, or 2D rows). */
  readonly pages: readonly DecodedPage[];
}

export interface JcampFile {
  readonly fileName: string;
  readonly blocks: readonly JcampBlock[];
}

/** First record with this (normalised) label in a block. */
export function findLabel(block: JcampBlock, label: string): LabelledRecord | undefined {
  return block.records.find((r) => r.label === label);
}

/** Low-level reader: every block with its labels (and their lines) and decoded pages. Throws JcampError. */
export function readJcampBlocks(text: string, fileName: string): JcampFile {
  const raw = tokenizeBlocks(text, fileName);
  const src = text.charCodeAt(0) === 0xfeff ? ` ${text.slice(1)}` : text;
  const blocks = raw.map((b, index) => readBlock(src, b, index, fileName));
  return { fileName, blocks };
}

function readBlock(src: string, b: RawBlock, index: number, file: string): JcampBlock {
  const header = new LabelScope(file, b.line);
  let scope = header;
  let pageValue = '';
  let pageLine = b.line;
  const pages: DecodedPage[] = [];
  const seenSymbols = new Set<string>();
  for (const r of b.records) {
    if (r.label === 'PAGE') {
      scope = new LabelScope(file, r.line, header);
      pageValue = r.value;
      pageLine = r.line;
    } else if (r.label === 'ENDNTUPLES') {
      scope = header;
    } else if (r.label === 'XYDATA') {
      pages.push(decodeTable(src, r, xyDataSpec(scope, r, file), '', r.line, file));
    } else if (r.label === 'DATATABLE') {
      const spec = ntuplesSpec(scope, r, pageLine, seenSymbols, file);
      seenSymbols.add(spec.ySymbol);
      pages.push(decodeTable(src, r, spec, pageValue, pageLine, file));
    } else {
      scope.set(r);
    }
  }
  const dataType = b.records.find((r) => r.label === 'DATATYPE')?.value.toUpperCase() ?? '';
  const blockId = b.records.find((r) => r.label === 'BLOCKID')?.value;
  return { index, title: b.title, line: b.line, endLine: b.endLine, blockId, dataType, records: b.records, pages };
}

function xyDataSpec(scope: LabelScope, r: LabelledRecord, file: string): TableSpec {
  if (!/^\(\s*X\s*\+\+\s*\(\s*Y\s*\.\.\s*Y\s*\)\s*\)$/i.test(r.value)) {
    throw new JcampError(file, r.line, `unsupported table form "${r.value}": only (X++(Y..Y)) is read`, 'XYDATA');
  }
  const why = 'needed to decode ##XYDATA=';
  const firstY = scope.get('FIRSTY');
  return {
    xSymbol: 'X',
    ySymbol: 'Y',
    xUnits: scope.get('XUNITS')?.value.toUpperCase() ?? '',
    yUnits: scope.get('YUNITS')?.value.toUpperCase() ?? '',
    first: scope.number('FIRSTX', why),
    firstText: scope.require('FIRSTX', why).value,
    last: scope.number('LASTX', why),
    points: scope.number('NPOINTS', why),
    // Required by the standard (McDonald & Wilks 1988 [from memory]); a lost YFACTOR would silently rescale.
    xFactor: scope.number('XFACTOR', why),
    yFactor: scope.number('YFACTOR', why),
    ...(firstY
      ? { firstY: { value: parseNumber(firstY.value, file, firstY.line, 'FIRSTY'), text: firstY.value, line: firstY.line, field: 'FIRSTY' } }
      : {}),
  };
}

const TABLE_FORM = /^\(\s*([A-Z][A-Z0-9]*)\s*\+\+\s*\(\s*([A-Z][A-Z0-9]*)\s*\.\.\s*([A-Z][A-Z0-9]*)\s*\)\s*\)\s*(?:,\s*([A-Z ]*))?$/i;
const CONTINUOUS = new Set(['', 'XYDATA', 'PROFILE', 'SPECTRUM']);

/** Column entry `i` of an NTUPLES list label, or undefined when the label or entry is absent. */
function column(scope: LabelScope, label: string, i: number): { text: string; line: number } | undefined {
  const r = scope.get(label);
  if (!r) return undefined;
  const text = splitList(r.value)[i];
  return text === undefined || text === '' ? undefined : { text, line: r.line };
}

function columnNumber(scope: LabelScope, label: string, i: number, sym: string, file: string, fallback?: number): number {
  const c = column(scope, label, i);
  if (c) return parseNumber(c.text, file, c.line, label);
  if (fallback !== undefined) return fallback;
  throw new JcampError(file, scope.line, `missing required ##${label}= entry for column ${sym}`);
}

/** An NTUPLES column without a FACTOR entry is taken as unscaled (factor 1). */
function ntuplesSpec(scope: LabelScope, r: LabelledRecord, pageLine: number, seen: Set<string>, file: string): TableSpec {
  const m = TABLE_FORM.exec(r.value);
  const kind = (m?.[4] ?? '').trim().toUpperCase();
  if (!m || m[2]?.toUpperCase() !== m[3]?.toUpperCase() || !CONTINUOUS.has(kind)) {
    throw new JcampError(file, r.line, `unsupported table "${r.value}": only (X++(Y..Y)) with XYDATA, PROFILE or SPECTRUM is read`, 'DATATABLE');
  }
  const xSymbol = (m[1] ?? '').toUpperCase();
  const ySymbol = (m[2] ?? '').toUpperCase();
  const symbols = splitList(scope.require('SYMBOL', 'needed to read NTUPLES pages').value).map((s) => s.toUpperCase());
  const xi = symbols.indexOf(xSymbol);
  const yi = symbols.indexOf(ySymbol);
  if (xi < 0 || yi < 0) {
    throw new JcampError(file, r.line, `column ${xi < 0 ? xSymbol : ySymbol} is not listed in ##SYMBOL= (${symbols.join(', ')})`, 'DATATABLE');
  }
  const pointsRec = scope.get('NPOINTS');
  const points =
    pointsRec && pointsRec.line > pageLine
      ? parseNumber(pointsRec.value, file, pointsRec.line, 'NPOINTS')
      : columnNumber(scope, 'VARDIM', yi, ySymbol, file, columnNumber(scope, 'VARDIM', xi, xSymbol, file));
  const firstRec = scope.get('FIRST');
  const yFirst = column(scope, 'FIRST', yi);
  // The header's FIRST for a Y column describes the first page of that column; a page's own FIRST its page.
  const useFirstY = yFirst && firstRec && (firstRec.line > pageLine || !seen.has(ySymbol));
  const xFirst = column(scope, 'FIRST', xi);
  return {
    xSymbol,
    ySymbol,
    xUnits: (column(scope, 'UNITS', xi)?.text ?? '').toUpperCase(),
    yUnits: (column(scope, 'UNITS', yi)?.text ?? '').toUpperCase(),
    first: columnNumber(scope, 'FIRST', xi, xSymbol, file),
    firstText: xFirst?.text ?? '',
    last: columnNumber(scope, 'LAST', xi, xSymbol, file),
    points,
    xFactor: columnNumber(scope, 'FACTOR', xi, xSymbol, file, 1),
    yFactor: columnNumber(scope, 'FACTOR', yi, ySymbol, file, 1),
    ...(useFirstY
      ? { firstY: { value: parseNumber(yFirst.text, file, yFirst.line, 'FIRST'), text: yFirst.text, line: yFirst.line, field: 'FIRST' } }
      : {}),
  };
}
