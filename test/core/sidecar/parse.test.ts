import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { isWritable, parseSidecar, type SidecarDiagnostic } from '../../../src/core/sidecar';
import { golden, gitMergeFile, linesWhere } from './helpers';

const NAME = 'demo-cosy.jdx.couplet.yaml';
const canonical = golden('canonical.couplet.yaml');
const codes = (ds: readonly SidecarDiagnostic[]): string[] => ds.map((d) => d.code);
const replaceLine = (text: string, from: string, to: string): string => {
  if (!text.includes(from)) throw new Error(`test setup: "${from}" not in text`);
  return text.replace(from, to);
};
const lineOf = (text: string, needle: string): number => text.slice(0, text.indexOf(needle)).split('\n').length;

describe('parseSidecar: valid files', () => {
  it('reads the canonical golden file (written by hand from SCHEMA.md) without diagnostics', () => {
    const { sidecar, diagnostics, conflicted } = parseSidecar(canonical, NAME);
    expect(diagnostics).toEqual([]);
    expect(conflicted).toBe(false);
    expect(isWritable(diagnostics)).toBe(true);
    expect(sidecar?.data.file).toBe('demo-cosy.jdx');
    expect(sidecar?.picks.map((p) => p.id)).toEqual([
      'p-1.2500-1.2500', 'p-2.3400-4.1200', 'p-2.6100-2.3400', 'p-4.1200-2.3400', 'p-5.0200-3.9800', 'p-10.0100-7.2600']);
    expect(sidecar?.picks[0]?.label).toEqual(['H-10']); // a single label is a one-item list
    expect(sidecar?.picks[4]?.label).toEqual([]);
    expect(sidecar?.picks[2]?.note).toBe('overlaps: solvent satellite');
    const geminal = sidecar?.couplings.find((c) => c.method === 'manual');
    expect(geminal).toMatchObject({ atoms: ['H-4a', 'H-4b'], jHz: -14.2, jSdHz: 0.3, picks: [], flags: ['second-order'] });
    expect(sidecar?.couplings[1]).toMatchObject({ passiveHz: [4.5, 2], linewidthHz: 1.1, dimension: 'F2' });
  });

  it('accepts the data hash when the caller passes SHA-256("abc") (FIPS 180-2 Appendix B.1 test vector)', () => {
    const hex = createHash('sha256').update('abc').digest('hex');
    expect(hex).toBe('ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad');
    expect(parseSidecar(canonical, NAME, { dataSha256: hex }).diagnostics).toEqual([]);
    expect(parseSidecar(canonical, NAME, { dataSha256: hex.toUpperCase() }).diagnostics).toEqual([]);
  });
});

describe('parseSidecar: problems become diagnostics with line and field', () => {
  it('reports a data hash mismatch at the sha256 line, and the file is not writable', () => {
    const hex = createHash('sha256').update('abd').digest('hex');
    const { diagnostics } = parseSidecar(canonical, NAME, { dataSha256: hex });
    expect(diagnostics).toHaveLength(1);
    expect(diagnostics[0]).toMatchObject({ code: 'data-hash-mismatch', line: 4, field: 'data.sha256', severity: 'error' });
    expect(diagnostics[0]?.message).toContain(`${NAME}:4:`);
    expect(isWritable(diagnostics)).toBe(false);
  });

  it('reports each git conflict marker line of a real `git merge-file` conflict; not writable', () => {
    const ours = replaceLine(canonical, 'j_hz: 10.20', 'j_hz: 10.30');
    const theirs = replaceLine(canonical, 'j_hz: 10.20', 'j_hz: 10.40');
    const merged = gitMergeFile(ours, canonical, theirs);
    expect(merged.conflicts).toBe(1);
    const { sidecar, diagnostics, conflicted } = parseSidecar(merged.text, NAME);
    const expectedLines = linesWhere(merged.text, (l) => /^(<<<<<<<|=======|>>>>>>>)/.test(l));
    expect(expectedLines).toHaveLength(3);
    expect(diagnostics.map((d) => d.line)).toEqual(expectedLines);
    expect(new Set(codes(diagnostics))).toEqual(new Set(['conflict-marker']));
    expect(conflicted).toBe(true);
    expect(sidecar).toBeNull();
    expect(isWritable(diagnostics)).toBe(false);
  });

  it('reports hand-placed markers including the diff3 base marker, at their lines', () => {
    const text = 'schema: couplet-sidecar/1\n<<<<<<< ours\na: 1\n||||||| base\na: 0\n=======\na: 2\n>>>>>>> theirs\n';
    const { diagnostics } = parseSidecar(text, NAME);
    expect(diagnostics.map((d) => [d.line, d.column])).toEqual([[2, 1], [4, 1], [6, 1], [8, 1]]);
    expect(diagnostics[0]?.message).toContain(`${NAME}:2:`);
  });

  it('does not take an indented or longer run of = for a marker', () => {
    const text = replaceLine(canonical, 'note: geminal, read from the 1D multiplet', 'note: "x"\n    # =======');
    expect(parseSidecar(text, NAME).conflicted).toBe(false);
  });

  it('reports YAML syntax errors at the offending line (YAML 1.2.2 §6.1 no tabs in indentation, §3.2.1.3 unique keys, §8.2.1 block sequence indentation)', () => {
    const tab = 'schema: couplet-sidecar/1\ndata:\n  file: a.jdx\n\tsha256: x\n';
    const dup = 'schema: couplet-sidecar/1\ndata:\n  file: a.jdx\n  file: b.jdx\n';
    const indent = 'schema: couplet-sidecar/1\npicks:\n  - id: a\n   f2_ppm: 1\n';
    for (const [text, line] of [[tab, 4], [dup, 4], [indent, 4]] as const) {
      const { sidecar, diagnostics } = parseSidecar(text, NAME);
      expect(sidecar).toBeNull();
      expect(diagnostics[0]).toMatchObject({ code: 'yaml-syntax', line, severity: 'error' });
      expect(diagnostics[0]?.message).toMatch(new RegExp(`^${NAME}:${line}: YAML: `));
      expect(isWritable(diagnostics)).toBe(false);
    }
  });

  it('reports an unclosed quote at the line where it was opened (YAML 1.2.2 §7.3.1 double-quoted, §7.3.2 single-quoted)', () => {
    const dq = 'schema: couplet-sidecar/1\ndata:\n  file: "a \\" b.jdx\npicks: []\ncouplings: []\n';
    const sq = "schema: couplet-sidecar/1\ndata:\n  file: 'it''s.jdx\npicks: []\ncouplings: []\n";
    for (const text of [dq, sq]) {
      const { diagnostics } = parseSidecar(text, NAME);
      expect(diagnostics[0]).toMatchObject({ code: 'yaml-syntax', line: 3, column: 9 });
      expect(diagnostics[0]?.message).toMatch(/Missing closing .quote/);
    }
  });

  it('refuses an unknown schema and a future one, at line 1, with no sidecar', () => {
    const unknown = parseSidecar(replaceLine(canonical, 'couplet-sidecar/1', 'other-tool/1'), NAME);
    expect(unknown.sidecar).toBeNull();
    expect(unknown.diagnostics).toMatchObject([{ code: 'unknown-schema', line: 1, field: 'schema' }]);
    const future = parseSidecar(replaceLine(canonical, 'couplet-sidecar/1', 'couplet-sidecar/2'), NAME);
    expect(future.diagnostics).toMatchObject([{ code: 'future-schema', line: 1 }]);
    expect(isWritable(future.diagnostics)).toBe(false);
    expect(parseSidecar(canonical.replace(/^schema:.*\n/, ''), NAME).diagnostics).toMatchObject([{ code: 'missing-field', field: 'schema' }]);
  });

  it('names the field path and line of mistyped, invalid, missing and unknown fields', () => {
    let text = replaceLine(canonical, 'f2_ppm: 2.6100', 'f2_ppm: "2.6100"');
    text = replaceLine(text, '    j_hz: 2.10\n', '');
    text = replaceLine(text, 'kind: diagonal', 'kind: diagonal\n    colour: red');
    text = replaceLine(text, 'method: manual', 'method: guessed');
    const { diagnostics } = parseSidecar(text, NAME);
    const byField = new Map(diagnostics.map((d) => [d.field, d]));
    expect(byField.get('picks[2].f2_ppm')).toMatchObject({ code: 'wrong-type', line: lineOf(text, 'f2_ppm: "2.6100"') });
    expect(byField.get('picks[0].colour')).toMatchObject({ code: 'unknown-field', line: lineOf(text, 'colour: red') });
    expect(byField.get('couplings[0].j_hz')).toMatchObject({ code: 'missing-field', line: lineOf(text, 'atoms: [H-1, H-2]') });
    expect(byField.get('couplings[4].method')).toMatchObject({ code: 'invalid-value', line: lineOf(text, 'method: guessed') });
    expect(byField.get('couplings[4].method')?.message).toContain('expected one of fit, naive, manual, 1d');
    expect(byField.get('picks[2].f2_ppm')?.message).toMatch(/^demo-cosy\.jdx\.couplet\.yaml:\d+: picks\[2\]\.f2_ppm: expected a number, found the text "2\.6100"$/);
    expect(diagnostics).toHaveLength(4);
    expect(isWritable(diagnostics)).toBe(false);
  });

  it('reports a duplicate pick id at the second pick and a duplicate coupling key', () => {
    const text = replaceLine(canonical, 'id: p-2.6100-2.3400', 'id: p-2.3400-4.1200');
    const { diagnostics } = parseSidecar(text, NAME);
    const dup = diagnostics.find((d) => d.code === 'duplicate-pick-id');
    expect(dup).toMatchObject({ field: 'picks[2].id', line: lineOf(text, 'f2_ppm: 2.6100') - 1 });
    const twice = replaceLine(canonical, 'dimension: F1', 'dimension: F2');
    expect(codes(parseSidecar(twice, NAME).diagnostics)).toContain('duplicate-coupling');
  });

  it('warns (still writable) about couplings citing unknown picks, and notes unsorted lists', () => {
    const text = replaceLine(canonical, 'picks: [p-10.0100-7.2600]', 'picks: [p-10.0100-7.2700]');
    const { diagnostics } = parseSidecar(text, NAME);
    expect(diagnostics).toMatchObject([{ code: 'unknown-pick', severity: 'warning', field: 'couplings[0].picks', line: lineOf(text, 'picks: [p-10.0100-7.2700]') }]);
    expect(isWritable(diagnostics)).toBe(true);
    const unsorted = replaceLine(canonical, 'id: p-2.6100-2.3400', 'id: p-9.6100-2.3400');
    expect(parseSidecar(unsorted, NAME).diagnostics).toMatchObject([{ code: 'unsorted', severity: 'info', field: 'picks[3]' }]);
  });

  it('rejects a root that is not a mapping, bad sha256 and out-of-range values', () => {
    expect(parseSidecar('- a\n- b\n', NAME).diagnostics).toMatchObject([{ code: 'wrong-type', line: 1 }]);
    const bad = replaceLine(canonical, 'j_sd_hz: 0.15', 'j_sd_hz: -0.15');
    expect(parseSidecar(bad, NAME).diagnostics).toMatchObject([{ code: 'invalid-value', field: 'couplings[1].j_sd_hz' }]);
    const sha = replaceLine(canonical, 'sha256: ba78', 'sha256: BA78');
    expect(parseSidecar(sha, NAME).diagnostics).toMatchObject([{ code: 'invalid-value', field: 'data.sha256', line: 4 }]);
    const three = replaceLine(canonical, 'label: [H-1, H-2]', 'label: [H-1, H-2, H-3]');
    expect(parseSidecar(three, NAME).diagnostics).toMatchObject([{ code: 'invalid-value', field: 'picks[5].label' }]);
  });

  it('never throws on arbitrary text (empty file, binary-looking bytes, a bare scalar)', () => {
    for (const text of ['', '\u0000\u0001', '42', 'schema: [', '---\na: 1\n---\nb: 2\n']) {
      const r = parseSidecar(text, NAME);
      expect(isWritable(r.diagnostics)).toBe(false);
      expect(r.diagnostics.every((d) => d.line >= 1 && d.message.startsWith(`${NAME}:`))).toBe(true);
    }
  });
});
