import { existsSync, readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { run } from './helpers';

const repo = resolve(__dirname, '..', '..');
const checks = resolve(repo, '..', 'shared', 'checks');
const indep = resolve(checks, 'jcamp2d', 'indep_dqfcosy_sqz.jdx');


interface TruthAxis { n: number; first_hz: number; last_hz: number; first_ppm: number; last_ppm: number }
interface Truth { observe_mhz: number; axes: { f1: TruthAxis; f2: TruthAxis }; cross_peaks: { f1_ppm: number; f2_ppm: number; j_active_hz: number }[] }

describe.runIf(existsSync(indep))('couplet on the independently written 2D file (../shared/checks/jcamp2d)', () => {
  const truth = JSON.parse(readFileSync(indep.replace(/\.jdx$/, '.truth.json'), 'utf8')) as Truth;

  it('info --json gives the axes in its truth file, slowest dimension first (design.md contract)', () => {
    const r = run('info', indep, '--json');
    expect(r.code).toBe(0);
    const i = JSON.parse(r.out) as { dims: number; observe_mhz: number; axes: { dimension: string; points: number; first_hz: number; last_hz: number; first_ppm: number; last_ppm: number }[] };
    expect(i.dims).toBe(2);
    expect(i.observe_mhz).toBeCloseTo(truth.observe_mhz, 6);
    const [f1, f2] = i.axes;
    expect(f1?.dimension).toBe('indirect');
    expect(f2?.dimension).toBe('direct');
    for (const [got, want] of [[f1, truth.axes.f1], [f2, truth.axes.f2]] as const) {
      expect(got?.points).toBe(want.n);
      // The file writes FIRST/LAST to 6 decimals (Hz); ppm = Hz / observe MHz.
      expect(got?.first_hz).toBeCloseTo(want.first_hz, 3);
      expect(got?.last_hz).toBeCloseTo(want.last_hz, 3);
      expect(got?.first_ppm).toBeCloseTo(want.first_ppm, 5);
      expect(got?.last_ppm).toBeCloseTo(want.last_ppm, 5);
    }
  });

  it('peaks --json finds every cross peak of the truth file, with its symmetric partner', () => {
    const r = run('peaks', indep, '--json');
    expect(r.code).toBe(0);
    const p = JSON.parse(r.out) as { peaks: { f2_ppm: number; f1_ppm: number; kind: string; partner: number | null }[] };
    for (const t of truth.cross_peaks) {
      const hit = p.peaks.findIndex((q) => q.kind === 'cross' && Math.abs(q.f2_ppm - t.f2_ppm) < 0.01 && Math.abs(q.f1_ppm - t.f1_ppm) < 0.03);
      expect(hit, `cross peak at F2 ${t.f2_ppm} / F1 ${t.f1_ppm}`).toBeGreaterThanOrEqual(0);
      const partner = p.peaks[hit]?.partner;
      expect(partner).not.toBeNull();
      expect(p.peaks[partner ?? -1]?.f2_ppm).toBeCloseTo(t.f1_ppm, 1);
    }
  });

  it('measure --json at a cross peak whose J (0.7 Hz) is far below the linewidth flags it unresolved', () => {
    const t = truth.cross_peaks[0];
    if (!t) throw new Error('truth file has no cross peaks');
    const r = run('measure', indep, '--f2', String(t.f2_ppm), '--f1', String(t.f1_ppm), '--json');
    expect(r.err).toBe('');
    expect(r.code).toBe(0);
    const m = JSON.parse(r.out) as Record<string, unknown>;
    for (const key of ['j_hz', 'j_sd_hz', 'passive_hz', 'linewidth_hz', 'method', 'flags', 'dimension']) expect(m).toHaveProperty(key);
    expect(m.method).toBe('fit');
    expect(m.dimension).toBe('F2');
    expect(m.flags).toContain('unresolved');
  });
});

describe('couplet exit codes (design.md: 0 success, 1 measurement failed, 2 bad input or usage)', () => {
  it('exits 2 naming the file when it does not exist', () => {
    const r = run('info', 'no/such/file.jdx');
    expect(r.code).toBe(2);
    expect(r.err).toContain('no/such/file.jdx');
  });

  it('exits 2 on an unknown command or a bad number', () => {
    expect(run('frobnicate').code).toBe(2);
    expect(run('measure', indep, '--f2', 'abc', '--f1', '1').code).toBe(2);
  });

  it('exits 2 with the file and line when the file is damaged', () => {
    const r = run('info', resolve(repo, 'test', 'cli', 'fixtures', 'truncated.jdx'));
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/truncated\.jdx:\d+/);
  });

  it.runIf(existsSync(indep))('exits 1 when no cross peak lies near the requested point', () => {
    const r = run('measure', indep, '--f2', '5.0', '--f1', '4.5');
    expect(r.code).toBe(1);
    expect(r.err).toMatch(/no cross peak/);
  });

  it('exits 0 for --help', () => {
    expect(run('--help').code).toBe(0);
  });
});
