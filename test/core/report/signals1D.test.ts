import { describe, expect, it } from 'vitest';
import { buildNetwork } from '../../../src/core/network';
import { deriveSiEntries } from '../../../src/core/report/siEntries';
import type { Pick, Sidecar } from '../../../src/core/sidecar/types';
import { simulate1D } from '../../../src/core/simulate/simulate1D';
import type { SpinSystem } from '../../../src/core/simulate/spinSystem';
import type { DimensionProcessing } from '../../../src/core/spectrum/processing';

const HASH = 'c'.repeat(64);
// An invented CH3-CH fragment and a lone CH: H-1 (CH3, 3 H) d 6.5 Hz to H-2 (q), H-3 a singlet.
const sys: SpinSystem = {
  observeMhz: 600,
  spins: [{ label: 'H-1', ppm: 1.2, linewidthHz: 1, count: 3 }, { label: 'H-2', ppm: 3.9, linewidthHz: 1 }, { label: 'H-3', ppm: 2.6, linewidthHz: 1 }],
  couplings: [{ a: 'H-1', b: 'H-2', jHz: 6.5 }],
};
const p: DimensionProcessing = { acquiredPoints: 8192, spectralWidthHz: 3000, carrierHz: 1500, window: { kind: 'exponential', lbHz: 0.3 }, size: 16384 };
const spectrum1D = simulate1D(sys, p, { noise: { seed: 7, snr: 800 } }).spectrum;

const pick = (id: string, f2Ppm: number, label: string, extra: Partial<Pick> = {}): Pick => ({ id, f2Ppm, label: [label], kind: 'multiplet', ...extra });
const derive = (picks: Pick[]) => {
  const sidecar: Sidecar = { schema: 'couplet-sidecar/1', data: { file: '1h.jdx', sha256: HASH }, picks, couplings: [] };
  const sources = [{ file: '1h.jdx.couplet.yaml', sidecar }];
  return deriveSiEntries({ network: buildNetwork(sources), sources, spectrum1D });
};
const basePicks = (): Pick[] => [pick('a', 1.2, 'H-1'), pick('b', 3.9, 'H-2'), pick('c', 2.6, 'H-3')];
const protons = (d: ReturnType<typeof derive>): Record<string, number> => Object.fromEntries(d.entries.map((e) => [e.labels.join(','), e.protons]));

describe('1D signals: the chemist\'s region and integral reference (sidecar from_ppm/to_ppm, protons)', () => {
  it('integral proportional to the number of protons (the 1D intensity law; common practice): 3 : 1 : 1 inferred without a reference', () => {
    expect(protons(derive(basePicks()))).toEqual({ 'H-1': 3, 'H-2': 1, 'H-3': 1 });
  });

  it('with H-3 as a 1 H reference the counts follow it, and the notes say so', () => {
    const picks = basePicks();
    picks[2] = pick('c', 2.6, 'H-3', { protons: 1 });
    const d = derive(picks);
    expect(protons(d)).toEqual({ 'H-1': 3, 'H-2': 1, 'H-3': 1 });
    expect(d.notes).toContain('proton counts against the integral reference H-3 = 1 H (pick c).');
  });

  it('a wrong reference (the CH3 said to hold 2 H) makes the others read 2/3 H: written 1H, and the notes say so instead of hiding it', () => {
    const picks = basePicks();
    picks[0] = pick('a', 1.2, 'H-1', { protons: 2 });
    const d = derive(picks);
    expect(protons(d)).toEqual({ 'H-1': 2, 'H-2': 1, 'H-3': 1 });
    expect(d.notes.join('\n')).toMatch(/H-2: integrates to 0\.6\d H against the reference; written as 1H/);
    expect(d.notes.join('\n')).toMatch(/H-3: integrates to 0\.6\d H against the reference; written as 1H/);
  });

  it('the chemist\'s region is the one integrated and analysed: a region cutting the quartet in half halves its integral', () => {
    const full = derive(basePicks()).signals.find((g) => g.labels[0] === 'H-2')!;
    const picks = basePicks();
    // The quartet spans 3.9 ± 9.75 Hz = ± 0.01625 ppm; keep only its upper half.
    picks[1] = pick('b', 3.9, 'H-2', { fromPpm: 3.93, toPpm: 3.9 });
    const half = derive(picks).signals.find((g) => g.labels[0] === 'H-2')!;
    expect(half.regionSet).toBe(true);
    expect(half.region).toEqual([3.93, 3.9]);
    expect(full.regionSet).toBe(false);
    expect(half.integral! / full.integral!).toBeGreaterThan(0.4);
    expect(half.integral! / full.integral!).toBeLessThan(0.6);
  });

  it('a region where the automatic picking found no multiplet still makes a signal of the atoms inside it', () => {
    const picks = [...basePicks(), pick('d', 2.0, 'H-9', { fromPpm: 2.05, toPpm: 1.95 })];
    const d = derive(picks);
    const g = d.signals.find((s) => s.labels.includes('H-9'))!;
    expect(g.region).toEqual([2.05, 1.95]);
    expect(g.regionSet).toBe(true);
    expect(d.entries.find((e) => e.labels.includes('H-9'))!.rangePpm).toEqual([2.05, 1.95]);
  });
});
