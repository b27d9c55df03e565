import { cpSync, mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { expectSnapshot, run } from './helpers';

const repo = resolve(__dirname, '..', '..');
const samples = join(repo, 'samples');


describe('couplet report on the samples (every invented compound has a note, spectra and sidecars)', () => {
  const md = run('report', samples);

  it('writes one SI line per compound, from its note\'s front matter (compound, solvent)', () => {
    expect(md.code).toBe(0);
    for (const id of ['brisquarene', 'quellopyranol', 'vantrelenol']) expect(md.out).toContain(`## ${id}\n\n¹H NMR (`);
    expect(md.out.match(/¹H NMR \(\d+ MHz, CDCl₃\) δ /g)).toHaveLength(3);
  });

  it('pins the markdown report (snapshot)', () => expectSnapshot('report-samples', 'md', md.out, 'report', ' (re-generate the samples\' sidecars with npm run samples:sidecars)'));

  it('pins the LaTeX lines (snapshot): \\textit{J}, \\,Hz, $^{1}$H', () => {
    const tex = run('report', samples, '--format', 'tex');
    expect(tex.code).toBe(0);
    expect(tex.out).toContain('$^{1}$H NMR (500\\,MHz, CDCl$_{3}$) $\\delta$ ');
    expectSnapshot('report-samples', 'tex', tex.out, 'report', ' (re-generate the samples\' sidecars with npm run samples:sidecars)');
  });

  it('json carries the SI line and the numbers behind it; csv one row per measurement', () => {
    const j = JSON.parse(run('report', join(samples, 'brisquarene'), '--format', 'json').out) as { compounds: { compound: string; si: { line: string } }[] };
    expect(j.compounds.map((c) => c.compound)).toEqual(['brisquarene']);
    expect(md.out).toContain(j.compounds[0]!.si.line);
    const csv = run('report', join(samples, 'brisquarene'), '--format', 'csv').out.split('\r\n');
    expect(csv[0]).toBe('compound,atom_a,atom_b,j_hz,j_sd_hz,method,dimension,flags,source,picks,adopted_j_hz,adopted_j_sd_hz,consistent');
    expect(csv[1]).toMatch(/^brisquarene,H-/);
  });

  it('nmredata: one SD record per compound with the NMREDATA tags (layout checked in test/cli/nmredata.test.ts)', () => {
    const sd = run('report', samples, '--format', 'nmredata').out;
    expect(sd.match(/^\$\$\$\$$/gm)).toHaveLength(3);
    expect(sd).toContain('>  <NMREDATA_1D_1H>\nLarmor=600.13\\\n');
  });
});

describe('couplet report refuses what would put wrong numbers in a manuscript', () => {
  const dir = mkdtempSync(join(tmpdir(), 'couplet-report-'));
  afterAll(() => rmSync(dir, { recursive: true, force: true }));

  it('a sidecar with conflict markers: exit 2, names the file and line', () => {
    cpSync(join(samples, 'brisquarene'), join(dir, 'b'), { recursive: true });
    const sc = join(dir, 'b', 'cosy.jdx.couplet.yaml');
    const text = readFileSync(sc, 'utf8');
    writeFileSync(sc, text.replace('couplings:', '<<<<<<< ours\n=======\n>>>>>>> theirs\ncouplings:'));
    const r = run('report', join(dir, 'b'));
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/cosy\.jdx\.couplet\.yaml: cannot report from this sidecar/);
    expect(r.err).toMatch(/conflict/i);
  });

  it('a folder without sidecars: exit 2', () => {
    mkdirSync(join(dir, 'empty'));
    expect(run('report', join(dir, 'empty')).code).toBe(2);
  });
});
