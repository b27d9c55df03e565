import { describe, expect, it } from 'vitest';
import { commandAction, keyAction } from '../../webview/keys';
import { parseLabels } from '../../webview/labels';

const key = (k: string, mods: Partial<{ shiftKey: boolean; ctrlKey: boolean; metaKey: boolean; altKey: boolean }> = {}) =>
  keyAction({ key: k, shiftKey: false, ctrlKey: false, metaKey: false, altKey: false, ...mods });

describe('keyAction', () => {
  it('reaches every panel action from the keyboard', () => {
    const kinds = ['n', 'p', 'm', 'a', 'l', 'z', '0', '+', '-', 'ArrowLeft', 'Escape'].map((k) => key(k)?.kind);
    expect(kinds).toEqual(['nextPeak', 'previousPeak', 'measure', 'accept', 'label', 'zoomToPeak', 'resetZoom', 'zoom', 'zoom', 'pan', 'cancel']);
  });
  it('pans further with Shift and leaves modified keys to VS Code', () => {
    expect(key('ArrowRight')).toEqual({ kind: 'pan', dx: -0.1, dy: 0 });
    expect(key('ArrowRight', { shiftKey: true })).toEqual({ kind: 'pan', dx: -0.4, dy: 0 });
    expect(key('z', { ctrlKey: true })).toBeNull();
    expect(key('s', { metaKey: true })).toBeNull();
    expect(key('q')).toBeNull();
  });
  it('maps host commands onto the same actions', () => {
    expect(commandAction('zoomToPeak')).toEqual({ kind: 'zoomToPeak' });
  });
});

describe('parseLabels', () => {
  it('splits on commas, spaces, semicolons and slashes', () => {
    expect(parseLabels(' H-3, H-4a ')).toEqual(['H-3', 'H-4a']);
    expect(parseLabels('H-3/H-4a')).toEqual(['H-3', 'H-4a']);
    expect(parseLabels('')).toEqual([]);
  });
});

describe('removing a pick', () => {
  it('is on Delete and Backspace', () => {
    expect(key('Delete')).toEqual({ kind: 'removePick' });
    expect(key('Backspace')).toEqual({ kind: 'removePick' });
  });
});
