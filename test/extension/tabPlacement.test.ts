import { describe, expect, it } from 'vitest';
import { shouldMoveBeside, type TabFacts } from '../../src/extension/tabPlacement';

const note: TabFacts = { kind: 'note', uri: 'file:///s/b/brisquarene.md', column: 1 };
const spectrum: TabFacts = { kind: 'spectrum', uri: 'file:///s/b/cosy.jdx', column: 1 };

describe('shouldMoveBeside', () => {
  it('moves a spectrum that opened over the note it was opened from', () => {
    expect(shouldMoveBeside(note, spectrum, true)).toBe(true);
  });

  it('leaves it where it is when the note was in another group (already beside), or is gone (a replaced preview)', () => {
    expect(shouldMoveBeside(note, { ...spectrum, column: 2 }, true)).toBe(false);
    expect(shouldMoveBeside(note, spectrum, false)).toBe(false);
  });

  it('leaves it when the active tab before was not a note (another editor, or the panel itself being dragged)', () => {
    expect(shouldMoveBeside({ kind: 'other', uri: '', column: 1 }, spectrum, true)).toBe(false);
    expect(shouldMoveBeside({ ...spectrum, column: 2 }, spectrum, true)).toBe(false);
    expect(shouldMoveBeside(null, spectrum, true)).toBe(false);
  });

  it('only ever moves our spectrum editor', () => {
    expect(shouldMoveBeside(note, { kind: 'other', uri: 'file:///x.txt', column: 1 }, true)).toBe(false);
  });
});
