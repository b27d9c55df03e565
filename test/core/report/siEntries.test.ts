import { describe, expect, it } from 'vitest';
import { buildNetwork } from '../../../src/core/network';
import { compoundReport } from '../../../src/core/report/compound';
import { atomShifts, deriveSiEntries, protonUnit } from '../../../src/core/report/siEntries';
import type { Coupling, Pick, Sidecar } from '../../../src/core/sidecar/types';

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
