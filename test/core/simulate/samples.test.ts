import { existsSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { parseJcamp } from '../../../src/core/jcamp';
import { simulateDqfCosy } from '../../../src/core/simulate/dqfCosy';
import { simulate1D } from '../../../src/core/simulate/simulate1D';
import { validateSpinSystem, type SpinSystem } from '../../../src/core/simulate/spinSystem';
import { COMPOUNDS } from '../../../scripts/sampleScenario';

const repoRoot = path.resolve(__dirname, '..', '..', '..');
const samplesDir = path.join(repoRoot, 'samples');

interface Truth {
  readonly compound: string;
  readonly system: Omit<SpinSystem, 'couplings'> & { readonly couplings: readonly { a: string; b: string; jHz: number; shiftToJRatio: number }[] };
}

function truthOf(id: string): Truth {
  return JSON.parse(readFileSync(path.join(samplesDir, id, 'truth.json'), 'utf8')) as Truth;
}

describe('demo samples (samples/, written by scripts/makeSamples.ts)', () => {
  for (const c of COMPOUNDS) {
    it(`${c.id}: has a structure note with front matter and every proton label, and a truth file that matches the scenario`, () => {
      const note = readFileSync(path.join(samplesDir, c.id, `${c.id}.md`), 'utf8');
      // More front matter may follow (structure:/atoms: for the NMReDATA export, karplus: requests).
      expect(note.startsWith(`---\ncompound: ${c.id}\nsolvent: CDCl3\n`)).toBe(true);
      expect(note).toMatch(/\n---\n\n# /);
      const truth = truthOf(c.id);
      validateSpinSystem(truth.system);
      for (const s of truth.system.spins) expect(note).toContain(`| ${s.label} |`);
      expect(truth.system.spins).toEqual(c.system.spins);
      expect(existsSync(path.join(samplesDir, c.id, '1h.jdx'))).toBe(true);
      expect(existsSync(path.join(samplesDir, c.id, 'cosy.jdx'))).toBe(true);
    });
  }

  it('gives the quality flags something to show (design.md: unresolved, large and clear, shift/J below 10)', () => {
    const all = COMPOUNDS.map((c) => truthOf(c.id));
    const pairs = all.flatMap((t) => t.system.couplings.map((k) => ({ ...k, width: Math.max(...t.system.spins.filter((s) => s.label === k.a || s.label === k.b).map((s) => s.linewidthHz)) })));
    expect(pairs.some((k) => Math.abs(k.jHz) <= k.width)).toBe(true); // J at or below the linewidth
    expect(pairs.some((k) => Math.abs(k.jHz) >= 10 && k.shiftToJRatio > 10)).toBe(true); // large and clear
    expect(pairs.some((k) => k.shiftToJRatio < 10)).toBe(true); // possible second order (design.md)
  });

  /** Largest |a - b| over the largest |b|. */
  const relDiff = (a: Float64Array, b: Float64Array): number => {
    let d = 0;
    let m = 0;
    for (let i = 0; i < b.length; i++) {
      d = Math.max(d, Math.abs((a[i] ?? NaN) - (b[i] ?? NaN)));
      m = Math.max(m, Math.abs(b[i] ?? 0));
    }
    return d / m;
  };

  // Golden files: the committed spectra are what the generator makes now (the writer quantises to
  // 2^20 counts of the largest value, so they agree to one count). Regenerate with `npm run samples`.
  for (const c of COMPOUNDS) {
    it(`${c.id}: 1h.jdx is up to date with the generator`, () => {
      const file = parseJcamp(readFileSync(path.join(samplesDir, c.id, '1h.jdx'), 'utf8'), '1h.jdx');
      const sim = simulate1D(c.system, c.oneD, { noise: { seed: c.seed, snr: c.snr1D } }).spectrum;
      if (file.dims !== 1) throw new Error('1h.jdx is not 1D');
      expect(file.axis.points).toBe(sim.axis.points);
      expect(file.processing).toEqual(c.oneD);
      expect(relDiff(file.data, sim.data)).toBeLessThan(2 ** -20);
    });
  }

  it('brisquarene: cosy.jdx is up to date with the generator (the smallest 2D)', () => {
    const c = COMPOUNDS.find((x) => x.id === 'brisquarene');
    if (!c) throw new Error('brisquarene missing from the scenario');
    const file = parseJcamp(readFileSync(path.join(samplesDir, c.id, 'cosy.jdx'), 'utf8'), 'cosy.jdx');
    if (file.dims !== 2) throw new Error('cosy.jdx is not 2D');
    const sim = simulateDqfCosy(c.system, { ...c.cosy, noise: { seed: c.seed + 1, snr: c.snr2D } }).spectrum;
    expect([file.f1.points, file.f2.points]).toEqual([sim.f1.points, sim.f2.points]);
    expect(file.f2.firstHz).toBeCloseTo(sim.f2.firstHz, 6);
    expect(relDiff(file.data, sim.data)).toBeLessThan(2 ** -20);
  });

  it('keeps the samples small (brief: under 15 MB in total)', () => {
    let bytes = 0;
    for (const c of COMPOUNDS) for (const f of ['1h.jdx', 'cosy.jdx', 'truth.json', `${c.id}.md`]) bytes += readFileSync(path.join(samplesDir, c.id, f)).length;
    expect(bytes).toBeLessThan(15e6);
  });
});
