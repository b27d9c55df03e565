import { describe, expect, it } from 'vitest';
import { buildNetwork } from '../../../src/core/network';
import { compoundReport } from '../../../src/core/report/compound';
import { atomShifts, deriveSiEntries, oneDDisagreements } from '../../../src/core/report/siEntries';
import { protonUnit } from '../../../src/core/report/signals1D';
import type { Coupling, Pick, Sidecar } from '../../../src/core/sidecar/types';
import { simulate1D } from '../../../src/core/simulate/simulate1D';
import type { SpinSystem } from '../../../src/core/simulate/spinSystem';
import type { DimensionProcessing } from '../../../src/core/spectrum/processing';

const HASH = 'b'.repeat(64);
const c = (a: string, b: string, jHz: number, extra: Partial<Coupling> = {}): Coupling =>
  ({ atoms: [a, b], jHz, jSdHz: 0.1, method: 'fit', dimension: 'F2', picks: [], flags: [], ...extra });
const cross = (id: string, f2Ppm: number, f1Ppm: number, label: string[]): Pick => ({ id, f2Ppm, f1Ppm, label, kind: 'cross' });

// An invented CH-CH2-CH3 fragment plus an olefinic pair: H-1 (4.10) couples to H-2a and H-2b with
// nearly the same J, H-2a/H-2b to H-3 (CH3 in this test is one label), and H-5/H-6 trans across a double bond.
const cosy: Sidecar = {
  schema: 'couplet-sidecar/1', data: { file: 'cosy.jdx', sha256: HASH },
  picks: [
    cross('p1', 4.1, 2.35, ['H-1', 'H-2a']), cross('p2', 2.35, 4.1, ['H-2a', 'H-1']), cross('p3', 4.1, 2.2, ['H-1', 'H-2b']),
    cross('p4', 6.3, 5.9, ['H-5', 'H-6']), cross('p5', 5.9, 6.3, ['H-6', 'H-5']),
  ],
  couplings: [c('H-1', 'H-2a', 7.2), c('H-1', 'H-2b', 6.8), c('H-5', 'H-6', 15.6), c('H-1', 'H-6', 0.7, { flags: ['unresolved'] })],
};
const sources = [{ file: 'cosy.jdx.couplet.yaml', sidecar: cosy }];

describe('deriving SI entries from sidecars (no 1D spectrum)', () => {
  it('atom shifts are the mean of the cross-peak positions of each label', () => {
    const s = atomShifts(sources);
    expect(s.get('H-1')).toBeCloseTo(4.1, 12);
    expect(s.get('H-2a')).toBeCloseTo(2.35, 12);
    expect(s.get('H-6')).toBeCloseTo(5.9, 12);
  });

  it('merges J within 0.5 Hz into one group (t), keeps unresolved J out with br, says what it did', () => {
    const d = deriveSiEntries({ network: buildNetwork(sources), sources, noteLabels: ['H-1', 'H-9'] });
    const h1 = d.entries.find((e) => e.labels[0] === 'H-1')!;
    expect(h1.couplings.map((x) => x.count)).toEqual([2, 1]);
    expect(h1.couplings[0]!.jHz).toBeCloseTo(7.0, 12);
    expect(h1.couplings[0]!.partners).toEqual(['H-2a', 'H-2b']);
    expect(d.notes).toContain('H-9: named in the structure note, but no spectrum assigns it; not in the SI line.');
    expect(d.notes.join(' ')).toMatch(/no 1D spectrum/);
  });

  it('three partners within 0.5 Hz make a q whose sd is that of the mean of three: σ/√3 (analytic)', () => {
    const three: Sidecar = {
      schema: 'couplet-sidecar/1', data: { file: 'cosy.jdx', sha256: HASH },
      picks: [cross('r1', 4.1, 2.0, ['H-1', 'H-2']), cross('r2', 4.1, 2.5, ['H-1', 'H-3']), cross('r3', 4.1, 3.0, ['H-1', 'H-4'])],
      couplings: [c('H-1', 'H-2', 7.0, { jSdHz: 0.3 }), c('H-1', 'H-3', 7.2, { jSdHz: 0.3 }), c('H-1', 'H-4', 7.1, { jSdHz: 0.3 })],
    };
    const src = [{ file: 'cosy.jdx.couplet.yaml', sidecar: three }];
    const h1 = deriveSiEntries({ network: buildNetwork(src), sources: src }).entries.find((e) => e.labels[0] === 'H-1')!;
    expect(h1.couplings.map((x) => x.count)).toEqual([3]);
    expect(h1.couplings[0]!.jHz).toBeCloseTo(7.1, 12);
    expect(h1.couplings[0]!.sdHz).toBeCloseTo(0.3 / Math.sqrt(3), 12);
  });

  it('gives the SI line (conventions of references.md, common practice)', () => {
    const r = compoundReport({ compound: 'x', sources, observeMhz: 400.13, solvent: 'C6D6' });
    expect(r.siLine.md).toBe('¹H NMR (400 MHz, C₆D₆) δ 6.30 (d, J = 15.6 Hz, 1H, H-5), 5.90 (br d, J = 15.6 Hz, 1H, H-6), ' +
      '4.10 (br t, J = 7.0 Hz, 1H, H-1), 2.35 (d, J = 7.2 Hz, 1H, H-2a), 2.20 (d, J = 6.8 Hz, 1H, H-2b).');
    expect(r.notes.join('\n')).toMatch(/H-1: J to H-6 is unresolved \(0\.7 Hz measured\)/);
  });

  it('writes a visible placeholder when the note names no solvent', () => {
    const r = compoundReport({ compound: 'x', sources, observeMhz: 400.13, solvent: null });
    expect(r.siLine.md).toMatch(/^¹H NMR \(400 MHz, solvent\?\) δ /);
    expect(r.notes[0]).toMatch(/no solvent/);
  });
});

describe('protonUnit: whole proton counts from integrals', () => {
  it('finds the largest unit making every integral whole (1 : 2 : 3 protons)', () => {
    expect(protonUnit([10.1, 19.8, 30.3])).toBeCloseTo(10.1, 6);
  });
  it('takes the largest unit that works, with integrals a few per cent off (1.00 : 2.06 : 2.94 -> 1, 2, 3)', () => {
    const u = protonUnit([1.0, 2.06, 2.94])!;
    expect([1.0, 2.06, 2.94].map((x) => Math.round(x / u))).toEqual([1, 2, 3]);
    expect(protonUnit([2, 4, 6])).toBe(2);
  });
});

describe('deriving SI entries with a 1D spectrum: the 1D multiplets get the COSY partners', () => {
  // Processing like the samples' 1D (exponential 0.3 Hz, 2x zero-fill) on a narrower window, for speed.
  const p: DimensionProcessing = { acquiredPoints: 8192, spectralWidthHz: 3000, carrierHz: 1680, window: { kind: 'exponential', lbHz: 0.3 }, size: 16384 };
  const cosyOf = (pairs: [string, string, number, number, number][]): Sidecar => ({
    schema: 'couplet-sidecar/1', data: { file: 'cosy.jdx', sha256: HASH },
    picks: pairs.map(([a, b, , f2, f1], i) => cross(`q${i}`, f2, f1, [a, b])),
    couplings: pairs.map(([a, b, j]) => c(a, b, j, { jSdHz: 0.2 })),
  });

  it('a partly resolved tt (11.0/11.3 and 4.6/4.4 Hz, 1.4 Hz lines) reaches the SI line as tt, J = 11.2, 4.5 Hz (common practice)', () => {
    const sys: SpinSystem = {
      observeMhz: 600,
      spins: [{ label: 'H-1', ppm: 4.0, linewidthHz: 1.4 }, ...['H-2', 'H-3', 'H-4', 'H-5'].map((label, i) => ({ label, ppm: 1.2 + 0.6 * i, linewidthHz: 1 }))],
      couplings: [{ a: 'H-1', b: 'H-2', jHz: 11.0 }, { a: 'H-1', b: 'H-3', jHz: 11.3 }, { a: 'H-1', b: 'H-4', jHz: 4.6 }, { a: 'H-1', b: 'H-5', jHz: 4.4 }],
    };
    const spectrum1D = simulate1D(sys, p, { noise: { seed: 2, snr: 1500 } }).spectrum;
    // Only two of the four couplings measured in the COSY: the recorded ones predict dd.
    const src = [{ file: 'cosy.jdx.couplet.yaml', sidecar: cosyOf([['H-1', 'H-2', 11.0, 4.0, 1.2], ['H-1', 'H-4', 4.6, 4.0, 2.4]]) }];
    const d = deriveSiEntries({ network: buildNetwork(src), sources: src, spectrum1D });
    const h1 = d.entries.find((e) => e.labels[0] === 'H-1')!;
    expect(h1.multiplet).toBeUndefined();
    expect(h1.couplings.map((x) => [Number(x.jHz.toFixed(1)), x.count])).toEqual([[11.2, 2], [4.5, 2]]);
    expect(d.notes.join('\n')).toMatch(/H-1: the 1D multiplet is tt \(J = 11\.2, 4\.5 Hz\), the recorded couplings give dd/);
    expect(oneDDisagreements(d)).toEqual([]);
  });

  it('a COSY J that no 1D splitting matches (9.0 for a simulated 11.0) is named in the notes and for the dihedral estimates', () => {
    const sys: SpinSystem = {
      observeMhz: 600,
      spins: [{ label: 'H-1', ppm: 4.0, linewidthHz: 1.2 }, { label: 'H-2', ppm: 1.2, linewidthHz: 1 }, { label: 'H-3', ppm: 2.4, linewidthHz: 1 }],
      couplings: [{ a: 'H-1', b: 'H-2', jHz: 11.0 }, { a: 'H-1', b: 'H-3', jHz: 4.5 }],
    };
    const spectrum1D = simulate1D(sys, p, { noise: { seed: 4, snr: 1500 } }).spectrum;
    // Only H-1/H-2 measured in the COSY (as quellopyranol H-3a/H-4): the recorded d and the 1D dd differ in letters too.
    const src = [{ file: 'cosy.jdx.couplet.yaml', sidecar: cosyOf([['H-1', 'H-2', 9.0, 4.0, 1.2]]) }];
    const d = deriveSiEntries({ network: buildNetwork(src), sources: src, spectrum1D });
    expect(d.notes.join('\n')).toMatch(/H-1: the 1D multiplet is dd/);
    expect(d.notes.join('\n')).toMatch(/H-1: J to H-2 is 9\.00 ± 0\.20 Hz in the COSY, but the nearest 1D splitting is 11\.0\d ± 0\.\d\d Hz/);
    const [x] = oneDDisagreements(d);
    expect(x).toMatchObject({ atom: 'H-1', partner: 'H-2' });
    expect(Math.abs((x?.oneDJHz ?? 0) - 11.0)).toBeLessThan(0.1);
  });

  it('1D and COSY J 0.15 Hz apart agree (the 0.2 Hz floor of checkPartners) even with σ far below that: the recorded J stand, no note', () => {
    const sys: SpinSystem = {
      observeMhz: 600,
      spins: [{ label: 'H-1', ppm: 4.0, linewidthHz: 1.2 }, { label: 'H-2', ppm: 1.2, linewidthHz: 1 }, { label: 'H-3', ppm: 2.4, linewidthHz: 1 }],
      couplings: [{ a: 'H-1', b: 'H-2', jHz: 11.0 }, { a: 'H-1', b: 'H-3', jHz: 4.5 }],
    };
    const spectrum1D = simulate1D(sys, p, { noise: { seed: 4, snr: 1500 } }).spectrum;
    // Both recorded with σ 0.01 Hz, H-1/H-2 0.15 Hz off the simulated 11.0: beyond 3 combined sd, within the floor.
    const sc = cosyOf([['H-1', 'H-2', 11.15, 4.0, 1.2], ['H-1', 'H-3', 4.5, 4.0, 2.4]]);
    const src = [{ file: 'cosy.jdx.couplet.yaml', sidecar: { ...sc, couplings: sc.couplings.map((x) => ({ ...x, jSdHz: 0.01 })) } }];
    const d = deriveSiEntries({ network: buildNetwork(src), sources: src, spectrum1D });
    const a = d.signals.find((g) => g.labels[0] === 'H-1')!.analysis!;
    expect(a.multiplicity).toBe('dd');
    expect(3 * Math.hypot(a.couplings[0]!.sdHz, 0.01)).toBeLessThan(0.15);
    expect(a.cosy.every((k) => k.agrees)).toBe(true);
    const h1 = d.entries.find((e) => e.labels[0] === 'H-1')!;
    expect(h1.couplings.map((x) => x.jHz)).toEqual([11.15, 4.5]);
    expect(d.notes.join('\n')).not.toMatch(/H-1: the 1D splittings/);
  });

  it('a partner 60 Hz away with J = 8 Hz (shift difference / J 7.5) makes the signal second order, though the simulated lines are first order', () => {
    const sys: SpinSystem = {
      observeMhz: 600,
      spins: [{ label: 'H-1', ppm: 4.0, linewidthHz: 1 }, { label: 'H-2', ppm: 4.1, linewidthHz: 1 }],
      couplings: [{ a: 'H-1', b: 'H-2', jHz: 8.0 }],
    };
    const spectrum1D = simulate1D(sys, p, { noise: { seed: 3, snr: 1500 } }).spectrum;
    const src = [{ file: 'cosy.jdx.couplet.yaml', sidecar: cosyOf([['H-1', 'H-2', 8.0, 4.0, 4.1], ['H-2', 'H-1', 8.0, 4.1, 4.0]]) }];
    const d = deriveSiEntries({ network: buildNetwork(src), sources: src, spectrum1D });
    const h1 = d.entries.find((e) => e.labels[0] === 'H-1')!;
    expect(h1.flags).toEqual(['second-order']);
    const sig = d.signals.find((g) => g.labels[0] === 'H-1')!;
    expect(sig.analysis!.notes.join(' ')).toMatch(/shift difference to H-2 \/ J = 7\.5/);
  });
});
