/**
 * The `couplet check` rules for one compound folder, for the editor: the same pure rules as the
 * CLI (src/core/review/check), with file access behind a small interface so this runs in Node
 * tests without VS Code. Reads saved files (what CI will see), not unsaved editor text.
 */
import { checkCompound, type NoteInput, type Problem, type SidecarInput } from '../../core/review/check';
import { parseSidecar } from '../../core/sidecar';
import { labelsInMarkdown } from '../../core/notes/labels';

export interface FolderReader {
  /** File names (not paths) in the folder. */
  list(folder: string): Promise<string[]>;
  /** Text of a file, or null when it cannot be read. */
  readText(path: string): Promise<string | null>;
  /** SHA-256 hex of a file's bytes, or null when it cannot be read. */
  sha256(path: string): Promise<string | null>;
}

const SIDECAR = '.couplet.yaml';
const NOTE = /\.(md|markdown|tex)$/i;

/**
 * Rules the editor shows from this module. Schema, syntax and hash problems of a sidecar already
 * come from the open panel's own diagnostics (src/extension/diagnostics.ts); showing them twice
 * would only add noise.
 */
const EDITOR_RULES = new Set<Problem['rule']>(['labels', 'repeated-j', 'hidden-flags', 'stale-si']);

export async function checkFolder(folder: string, r: FolderReader, join: (a: string, b: string) => string): Promise<Problem[]> {
  const names = (await r.list(folder)).sort();
  const sidecars: SidecarInput[] = [];
  for (const n of names.filter((x) => x.endsWith(SIDECAR))) {
    const file = join(folder, n);
    const text = await r.readText(file);
    if (text === null) continue;
    const dataName = parseSidecar(text, file).sidecar?.data.file ?? n.slice(0, -SIDECAR.length);
    sidecars.push({ file, text, dataSha256: await r.sha256(join(folder, dataName)) });
  }
  const notes: NoteInput[] = [];
  for (const n of names.filter((x) => NOTE.test(x))) {
    const text = await r.readText(join(folder, n));
    if (text !== null) notes.push({ file: join(folder, n), text });
  }
  if (sidecars.length === 0) return [];
  const input = notes.length === 0 ? { sidecars, notes } : { sidecars, notes, knownLabels: new Set(notes.flatMap((n) => labelsInMarkdown(n.text))) };
  return checkCompound(input).filter((p) => EDITOR_RULES.has(p.rule));
}

/** The quick fix that obviously applies to a problem, if any: the command to run and its title. */
export function quickFixFor(rule: Problem['rule']): { command: string; title: string } | undefined {
  if (rule === 'stale-si' || rule === 'hidden-flags') return { command: 'couplet.insertSiData', title: 'Update the SI region from the sidecars' };
  return undefined;
}

/**
 * Check runs per folder, newest wins. Save All fires one save event per file: the run started by
 * the first can still read the other file's old text and, finishing last, would publish problems
 * already fixed. Only the latest run started for a folder may publish.
 */
export class LatestRuns {
  private readonly latest = new Map<string, number>();
  private count = 0;

  /** Starts a run; the function returned tells whether it is still the newest for its folder. */
  start(folder: string): () => boolean {
    const n = ++this.count;
    this.latest.set(folder, n);
    return () => this.latest.get(folder) === n;
  }
}
