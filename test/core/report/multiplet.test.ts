import { describe, expect, it } from 'vitest';
import { analyseMultiplet, integrateRegion } from '../../../src/core/report/multiplet';
import { fitSplittingTree, treePattern } from '../../../src/core/report/splittingTree';
import { simulate1D } from '../../../src/core/simulate/simulate1D';
import type { Spin, SpinSystem } from '../../../src/core/simulate/spinSystem';
import { makeAxis } from '../../../src/core/spectrum/axis';
import type { DimensionProcessing } from '../../../src/core/spectrum/processing';
import { make1D, type Spectrum1D } from '../../../src/core/spectrum/spectrum';

const MHZ = 600;
// 5.5 s acquisition, 0.09 Hz/point after zero-filling, 0.5 Hz lines: well-resolved first-order multiplets.
const p: DimensionProcessing = { acquiredPoints: 32768, spectralWidthHz: 6000, carrierHz: 2100, window: { kind: 'none' }, size: 65536 };

/** Spin A at 4.00 ppm coupled to partners far away in shift (Δν/J > 100: first order). */
function systemFor(groups: { jHz: number; count: number }[]): SpinSystem {
  const spins: Spin[] = [{ label: 'A', ppm: 4.0, linewidthHz: 0.5 }];
  groups.forEach((g, i) => spins.push({ label: `X${i}`, ppm: 1.0 + i * 0.6, linewidthHz: 0.5, count: g.count }));
  return { observeMhz: MHZ, spins, couplings: groups.map((g, i) => ({ a: 'A', b: `X${i}`, jHz: g.jHz })) };
}

function analyseA(groups: { jHz: number; count: number }[], seed = 5) {
  const sim = simulate1D(systemFor(groups), p, { noise: { seed, snr: 2000 } });
  const half = groups.reduce((s, g) => s + (g.jHz * g.count) / 2, 0) + 3;
  return analyseMultiplet(sim.spectrum, 4.0 + half / MHZ, 4.0 - half / MHZ, { noise: sim.noiseSigma });
}

describe('first-order splitting trees (binomial intensities, Pascal\'s triangle: any NMR text)', () => {
  it('treePattern of a triplet is 1:2:1 at +J, 0, −J', () => {
    const t = treePattern([7], [2], 0.1);
    expect(t.map((c) => c.offset)).toEqual([7, 0, -7]);
    expect(t.map((c) => c.weight * 4)).toEqual([1, 2, 1]);
  });

  it('tells a quartet (1:3:3:1) from a dd with J1 = 2·J2 (1:1:1:1) by intensities alone', () => {
    const pos = [10.5, 3.5, -3.5, -10.5];
    expect(fitSplittingTree(pos.map((hz, i) => ({ hz, height: [1, 3, 3, 1][i]! })))!.multiplicity).toBe('q');
    expect(fitSplittingTree(pos.map((hz) => ({ hz, height: 1 })))!.multiplicity).toBe('dd');
  });
});

describe('analyseMultiplet recovers J of simulated first-order multiplets within 0.1 Hz (simulate1D is the truth)', () => {
  const cases: [string, { jHz: number; count: number }[]][] = [
    ['d', [{ jHz: 8.4, count: 1 }]],
    ['dd', [{ jHz: 10.2, count: 1 }, { jHz: 4.5, count: 1 }]],
    ['ddd', [{ jHz: 11.2, count: 1 }, { jHz: 6.3, count: 1 }, { jHz: 2.1, count: 1 }]],
    ['dt', [{ jHz: 10.5, count: 1 }, { jHz: 3.2, count: 2 }]],
    ['td', [{ jHz: 9.8, count: 2 }, { jHz: 4.1, count: 1 }]],
    ['q', [{ jHz: 7.1, count: 3 }]],
    ['p', [{ jHz: 6.8, count: 4 }]],
  ];
  for (const [mult, groups] of cases) {
    it(`${mult}: ${groups.map((g) => `${g.jHz} Hz × ${g.count}`).join(', ')}`, () => {
      const a = analyseA(groups);
      expect(a.flags).toEqual([]);
      expect(a.multiplicity).toBe(mult);
      const want = [...groups].sort((x, y) => y.jHz - x.jHz);
      expect(a.couplings.map((c) => c.count)).toEqual(want.map((g) => g.count));
      a.couplings.forEach((c, i) => expect(Math.abs(c.jHz - want[i]!.jHz), `${mult} J${i}`).toBeLessThan(0.1));
      expect(Math.abs(a.centrePpm - 4.0) * MHZ).toBeLessThan(0.1);
    });
  }

  it('normalises the integral to a reference: the q of a CH2 next to a CH3 reads 2 H against the CH3 as 3 H', () => {
    const sys: SpinSystem = {
      observeMhz: MHZ,
      spins: [{ label: 'A', ppm: 4.0, linewidthHz: 0.5, count: 2 }, { label: 'M', ppm: 1.2, linewidthHz: 0.5, count: 3 }],
      couplings: [{ a: 'A', b: 'M', jHz: 7.1 }],
    };
    const s = simulate1D(sys, p).spectrum;
    const ref = integrateRegion(s, 1.2 + 15 / MHZ, 1.2 - 15 / MHZ);
    const a = analyseMultiplet(s, 4.0 + 15 / MHZ, 4.0 - 15 / MHZ, { reference: { integral: ref, protons: 3 } });
    expect(a.multiplicity).toBe('q');
    expect(a.protons).toBeCloseTo(2, 1);
  });

  it('checks the 1D J against a COSY value for the same pair (agreement within 3 combined sd)', () => {
    const sim = simulate1D(systemFor([{ jHz: 10.2, count: 1 }, { jHz: 4.5, count: 1 }]), p, { noise: { seed: 3, snr: 2000 } });
    const a = analyseMultiplet(sim.spectrum, 4.0 + 11 / MHZ, 4.0 - 11 / MHZ, {
      partners: [{ label: 'X0', ppm: 1.0, jHz: 10.25, sdHz: 0.1 }, { label: 'X1', ppm: 1.6, jHz: 5.5, sdHz: 0.1 }],
    });
    expect(a.cosy.map((c) => [c.partner, c.agrees])).toEqual([['X0', true], ['X1', false]]);
    expect(a.flags).toEqual(['cosy-disagrees']);
  });
});

/**
 * AB quartet, synthesised analytically because the simulator is first order. Standard result
 * (any NMR text; derived from the 2-spin Hamiltonian): with 2C = √(Δν² + J²) and sin 2θ = J / 2C,
 * lines at ν0 ± (C + J/2) with intensity 1 − sin 2θ (outer) and ν0 ± (C − J/2) with 1 + sin 2θ (inner).
 */
function abQuartet(dnuHz: number, jHz: number, widthHz: number): Spectrum1D {
  const c = Math.sqrt(dnuHz ** 2 + jHz ** 2) / 2;
  const s2t = jHz / (2 * c);
  const nu0 = 2400;
  const lines = [
    { hz: nu0 + c + jHz / 2, a: 1 - s2t }, { hz: nu0 + c - jHz / 2, a: 1 + s2t },
    { hz: nu0 - c + jHz / 2, a: 1 + s2t }, { hz: nu0 - c - jHz / 2, a: 1 - s2t },
  ];
  const axis = makeAxis(8192, 2500, 2300, MHZ);
  const data = new Float64Array(axis.points);
  for (let i = 0; i < axis.points; i++) {
    const x = axis.firstHz + (i * (axis.lastHz - axis.firstHz)) / (axis.points - 1);
    for (const l of lines) data[i] = (data[i] ?? 0) + l.a / (1 + ((2 * (x - l.hz)) / widthHz) ** 2);
  }
  return make1D('AB quartet', data, axis);
}

describe('second-order AB pattern with Δν/J = 2 is flagged, not reported as first-order J', () => {
  const J = 7;
  const s = abQuartet(2 * J, J, 0.6);
  const ppm = (hz: number): number => hz / MHZ;

  it('the whole quartet: no binomial tree fits its 1:2.6:2.6:1 intensities (positions alone would pass as a dd)', () => {
    const a = analyseMultiplet(s, ppm(2420), ppm(2380));
    expect(a.lines).toHaveLength(4);
    expect(a.tree!.multiplicity).toBe('dd');
    expect(a.tree!.positionRmsHz).toBeLessThan(0.01);
    expect(a.flags).toContain('not-first-order');
    expect(a.couplings).toEqual([]);
    expect(a.multiplicity).toBe('m');
  });

  it('one half (the A doublet): roofing toward the partner', () => {
    const a = analyseMultiplet(s, ppm(2420), ppm(2401));
    expect(a.lines).toHaveLength(2);
    expect(a.flags).toEqual(expect.arrayContaining(['roofing', 'second-order']));
    expect(a.couplings).toEqual([]);
    expect(a.notes.join(' ')).toMatch(/lower frequency/);
  });

  it('a known partner with Δν/J < 10 is enough to flag it', () => {
    const a = analyseMultiplet(s, ppm(2420), ppm(2401), { partners: [{ label: 'B', ppm: ppm(2393), jHz: 7, sdHz: 0.1 }] });
    expect(a.notes.join(' ')).toMatch(/shift difference to B \/ J = /);
  });
});
