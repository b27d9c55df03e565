/**
 * Panel actions as sidecar text. Expected texts follow the layout in src/core/sidecar/SCHEMA.md
 * (ppm 4 decimals, Hz 2, a blank line between items, lists sorted by id and atom pair).
 */
import { describe, expect, it } from 'vitest';
import { applyEdits, lineDiffEdits } from '../../src/core/sidecar';
import { writeUndoable, type RecordedEdit, type TextTarget } from '../../src/extension/editHistory';
import { acceptText, labelText, removePickText, type CouplingValues } from '../../src/extension/sidecarActions';

const NAME = 'cosy.jdx.couplet.yaml';
const SHA = 'ab'.repeat(32);
const values: CouplingValues = { jHz: 7.4987, jSdHz: 0.0321, method: 'fit', dimension: 'F2', flags: ['fit_poor'], passiveHz: [], linewidthHz: 1.234 };
const at = (f2Ppm: number, f1Ppm: number, labels: string[], v: CouplingValues | undefined = values) =>
  ({ dataFileName: 'cosy.jdx', sha256: SHA, f2Ppm, f1Ppm, kind: 'cross' as const, labels, ...(v && { values: v }) });

const HEAD = `schema: couplet-sidecar/1
data:
  file: cosy.jdx
  sha256: ${SHA}
`;

const FIRST = `${HEAD}
picks:
  - id: p-4.2000-3.8521
    f2_ppm: 4.2000
    f1_ppm: 3.8521
    label: [H-1, H-2]
    kind: cross

couplings:
  - atoms: [H-1, H-2]
    j_hz: 7.50
    j_sd_hz: 0.03
    method: fit
    dimension: F2
    picks: [p-4.2000-3.8521]
    flags: [fit_poor]
    linewidth_hz: 1.23
`;

describe('acceptText', () => {
  it('creates the sidecar with the pick and its coupling when there is none', () => {
    const r = acceptText(null, NAME, at(4.19996, 3.85213, ['H-1', 'H-2']));
    expect(r).toEqual({ text: FIRST, pickId: 'p-4.2000-3.8521', coupled: true });
  });

  it('treats an empty file as no sidecar (e.g. after undoing its creation)', () => {
    expect(acceptText('\n', NAME, at(4.19996, 3.85213, ['H-1', 'H-2'])).text).toBe(FIRST);
  });

  it('adds a second pick by inserting lines only (nothing else in the file changes)', () => {
    const r = acceptText(FIRST, NAME, at(3.85, 4.2, []));
    expect(r.coupled).toBe(false);
    const edits = lineDiffEdits(FIRST, r.text);
    expect(edits.every((e) => e.length === 0)).toBe(true);
    expect(edits.map((e) => e.text).join('')).toBe(`  - id: p-3.8500-4.2000
    f2_ppm: 3.8500
    f1_ppm: 4.2000
    label: []
    kind: cross

`);
  });

  it('reuses the pick already at the same position (4 decimals) instead of adding another', () => {
    const r = acceptText(FIRST, NAME, at(4.20004, 3.85209, ['H-1', 'H-2'], { ...values, method: 'naive', jHz: 8.1 }));
    expect(r.pickId).toBe('p-4.2000-3.8521');
    expect(r.text.match(/- id:/g)).toHaveLength(1);
    // A different method is a different coupling (SCHEMA.md: pair, method, dimension identify it).
    expect(r.text).toContain('    j_hz: 8.10\n    j_sd_hz: 0.03\n    method: naive\n');
    expect(r.text.match(/- atoms:/g)).toHaveLength(2);
  });

  it('refuses a sidecar with conflict markers and says where', () => {
    const conflicted = FIRST.replace('picks:\n', '<<<<<<< ours\npicks:\n=======\n>>>>>>> theirs\n');
    expect(() => acceptText(conflicted, NAME, at(3.85, 4.2, ['H-2', 'H-1']))).toThrow(/cosy\.jdx\.couplet\.yaml:6: .*conflict/i);
  });
});

describe('labelText', () => {
  const unlabelled = acceptText(FIRST, NAME, at(3.85, 4.2, [])).text;

  it('turns a measurement accepted before labelling into a coupling once the pick has two labels', () => {
    const t = labelText(unlabelled, NAME, 'p-3.8500-4.2000', ['H-2', 'H-1'], { ...values, jHz: 7.61 });
    expect(t).toContain('    label: [H-2, H-1]\n');
    // Same atom pair, method and dimension as the first coupling: the newer value replaces it.
    expect(t).toContain('    j_hz: 7.61\n');
    expect(t).toContain('    picks: [p-3.8500-4.2000]\n');
    expect(t.match(/- atoms:/g)).toHaveLength(1);
  });

  it('moves the couplings citing a pick to its new atom pair', () => {
    const t = labelText(FIRST, NAME, 'p-4.2000-3.8521', ['H-1', 'H-3']);
    expect(t).toContain('  - atoms: [H-1, H-3]\n    j_hz: 7.50\n');
    expect(t).not.toContain('[H-1, H-2]');
  });

  it('keeps the coupling where it is while the pick has fewer than two labels', () => {
    const t = labelText(FIRST, NAME, 'p-4.2000-3.8521', ['H-1']);
    // One label is written as a plain scalar (SCHEMA.md: "one atom label, or a list of up to two").
    expect(t).toContain('    label: H-1\n');
    expect(t).toContain('  - atoms: [H-1, H-2]\n');
  });

  it('names the pick that does not exist', () => {
    expect(() => labelText(FIRST, NAME, 'p-9', ['H-1'])).toThrow(/no pick with id "p-9"/);
  });
});

describe('removePickText', () => {
  it('removes a coupling that rested on the removed pick alone, in the same text change, and names it', () => {
    const r = removePickText(FIRST, NAME, 'p-4.2000-3.8521');
    // No coupling is left behind with `picks: []` (that would read as a manual value).
    expect(r.text).toBe(`${HEAD}\npicks: []\n\ncouplings: []\n`);
    expect(r.removedCouplings).toEqual(['H-1–H-2 (fit F2, J = 7.50 Hz)']);
  });

  it('keeps a coupling that cites another pick too, dropping only the removed id', () => {
    const second = acceptText(FIRST, NAME, at(3.8521, 4.2, ['H-2', 'H-1'])).text;
    const both = second.replace('picks: [p-3.8521-4.2000]', 'picks: [p-3.8521-4.2000, p-4.2000-3.8521]');
    expect(both).toContain('picks: [p-3.8521-4.2000, p-4.2000-3.8521]');
    const r = removePickText(both, NAME, 'p-4.2000-3.8521');
    expect(r.removedCouplings).toEqual([]);
    expect(r.text).toContain('    picks: [p-3.8521-4.2000]\n');
    expect(r.text).toContain('    j_hz: 7.50\n');
  });
});

/** A document that only holds text, as the store does. */
function fakeTarget(initial: string | null): TextTarget & { value: string | null } {
  const t = { value: initial, text: () => t.value, write: async (after: string) => ((t.value = after), true) };
  return t;
}

describe('writeUndoable (undo is writing the text before back)', () => {
  it('undo restores the exact text before, redo the text after', async () => {
    const doc = fakeTarget(FIRST);
    const edits: RecordedEdit[] = [];
    const after = acceptText(FIRST, NAME, at(3.85, 4.2, [])).text;
    expect(await writeUndoable(doc, after, 'Accept', (e) => edits.push(e), () => undefined)).toBe(true);
    expect(edits).toHaveLength(1);
    await edits[0]?.undo();
    expect(doc.value).toBe(FIRST);
    await edits[0]?.redo();
    expect(doc.value).toBe(after);
  });

  it('undoing the creation leaves an empty text, which reads as no sidecar', async () => {
    const doc = fakeTarget(null);
    const edits: RecordedEdit[] = [];
    await writeUndoable(doc, FIRST, 'Accept', (e) => edits.push(e), () => undefined);
    await edits[0]?.undo();
    expect(doc.value).toBe('');
  });

  it('refuses to undo over a change made since (and says so) rather than lose it', async () => {
    const doc = fakeTarget(FIRST);
    const edits: RecordedEdit[] = [];
    const notes: string[] = [];
    await writeUndoable(doc, applyEdits(FIRST, lineDiffEdits(FIRST, FIRST.replace('H-1, H-2]\n    kind', 'H-1, H-5]\n    kind'))), 'Label', (e) => edits.push(e), (m) => notes.push(m));
    const typedByHand = `# checked by hand\n${doc.value ?? ''}`;
    doc.value = typedByHand;
    await edits[0]?.undo();
    expect(doc.value).toBe(typedByHand);
    expect(notes).toEqual(['Cannot undo "Label": the sidecar has changed since. Use undo in its text editor, or edit it there.']);
  });

  it('records nothing when the editor refuses the write', async () => {
    const doc = { text: () => FIRST, write: async () => false };
    const edits: RecordedEdit[] = [];
    expect(await writeUndoable(doc, 'x', 'Accept', (e) => edits.push(e), () => undefined)).toBe(false);
    expect(edits).toHaveLength(0);
  });
});
