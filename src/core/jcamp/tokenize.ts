import { JcampError } from './errors';
import { DATA_LABELS, normaliseLabel, stripComment } from './labels';

/** One `##LABEL= value` record with the lines it spans. */
export interface LabelledRecord {
  /** Normalised label: upper case, no spaces, hyphens, slashes or underscores (`.`/`$` kept). */
  readonly label: string;
  /** The label as written, e.g. `.OBSERVE FREQUENCY`. */
  readonly rawLabel: string;
  /**
   * The value with `$$` comments removed. For data tables (XYDATA, DATA TABLE, ...) only the first
   * line (e.g. `(X++(Y..Y))`); their data lines are read from `body`.
   */
  readonly value: string;
  /** 1-based line of the `##` record. */
  readonly line: number;
  /** Offsets into the text of the continuation lines: [start, end), and the line number of start. */
  readonly body: { readonly start: number; readonly end: number; readonly line: number };
}

/** One `##TITLE=` ... `##END=` block that is not itself a LINK of other blocks. */
export interface RawBlock {
  readonly title: string;
  readonly line: number;
  readonly endLine: number;
  readonly records: readonly LabelledRecord[];
}

interface OpenBlock {
  title: string;
  line: number;
  records: LabelledRecord[];
  isLink: boolean;
}

interface MutableRecord {
  label: string;
  rawLabel: string;
  value: string;
  line: number;
  body: { start: number; end: number; line: number };
}

/** Reject what cannot be a JCAMP-DX text before scanning it line by line. */
function checkText(text: string, file: string): void {
  if (!/\S/.test(text)) throw new JcampError(file, 1, 'empty file: no ##TITLE= record');
  const nul = text.indexOf('\0');
  if (nul >= 0) {
    throw new JcampError(file, lineAt(text, nul), 'binary data (a NUL byte): not a JCAMP-DX text file');
  }
}

/** 1-based line number of a text offset (used only when reporting errors). */
export function lineAt(text: string, offset: number): number {
  let n = 1;
  for (let i = text.indexOf('\n'); i >= 0 && i < offset; i = text.indexOf('\n', i + 1)) n++;
  return n;
}

/**
 * Split a JCAMP-DX text into its leaf blocks (LINK files nest blocks; only blocks that are not
 * LINKs are returned, in file order). Handles LF and CRLF line ends and `$$` comments.
 */
export function tokenizeBlocks(text: string, file: string): RawBlock[] {
  checkText(text, file);
  const src = text.charCodeAt(0) === 0xfeff ? ` ${text.slice(1)}` : text;
  const stack: OpenBlock[] = [];
  const done: RawBlock[] = [];
  let current: MutableRecord | undefined;
  let lineNo = 0;
  let pos = 0;
  const finishRecord = (): void => {
    if (!current) return;
    const top = stack[stack.length - 1];
    handleRecord(current, stack, done, file, top);
    current = undefined;
  };
  while (pos < src.length) {
    lineNo++;
    const nl = src.indexOf('\n', pos);
    const next = nl < 0 ? src.length : nl + 1;
    let end = nl < 0 ? src.length : nl;
    if (end > pos && src.charCodeAt(end - 1) === 13) end--;
    let s = pos;
    while (s < end && (src.charCodeAt(s) === 32 || src.charCodeAt(s) === 9)) s++;
    if (src.charCodeAt(s) === 35 && src.charCodeAt(s + 1) === 35) {
      finishRecord();
      current = startRecord(src, s + 2, end, lineNo, next, file);
    } else if (current) {
      extendRecord(current, src, pos, end, next);
    } else if (s < end && !src.startsWith('$$', s)) {
      throw new JcampError(file, lineNo, `text outside any ##LABEL= record: "${src.slice(s, Math.min(end, s + 30))}"`);
    }
    pos = next;
  }
  finishRecord();
  const open = stack[stack.length - 1];
  if (open) {
    throw new JcampError(file, lineNo, `file ends inside the block "${open.title}" opened at line ${open.line} (no ##END=): truncated?`);
  }
  if (done.length === 0) throw new JcampError(file, 1, 'no ##TITLE= ... ##END= block found');
  return done;
}

function startRecord(src: string, from: number, end: number, line: number, next: number, file: string): MutableRecord {
  const eq = src.indexOf('=', from);
  if (eq < 0 || eq >= end) {
    throw new JcampError(file, line, `label "##${src.slice(from, Math.min(end, from + 40))}" has no "="`);
  }
  const rawLabel = src.slice(from, eq).trim();
  return {
    label: normaliseLabel(rawLabel),
    rawLabel,
    value: stripComment(src.slice(eq + 1, end)),
    line,
    body: { start: next, end: next, line: line + 1 },
  };
}

function extendRecord(r: MutableRecord, src: string, pos: number, end: number, next: number): void {
  r.body.end = next;
  if (DATA_LABELS.has(r.label)) return;
  const extra = stripComment(src.slice(pos, end));
  if (extra !== '') r.value = r.value === '' ? extra : `${r.value}\n${extra}`;
}

function handleRecord(r: MutableRecord, stack: OpenBlock[], done: RawBlock[], file: string, top: OpenBlock | undefined): void {
  if (r.label === 'TITLE') {
    if (top && !top.isLink) {
      throw new JcampError(file, r.line, `##TITLE= inside the block "${top.title}" opened at line ${top.line}, which has no ##END=`);
    }
    stack.push({ title: r.value.replace(/\n/g, ' '), line: r.line, records: [r], isLink: false });
    return;
  }
  if (!top) throw new JcampError(file, r.line, `##${r.rawLabel}= outside any ##TITLE= ... ##END= block`);
  if (r.label === 'END') {
    stack.pop();
    if (!top.isLink) done.push({ title: top.title, line: top.line, endLine: r.line, records: top.records });
    return;
  }
  top.records.push(r);
  if (r.label === 'BLOCKS' || (r.label === 'DATATYPE' && r.value.toUpperCase() === 'LINK')) top.isLink = true;
}
