/**
 * The compound id of a structure note: markdown whose YAML front matter names `compound: <id>`.
 * Pure text in, id out; notes without front matter (or without the key) are not compound notes.
 */
import { parse } from 'yaml';

/** Front matter is a `---` line at the very top, closed by the next `---` (or `...`) line. */
export const FRONT_MATTER = /^---[ \t]*\r?\n([\s\S]*?)\r?\n(?:---|\.\.\.)[ \t]*(?:\r?\n|$)/;

export interface FrontMatter {
  /** The compound id, or null when the note names none. */
  readonly compound: string | null;
  /** `solvent:` (e.g. CDCl3) for the SI line's header, when the note gives it. */
  readonly solvent: string | null;
  /** Why the front matter could not be read (YAML error), for the note's diagnostics. */
  readonly problem: string | null;
  /** Offset just after the closing line (0 without front matter). */
  readonly end: number;
}

export function readFrontMatter(text: string): FrontMatter {
  const m = FRONT_MATTER.exec(text);
  if (!m) return { compound: null, solvent: null, problem: null, end: 0 };
  const end = m[0].length;
  let data: unknown;
  try {
    data = parse(m[1] ?? '');
  } catch (e) {
    return { compound: null, solvent: null, problem: `front matter is not valid YAML: ${e instanceof Error ? e.message.split('\n')[0] : String(e)}`, end };
  }
  if (typeof data !== 'object' || data === null || !('compound' in data)) return { compound: null, solvent: null, problem: null, end };
  const fields = data as { compound: unknown; solvent?: unknown };
  const solvent = typeof fields.solvent === 'string' && fields.solvent.trim() !== '' ? fields.solvent.trim() : null;
  const id = fields.compound;
  // `compound: 12` is a plausible id too; YAML reads it as a number.
  if (typeof id === 'string' && id.trim() !== '') return { compound: id.trim(), solvent, problem: null, end };
  if (typeof id === 'number') return { compound: String(id), solvent, problem: null, end };
  return { compound: null, solvent, problem: 'front matter field "compound" should be a compound id (text)', end };
}
