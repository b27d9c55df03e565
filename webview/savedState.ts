/**
 * What survives the panel being hidden (getState/setState instead of retainContextWhenHidden), and
 * reading it back. The state comes from an earlier load of the page, perhaps an older version of
 * it or another data file under the same name: each field is checked and dropped when it does not
 * fit, rather than sending the host a request it must refuse (a method it does not know, a peak
 * the spectrum does not have). Pure, tested in Node.
 */
import type { ContourSettings } from '../src/protocol';
import type { View } from './scales';

export interface SavedState {
  readonly view?: View;
  readonly selected?: number | null;
  readonly contours?: ContourSettings;
  readonly method?: 'fit' | 'naive';
  readonly dimension?: 'F2' | 'F1';
  /** The peak whose measurement was shown: measured again (the host has it cached) when the panel comes back. */
  readonly shownPeak?: number;
  /** Atom labels typed in the label field and not yet applied. */
  readonly labelDraft?: string;
}

type Obj = Record<string, unknown>;
const isObj = (v: unknown): v is Obj => typeof v === 'object' && v !== null && !Array.isArray(v);
const isPair = (v: unknown): v is [number, number] => Array.isArray(v) && v.length === 2 && v.every((x) => typeof x === 'number' && Number.isFinite(x));
const isIndex = (v: unknown, count: number): v is number => typeof v === 'number' && Number.isInteger(v) && v >= 0 && v < count;

/** The usable part of a saved state for a spectrum with `peakCount` peaks. */
export function readSavedState(raw: unknown, peakCount: number): SavedState {
  if (!isObj(raw)) return {};
  const v = raw.view;
  const c = raw.contours;
  const selected = isIndex(raw.selected, peakCount) ? raw.selected : null;
  return {
    ...(isObj(v) && isPair(v.x) && isPair(v.y) && { view: { x: v.x, y: v.y } }),
    selected,
    // Ranges are checked by usableContours (levels.ts); here only the shape.
    ...(isObj(c) && typeof c.lowestLevel === 'number' && typeof c.levels === 'number' && typeof c.spacing === 'number'
      && { contours: { lowestLevel: c.lowestLevel, levels: c.levels, spacing: c.spacing } }),
    ...((raw.method === 'fit' || raw.method === 'naive') && { method: raw.method }),
    ...((raw.dimension === 'F2' || raw.dimension === 'F1') && { dimension: raw.dimension }),
    ...(selected !== null && raw.shownPeak === selected && { shownPeak: selected }),
    ...(typeof raw.labelDraft === 'string' && raw.labelDraft !== '' && { labelDraft: raw.labelDraft }),
  };
}
