import { describe, expect, it } from 'vitest';
import { multipletLines, spinMultiplet, strongCouplingRatio, validateSpinSystem, type Line, type SpinSystem } from '../../../src/core/simulate/spinSystem';

function expectLines(actual: Line[], expected: [number, number][]): void {
  expect(actual.length).toBe(expected.length);
  const sorted = [...expected].sort((a, b) => b[0] - a[0]);
  actual.forEach((l, i) => {
    expect(l.offsetHz).toBeCloseTo(sorted[i]?.[0] ?? NaN, 9);
    expect(l.amplitude).toBeCloseTo(sorted[i]?.[1] ?? NaN, 12);
  });
}

// Expected patterns: Pascal's triangle for n equivalent partners, products of doublets otherwise
// (first-order rules; any NMR text, e.g. Pretsch et al., "Structure Determination of Organic Compounds" [mem]).
describe('first-order multiplets', () => {
  it('d: two lines 1:1 at +-J/2 (Pascal row 1)', () => {
    expectLines(multipletLines([7]), [[3.5, 0.5], [-3.5, 0.5]]);
  });
  it('t: 1:2:1 spaced by J (Pascal row 2)', () => {
    expectLines(multipletLines([7, 7]), [[7, 0.25], [0, 0.5], [-7, 0.25]]);
  });
  it('q: 1:3:3:1 spaced by J (Pascal row 3)', () => {
    expectLines(multipletLines([7, 7, 7]), [[10.5, 1 / 8], [3.5, 3 / 8], [-3.5, 3 / 8], [-10.5, 1 / 8]]);
  });
  it('dd: four equal lines at nu +- J1/2 +- J2/2', () => {
    expectLines(multipletLines([10, 4]), [[7, 0.25], [3, 0.25], [-3, 0.25], [-7, 0.25]]);
  });
  it('dt: a doublet (J1) of 1:2:1 triplets (J2)', () => {
    const [j1, j2] = [12, 3];
    const exp: [number, number][] = [];
    for (const s of [1, -1]) for (const [k, a] of [[-1, 0.25], [0, 0.5], [1, 0.25]] as const) exp.push([(s * j1) / 2 + k * j2, a / 2]);
    expectLines(multipletLines([j1, j2, j2]), exp);
  });
  it('td: a 1:2:1 triplet (J1) of doublets (J2)', () => {
    const [j1, j2] = [9, 2];
    const exp: [number, number][] = [];
    for (const [k, a] of [[-1, 0.25], [0, 0.5], [1, 0.25]] as const) for (const s of [1, -1]) exp.push([k * j1 + (s * j2) / 2, a / 2]);
    expectLines(multipletLines([j1, j1, j2]), exp);
  });
  it('antiphase doublet: +1/2 at +J/2 and -1/2 at -J/2, in-phase passive splitting on top', () => {
    // Product-operator result sin(pi J t) cos(pi Jp t) (e.g. Keeler, Understanding NMR Spectroscopy, ch. 7 [mem]).
    expectLines(multipletLines([4], 10), [[7, 0.25], [3, 0.25], [-3, -0.25], [-7, -0.25]]);
  });
  it('a spin next to a CH3 is a quartet whose intensity scales with its own proton count', () => {
    const sys: SpinSystem = {
      observeMhz: 500,
      spins: [{ label: 'H-1', ppm: 4.1, linewidthHz: 1, count: 2 }, { label: 'H-2', ppm: 1.2, linewidthHz: 1, count: 3 }],
      couplings: [{ a: 'H-1', b: 'H-2', jHz: 7 }],
    };
    const m = spinMultiplet(sys, 'H-1');
    expect(m.centreHz).toBeCloseTo(2050, 9);
    expectLines(m.lines, [[10.5, 2 / 8], [3.5, 6 / 8], [-3.5, 6 / 8], [-10.5, 2 / 8]]);
    expect(spinMultiplet(sys, 'H-2').lines.length).toBe(3); // CH3 next to CH2: triplet
  });
});

describe('validateSpinSystem', () => {
  const base: SpinSystem = { observeMhz: 600, spins: [{ label: 'H-1', ppm: 1, linewidthHz: 1 }, { label: 'H-2', ppm: 2, linewidthHz: 1 }], couplings: [] };
  it('names an unknown label in a coupling', () => {
    expect(() => validateSpinSystem({ ...base, couplings: [{ a: 'H-1', b: 'H-9', jHz: 3 }] })).toThrow(/couplings\[0\].*unknown spin label "H-9"/);
  });
  it('rejects a J on the diagonal', () => {
    expect(() => validateSpinSystem({ ...base, couplings: [{ a: 'H-1', b: 'H-1', jHz: 3 }] })).toThrow(/couplings\[0\].*itself/);
  });
  it('rejects a negative linewidth and says which spin', () => {
    expect(() => validateSpinSystem({ ...base, spins: [{ label: 'H-1', ppm: 1, linewidthHz: -1 }] })).toThrow(/spins\[0\] \("H-1"\)\.linewidthHz/);
  });
  it('rejects duplicate labels and pairs given twice', () => {
    expect(() => validateSpinSystem({ ...base, spins: [...base.spins, { label: 'H-1', ppm: 3, linewidthHz: 1 }] })).toThrow(/used twice/);
    expect(() => validateSpinSystem({ ...base, couplings: [{ a: 'H-1', b: 'H-2', jHz: 3 }, { a: 'H-2', b: 'H-1', jHz: 3 }] })).toThrow(/given twice/);
  });
});

describe('strongCouplingRatio', () => {
  it('is |delta nu| / |J| with delta nu in Hz at the observe frequency (definition)', () => {
    const sys: SpinSystem = { observeMhz: 500, spins: [{ label: 'a', ppm: 2.0, linewidthHz: 1 }, { label: 'b', ppm: 2.1, linewidthHz: 1 }], couplings: [{ a: 'a', b: 'b', jHz: -12.5 }] };
    expect(strongCouplingRatio(sys, 'a', 'b')).toBeCloseTo(50 / 12.5, 9);
    expect(strongCouplingRatio({ ...sys, couplings: [] }, 'a', 'b')).toBe(Number.POSITIVE_INFINITY);
    expect(() => strongCouplingRatio(sys, 'a', 'z')).toThrow(/unknown spin label "z"/);
  });
});
