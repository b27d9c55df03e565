import { describe, expect, it } from 'vitest';
import { formatSidecar, newSidecar, type Sidecar } from '../../../src/core/sidecar';
import { readFrontMatter } from '../../../src/core/notes/frontMatter';
import { hoverText } from '../../../src/extension/notes/hoverText';
import { labelCompletions, labelPrefixStart } from '../../../src/extension/notes/labelCompletion';
import { buildLabelIndex, shiftOf } from '../../../src/extension/notes/labelIndex';
import { noteProblems } from '../../../src/extension/notes/noteDiagnostics';
import { readStructureRef } from '../../../src/core/structure/structureRef';

const HASH = 'ab'.repeat(32);

function cosy(): string {
  const s: Sidecar = {
    ...newSidecar('cosy.jdx', HASH),
    picks: [
      { id: 'p-4.1200-2.3400', f2Ppm: 4.12, f1Ppm: 2.34, label: ['H-3', 'H-4a'], kind: 'cross' },
      { id: 'p-2.3400-4.1200', f2Ppm: 2.34, f1Ppm: 4.12, label: ['H-4a', 'H-3'], kind: 'cross' },
      { id: 'p-7.2600-7.2600', f2Ppm: 7.26, f1Ppm: 7.26, label: ['H-6'], kind: 'diagonal' },
    ],
    couplings: [
      { atoms: ['H-3', 'H-4a'], jHz: 10.2, jSdHz: 0.15, method: 'fit', dimension: 'F2', picks: ['p-4.1200-2.3400'], flags: [] },
      { atoms: ['H-3', 'H-5'], jHz: 4.5, jSdHz: 0.3, method: 'fit', dimension: 'F2', picks: [], flags: ['unresolved'] },
    ],
  };
  return formatSidecar(s);
}

function oneD(): string {
  return formatSidecar({ ...newSidecar('1h.jdx', HASH), picks: [{ id: 'p-4.1180', f2Ppm: 4.118, label: ['H-3'], kind: 'multiplet' }] });
}

describe('buildLabelIndex', () => {
  it('gives the F2 atom of a cross pick the F2 shift and the F1 atom the F1 shift', () => {
    const idx = buildLabelIndex([{ fileName: 'cosy.jdx.couplet.yaml', text: cosy() }]);
    expect(idx.labels).toEqual(['H-3', 'H-4a', 'H-5', 'H-6']);
    const h4a = idx.get('H-4a');
    // The sidecar writer sorts picks by id, so p-2.34... comes first.
    expect(h4a?.shifts.map((s) => [s.ppm, s.axis, s.pickId])).toEqual([[2.34, 'F2', 'p-2.3400-4.1200'], [2.34, 'F1', 'p-4.1200-2.3400']]);
    expect(idx.get('H-6')?.shifts).toHaveLength(1); // a diagonal pick counts once
    expect(idx.has1D).toBe(false);
  });

  it('lists each coupling under both atoms, with its partner', () => {
    const idx = buildLabelIndex([{ fileName: 'cosy.jdx.couplet.yaml', text: cosy() }]);
    expect(idx.get('H-3')?.couplings.map((c) => [c.partner, c.jHz])).toEqual([['H-4a', 10.2], ['H-5', 4.5]]);
    expect(idx.get('H-5')?.couplings.map((c) => c.partner)).toEqual(['H-3']);
  });

  it('prefers the 1D multiplet centre for the shift (arithmetic mean otherwise)', () => {
    const idx = buildLabelIndex([{ fileName: 'cosy.jdx.couplet.yaml', text: cosy() }, { fileName: '1h.jdx.couplet.yaml', text: oneD() }]);
    const h3 = idx.get('H-3');
    expect(h3 && shiftOf(h3)?.ppm).toBe(4.118);
    expect(idx.has1D).toBe(true);
    const only = buildLabelIndex([{ fileName: 'c', text: cosy() }]).get('H-4a');
    expect(only && shiftOf(only)?.ppm).toBeCloseTo(2.34, 12);
  });

  it('names an unreadable sidecar instead of throwing, and skips its labels', () => {
    const idx = buildLabelIndex([{ fileName: 'bad.couplet.yaml', text: 'schema: [' }]);
    expect(idx.labels).toEqual([]);
    expect(idx.unreadable).toHaveLength(1);
    expect(idx.unreadable[0]).toContain('bad.couplet.yaml');
  });
});

describe('hoverText', () => {
  it('shows the shift, the multiplicity, J largest first with sigma, method, flags and source', () => {
    const idx = buildLabelIndex([{ fileName: 'cosy.jdx.couplet.yaml', text: cosy() }]);
    const h3 = idx.get('H-3');
    if (!h3) throw new Error('H-3 missing');
    expect(hoverText(h3, { jDecimals: 1, multiplicity: 'dd' })).toBe([
      '**H-3** — δ 4.12 ppm, dd',
      '',
      'Picked at 4.1200 (F1, cosy.jdx.couplet.yaml `p-2.3400-4.1200`); 4.1200 (F2, cosy.jdx.couplet.yaml `p-4.1200-2.3400`)',
      '',
      '| partner | J (Hz) | σ (Hz) | method | flags | from |',
      '|---|---:|---:|---|---|---|',
      '| H-4a | 10.2 | 0.2 | fit F2 | — | cosy.jdx.couplet.yaml `p-4.1200-2.3400` |',
      '| H-5 | 4.5 | 0.3 | fit F2 | unresolved | cosy.jdx.couplet.yaml (no pick) |',
    ].join('\n'));
  });

  it('says when nothing was measured for a picked label', () => {
    const h6 = buildLabelIndex([{ fileName: 'c.yaml', text: cosy() }]).get('H-6');
    if (!h6) throw new Error('H-6 missing');
    expect(hoverText(h6, { jDecimals: 2 })).toContain('No coupling measured yet.');
  });
});

describe('noteProblems', () => {
  const note = '---\ncompound: demo\n---\nH-3 couples to H-4a; H-7 is the methoxy. H-7 again, H-9.\n';

  it('flags each unassigned label once, at its first mention, as information while no 1D is picked', () => {
    const idx = buildLabelIndex([{ fileName: 'cosy.jdx.couplet.yaml', text: cosy() }]);
    const p = noteProblems(note, readFrontMatter(note), idx);
    expect(p.map((x) => [note.slice(x.offset, x.offset + x.length), x.severity])).toEqual([['H-7', 'info'], ['H-9', 'info']]);
    expect(p[0]?.message).toBe("H-7 is not assigned: no pick or coupling in this folder's sidecars names it (mentioned 2 times)");
  });

  it('warns once a 1D spectrum has picks, and says when there are no sidecars at all', () => {
    const with1D = buildLabelIndex([{ fileName: 'c', text: cosy() }, { fileName: 'h', text: oneD() }]);
    expect(noteProblems(note, readFrontMatter(note), with1D).every((x) => x.severity === 'warning')).toBe(true);
    const none = noteProblems(note, readFrontMatter(note), buildLabelIndex([]));
    expect(none.map((x) => x.message)[0]).toBe('H-3 is not assigned: no spectrum of this compound has a sidecar yet');
  });

  it('shows a structure reference problem (structure:/atoms:) as an error over its whole line', () => {
    const bad = '---\ncompound: demo\nstructure: demo.mol\natoms: { H-3: x }\n---\nH-3.\n';
    const p = noteProblems(bad, readFrontMatter(bad), buildLabelIndex([{ fileName: 'c', text: cosy() }]), [], [], readStructureRef(bad).problems);
    const s = p.filter((x) => x.code === 'structure');
    expect(s.map((x) => [bad.slice(x.offset, x.offset + x.length), x.severity, x.message])).toEqual([
      ['atoms: { H-3: x }', 'error', 'atoms.H-3: expected an atom number (1, 2, ...) or a list of them'],
    ]);
  });

  it('leaves a note without a compound id alone', () => {
    expect(noteProblems('H-9 only\n', readFrontMatter('H-9 only\n'), buildLabelIndex([]))).toEqual([]);
  });
});

describe('label completion', () => {
  it('finds the label being typed only where a label may start', () => {
    expect(labelPrefixStart('see H-')).toBe(4);
    expect(labelPrefixStart('see H-1')).toBe(4);
    expect(labelPrefixStart('see H')).toBe(4);
    expect(labelPrefixStart('see CH-')).toBeNull();
    expect(labelPrefixStart('see H-3-')).toBeNull();
  });

  it('offers sidecar and note labels in natural order with what the sidecars know', () => {
    const idx = buildLabelIndex([{ fileName: 'cosy.jdx.couplet.yaml', text: cosy() }]);
    const items = labelCompletions(idx, ['H-10', 'H-3']);
    expect(items.map((i) => i.label)).toEqual(['H-3', 'H-4a', 'H-5', 'H-6', 'H-10']);
    expect(items[0]?.detail).toBe('δ 4.12 · 2 couplings · cosy.jdx.couplet.yaml');
    expect(items[4]?.detail).toBe('in the notes only');
    expect(items.map((i) => i.sortText)).toEqual(['0000', '0001', '0002', '0003', '0004']);
  });
});

describe('noteProblems: inconsistent J', () => {
  it('warns at the first mention of the pair, with the network\'s message', () => {
    const note = '---\ncompound: demo\n---\nH-3 and H-4a.\n';
    const idx = buildLabelIndex([{ fileName: 'c', text: cosy() }]);
    const p = noteProblems(note, readFrontMatter(note), idx, [{ atoms: ['H-4a', 'H-9'], message: 'H-4a–H-9: 7.1 and 9.0 Hz disagree' }]);
    expect(p.map((x) => [x.code, note.slice(x.offset, x.offset + x.length), x.severity])).toEqual([['inconsistent-j', 'H-4a', 'warning']]);
  });
});
