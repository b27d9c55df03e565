import { describe, expect, it } from 'vitest';
import { parse } from 'yaml';
import { formatSidecar, newSidecar, parseSidecar, type Sidecar } from '../../../src/core/sidecar';
import { expectGolden, golden } from './helpers';

const SHA_ABC = 'ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad'; // FIPS 180-2 B.1
const read = (text: string): Sidecar => {
  const { sidecar, diagnostics } = parseSidecar(text, 'test.couplet.yaml');
  if (sidecar === null) throw new Error(diagnostics.map((d) => d.message).join('\n'));
  return sidecar;
};

/** The canonical golden file's content, built in code, in scrambled order and with unrounded values. */
function demo(): Sidecar {
  const s = newSidecar('data/demo-cosy.jdx', SHA_ABC.toUpperCase());
  s.picks.push(
    { id: 'p-10.0100-7.2600', f2Ppm: 10.01, f1Ppm: 7.26, label: ['H-1', 'H-2'], kind: 'cross' },
    { id: 'p-4.1200-2.3400', f2Ppm: 4.12004, f1Ppm: 2.33996, label: ['H-3', 'H-4a'], kind: 'cross' },
    { id: 'p-1.2500-1.2500', f2Ppm: 1.25, f1Ppm: 1.25, label: ['H-10'], kind: 'diagonal' },
    { id: 'p-5.0200-3.9800', f2Ppm: 5.02, f1Ppm: 3.98, label: [] },
    { id: 'p-2.6100-2.3400', f2Ppm: 2.61, f1Ppm: 2.34, label: ['H-4b', 'H-4a'], kind: 'cross', note: 'overlaps: solvent satellite' },
    { id: 'p-2.3400-4.1200', f2Ppm: 2.34, f1Ppm: 4.12, label: ['H-4a', 'H-3'], kind: 'cross' },
  );
  s.couplings.push(
    { atoms: ['H-4b', 'H-4a'], jHz: -14.2, jSdHz: 0.3, method: 'manual', dimension: 'F2', picks: [], flags: ['second-order'], note: 'geminal, read from the 1D multiplet' },
    { atoms: ['H-4a', 'H-3'], jHz: 10.6, jSdHz: 0.5, method: 'naive', dimension: 'F2', picks: ['p-4.1200-2.3400'], flags: [] },
    { atoms: ['H-3', 'H-4a'], jHz: 11, jSdHz: 1.995, method: 'fit', dimension: 'F1', picks: ['p-2.3400-4.1200'], flags: ['resolution-limited'] },
    { atoms: ['H-3', 'H-4a'], jHz: 10.199, jSdHz: 0.15, method: 'fit', dimension: 'F2', picks: ['p-2.3400-4.1200', 'p-4.1200-2.3400'], flags: [], passiveHz: [4.5, 2.004], linewidthHz: 1.1 },
    { atoms: ['H-2', 'H-1'], jHz: 2.1, jSdHz: 0.4, method: 'naive', dimension: 'F2', picks: ['p-10.0100-7.2600'], flags: ['unresolved', 'resolution-limited', 'unresolved'] },
  );
  return s;
}

describe('formatSidecar: canonical form', () => {
  it('writes the canonical golden file (hand-written from SCHEMA.md): sorted, fixed decimals, block style', () => {
    expectGolden('canonical.couplet.yaml', formatSidecar(demo()));
  });

  it('round-trips the golden file: format(parse(text)) === text', () => {
    const text = golden('canonical.couplet.yaml');
    expect(formatSidecar(read(text))).toBe(text);
    expect(formatSidecar(read(text), text)).toBe(text);
  });

  it('is idempotent: format(parse(format(x))) === format(x)', () => {
    const once = formatSidecar(demo());
    expect(formatSidecar(read(once))).toBe(once);
    const empty = formatSidecar(newSidecar('a.jdx', SHA_ABC));
    expect(empty).toBe(`schema: couplet-sidecar/1\ndata:\n  file: a.jdx\n  sha256: ${SHA_ABC}\n\npicks: []\n\ncouplings: []\n`);
    expect(formatSidecar(read(empty))).toBe(empty);
  });

  it('quotes text only where a plain scalar would read back differently (YAML 1.2.2 §7.3.3 plain scalars, §10.3.2 core schema tags)', () => {
    const awkward = ['true', '1.5', 'null', 'a: b', '# x', 'x, y', ' lead', 'two\nlines', '[H-3]', '-', "it's", 'é-α', '~',
      'NULL', 'Yes', 'off', '1:20', '.inf', '0x1A', '1e3'];
    const s = newSidecar('a.jdx', SHA_ABC);
    awkward.forEach((t, i) => s.picks.push({ id: `p-${i + 1}`, f2Ppm: 1, label: [t, 'H-1'], note: t }));
    const text = formatSidecar(s);
    const back = read(text);
    expect(back.picks.map((p) => p.note)).toEqual(awkward);
    expect(back.picks.map((p) => p.label[0])).toEqual(awkward);
    // Cross-check with the yaml package's own reading, independent of our validator.
    const raw = parse(text) as { picks: { note: unknown }[] };
    expect(raw.picks.map((p) => p.note)).toEqual(awkward);
    expect(text).toContain("note: it's\n"); // plain where safe
    expect(text).toContain('note: "true"\n');
    // YAML 1.1 readers take yes/off as booleans and 1:20 as a sexagesimal number (YAML 1.1 bool and int types).
    expect(text).toContain('note: "Yes"\n');
    expect(text).toContain('note: "1:20"\n');
  });
});

describe('formatSidecar refuses data it cannot write as valid schema v1, naming item and field', () => {
  const base = (): Sidecar => newSidecar('a.jdx', SHA_ABC);
  it('rejects non-finite numbers', () => {
    const s = base();
    s.picks.push({ id: 'p-1', f2Ppm: Number.NaN, label: [] });
    expect(() => formatSidecar(s)).toThrow('cannot write the sidecar: pick p-1: f2_ppm is NaN');
    const c = base();
    c.couplings.push({ atoms: ['H-1', 'H-2'], jHz: 1, jSdHz: 0.1, method: 'fit', dimension: 'F2', picks: [], flags: [], passiveHz: [1, Infinity] });
    expect(() => formatSidecar(c)).toThrow('coupling H-1/H-2 fit F2: passive_hz[1] is Infinity');
  });
  it('rejects duplicate ids, bad ids, empty labels and negative standard deviations', () => {
    const s = base();
    s.picks.push({ id: 'p-1', f2Ppm: 1, label: [] }, { id: 'p-1', f2Ppm: 2, label: [] });
    expect(() => formatSidecar(s)).toThrow(/picks\[1\]\.id: id "p-1" is already used/);
    const t = base();
    t.picks.push({ id: 'has space', f2Ppm: 1, label: [''] });
    expect(() => formatSidecar(t)).toThrow(/picks\[0\]\.id: .*not a valid id.*picks\[0\]\.label\[0\]: expected atom labels/);
    const u = base();
    u.couplings.push({ atoms: ['H-1', 'H-2'], jHz: 1, jSdHz: -0.1, method: 'fit', dimension: 'F2', picks: [], flags: [] });
    expect(() => formatSidecar(u)).toThrow(/couplings\[0\]\.j_sd_hz: must not be negative/);
  });
});

describe('formatSidecar with the previous text: people\'s comments survive', () => {
  const commented = golden('commented.couplet.yaml');

  it('returns the commented golden file unchanged when the data did not change', () => {
    expect(formatSidecar(read(commented), commented)).toBe(commented);
  });

  it('keeps every comment and the exact text of unchanged items when items are added, changed and removed', () => {
    const s = read(commented);
    s.picks = s.picks.filter((p) => p.id !== 'p-1.2500-1.2500'); // removes it with its own comment
    const moved = s.picks.find((p) => p.id === 'p-2.3400-4.1200');
    if (moved === undefined) throw new Error('test setup');
    moved.f2Ppm = 2.3512;
    s.picks.push({ id: 'p-3.0000-1.5000', f2Ppm: 3, f1Ppm: 1.5, label: ['H-5'] });
    const out = formatSidecar(s, commented);
    const comments = commented.split('\n').flatMap((l) => (l.includes('#') ? [l.slice(l.indexOf('#'))] : []));
    const lost = comments.filter((c) => !out.includes(c));
    expect(lost).toEqual(['# diagonal reference for the methyl']);
    expect(out).toContain('    f2_ppm: 2.3512   # centre by eye, broad\n');
    expect(out).toContain('    label: [H-3, H-4a]  # assignment from the HSQC\n');
    expect(read(out)).toEqual(read(formatSidecar(s)));
  });

  it('keeps CRLF line ends of the previous text', () => {
    const crlf = commented.replace(/\n/g, '\r\n');
    const s = read(crlf);
    s.couplings[0] = { ...s.couplings[0]!, jHz: 10.25 };
    const out = formatSidecar(s, crlf);
    expect(out.split('\r\n').length).toBe(commented.split('\n').length);
    expect(out).not.toMatch(/[^\r]\n/);
    expect(out).toContain('j_hz: 10.25   # axial-axial\r\n');
  });

  it('falls back to the canonical layout for a layout it does not understand, moving all comments to the top', () => {
    const flow = `# note on top\nschema: couplet-sidecar/1\ndata: {file: a.jdx, sha256: ${SHA_ABC}}\n`
      + 'picks: [{id: p-1, f2_ppm: 1, label: H-1}]  # flow style\n# between\ncouplings: []\n';
    const out = formatSidecar(read(flow), flow);
    expect(out.startsWith('# note on top\n# flow style\n# between\nschema: couplet-sidecar/1\n')).toBe(true);
    expect(out).toContain('  - id: p-1\n    f2_ppm: 1.0000\n');
  });

  it('refuses to write over a file with errors, naming the problem', () => {
    const conflicted = '<<<<<<< ours\nschema: couplet-sidecar/1\n';
    expect(() => formatSidecar(newSidecar('a.jdx', SHA_ABC), conflicted)).toThrow(/^cannot rewrite .*previous text:1: git conflict marker/);
  });
});
