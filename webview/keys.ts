/**
 * Keyboard map of the plot: every action has a key. Pure (takes the fields of a KeyboardEvent),
 * so the mapping is tested without a browser. Host commands (`command` messages) reach the same
 * actions through `commandAction`.
 */
import type { CommandMessage } from '../src/protocol';

export type Action =
  | { readonly kind: 'nextPeak' | 'previousPeak' | 'measure' | 'accept' | 'label' | 'zoomToPeak' | 'resetZoom' | 'cancel' | 'removePick' }
  /** Step through the changes since another revision (the compare overlay). */
  | { readonly kind: 'nextChange' | 'previousChange' }
  | { readonly kind: 'pan'; readonly dx: number; readonly dy: number }
  | { readonly kind: 'zoom'; readonly factor: number };

export interface KeyLike {
  readonly key: string;
  readonly shiftKey: boolean;
  readonly ctrlKey: boolean;
  readonly metaKey: boolean;
  readonly altKey: boolean;
}

/** Fraction of the visible span one arrow press pans (Shift: a larger step). */
export const PAN_STEP = 0.1;
export const ZOOM_STEP = 1.5;

export function keyAction(e: KeyLike): Action | null {
  if (e.ctrlKey || e.metaKey || e.altKey) return null; // leave editor shortcuts to VS Code
  const step = e.shiftKey ? PAN_STEP * 4 : PAN_STEP;
  switch (e.key) {
    case 'ArrowLeft': return { kind: 'pan', dx: step, dy: 0 };
    case 'ArrowRight': return { kind: 'pan', dx: -step, dy: 0 };
    case 'ArrowUp': return { kind: 'pan', dx: 0, dy: step };
    case 'ArrowDown': return { kind: 'pan', dx: 0, dy: -step };
    case '+': case '=': return { kind: 'zoom', factor: ZOOM_STEP };
    case '-': case '_': return { kind: 'zoom', factor: 1 / ZOOM_STEP };
    case 'n': case 'N': case ']': return { kind: 'nextPeak' };
    case 'p': case 'P': case '[': return { kind: 'previousPeak' };
    case 'm': case 'M': case 'Enter': return { kind: 'measure' };
    case 'a': case 'A': return { kind: 'accept' };
    case 'l': case 'L': return { kind: 'label' };
    case 'z': case 'Z': return { kind: 'zoomToPeak' };
    case '0': case 'Home': return { kind: 'resetZoom' };
    case 'Escape': return { kind: 'cancel' };
    case 'Delete': case 'Backspace': return { kind: 'removePick' };
    case 'c': return { kind: 'nextChange' };
    case 'C': return { kind: 'previousChange' };
    default: return null;
  }
}

export function commandAction(c: CommandMessage['command']): Action {
  return { kind: c };
}
