import { describe, expect, it } from 'vitest';
import { measureCrossPeak } from '../../../src/core/measure';
import { lorentz, separable2D } from './helpers';

// references.md, "Antiphase doublet: apparent splitting versus true J" (Lorentzian column, exact
// closed form d = sqrt((b^2 - 1 + 2 sqrt(b^4 + b^2 + 1)) / 3), b = J/w; Neuhaus et al. 1985 [mem]).
const TABLE: [number, number][] = [[0.1, 0.5831], [0.25, 0.6131], [0.5, 0.7168], [1, 1.0746], [2, 2.0137], [5, 5.001]];
const W = 4; // Hz

function antiphase(j: number) {
  return separable2D((hz) => lorentz(hz - j / 2, W) - lorentz(hz + j / 2, W), [1, -0.4], 30, 0.05);
}

describe('naive antiphase splitting on noise-free Lorentzian doublets (no truncation, w/80 per point)', () => {
  for (const [b, d] of TABLE) {
    it(`reproduces the analytic apparent splitting d = ${d} at J/w = ${b} (references.md table, to 5e-4)`, () => {
      const { s, peak } = antiphase(b * W);
      const m = measureCrossPeak(s, peak, { method: 'naive', noise: 1e-9 });
      expect(Math.abs(m.jHz / W - d)).toBeLessThan(5e-4);
    });
  }

  it('closed form of the table agrees with the table (the derivation the test rests on)', () => {
    for (const [b, d] of TABLE) expect(Math.sqrt((b * b - 1 + 2 * Math.sqrt(b ** 4 + b * b + 1)) / 3)).toBeCloseTo(d, 3);
  });
});

describe('the model fit removes the antiphase bias on the same traces', () => {
  for (const [b] of TABLE) {
    it(`recovers J at J/w = ${b} to 0.2 % of w (processing unknown: Lorentz-Gauss line fitted)`, () => {
      const { s, peak } = antiphase(b * W);
      const m = measureCrossPeak(s, peak, { noise: 1e-9, maxPassive: 0 });
      expect(Math.abs(m.jHz - b * W)).toBeLessThan(0.002 * W);
      expect(m.lineshape).toMatch(/^Lorentz-Gauss mix/);
      expect(m.linewidthHz).toBeCloseTo(W, 2);
    });
  }
});

describe('naive reading with a passive coupling larger than J (the adjacent antiphase pair, as a chemist reads it)', () => {
  it('reads J, not the outer span, from lines at +-J/2 +-Jp/2 (signs + - + -: first-order DQF-COSY pattern)', () => {
    const j = 4;
    const jp = 10;
    const w = 1;
    // Antiphase in J, in-phase in Jp (design.md model); J/w = 4, so the apparent splitting is within 0.3 % of J
    // (references.md closed form d(b) at b = 4: 4.002 w).
    const f = (hz: number): number => lorentz(hz - j / 2 - jp / 2, w) + lorentz(hz - j / 2 + jp / 2, w) -
      lorentz(hz + j / 2 - jp / 2, w) - lorentz(hz + j / 2 + jp / 2, w);
    const { s, peak } = separable2D(f, [1, -0.4], 30, 0.05);
    const m = measureCrossPeak(s, peak, { method: 'naive', noise: 1e-9 });
    expect(Math.abs(m.jHz - j)).toBeLessThan(0.02);
  });
});
