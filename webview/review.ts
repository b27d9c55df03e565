/**
 * The overlay of changes since another revision (issue 6): which mark is current, stepping
 * through them with the keyboard, and how each kind is drawn. Pure (no DOM), tested in Node.
 * Every kind differs in shape as well as colour, so the overlay also reads without colour.
 */
import type { ReviewMarkView } from '../src/protocol';

export interface ReviewState {
  /** The revision compared with; null when there is no overlay. */
  readonly against: string | null;
  readonly marks: readonly ReviewMarkView[];
  /** Index into marks of the change in focus. */
  readonly current: number | null;
}

export const NO_REVIEW: ReviewState = { against: null, marks: [], current: null };

export type MarkShape = 'circle' | 'crossedCircle' | 'square' | 'diamond' | 'triangle' | 'dot';

export const MARK_SHAPE: Readonly<Record<ReviewMarkView['kind'], MarkShape>> = {
  added: 'circle', removed: 'crossedCircle', moved: 'square', relabelled: 'diamond', 're-measured': 'triangle', other: 'dot',
};

/** The theme colours the marks use (theme.ts's Palette has them; no DOM import here, so Node tests run). */
export interface MarkPalette {
  readonly fit: string;
  readonly residual: string;
  readonly focus: string;
  readonly pick: string;
  readonly negative: string;
  readonly muted: string;
}

export function markColour(kind: ReviewMarkView['kind'], p: MarkPalette): string {
  switch (kind) {
    case 'added': return p.fit;
    case 'removed': return p.residual;
    case 'moved': return p.focus;
    case 'relabelled': return p.pick;
    case 're-measured': return p.negative;
    case 'other': return p.muted;
  }
}

/** The next (dir 1) or previous (-1) change, wrapping; null when there are none. */
export function stepChange(s: ReviewState, dir: 1 | -1): number | null {
  const n = s.marks.length;
  if (n === 0) return null;
  if (s.current === null) return dir === 1 ? 0 : n - 1;
  return (((s.current + dir) % n) + n) % n;
}

/** The status line for the change in focus, e.g. `2/5 since HEAD: pick p-1 moved ...`. */
export function changeStatus(s: ReviewState): string {
  if (s.against === null) return '';
  if (s.marks.length === 0) return `No changes to the picks since ${s.against}.`;
  const m = s.current === null ? undefined : s.marks[s.current];
  if (m === undefined) return `${s.marks.length} change(s) since ${s.against}: C / Shift+C step through them.`;
  return `${(s.current ?? 0) + 1}/${s.marks.length} since ${s.against}: ${m.text}`;
}

/**
 * The overlay after a message from the host. The host sends it again after every edit of the
 * sidecar while it is shown: the change in focus stays in focus when it is still there (matched by
 * its text), and `newComparison` says whether this is another comparison (then the status line
 * tells about it) or a refresh of the same one (then the status line is left to the last action).
 */
export function reviewUpdate(prev: ReviewState, m: { readonly against: string | null; readonly marks: readonly ReviewMarkView[] }): { state: ReviewState; newComparison: boolean } {
  const newComparison = prev.against !== m.against;
  const focused = prev.current === null ? undefined : prev.marks[prev.current];
  const at = newComparison || focused === undefined ? -1 : m.marks.findIndex((k) => k.text === focused.text);
  return { state: { against: m.against, marks: m.marks, current: at < 0 ? null : at }, newComparison };
}
