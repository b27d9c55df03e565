import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { run } from './helpers';
import type { MultipletAnalysisJson } from '../../src/cli/measure1D';

const sample = (name: string, file: string): string => resolve(__dirname, '..', '..', 'samples', name, file);


interface Truth { system: { couplings: { a: string; b: string; jHz: number }[] } }
const truth = JSON.parse(readFileSync(sample('quellopyranol', 'truth.json'), 'utf8')) as Truth;
/** |J| of the simulated couplings of one proton, largest first (the simulation's own parameters, first order). */
const truthJ = (label: string): number[] =>
  truth.system.couplings.filter((c) => c.a === label || c.b === label).map((c) => Math.abs(c.jHz)).sort((x, y) => y - x);

describe('couplet measure on a 1D spectrum: the multiplet analysis of a region', () => {
  it('--from/--to on H-3b of the quellopyranol sample gives the four simulated J within 0.15 Hz (first-order dddd, binomial lines)', () => {
    const r = run('measure', sample('quellopyranol', '1h.jdx'), '--from', '2.01', '--to', '1.95', '--json');
    expect(r.err).toBe('');
    expect(r.code).toBe(0);
    const m = JSON.parse(r.out) as MultipletAnalysisJson;
    expect(m.from_ppm).toBe(2.01);
    expect(m.to_ppm).toBe(1.95);
    expect(m.multiplicity).toBe('dddd');
    const want = truthJ('H-3b'); // 12.4, 4.6, 2.1, 1.1
    expect(m.couplings.map((c) => c.j_hz)).toHaveLength(want.length);
    m.couplings.forEach((c, i) => expect(Math.abs(c.j_hz - (want[i] ?? 0))).toBeLessThan(0.15));
  });

  it('--f2 picks the automatic multiplet there (the same region the report uses), ends in either order mean the same', () => {
    const at = JSON.parse(run('measure', sample('quellopyranol', '1h.jdx'), '--f2', '1.98', '--json').out) as MultipletAnalysisJson;
    expect(at.from_ppm).toBeGreaterThan(1.98);
    expect(at.to_ppm).toBeLessThan(1.98);
    const a = run('measure', sample('quellopyranol', '1h.jdx'), '--from', '3.86', '--to', '3.78', '--json').out;
    const b = run('measure', sample('quellopyranol', '1h.jdx'), '--from', '3.78', '--to', '3.86', '--json').out;
    expect(a).toBe(b);
  });

  it('text output ends with the second-order caveat (no partner shifts in a bare region)', () => {
    const r = run('measure', sample('quellopyranol', '1h.jdx'), '--f2', '1.17');
    expect(r.code).toBe(0);
    // H-7 (the CH3 at 1.17 ppm) is a d of its one simulated coupling (truth.json).
    const m = / d +(\d+\.\d\d) ± 0\.\d\d /.exec(r.out);
    expect(m, r.out).not.toBeNull();
    expect(Math.abs(Number(m![1]) - (truthJ('H-7')[0] ?? 0))).toBeLessThan(0.1);
    expect(r.out).toContain('Second order is judged here from roofing alone');
  });

  it('--f2 in an empty stretch analyses no far-away multiplet: exit 1 and says why (the 0.1 ppm snap of the panel and of 2D --f2/--f1)', () => {
    const r = run('measure', sample('quellopyranol', '1h.jdx'), '--f2', '9.5', '--json');
    expect(r.code).toBe(1);
    expect(r.out).toBe('');
    expect(r.err).toContain('1h.jdx: no multiplet above the threshold within 0.1 ppm of 9.5 ppm');
  });

  it('bad regions are usage errors (exit 2) that say what is wrong', () => {
    const half = run('measure', sample('quellopyranol', '1h.jdx'), '--from', '3.86');
    expect(half.code).toBe(2);
    expect(half.err).toContain('a 1D region needs both --from PPM and --to PPM');
    const none = run('measure', sample('quellopyranol', '1h.jdx'));
    expect(none.code).toBe(2);
    expect(none.err).toContain('measure on a 1D spectrum needs --from PPM --to PPM, --f2 PPM, or --all');
    const same = run('measure', sample('quellopyranol', '1h.jdx'), '--from', '3.8', '--to', '3.8');
    expect(same.code).toBe(2);
    expect(same.err).toMatch(/1h\.jdx: multiplet region 3\.8\.\.3\.8 ppm must be two different finite shifts/);
  });
});
