import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { parseJcamp } from '../../../src/core/jcamp';
import { pickCrossPeaks } from '../../../src/core/peaks';
import { measureCrossPeak, measurePair, reconcile } from '../../../src/core/measure';
import { simulateDqfCosy, type SpinSystem } from '../../../src/core/simulate';
import type { DimensionProcessing } from '../../../src/core/spectrum/processing';

// Truth from the simulator (src/core/simulate/dqfCosy.ts): the trace of A coupled to n equivalent
// X protons is sin(pi J t) cos^(n-1)(pi J t) (DQF-COSY product operators, e.g. Keeler,
// Understanding NMR Spectroscopy, ch. 8 [mem]): an antiphase pair at n J for n = 2.
const MHZ = 600;
const J = 7;
const f2: DimensionProcessing = { acquiredPoints: 1024, spectralWidthHz: 1500, carrierHz: 1650, window: { kind: 'sine', power: 2, shiftDeg: 90 }, size: 2048 };
const f1: DimensionProcessing = { acquiredPoints: 128, spectralWidthHz: 1500, carrierHz: 1650, window: { kind: 'sine', power: 2, shiftDeg: 90 }, size: 256 };

function system(n: number): SpinSystem {
  return {
    observeMhz: MHZ,
    spins: [{ label: 'A', ppm: 3.5, linewidthHz: 0.8 }, { label: 'X', ppm: 2.0, linewidthHz: 0.8, count: n }],
    couplings: [{ a: 'A', b: 'X', jHz: J }],
  };
}

describe('measurePair on simulated A-Xn systems (truth: the simulator)', () => {
  for (const n of [2, 3]) {
    it(`A-X${n}: the A trace reads a multiple of J alone, the pair gives J within 3 sigma and flags equivalent_partner`, () => {
      const { spectrum } = simulateDqfCosy(system(n), { f1, f2, noise: { seed: 40 + n, snr: 300 } });
      const atA = { f2Ppm: 3.5, f1Ppm: 2.0 }; // F2 trace of A, active partner X (n protons)
      const atX = { f2Ppm: 2.0, f1Ppm: 3.5 };
      const single = measureCrossPeak(spectrum, atA);
      expect(Math.abs(single.jHz - J)).toBeGreaterThan(3); // the single-trace reading is off (2J or 3J pattern)
      const pair = measurePair(spectrum, atA, atX);
      expect(pair.partner).not.toBeNull();
      expect(Math.abs(pair.jHz - J)).toBeLessThan(3 * pair.jSdHz + 0.05);
      expect(pair.flags).toContain('equivalent_partner');
      expect(pair.ownJHz).toBeCloseTo(single.jHz, 6);
    });
  }
});

describe('reconcile (rules of pair.ts)', () => {
  it('inverse-variance weighted mean when both agree within 3 combined sigma', () => {
    const r = reconcile(7.0, 0.1, 7.2, 0.2);
    // weights 100 and 25: (700 + 180) / 125 = 7.04; sigma 1 / sqrt(125)
    expect(r.jHz).toBeCloseTo(7.04, 10);
    expect(r.jSdHz).toBeCloseTo(1 / Math.sqrt(125), 10);
    expect(r.flag).toBeNull();
    expect(r.note).toMatch(/^consistent/);
  });
  it('takes the smaller reading when the other is about 2 or 3 times it', () => {
    expect(reconcile(14.1, 0.1, 7.0, 0.05)).toMatchObject({ jHz: 7.0, flag: 'equivalent_partner' });
    expect(reconcile(7.0, 0.05, 21.1, 0.1)).toMatchObject({ jHz: 7.0, flag: 'equivalent_partner' });
  });
  it('keeps its own value and flags partner_disagrees otherwise', () => {
    expect(reconcile(7.0, 0.05, 10.0, 0.05)).toMatchObject({ jHz: 7.0, flag: 'partner_disagrees' });
  });
});

interface SampleTruth { system: { spins: { label: string; ppm: number }[]; couplings: { a: string; b: string; jHz: number }[] } }

describe('measurePair on the vantrelenol sample (truth: samples/vantrelenol/truth.json)', () => {
  const dir = resolve(__dirname, '..', '..', '..', 'samples', 'vantrelenol');
  const s = parseJcamp(readFileSync(resolve(dir, 'cosy.jdx'), 'utf8'), 'cosy.jdx');
  const truth = JSON.parse(readFileSync(resolve(dir, 'truth.json'), 'utf8')) as SampleTruth;
  const label = (ppm: number): string => truth.system.spins.reduce((a, b) => (Math.abs(b.ppm - ppm) < Math.abs(a.ppm - ppm) ? b : a)).label;
  const trueJ = (a: string, b: string): number => Math.abs(truth.system.couplings.find((c) => (c.a === a && c.b === b) || (c.a === b && c.b === a))?.jHz ?? NaN);

  it('the CH3-CH (H-1/H-2) cross peaks come out right with the pair, and more peaks are right than alone', () => {
    if (s.dims !== 2) throw new Error('expected a 2D sample');
    const { peaks, noise } = pickCrossPeaks(s);
    let single = 0;
    let paired = 0;
    for (const p of peaks) {
      const other = p.partner === null ? undefined : peaks[p.partner];
      if (p.kind !== 'cross' || !other) continue;
      const [a, b] = [label(p.f2Ppm), label(p.f1Ppm)];
      const j = trueJ(a, b);
      const one = measureCrossPeak(s, p, { noise });
      const two = measurePair(s, p, other, { noise });
      // "right": within 3 sigma or the 0.15 Hz tolerance
      const right = (v: number, sd: number): boolean => Math.abs(v - j) <= Math.max(3 * sd, 0.15);
      single += right(one.jHz, one.jSdHz) ? 1 : 0;
      paired += right(two.jHz, two.jSdHz) ? 1 : 0;
      if ((a === 'H-1' && b === 'H-2') || (a === 'H-2' && b === 'H-1')) expect(right(two.jHz, two.jSdHz), `${a}/${b}`).toBe(true);
    }
    expect(paired).toBeGreaterThan(single);
  });
});
