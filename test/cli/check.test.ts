import { createHash } from 'node:crypto';
import { copyFileSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { run } from './helpers';
import { formatSidecar, type Coupling, type Sidecar } from '../../src/core/sidecar';

const samples = resolve(__dirname, '..', '..', 'samples');
const DATA = 'fake cosy bytes\n';
const sha = (s: string | Buffer): string => createHash('sha256').update(s).digest('hex');

const NOTE = [
  '---', 'compound: testol', '---', '', '# Testol', '', '| label | environment |', '|---|---|',
  '| H-3 | CHOH |', '| H-4a | CH2 |', '| H-5 | olefinic |', '',
  '<!-- couplet:si H1 begin -->',
  '¹H NMR (600 MHz, CDCl₃) δ 5.60 (d, J = 15.8 Hz, 1H, H-5),',
  '4.12 (dd, J = 10.2, 0.7 Hz, 1H, H-3).',
  '<!-- couplet:si H1 end -->', '',
].join('\n');

const fit = (atoms: [string, string], jHz: number, jSdHz: number, extra: Partial<Coupling> = {}): Coupling =>
  ({ atoms, jHz, jSdHz, method: 'fit', dimension: 'F2', picks: [], flags: [], ...extra });

function sidecar(extra: Partial<Sidecar> = {}): Sidecar {
  return {
    schema: 'couplet-sidecar/1', data: { file: 'cosy.jdx', sha256: sha(DATA) },
    picks: [{ id: 'p-4.1200-2.3400', f2Ppm: 4.12, f1Ppm: 2.34, label: ['H-3', 'H-4a'], kind: 'cross' }],
    couplings: [fit(['H-3', 'H-4a'], 10.2, 0.1)],
    ...extra,
  };
}

let dirs: string[] = [];
afterEach(() => {
  for (const d of dirs) rmSync(d, { recursive: true, force: true });
  dirs = [];
});

function compound(sidecarText: string, files: Record<string, string> = {}): { dir: string; file: string } {
  const dir = mkdtempSync(join(tmpdir(), 'couplet-check-'));
  dirs.push(dir);
  writeFileSync(join(dir, 'cosy.jdx'), DATA);
  writeFileSync(join(dir, 'testol.md'), NOTE);
  for (const [n, t] of Object.entries(files)) writeFileSync(join(dir, n), t);
  const file = join(dir, 'cosy.jdx.couplet.yaml');
  writeFileSync(file, sidecarText);
  return { dir, file };
}


/** 1-based line of the only line containing `needle` (the seeded problem). */
function lineOf(text: string, needle: string): number {
  const hits = text.split('\n').flatMap((l, i) => (l.includes(needle) ? [i + 1] : []));
  expect(hits, `"${needle}" once`).toHaveLength(1);
  return hits[0] ?? 0;
}

interface Json { problems: { file: string; line: number; severity: string; rule: string; message: string }[]; errors: number; warnings: number }
const json = (target: string): Json => JSON.parse(run('check', target, '--format', 'json').out) as Json;

describe('couplet check', () => {
  it('passes on samples/ (exit 0)', () => {
    const r = run('check', samples);
    expect(r.err).toBe('');
    expect(r.code).toBe(0);
  });

  it('passes on a sample folder given a sidecar with its real hash and the labels of its notes', () => {
    const dir = mkdtempSync(join(tmpdir(), 'couplet-check-sample-'));
    dirs.push(dir);
    for (const f of ['cosy.jdx', 'brisquarene.md', 'brisquarene.mol']) copyFileSync(join(samples, 'brisquarene', f), join(dir, f));
    const s: Sidecar = {
      schema: 'couplet-sidecar/1', data: { file: 'cosy.jdx', sha256: sha(readFileSync(join(dir, 'cosy.jdx'))) },
      picks: [{ id: 'p-7.2100-6.8600', f2Ppm: 7.21, f1Ppm: 6.86, label: ['H-5', 'H-6'], kind: 'cross' }],
      couplings: [fit(['H-5', 'H-6'], 8.52, 0.05), fit(['H-5', 'H-6'], 8.46, 0.04, { method: '1d' })],
    };
    writeFileSync(join(dir, 'cosy.jdx.couplet.yaml'), formatSidecar(s));
    const r = run('check', dir);
    expect(r.out).toMatch(/checked 1 sidecar\(s\) and 1 note\(s\): 0 error\(s\), 0 warning\(s\)/);
    expect(r.code).toBe(0);
  });

  it('stale SI: a region that differs from what couplet report gives is an error at its begin marker; the current line passes', () => {
    const dir = mkdtempSync(join(tmpdir(), 'couplet-check-si-'));
    dirs.push(dir);
    for (const f of ['cosy.jdx', 'brisquarene.md', 'brisquarene.mol']) copyFileSync(join(samples, 'brisquarene', f), join(dir, f));
    const s: Sidecar = {
      schema: 'couplet-sidecar/1', data: { file: 'cosy.jdx', sha256: sha(readFileSync(join(dir, 'cosy.jdx'))) },
      picks: [{ id: 'p-7.2100-6.8600', f2Ppm: 7.21, f1Ppm: 6.86, label: ['H-5', 'H-6'], kind: 'cross' }],
      couplings: [fit(['H-5', 'H-6'], 8.52, 0.05)],
    };
    writeFileSync(join(dir, 'cosy.jdx.couplet.yaml'), formatSidecar(s));
    const note = readFileSync(join(dir, 'brisquarene.md'), 'utf8');
    expect(note, 'the sample note names its solvent (else the rule stays silent)').toMatch(/^solvent: /m);
    const report = run('report', dir, '--format', 'json');
    expect(report.code).toBe(0);
    const current = (JSON.parse(report.out) as { compounds: { si: { line: string } }[] }).compounds[0]?.si.line;
    expect(current, 'report --format json gives the SI line').toBeTypeOf('string');
    expect(current).toContain('8.5 Hz');
    const region = (body: string): string => `${note}\n<!-- couplet:si H1 begin -->\n${body}\n<!-- couplet:si H1 end -->\n`;
    writeFileSync(join(dir, 'brisquarene.md'), region(current ?? ''));
    expect(json(dir).problems).toEqual([]);
    const stale = region((current ?? '').replace('8.5 Hz', '8.6 Hz'));
    writeFileSync(join(dir, 'brisquarene.md'), stale);
    expect(json(dir).problems).toMatchObject([{ file: join(dir, 'brisquarene.md'), rule: 'stale-si', severity: 'error', line: lineOf(stale, 'couplet:si H1 begin') }]);
  });

  it('passes on a clean fixture, one line of summary', () => {
    const { dir } = compound(formatSidecar(sidecar()));
    const r = run('check', dir);
    expect(r.out).toBe('checked 1 sidecar(s) and 1 note(s): 0 error(s), 0 warning(s)\n');
    expect(r.code).toBe(0);
  });

  it('schema: reports a negative sigma at its line, exit 1', () => {
    const text = formatSidecar(sidecar()).replace('j_sd_hz: 0.10', 'j_sd_hz: -0.10');
    const { file } = compound(text);
    const r = run('check', file);
    expect(r.out).toContain(`${file}:${lineOf(text, 'j_sd_hz')}: error: couplings[0].j_sd_hz: must not be negative`);
    expect(r.code).toBe(1);
  });

  it('data hash: reports a changed data file at the sha256 line', () => {
    const { dir, file } = compound(formatSidecar(sidecar()));
    writeFileSync(join(dir, 'cosy.jdx'), DATA + 'reprocessed\n');
    const p = json(dir).problems;
    expect(p.map((x) => [x.rule, x.line])).toEqual([['data-hash', lineOf(readFileSync(file, 'utf8'), 'sha256')]]);
  });

  it('data hash: reports a missing data file at the data.file line', () => {
    const { dir, file } = compound(formatSidecar(sidecar()));
    rmSync(join(dir, 'cosy.jdx'));
    expect(json(dir).problems.map((x) => [x.rule, x.line])).toEqual([['data-hash', lineOf(readFileSync(file, 'utf8'), 'file: cosy.jdx')]]);
  });

  it('labels: reports a pick label the structure notes do not define, at the pick', () => {
    const s = sidecar();
    const text = formatSidecar({ ...s, picks: [...s.picks, { id: 'p-5.6000-4.1200', f2Ppm: 5.6, f1Ppm: 4.12, label: ['H-9', 'H-3'] }] });
    const { dir, file } = compound(text);
    const p = json(dir).problems;
    expect(p).toMatchObject([{ file, rule: 'labels', severity: 'error', line: lineOf(text, 'id: p-5.6000-4.1200') }]);
    expect(p[0]?.message).toContain('H-9');
  });

  it('repeated J: two readings of one pair beyond 3 x combined sigma (the network rule) warn at the second (exit 0, 1 with --strict)', () => {
    const text = formatSidecar(sidecar({ couplings: [fit(['H-3', 'H-4a'], 10.2, 0.1), fit(['H-3', 'H-4a'], 11.0, 0.1, { dimension: 'F1' })] }));
    const { dir, file } = compound(text);
    const p = json(dir).problems;
    // |10.2 - 11.0| = 0.8 > 3 * sqrt(0.1^2 + 0.1^2) = 0.42 (src/core/network AGREE_SIGMAS); the F1 item is the second coupling (sorted F2 before F1).
    const second = text.split('\n').flatMap((l, i) => (l.includes('- atoms:') ? [i + 1] : []))[1];
    expect(p).toMatchObject([{ file, rule: 'repeated-j', severity: 'warning', line: second }]);
    expect(run('check', dir).code).toBe(0);
    expect(run('check', dir, '--strict').code).toBe(1);
  });

  it('repeated J: readings that agree within 3 x combined sigma, and naive values, are not reported', () => {
    const text = formatSidecar(sidecar({ couplings: [
      fit(['H-3', 'H-4a'], 10.2, 0.1), fit(['H-3', 'H-4a'], 10.4, 0.1, { dimension: 'F1' }), fit(['H-3', 'H-4a'], 12.0, 0.3, { method: 'naive' }),
    ] }));
    expect(json(compound(text).dir).problems).toEqual([]);
  });

  it('hidden flags: an unresolved J printed to 0.1 Hz in the SI region is an error at that note line', () => {
    const text = formatSidecar(sidecar({ couplings: [fit(['H-3', 'H-4a'], 10.2, 0.1), fit(['H-3', 'H-5'], 0.68, 0.4, { flags: ['unresolved'] })] }));
    const { dir } = compound(text);
    const p = json(dir).problems;
    expect(p).toMatchObject([{ file: join(dir, 'testol.md'), rule: 'hidden-flags', severity: 'error', line: lineOf(NOTE, 'J = 10.2, 0.7 Hz') }]);
    expect(p[0]?.message).toContain('unresolved');
  });

  it('reports conflict markers and leaves the file as it was', () => {
    const clean = formatSidecar(sidecar());
    const text = clean.replace('  - id: p-4.1200-2.3400\n', '<<<<<<< HEAD\n  - id: p-4.1200-2.3400\n=======\n  - id: p-4.1300-2.3400\n>>>>>>> other\n');
    const { file } = compound(text);
    const r = run('check', file, '--format', 'annotations');
    expect(r.out.split('\n').filter((l) => l !== '')).toEqual([
      `${file}:${lineOf(text, '<<<<<<<')}:1: error: git conflict marker "<<<<<<<": resolve the merge conflict before editing this file`,
      `${file}:${lineOf(text, '=======')}:1: error: git conflict marker "=======": resolve the merge conflict before editing this file`,
      `${file}:${lineOf(text, '>>>>>>>')}:1: error: git conflict marker ">>>>>>>": resolve the merge conflict before editing this file`,
    ]);
    expect(r.code).toBe(1);
    expect(readFileSync(file, 'utf8')).toBe(text);
  });

  it('exits 2 naming the path when the target does not exist or is not a sidecar', () => {
    expect(run('check', 'no/such/dir').code).toBe(2);
    const r = run('check', join(samples, 'brisquarene', 'cosy.jdx'));
    expect(r.code).toBe(2);
    expect(r.err).toContain('not a sidecar');
  });
});

describe('couplet check: the structure note\'s front matter (the readers of couplet report)', () => {
  it('reports a bad karplus ξ and an atom number that is not an H atom at their lines (rule front-matter, exit 1)', () => {
    const dir = mkdtempSync(join(tmpdir(), 'couplet-check-front-'));
    dirs.push(dir);
    for (const f of ['cosy.jdx', '1h.jdx', 'cosy.jdx.couplet.yaml', '1h.jdx.couplet.yaml', 'quellopyranol.mol']) copyFileSync(join(samples, 'quellopyranol', f), join(dir, f));
    const good = readFileSync(join(samples, 'quellopyranol', 'quellopyranol.md'), 'utf8');
    writeFileSync(join(dir, 'quellopyranol.md'), good);
    expect(json(dir).problems).toEqual([]);
    // Atom 3 of the sample molfile is a ring carbon (heavy atoms are numbered by locant, scripts/sampleStructures.ts).
    const bad = good.replace('H-2: 11,', 'H-2: 3,').replace('    orientation: [-1, -1, +1]\n', '    orientation: [-1, -1, 2]\n');
    writeFileSync(join(dir, 'quellopyranol.md'), bad);
    const r = run('check', dir, '--format', 'json');
    expect(r.code).toBe(1);
    const p = (JSON.parse(r.out) as Json).problems;
    expect(p.map((x) => [x.rule, x.line])).toEqual([['front-matter', lineOf(bad, 'atoms: {')], ['front-matter', lineOf(bad, 'orientation: [-1, -1, 2]')]]);
    expect(p[0]?.message).toMatch(/^atoms\.H-2: atom 3 of quellopyranol\.mol is C, not H/);
    expect(p[1]?.message).toMatch(/^karplus\[1\]\.orientation\[2\]: must be \+1 or -1, got 2/);
    rmSync(join(dir, 'quellopyranol.mol'));
    writeFileSync(join(dir, 'quellopyranol.md'), good);
    expect(json(dir).problems.map((x) => x.message)).toEqual(['structure: cannot read quellopyranol.mol beside the note']);
  });
});
