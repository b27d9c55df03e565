/** Hot exit: which backed-up sidecar text is put back into the document (src/extension/backupText.ts). */
import { describe, expect, it } from 'vitest';
import { decodeBackup, encodeBackup, textToRestore } from '../../src/extension/backupText';

describe('textToRestore', () => {
  it('puts the unsaved text back when the document lost it', () => {
    expect(textToRestore('picks:\n  - id: p-1\n', 'picks: []\n')).toBe('picks:\n  - id: p-1\n');
    expect(textToRestore('picks:\n  - id: p-1\n', null)).toBe('picks:\n  - id: p-1\n');
  });

  it('leaves a document alone that already holds the text (VS Code restored it itself)', () => {
    expect(textToRestore('picks: []\n', 'picks: []\n')).toBeNull();
    expect(textToRestore('', null)).toBeNull();
  });

  it('never empties a sidecar with a blank backup (taken while there was no sidecar yet)', () => {
    expect(textToRestore('', 'schema: couplet-sidecar/1\npicks: []\n')).toBeNull();
    expect(textToRestore('  \n', 'schema: couplet-sidecar/1\n')).toBeNull();
  });
});

describe('encodeBackup / decodeBackup', () => {
  const text = 'schema: couplet-sidecar/1\npicks:\n  - id: p-1\n';

  it('reads back exactly what was written', () => {
    expect(decodeBackup(encodeBackup(text))).toBe(text);
    expect(decodeBackup(encodeBackup(''))).toBe('');
  });

  it('refuses a torn backup (the write cut short), which would otherwise bring back a sidecar missing its last picks', () => {
    const whole = encodeBackup(text);
    expect(decodeBackup(whole.slice(0, whole.length - 12))).toBeNull();
    expect(decodeBackup(whole.replace('p-1', 'p-2'))).toBeNull();
  });

  it('reads a backup without the check line as it is (written before the check existed)', () => {
    expect(decodeBackup(text)).toBe(text);
  });
});
