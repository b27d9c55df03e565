import { describe, expect, it } from 'vitest';
import type { ReviewMarkView } from '../../src/protocol';
import { keyAction } from '../../webview/keys';
import { changeStatus, MARK_SHAPE, NO_REVIEW, reviewUpdate, stepChange, type ReviewState } from '../../webview/review';

const marks: ReviewMarkView[] = [
  { kind: 'added', text: 'pick p-3 added', f2Ppm: 5, f1Ppm: 3 },
  { kind: 'moved', text: 'pick p-1 moved', f2Ppm: 4.13, f1Ppm: 2.34, fromF2Ppm: 4.12, fromF1Ppm: 2.34 },
  { kind: 're-measured', text: 'J(H-3,H-4a) re-measured' },
];
const state = (current: number | null): ReviewState => ({ against: 'HEAD', marks, current });
const key = (k: string, shiftKey = false): ReturnType<typeof keyAction> => keyAction({ key: k, shiftKey, ctrlKey: false, metaKey: false, altKey: false });

describe('compare overlay view model', () => {
  it('steps forward and back through the changes, wrapping at both ends', () => {
    expect(stepChange(state(null), 1)).toBe(0);
    expect(stepChange(state(null), -1)).toBe(2);
    expect(stepChange(state(2), 1)).toBe(0);
    expect(stepChange(state(0), -1)).toBe(2);
    expect(stepChange(NO_REVIEW, 1)).toBeNull();
  });

  it('says which change is in focus and since which revision', () => {
    expect(changeStatus(state(1))).toBe('2/3 since HEAD: pick p-1 moved');
    expect(changeStatus(state(null))).toBe('3 change(s) since HEAD: C / Shift+C step through them.');
    expect(changeStatus({ against: 'main', marks: [], current: null })).toBe('No changes to the picks since main.');
    expect(changeStatus(NO_REVIEW)).toBe('');
  });

  it('draws every kind of change with its own shape', () => {
    const shapes = Object.values(MARK_SHAPE);
    expect(new Set(shapes).size).toBe(shapes.length);
  });

  it('maps C and Shift+C to the next and previous change', () => {
    expect(key('c')).toEqual({ kind: 'nextChange' });
    expect(key('C', true)).toEqual({ kind: 'previousChange' });
  });
});

describe('reviewUpdate (the host refreshes the overlay after each edit)', () => {
  it('keeps the change in focus when it is still there, and says the status need not change', () => {
    const added = { kind: 'added', text: 'pick p-9 added', f2Ppm: 6, f1Ppm: 2 } as const;
    const u = reviewUpdate(state(1), { against: 'HEAD', marks: [added, ...marks] });
    expect(u.state.current).toBe(2);
    expect(u.state.marks).toHaveLength(4);
    expect(u.newComparison).toBe(false);
  });

  it('drops the focus when its change is gone, and starts afresh for another revision', () => {
    expect(reviewUpdate(state(1), { against: 'HEAD', marks: [marks[0]!] }).state.current).toBeNull();
    const other = reviewUpdate(state(1), { against: 'main', marks });
    expect(other.state.current).toBeNull();
    expect(other.newComparison).toBe(true);
    expect(reviewUpdate(NO_REVIEW, { against: 'HEAD', marks }).newComparison).toBe(true);
  });
});
