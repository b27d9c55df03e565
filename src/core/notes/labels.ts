/**
 * Atom labels known in the workspace, for completion when the chemist labels a pick. Pure text
 * scanning; the caller finds and reads the files (markdown structure notes and other sidecars).
 */
import { naturalCompare, parseSidecar } from '../sidecar';

/**
 * Proton labels as the structure notes write them: `H-3`, `H-4a`, `H-2'`, `H-10b`. The label must
 * stand alone (not inside `CH-3x1` or `H-3-ol`), so the characters around it are checked.
 */
const LABEL = /(?<![\w-])H-\d{1,3}[a-z]?'{0,2}(?![\w'-])/g;

export function labelsInMarkdown(text: string): string[] {
  return [...new Set(text.match(LABEL) ?? [])];
}

/** Every label occurrence with its offset (UTF-16 index), for hover and diagnostics in notes. */
export function labelMatches(text: string): { label: string; offset: number }[] {
  return [...text.matchAll(LABEL)].map((m) => ({ label: m[0], offset: m.index }));
}

/** Pick labels and coupling atoms of a readable sidecar; an unreadable one gives none (its diagnostics come elsewhere). */
export function labelsInSidecar(text: string, fileName: string): string[] {
  const { sidecar } = parseSidecar(text, fileName);
  if (sidecar === null) return [];
  return [...new Set([...sidecar.picks.flatMap((p) => p.label), ...sidecar.couplings.flatMap((c) => c.atoms)])];
}

/** Labels in natural order (H-2 before H-10), each once. */
export function mergeLabels(...lists: readonly (readonly string[])[]): string[] {
  const all = new Set(lists.flat().filter((l) => l.trim() !== ''));
  return [...all].sort(naturalCompare);
}
