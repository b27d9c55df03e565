import { describe, expect, it } from 'vitest';
import {
  addPick, applyEdits, formatSidecar, isWritable, lineDiffEdits, movePick, newSidecar, parseSidecar, pickIdFor,
  relabelPick, removeCoupling, removePick, setCoupling, setDataHash, sidecarNameFor, type Coupling, type Sidecar,
  type TextEdit,
} from '../../../src/core/sidecar';
import { changedOldLines, gitDiffHunks, gitMergeFile, golden } from './helpers';

const NAME = 'demo-cosy.jdx.couplet.yaml';
const commented = golden('commented.couplet.yaml');
const canonical = golden('canonical.couplet.yaml');

const read = (text: string): Sidecar => {
  const { sidecar, diagnostics } = parseSidecar(text, NAME);
  if (sidecar === null || !isWritable(diagnostics)) throw new Error(diagnostics.map((d) => d.message).join('\n'));
  return sidecar;
};
/** 1-based line of the first line containing `needle`. */
const lineOf = (text: string, needle: string): number => {
  const at = text.indexOf(needle);
  if (at < 0) throw new Error(`test setup: "${needle}" not found`);
  return text.slice(0, at).split('\n').length;
};
const comments = (text: string): string[] => text.split('\n').flatMap((l) => (l.includes('#') ? [l.slice(l.indexOf('#'))] : []));
const apply = (text: string, edits: TextEdit[]): string => {
  const out = applyEdits(text, edits);
  expect(parseSidecar(out, NAME).diagnostics.filter((d) => d.severity !== 'info')).toEqual([]);
  return out;
};

const remeasured: Coupling = {
  atoms: ['H-4a', 'H-3'], jHz: 10.254, jSdHz: 0.12, method: 'fit', dimension: 'F2',
  picks: ['p-2.3400-4.1200', 'p-4.1200-2.3400'], flags: [], passiveHz: [4.5, 2], linewidthHz: 1.1,
};

describe('edit actions change only the lines of the item they touch (checked with git diff -U0)', () => {
  it('movePick changes exactly the two position lines of that pick and keeps their comments', () => {
    const out = apply(commented, movePick(commented, 'p-2.3400-4.1200', { f2Ppm: 2.3512, f1Ppm: 4.1188 }, NAME));
    const f2Line = lineOf(commented, 'f2_ppm: 2.3400');
    expect(changedOldLines(gitDiffHunks(commented, out))).toEqual([f2Line, f2Line + 1]);
    expect(out).toContain('    f2_ppm: 2.3512   # centre by eye, broad\n    f1_ppm: 4.1188\n');
    expect(read(out).picks.find((p) => p.id === 'p-2.3400-4.1200')).toMatchObject({ f2Ppm: 2.3512, f1Ppm: 4.1188 });
    expect(comments(out)).toEqual(comments(commented));
  });

  it('relabelPick changes only the label line, keeping its end-of-line comment', () => {
    const out = apply(commented, relabelPick(commented, 'p-4.1200-2.3400', ['H-3', 'H-4b'], NAME));
    expect(changedOldLines(gitDiffHunks(commented, out))).toEqual([lineOf(commented, 'label: [H-3, H-4a]')]);
    expect(out).toContain('    label: [H-3, H-4b]  # assignment from the HSQC\n');
    expect(comments(out)).toEqual(comments(commented));
  });

  it('addPick only inserts lines, at the sorted position between its neighbours', () => {
    const { edits, id } = addPick(commented, { f2Ppm: 3, f1Ppm: 1.5, label: ['H-5'], kind: 'cross' }, NAME);
    expect(id).toBe('p-3.0000-1.5000');
    const out = apply(commented, edits);
    const hunks = gitDiffHunks(commented, out);
    expect(hunks).toHaveLength(1);
    expect(hunks[0]?.oldCount).toBe(0);
    const after = hunks[0]?.oldStart ?? 0; // git: insertion after this old line
    expect(after).toBeGreaterThanOrEqual(lineOf(commented, '# symmetric partner'));
    expect(after).toBeLessThan(lineOf(commented, '- id: p-4.1200-2.3400'));
    expect(read(out).picks.map((p) => p.id)).toEqual(['p-1.2500-1.2500', 'p-2.3400-4.1200', id, 'p-4.1200-2.3400', 'p-5.0200-3.9800']);
    expect(comments(out)).toEqual(comments(commented));
  });

  it('removePick deletes its lines (with the comment above it) and its id from couplings citing it', () => {
    const out = apply(commented, removePick(commented, 'p-4.1200-2.3400', NAME));
    const first = lineOf(commented, '- id: p-4.1200-2.3400');
    const citing = lineOf(commented, 'picks: [p-2.3400-4.1200, p-4.1200-2.3400]');
    const changed = changedOldLines(gitDiffHunks(commented, out));
    const itemLines = changed.filter((l) => l !== citing);
    expect(changed).toContain(citing);
    // Its 5 lines plus one blank separator: the one before or the one after (equal lines, git may pick either).
    expect(itemLines).toHaveLength(6);
    expect(Math.min(...itemLines)).toBeGreaterThanOrEqual(first - 1);
    expect(Math.max(...itemLines)).toBeLessThanOrEqual(first + 5);
    expect(read(out).couplings[0]?.picks).toEqual(['p-2.3400-4.1200']);
    expect(comments(out)).toEqual(comments(commented).filter((c) => c !== '# assignment from the HSQC'));
  });

  it('setCoupling re-measures in place: only the changed values, comments kept', () => {
    const out = apply(commented, setCoupling(commented, remeasured, NAME));
    const jLine = lineOf(commented, 'j_hz: 10.20');
    expect(changedOldLines(gitDiffHunks(commented, out))).toEqual([jLine, jLine + 1]);
    expect(out).toContain('    j_hz: 10.25   # axial-axial\n    j_sd_hz: 0.12\n');
  });

  it('setCoupling adds a new coupling by inserting lines only, sorted by atom pair', () => {
    const naive: Coupling = { ...remeasured, atoms: ['H-1', 'H-2'], jHz: 2.1, method: 'naive', picks: [], flags: ['unresolved'] };
    const out = apply(commented, setCoupling(commented, naive, NAME));
    const hunks = gitDiffHunks(commented, out);
    expect(hunks.map((h) => h.oldCount)).toEqual([0]);
    expect(read(out).couplings.map((c) => c.atoms)).toEqual([['H-1', 'H-2'], ['H-3', 'H-4a']]);
    expect(comments(out)).toEqual(comments(commented));
  });

  it('removeCoupling only deletes that coupling\'s lines', () => {
    const out = apply(canonical, removeCoupling(canonical, { atoms: ['H-4a', 'H-3'], method: 'naive', dimension: 'F2' }, NAME));
    const hunks = gitDiffHunks(canonical, out);
    expect(hunks.every((h) => h.newCount === 0)).toBe(true);
    expect(changedOldLines(hunks)).toHaveLength(8); // 7 field lines + 1 blank separator
    expect(read(out).couplings).toHaveLength(4);
  });

  it('setDataHash rewrites only the sha256 line', () => {
    const hex = 'f'.repeat(64);
    const out = apply(commented, setDataHash(commented, hex.toUpperCase(), NAME));
    expect(changedOldLines(gitDiffHunks(commented, out))).toEqual([lineOf(commented, 'sha256:')]);
    expect(read(out).data.sha256).toBe(hex);
  });

  it('builds a whole sidecar from empty through the actions, ending in canonical form', () => {
    let text = formatSidecar(newSidecar('demo-cosy.jdx', 'ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad'));
    for (const p of read(canonical).picks) text = applyEdits(text, addPick(text, p, NAME).edits);
    for (const c of read(canonical).couplings) text = applyEdits(text, setCoupling(text, c, NAME));
    expect(text).toBe(canonical);
  });
});

describe('every action keeps the comments people wrote (all but those of an item it removes)', () => {
  const actions: [string, (t: string) => TextEdit[], string[]][] = [
    ['addPick', (t) => addPick(t, { f2Ppm: 6, f1Ppm: 1, label: ['H-9'] }, NAME).edits, []],
    ['movePick', (t) => movePick(t, 'p-1.2500-1.2500', { f2Ppm: 1.26, f1Ppm: 1.26 }, NAME), []],
    ['relabelPick', (t) => relabelPick(t, 'p-5.0200-3.9800', ['H-7'], NAME), []],
    ['removePick', (t) => removePick(t, 'p-1.2500-1.2500', NAME), ['# diagonal reference for the methyl']],
    ['setCoupling', (t) => setCoupling(t, { ...remeasured, jSdHz: 0.2, flags: ['second-order'] }, NAME), []],
    ['removeCoupling', (t) => removeCoupling(t, { atoms: ['H-3', 'H-4a'], method: 'fit', dimension: 'F2' }, NAME),
      ['# the key coupling for the ring conformation', '# axial-axial']],
    ['setDataHash', (t) => setDataHash(t, '0'.repeat(64), NAME), []],
  ];
  for (const [name, action, goes] of actions) {
    it(`${name}`, () => {
      const out = apply(commented, action(commented));
      expect(comments(out)).toEqual(comments(commented).filter((c) => !goes.includes(c)));
    });
  }
});

describe('edits on hand-written, non-canonical layouts keep that layout', () => {
  const sha = 'a'.repeat(64);
  const hand = `schema: couplet-sidecar/1\ndata:\n  file: a.jdx\n  sha256: ${sha}\npicks:   # by id\n`
    + '- id: p-1\n  f2_ppm: 1.5   # hmm\n  label: "H-1"  # \'quoted # not a comment\'\n'
    + '- id: p-3\n  f2_ppm: 3\n  label: [H-3]\n'
    + '-\n  id: p-5\n  f2_ppm: 5\n  label: H-5\n'
    + 'couplings: [] # none yet\n';

  it('moves a pick written with a lone dash, touching only its position line', () => {
    const out = apply(hand, movePick(hand, 'p-5', { f2Ppm: 5.25 }, NAME));
    expect(changedOldLines(gitDiffHunks(hand, out))).toEqual([lineOf(hand, 'f2_ppm: 5')]);
    expect(out).toContain('-\n  id: p-5\n  f2_ppm: 5.2500\n');
  });

  it('inserts into a compact list at column 0 without blank lines, in the same style', () => {
    const { edits } = addPick(hand, { f2Ppm: 2, label: ['H-2'] }, NAME);
    const out = apply(hand, edits);
    expect(out).toContain("not a comment'\n- id: p-2.0000\n  f2_ppm: 2.0000\n  label: H-2\n- id: p-3\n");
    expect(gitDiffHunks(hand, out).map((h) => [h.oldCount, h.newCount])).toEqual([[0, 3]]);
  });

  it('keeps the comments of a value written over several lines when that value changes', () => {
    const multi = hand.replace('  label: [H-3]\n', '  label:   # F2 atom first\n    - H-3  # from the HSQC\n    # second atom unknown\n');
    const out = apply(multi, relabelPick(multi, 'p-3', ['H-3', 'H-4'], NAME));
    expect(comments(out).sort()).toEqual(comments(multi).sort()); // all kept; the moved one now sits above
    // The comment line after the list is the item's closing comment and stays after it.
    expect(out).toContain('  # from the HSQC\n  label: [H-3, H-4]   # F2 atom first\n    # second atom unknown\n');
  });

  it('keeps end-of-line comments (also after quoted text holding #) and the key-line comment when a list stops being empty', () => {
    let out = apply(hand, movePick(hand, 'p-1', { f2Ppm: 1.25 }, NAME));
    expect(out).toContain('  f2_ppm: 1.2500   # hmm\n  label: "H-1"  # \'quoted # not a comment\'\n');
    out = apply(out, setCoupling(out, { ...remeasured, atoms: ['H-1', 'H-3'], picks: ['p-1', 'p-3'] }, NAME));
    expect(out).toContain('couplings: # none yet\n  - atoms: [H-1, H-3]\n');
    out = apply(out, removeCoupling(out, { atoms: ['H-1', 'H-3'], method: 'fit', dimension: 'F2' }, NAME));
    expect(out).toContain('couplings: [] # none yet\n');
  });
});

describe('two people editing the same base merge with `git merge-file` without conflict', () => {
  it('merges two picks added at different sorted positions', () => {
    const ours = applyEdits(canonical, addPick(canonical, { f2Ppm: 3.1, f1Ppm: 1.9, label: ['H-6', 'H-7'] }, NAME).edits);
    const theirs = applyEdits(canonical, addPick(canonical, { f2Ppm: 6.5, f1Ppm: 5.2, label: ['H-8'] }, NAME).edits);
    const merged = gitMergeFile(ours, canonical, theirs);
    expect(merged.conflicts).toBe(0);
    expect(read(merged.text).picks.map((p) => p.id)).toContain('p-3.1000-1.9000');
    expect(read(merged.text).picks.map((p) => p.id)).toContain('p-6.5000-5.2000');
    expect(merged.text).toBe(formatSidecar(read(merged.text))); // still canonical
  });

  it('merges a pick added by one person with a coupling re-measured and a pick moved by the other', () => {
    const ours = applyEdits(canonical, addPick(canonical, { f2Ppm: 3.1, f1Ppm: 1.9, label: ['H-6', 'H-7'] }, NAME).edits);
    let theirs = applyEdits(canonical, setCoupling(canonical, { ...remeasured, passiveHz: [4.5, 2.0] }, NAME));
    theirs = applyEdits(theirs, movePick(theirs, 'p-10.0100-7.2600', { f2Ppm: 10.02, f1Ppm: 7.25 }, NAME));
    const merged = gitMergeFile(ours, canonical, theirs);
    expect(merged.conflicts).toBe(0);
    const s = read(merged.text);
    expect(s.picks).toHaveLength(7);
    expect(s.couplings[1]?.jHz).toBe(10.25);
  });

  it('merges a move and a relabel of the same pick (different lines of one item)', () => {
    const ours = applyEdits(canonical, movePick(canonical, 'p-4.1200-2.3400', { f2Ppm: 4.13, f1Ppm: 2.34 }, NAME));
    const theirs = applyEdits(canonical, relabelPick(canonical, 'p-4.1200-2.3400', ['H-3', 'H-4b'], NAME));
    const merged = gitMergeFile(ours, canonical, theirs);
    expect(merged.conflicts).toBe(0);
    expect(read(merged.text).picks.find((p) => p.id === 'p-4.1200-2.3400')).toMatchObject({ f2Ppm: 4.13, label: ['H-3', 'H-4b'] });
  });

  it('merges two couplings added for different atom pairs', () => {
    const c = (a: string, b: string): Coupling => ({ ...remeasured, atoms: [a, b], method: 'manual', picks: [] });
    const ours = applyEdits(canonical, setCoupling(canonical, c('H-2', 'H-3'), NAME));
    const theirs = applyEdits(canonical, setCoupling(canonical, c('H-5', 'H-6'), NAME));
    const merged = gitMergeFile(ours, canonical, theirs);
    expect(merged.conflicts).toBe(0);
    expect(read(merged.text).couplings).toHaveLength(7);
  });

  it('still conflicts (and is then flagged) when both add at the same sorted position: the limit of the design', () => {
    const ours = applyEdits(canonical, addPick(canonical, { f2Ppm: 3.1, f1Ppm: 1.9, label: [] }, NAME).edits);
    const theirs = applyEdits(canonical, addPick(canonical, { f2Ppm: 3.2, f1Ppm: 1.9, label: [] }, NAME).edits);
    const merged = gitMergeFile(ours, canonical, theirs);
    expect(merged.conflicts).toBeGreaterThan(0);
    expect(parseSidecar(merged.text, NAME).conflicted).toBe(true);
  });
});

describe('edit plumbing', () => {
  it('lineDiffEdits + applyEdits reproduce the new text (many line-level changes)', () => {
    const a = canonical;
    const b = canonical.replace(/j_sd_hz: (\d)/g, 'j_sd_hz: 9').replace('schema:', '# top\nschema:').concat('# end\n');
    expect(applyEdits(a, lineDiffEdits(a, b))).toBe(b);
    expect(applyEdits(b, lineDiffEdits(b, a))).toBe(a);
    expect(lineDiffEdits(a, a)).toEqual([]);
    expect(applyEdits('x', lineDiffEdits('x', 'x\n'))).toBe('x\n');
  });

  it('applyEdits refuses overlapping and out-of-range edits, saying where', () => {
    expect(() => applyEdits('abcdef', [{ offset: 1, length: 3, text: '' }, { offset: 2, length: 1, text: 'x' }])).toThrow(/overlaps/);
    expect(() => applyEdits('abc', [{ offset: 2, length: 5, text: '' }])).toThrow(/offset 2.*outside/);
    expect(applyEdits('abc', [{ offset: 3, length: 0, text: 'd' }, { offset: 0, length: 1, text: 'A' }])).toBe('Abcd');
  });

  it('refuses to edit a conflicted or broken file, naming file and line', () => {
    const conflicted = gitMergeFile(
      canonical.replace('j_hz: 2.10', 'j_hz: 2.20'), canonical, canonical.replace('j_hz: 2.10', 'j_hz: 2.30')).text;
    expect(() => movePick(conflicted, 'p-1.2500-1.2500', { f2Ppm: 1, f1Ppm: 1 }, NAME)).toThrow(new RegExp(`not editing ${NAME.replace(/\./g, '\\.')}: ${NAME.replace(/\./g, '\\.')}:\\d+: git conflict marker`));
    expect(() => relabelPick(canonical, 'p-9', ['H-1'], NAME)).toThrow(`${NAME}: no pick with id "p-9"`);
    expect(() => removeCoupling(canonical, { atoms: ['H-1', 'H-9'], method: 'fit', dimension: 'F2' }, NAME)).toThrow(/no fit F2 coupling between H-1 and H-9/);
    expect(() => addPick(canonical, { id: 'p-1.2500-1.2500', f2Ppm: 1, label: [] }, NAME)).toThrow(/already exists/);
  });

  it('gives new picks ids from their position, made unique with a suffix; names sidecars after the data file', () => {
    const s = read(canonical);
    expect(pickIdFor(s, 4.12, 2.34)).toBe('p-4.1200-2.3400-2');
    expect(pickIdFor(s, 7.004449)).toBe('p-7.0044');
    expect(sidecarNameFor('cosy.jdx')).toBe('cosy.jdx.couplet.yaml'); // the example in design.md
    expect(sidecarNameFor('spectra/cosy.jdx')).toBe('spectra/cosy.jdx.couplet.yaml');
    expect(() => sidecarNameFor('spectra/')).toThrow(/not a data file name/);
    expect(() => newSidecar('cosy.jdx', 'xyz')).toThrow(/not a SHA-256/);
  });
});
