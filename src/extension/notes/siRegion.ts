/**
 * The marked region an SI data line lives in, so that re-running the insert command replaces the
 * line instead of adding a second one. Markers are comments of our own that the rendered document
 * does not show:
 *
 *   markdown: <!-- couplet:si H1 begin -->      LaTeX: % couplet:si H1 begin
 *             ...line...                               ...line...
 *             <!-- couplet:si H1 end -->               % couplet:si H1 end
 *
 * Pure: text in, one replacement out (the glue applies it as one WorkspaceEdit, one undo step).
 */

export type NoteLanguage = 'markdown' | 'latex';

export interface RegionEdit {
  readonly offset: number;
  readonly length: number;
  readonly text: string;
  /** True when an existing region was updated, false when a new one was inserted at the cursor. */
  readonly replaced: boolean;
}

const marker = (lang: NoteLanguage, kind: string, end: 'begin' | 'end'): string =>
  lang === 'markdown' ? `<!-- couplet:si ${kind} ${end} -->` : `% couplet:si ${kind} ${end}`;

function escapeRe(s: string): string {
  return s.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
}

/** A marker line, with whatever indentation and trailing blanks the user gave it. */
function markerLines(text: string, m: string): { start: number; end: number }[] {
  const re = new RegExp(`^[ \\t]*${escapeRe(m)}[ \\t]*$`, 'gm');
  return [...text.matchAll(re)].map((x) => ({ start: x.index, end: x.index + x[0].length }));
}

const lineOf = (text: string, offset: number): number => text.slice(0, offset).split('\n').length;

/**
 * Replaces the body between the markers of `kind` (e.g. `H1`), or inserts a new marked region at
 * `cursor`. Throws, naming the line, when the markers are unpaired or doubled: guessing which
 * region was meant could overwrite text the chemist wrote.
 */
export function upsertRegion(text: string, cursor: number, lang: NoteLanguage, kind: string, body: string, fileName: string): RegionEdit {
  if (!/^[A-Za-z0-9]+$/.test(kind)) throw new Error(`region kind "${kind}" must be letters and digits`);
  const eol = text.includes('\r\n') ? '\r\n' : '\n';
  const begins = markerLines(text, marker(lang, kind, 'begin'));
  const ends = markerLines(text, marker(lang, kind, 'end'));
  const inner = body.replace(/\r?\n/g, eol).replace(/\s+$/, '');
  if (begins.length === 0 && ends.length === 0) {
    const at = Math.max(0, Math.min(cursor, text.length));
    const region = `${marker(lang, kind, 'begin')}${eol}${inner}${eol}${marker(lang, kind, 'end')}`;
    // Keep the markers on lines of their own whatever the cursor position.
    const before = at > 0 && text[at - 1] !== '\n' ? eol : '';
    const after = at < text.length && text[at] !== '\n' && text[at] !== '\r' ? eol : '';
    return { offset: at, length: 0, text: `${before}${region}${after}`, replaced: false };
  }
  const b = begins[0];
  const e = ends[0];
  if (begins.length > 1 || ends.length > 1) {
    const second = begins[1] ?? ends[1];
    throw new Error(`${fileName}:${lineOf(text, second?.start ?? 0)}: a second "couplet:si ${kind}" marker; keep one region per note`);
  }
  if (!b) throw new Error(`${fileName}:${lineOf(text, e?.start ?? 0)}: "couplet:si ${kind} end" without its begin marker`);
  if (!e) throw new Error(`${fileName}:${lineOf(text, b.start)}: "couplet:si ${kind} begin" without its end marker`);
  if (e.start < b.end) throw new Error(`${fileName}:${lineOf(text, e.start)}: "couplet:si ${kind} end" comes before its begin marker`);
  // Replace from the end of the begin line to the start of the end line: markers stay byte for byte.
  return { offset: b.end, length: e.start - b.end, text: `${eol}${inner}${eol}`, replaced: true };
}
