import { describe, expect, it } from 'vitest';
import { analyseMultiplet, type KnownPartner, type MultipletAnalysis } from '../../../src/core/report/multiplet';
import { processedLine } from '../../../src/core/measure/lineshape';
import { mergeNear } from '../../../src/core/report/multipletLineshape';
import { treeLines } from '../../../src/core/report/multipletModel';
import { seededRandom } from '../../../src/core/simulate/random';
import { simulate1D } from '../../../src/core/simulate/simulate1D';
import { makeAxis } from '../../../src/core/spectrum/axis';
import { make1D, type Spectrum1D } from '../../../src/core/spectrum/spectrum';
import type { Spin, SpinSystem } from '../../../src/core/simulate/spinSystem';
import type { DimensionProcessing } from '../../../src/core/spectrum/processing';

const MHZ = 600;
// Processing like the samples (4.1 s acquisition, 0.3 Hz exponential line broadening, zero-filled twice), on a
// narrower window so that the simulation stays quick.
const p: DimensionProcessing = { acquiredPoints: 8192, spectralWidthHz: 2000, carrierHz: 1500, window: { kind: 'exponential', lbHz: 0.3 }, size: 16384 };

interface Group { jHz: number; count: number }

/** Spin A at 4.00 ppm coupled to one partner spin per J, each far away in shift (Δν/J > 50: first order). */
function systemFor(groups: readonly Group[], widthHz: number): SpinSystem {
  const spins: Spin[] = [{ label: 'A', ppm: 4.0, linewidthHz: widthHz }];
  groups.forEach((g, i) => spins.push({ label: `X${i}`, ppm: 1.0 + i * 0.5, linewidthHz: 1, count: g.count }));
  return { observeMhz: MHZ, spins, couplings: groups.map((g, i) => ({ a: 'A', b: `X${i}`, jHz: g.jHz })) };
}

function analyse(groups: readonly Group[], o: { widthHz?: number; snr?: number; seed?: number; partners?: KnownPartner[] } = {}): MultipletAnalysis {
  const sim = simulate1D(systemFor(groups, o.widthHz ?? 0.8), p, { noise: { seed: o.seed ?? 11, snr: o.snr ?? 3000 } });
  const half = groups.reduce((s, g) => s + (g.jHz * g.count) / 2, 0) + 5;
  return analyseMultiplet(sim.spectrum, 4.0 + half / MHZ, 4.0 - half / MHZ, o.partners ? { partners: o.partners } : {});
}

const sorted = (gs: readonly Group[]): Group[] => [...gs].sort((a, b) => b.jHz - a.jHz);

describe('lineshape fit of simulated first-order multiplets at good SNR (binomial patterns, any NMR text; simulate1D is the truth)', () => {
  const cases: [string, Group[]][] = [
    ['d', [{ jHz: 7.3, count: 1 }]],
    ['dd', [{ jHz: 9.6, count: 1 }, { jHz: 3.4, count: 1 }]],
    ['ddd', [{ jHz: 12.1, count: 1 }, { jHz: 5.2, count: 1 }, { jHz: 2.6, count: 1 }]],
    ['dt', [{ jHz: 10.8, count: 1 }, { jHz: 2.9, count: 2 }]],
    ['td', [{ jHz: 7.6, count: 2 }, { jHz: 3.3, count: 1 }]],
    ['q', [{ jHz: 7.2, count: 3 }]],
    ['tt', [{ jHz: 9.4, count: 2 }, { jHz: 3.6, count: 2 }]],
    ['dddd', [{ jHz: 11.7, count: 1 }, { jHz: 6.1, count: 1 }, { jHz: 3.9, count: 1 }, { jHz: 2.4, count: 1 }]],
  ];
  for (const [mult, groups] of cases) {
    it(`${mult}: J within 0.1 Hz, σ covers the error`, () => {
      const a = analyse(groups);
      expect(a.flags).toEqual([]);
      expect(a.multiplicity).toBe(mult);
      const want = sorted(groups);
      expect(a.couplings.map((c) => c.count)).toEqual(want.map((g) => g.count));
      a.couplings.forEach((c, i) => {
        const err = Math.abs(c.jHz - want[i]!.jHz);
        expect(err, `${mult} J${i}`).toBeLessThan(0.1);
        expect(err, `${mult} J${i} within 4 σ (σ ${c.sdHz})`).toBeLessThan(4 * c.sdHz + 0.005);
      });
      expect(Math.abs(a.centrePpm - 4.0) * MHZ).toBeLessThan(0.05);
      expect(a.fit!.chi2Reduced).toBeLessThan(1.5);
      // The reported linewidth is that of one fitted line (the tallest maximum may be a blend).
      expect(a.linewidthHz).toBe(a.fit!.fwhmHz);
    });
  }
});

describe('the lineshape memo', () => {
  it('reuses a fit only for the same seeds: picking options that change the lines get their own search', () => {
    const sim = simulate1D(systemFor([{ jHz: 7.2, count: 3 }], 0.8), p, { noise: { seed: 11, snr: 3000 } });
    const [from, to] = [4.0 + 16 / MHZ, 4.0 - 16 / MHZ];
    const a = analyseMultiplet(sim.spectrum, from, to);
    expect(analyseMultiplet(sim.spectrum, from, to).fit).toBe(a.fit);
    // Lines below half the tallest dropped: the q's outer lines (1 : 3 : 3 : 1) are no longer seeds.
    const b = analyseMultiplet(sim.spectrum, from, to, { minRelativeHeight: 0.5 });
    expect(b.lines.length).toBeLessThan(a.lines.length);
    expect(b.fit).not.toBe(a.fit);
  });
});

describe('partly resolved multiplets: the fit gives what the line maxima cannot', () => {
  it('ddd with the small J equal to the linewidth (1.2 Hz lines): all three J within 0.1 Hz', () => {
    const groups = [{ jHz: 10.4, count: 1 }, { jHz: 4.2, count: 1 }, { jHz: 1.5, count: 1 }];
    const a = analyse(groups, { widthHz: 1.2, snr: 1500 });
    expect(a.multiplicity).toBe('ddd');
    a.couplings.forEach((c, i) => expect(Math.abs(c.jHz - sorted(groups)[i]!.jHz)).toBeLessThan(0.1));
  });

  it('two J 0.3 Hz apart (11.0, 11.3) and two 0.2 Hz apart (4.6, 4.4) with 1.4 Hz lines: tt with the means (common practice), within 0.1 Hz', () => {
    const groups = [{ jHz: 11.0, count: 1 }, { jHz: 11.3, count: 1 }, { jHz: 4.6, count: 1 }, { jHz: 4.4, count: 1 }];
    const a = analyse(groups, { widthHz: 1.4, snr: 1500 });
    expect(a.flags).toEqual([]);
    expect(a.multiplicity).toBe('tt');
    expect(Math.abs(a.couplings[0]!.jHz - 11.15)).toBeLessThan(0.1);
    expect(Math.abs(a.couplings[1]!.jHz - 4.5)).toBeLessThan(0.1);
  });

  it('the same with the COSY partners passed: seeded from them, and each partner is checked against a 1D J', () => {
    const partners: KnownPartner[] = [
      { label: 'X0', ppm: 1.0, jHz: 11.0, sdHz: 0.2 }, { label: 'X1', ppm: 1.5, jHz: 11.3, sdHz: 0.2 },
      { label: 'X2', ppm: 2.0, jHz: 4.6, sdHz: 0.2 }, { label: 'X3', ppm: 2.5, jHz: 4.4, sdHz: 0.2 },
    ];
    const groups = partners.map((x) => ({ jHz: x.jHz!, count: 1 }));
    const a = analyse(groups, { widthHz: 1.4, snr: 1500, partners });
    expect(a.multiplicity).toBe('tt');
    expect(a.cosy.map((c) => [c.partner, c.agrees])).toEqual(partners.map((x) => [x.label, true]));
  });

  it('a q of 6.4 Hz plus a d of 6.6 Hz (0.2 Hz apart, 1.1 Hz lines) and a 1.0 Hz d: pd, J = 6.45, 1.0 Hz within 0.1 Hz', () => {
    const a = analyse([{ jHz: 6.4, count: 3 }, { jHz: 6.6, count: 1 }, { jHz: 1.0, count: 1 }], { widthHz: 1.1, snr: 1500 });
    expect(a.multiplicity).toBe('pd');
    expect(Math.abs(a.couplings[0]!.jHz - 6.45)).toBeLessThan(0.1);
    expect(Math.abs(a.couplings[1]!.jHz - 1.0)).toBeLessThan(0.1);
  });
});

describe('a spectrum without recorded processing (Lorentz-Gauss line model)', () => {
  it('an analytic Lorentzian dt (J 9.2, 2.4 Hz, 1.0 Hz lines) with seeded noise: J within 0.1 Hz', () => {
    // Lines of a dt at ν0 ± 4.6 ± {2.4, 0, −2.4}, weights 1:2:1 (Pascal's triangle), Lorentzian of FWHM 1.0 Hz.
    const axis = makeAxis(8192, 2600, 2200, MHZ);
    const rng = seededRandom(9);
    const data = new Float64Array(axis.points);
    for (let i = 0; i < axis.points; i++) {
      const x = axis.firstHz + (i * (axis.lastHz - axis.firstHz)) / (axis.points - 1);
      for (const a of [4.6, -4.6]) {
        for (const [b, w] of [[2.4, 1], [0, 2], [-2.4, 1]] as const) data[i] = (data[i] ?? 0) + w / (1 + (2 * (x - 2400 - a - b)) ** 2);
      }
      data[i] = (data[i] ?? 0) + 0.001 * rng.gaussian();
    }
    const a = analyseMultiplet(make1D('dt, no processing recorded', data, axis), 2415 / MHZ, 2385 / MHZ);
    expect(a.flags).toEqual([]);
    expect(a.multiplicity).toBe('dt');
    expect(Math.abs(a.couplings[0]!.jHz - 9.2)).toBeLessThan(0.1);
    expect(Math.abs(a.couplings[1]!.jHz - 2.4)).toBeLessThan(0.1);
  });
});

/**
 * AB quartet with the exact processed line of `p` and seeded noise (the simulator is first order).
 * Standard result (any NMR text; from the 2-spin Hamiltonian): 2C = √(Δν² + J²), sin 2θ = J / 2C,
 * lines at ν0 ± (C + J/2) with intensity 1 − sin 2θ and ν0 ± (C − J/2) with 1 + sin 2θ.
 */
function abQuartet(dnuHz: number, jHz: number, snr: number): Spectrum1D {
  const c = Math.sqrt(dnuHz ** 2 + jHz ** 2) / 2;
  const s2t = jHz / (2 * c);
  const lines = [[c + jHz / 2, 1 - s2t], [c - jHz / 2, 1 + s2t], [-c + jHz / 2, 1 + s2t], [-c - jHz / 2, 1 - s2t]] as const;
  const first = p.carrierHz + p.spectralWidthHz / 2;
  const step = p.spectralWidthHz / p.size;
  const axis = makeAxis(p.size, first, first - step * (p.size - 1), MHZ);
  const data = new Float64Array(p.size);
  const re = new Float64Array(p.size);
  const im = new Float64Array(p.size);
  for (const [off, amp] of lines) {
    processedLine(p).evaluateGrid(2400 + off - first, step, 0.8, 0, re, im);
    for (let i = 0; i < p.size; i++) data[i] = (data[i] ?? 0) + amp * (re[i] ?? 0);
  }
  const top = data.reduce((a, v) => Math.max(a, v), 0);
  const rng = seededRandom(6);
  for (let i = 0; i < p.size; i++) data[i] = (data[i] ?? 0) + (top / snr) * rng.gaussian();
  return make1D('AB quartet', data, axis, p);
}

describe('what the fit refuses', () => {
  it('an AB quartet at Δν/J = 2 (J 7 Hz, SNR 500, recorded processing): the whole and its upper half are m, the half with roofing', () => {
    const s = abQuartet(14, 7, 500);
    const c = Math.sqrt(14 ** 2 + 7 ** 2) / 2;
    const whole = analyseMultiplet(s, (2400 + c + 8.5) / MHZ, (2400 - c - 8.5) / MHZ);
    expect(whole.flags).toContain('not-first-order');
    expect([whole.multiplicity, whole.couplings]).toEqual(['m', []]);
    const upper = analyseMultiplet(s, (2400 + c + 8.5) / MHZ, (2400 + c - 6.5) / MHZ);
    expect(upper.flags).toEqual(expect.arrayContaining(['not-first-order', 'roofing', 'second-order']));
    expect([upper.multiplicity, upper.couplings]).toEqual(['m', []]);
  });


  it('two overlapping multiplets (a d and a t 6 Hz apart) in one region: misfit, written as m without J', () => {
    const sys: SpinSystem = {
      observeMhz: MHZ,
      spins: [
        { label: 'A', ppm: 4.0, linewidthHz: 0.8 }, { label: 'B', ppm: 4.01, linewidthHz: 0.8 },
        { label: 'X', ppm: 1.2, linewidthHz: 1 }, { label: 'Y', ppm: 2.2, linewidthHz: 1, count: 2 },
      ],
      couplings: [{ a: 'A', b: 'X', jHz: 7.4 }, { a: 'B', b: 'Y', jHz: 5.1 }],
    };
    const s = simulate1D(sys, p, { noise: { seed: 4, snr: 3000 } }).spectrum;
    const a = analyseMultiplet(s, 4.0 - 10 / MHZ, 4.01 + 10 / MHZ);
    expect(a.flags).toContain('not-first-order');
    expect(a.multiplicity).toBe('m');
    expect(a.couplings).toEqual([]);
    expect(a.notes.join(' ')).toMatch(/beyond the noise/);
  });

  it('a dqdd whose weak outer lines sink into the noise (SNR 300): two descriptions fit about equally, so m with a note naming both', () => {
    const a = analyse([{ jHz: 13.6, count: 1 }, { jHz: 9.5, count: 3 }, { jHz: 5.1, count: 1 }, { jHz: 3.8, count: 1 }], { widthHz: 1.39, snr: 300, seed: 3 });
    expect(a.flags).toEqual(['ambiguous']);
    expect([a.multiplicity, a.couplings]).toEqual(['m', []]);
    expect(a.notes.join(' ')).toMatch(/nearly equally well/);
  });

  it('a known partner with shift difference / J < 10 makes even a clean fit m (the first-order J may be wrong)', () => {
    const a = analyse([{ jHz: 8.0, count: 1 }], { partners: [{ label: 'B', ppm: 4.0 - 60 / MHZ, jHz: 8.0, sdHz: 0.1 }] });
    expect(a.fit!.groups[0]!.jHz).toBeCloseTo(8.0, 1);
    expect(a.flags).toContain('second-order');
    expect(a.multiplicity).toBe('m');
  });
});

describe('the model and the grouping rule', () => {
  it('treeLines of a td (J 7, 3) is 1:1:2:2:1:1 at ±8.5, ±5.5, ±1.5 Hz (Pascal × Pascal, hand-checked)', () => {
    const t = treeLines([7, 3], [2, 1]);
    const byOffset = new Map<number, number>();
    t.offsets.forEach((o, i) => byOffset.set(o, (byOffset.get(o) ?? 0) + t.weights[i]!));
    expect([...byOffset].sort((x, y) => y[0] - x[0])).toEqual([[8.5, 1], [5.5, 1], [1.5, 2], [-1.5, 2], [-5.5, 1], [-8.5, 1]]);
  });

  it('mergeNear: 11.0 and 11.3 Hz (within w/√3 and a fifth of J) become t 11.15; 2.0 and 1.1 Hz stay two d', () => {
    const g = (jHz: number) => ({ jHz, sdHz: 0.02, count: 1 });
    const tt = mergeNear([g(11.3), g(4.4), g(11.0), g(4.6)], 1.5 / Math.sqrt(3), 0.2);
    expect(tt.map((x) => [Number(x.jHz.toFixed(2)), x.count])).toEqual([[11.15, 2], [4.5, 2]]);
    expect(mergeNear([g(2.0), g(1.1)], 1.6 / Math.sqrt(3), 0.2).map((x) => x.count)).toEqual([1, 1]);
  });
});
