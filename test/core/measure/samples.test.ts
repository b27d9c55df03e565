import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { measureAll, require2D, type MeasurementJson } from '../../../src/cli/measure';
import { parseJcamp } from '../../../src/core/jcamp';

/**
 * Regression test of the demo samples: every cross peak is either right (within 3 sigma of the
 * truth) or flagged. The truth files are our own simulation parameters (samples/*\/truth.json,
 * first-order spin systems), so this checks the demo against its generator, not against an outside
 * standard; the outside checks of the measurement are accuracy.test.ts and measure.test.ts.
 */
const repo = resolve(__dirname, '..', '..', '..');

interface Truth {
  system: { spins: { label: string; ppm: number }[]; couplings: { a: string; b: string; jHz: number }[] };
}

function label(t: Truth, ppm: number): string | undefined {
  const near = [...t.system.spins].sort((a, b) => Math.abs(a.ppm - ppm) - Math.abs(b.ppm - ppm))[0];
  return near && Math.abs(near.ppm - ppm) < 0.03 ? near.label : undefined;
}

function trueJ(t: Truth, m: MeasurementJson): number | undefined {
  const a = label(t, m.f2_ppm);
  const b = label(t, m.f1_ppm);
  const c = t.system.couplings.find((x) => (x.a === a && x.b === b) || (x.a === b && x.b === a));
  return c ? Math.abs(c.jHz) : undefined;
}

function confidentlyWrong(sample: string): string[] {
  const dir = resolve(repo, 'samples', sample);
  const file = resolve(dir, 'cosy.jdx');
  const truth = JSON.parse(readFileSync(resolve(dir, 'truth.json'), 'utf8')) as Truth;
  const s = require2D(file, parseJcamp(readFileSync(file, 'utf8'), file));
  const { results } = measureAll(file, s, { method: 'fit', dimension: 'F2', threshold: undefined });
  expect(results.length).toBeGreaterThan(0);
  return results.filter((m) => {
    const t = trueJ(truth, m);
    // A cross peak with no coupling in the truth (overlap) is right only when flagged.
    const wrong = t === undefined || Math.abs(m.j_hz - t) > 3 * m.j_sd_hz;
    return wrong && m.flags.length === 0;
  }).map((m) => `${sample} peak ${m.peak} (F2 ${m.f2_ppm} / F1 ${m.f1_ppm}): J ${m.j_hz} ± ${m.j_sd_hz}, true ${trueJ(truth, m)}`);
}

describe('demo samples: no confidently wrong cross peak (truth = our simulation parameters)', () => {
  it('brisquarene', () => expect(confidentlyWrong('brisquarene')).toEqual([]));
  it('vantrelenol (CH2 and CH3 partners: 2J readings resolved by the multiplet check and the symmetric peak)', () => {
    expect(confidentlyWrong('vantrelenol')).toEqual([]);
  });
  it('quellopyranol (crowded multiplets): only the known open case H-3a/H-4 remains', () => {
    // Open: H-3a's passives (-12.4, 11.2 Hz) are within a quarter linewidth of J = 11.0 Hz, the inner lines cancel,
    // and its symmetric peak is too weak to measure; it reads 9.15 Hz unflagged. Listed so a fix (or a new failure) shows.
    const wrong = confidentlyWrong('quellopyranol');
    expect(wrong).toHaveLength(1);
    expect(wrong[0]).toMatch(/F2 1\.25\d+ \/ F1 3\.80\d+/);
  });
});
