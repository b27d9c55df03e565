/** Reading back the panel's saved view state (webview/savedState.ts). */
import { describe, expect, it } from 'vitest';
import { readSavedState } from '../../webview/savedState';

describe('readSavedState', () => {
  const good = { view: { x: [5, 3], y: [5, 3] }, selected: 2, contours: { lowestLevel: 8, levels: 10, spacing: 1.4 }, method: 'naive', dimension: 'F1', shownPeak: 2 };

  it('keeps a state that fits the spectrum', () => {
    expect(readSavedState(good, 4)).toEqual(good);
  });

  it('drops what an older page or another file left behind, field by field', () => {
    expect(readSavedState({ ...good, method: 'lsq', dimension: 'F3', view: { x: [5], y: [5, 3] } }, 4)).toEqual({
      selected: 2, contours: good.contours, shownPeak: 2,
    });
    // The spectrum now has fewer peaks: no selection, and nothing to measure again.
    expect(readSavedState(good, 2)).toEqual({ view: good.view, selected: null, contours: good.contours, method: 'naive', dimension: 'F1' });
    expect(readSavedState({ ...good, shownPeak: 1 }, 4).shownPeak).toBeUndefined();
  });

  it('keeps labels typed but not yet applied, and drops a draft that is not text', () => {
    expect(readSavedState({ labelDraft: 'H-3, H-4a' }, 4).labelDraft).toBe('H-3, H-4a');
    expect(readSavedState({ labelDraft: 3 }, 4).labelDraft).toBeUndefined();
  });

  it('reads nothing from a state that is not an object', () => {
    expect(readSavedState(undefined, 4)).toEqual({});
    expect(readSavedState('x', 4)).toEqual({});
  });
});
