import { cpSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { runCli } from '../../src/cli/program';
import { expectSnapshot } from './helpers';
import { buildReports, formatReports } from '../../src/cli/report';
import { toFixedDecimal } from '../../src/core/sidecar';

const samples = resolve(__dirname, '..', '..', 'samples');

describe('couplet report: dihedral estimates for the pairs quellopyranol.md requests', () => {
  const [report] = buildReports(join(samples, 'quellopyranol'));
  if (!report) throw new Error('no report for quellopyranol');
  const md = formatReports([report], 'md');
  const section = md.slice(md.indexOf('### Dihedral estimates (Karplus)'));

  it('lists the requested pairs in the note\'s order, with the adopted J ± σ the J table shows (what the data say)', () => {
    expect(report.karplus.map((e) => e.pair.join('/'))).toEqual(['H-2/H-3a', 'H-3a/H-4', 'H-4/H-5a', 'H-5a/H-6']);
    const adopted = report.network.pairs.find((p) => p.atoms[0] === 'H-3a' && p.atoms[1] === 'H-4')?.adopted;
    expect(adopted).toBeDefined();
    expect(section).toContain(`**H-3a/H-4**: J = ${toFixedDecimal(adopted!.jHz, 2)} ± ${toFixedDecimal(adopted!.sdHz, 2)} Hz`);
    expect(section).toContain('**H-4/H-5a**: J not measured');
    expect(section).toMatch(/^Sources: Haasnoot, de Leeuw, Altona, Tetrahedron 36 \(1980\) 2783/m);
  });

  it('pins the markdown section (snapshot)', () => expectSnapshot('report-karplus', 'md', section, 'Karplus section'));

  it('pins the LaTeX block (snapshot); it is plain ASCII', () => {
    const tex = formatReports([report], 'tex');
    const block = tex.slice(tex.indexOf('\\paragraph{Dihedral estimates (Karplus).}'));
    expect(block).not.toMatch(/[^\x20-\x7e\n]/);
    expectSnapshot('report-karplus', 'tex', block, 'Karplus section');
  });

  it('pins the json karplus array (snapshot): stable snake_case keys', () => {
    const j = JSON.parse(formatReports([report], 'json')) as { compounds: { karplus: Record<string, unknown>[] }[] };
    const k = j.compounds[0]!.karplus;
    expect(k.map((e) => e.relation)).toContain('Karplus 1963');
    expectSnapshot('report-karplus', 'json', JSON.stringify(k, null, 2) + '\n', 'Karplus section');
  });

  it('writes nothing about Karplus when the note asks for no pair', () => {
    const none = { ...report, karplus: [] };
    expect(formatReports([none], 'md')).not.toContain('Dihedral');
    expect(formatReports([none], 'tex')).not.toContain('Dihedral');
    expect(JSON.parse(formatReports([none], 'json')).compounds[0]).not.toHaveProperty('karplus');
  });
});

describe('couplet report refuses a mistyped karplus request', () => {
  const dir = mkdtempSync(join(tmpdir(), 'couplet-karplus-'));
  afterAll(() => rmSync(dir, { recursive: true, force: true }));

  it('exit 2, naming the note, the line and the field', () => {
    cpSync(join(samples, 'quellopyranol'), join(dir, 'q'), { recursive: true });
    const note = join(dir, 'q', 'quellopyranol.md');
    const text = readFileSync(note, 'utf8');
    const bad = text.replace(/(pair: \[H-3a, H-4\]\n\s+substituents: \[[^\]]*\][^\n]*\n\s+orientation: \[)-1/, '$13');
    expect(bad).not.toBe(text);
    writeFileSync(note, bad);
    const line = bad.split('\n').findIndex((l) => /orientation: \[3,/.test(l)) + 1;
    let err = '';
    const code = runCli(['report', join(dir, 'q')], { out: () => undefined, err: (t) => (err += t) });
    expect(code).toBe(2);
    expect(err).toContain(`quellopyranol.md:${line}: karplus[1].orientation[0]: must be +1 or -1, got 3`);
  });
});
