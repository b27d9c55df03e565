/** The view of a 1D analysis: what is drawn and said, on hand-made analyses small enough to check by hand. */
import { describe, expect, it } from 'vitest';
import type { LineshapeFit } from '../../src/core/report/multipletFit';
import type { MultipletAnalysis } from '../../src/core/report/multiplet';
import { analyseMultiplet } from '../../src/core/report/multiplet';
import { simulate1D } from '../../src/core/simulate/simulate1D';
import type { SpinSystem } from '../../src/core/simulate/spinSystem';
import { makeAxis, ppmToPoint } from '../../src/core/spectrum/axis';
import type { DimensionProcessing } from '../../src/core/spectrum/processing';
import { make1D } from '../../src/core/spectrum/spectrum';
import { FLAG_NOTES, multipletView, type ViewContext } from '../../src/extension/multipletView';

// 1001 points from 4.1 to 3.9 ppm at 600 MHz: 0.12 Hz, 0.0002 ppm per point; 4.0 ppm is point 500.
const axis = makeAxis(1001, 2460, 2340, 600);
const context: ViewContext = { peakIndex: 0, pickId: null, label: [], regionSet: false, axis, reference: null, partners: [] };

function analysis(over: Partial<MultipletAnalysis>, points: number): MultipletAnalysis {
  // model is the whole fit (2 from the lines plus the 0.5 baseline), as LineshapeFit documents it.
  const fit = { groups: [{ jHz: 7.2, sdHz: 0.01, count: 1 }], centreHz: 2400, model: new Float64Array(points).fill(2.5), baseline: new Float64Array(points).fill(0.5) } as unknown as LineshapeFit;
  return {
    fromPpm: 4.01, toPpm: 3.99, centreHz: 2400, centrePpm: 4.0, integral: 10, protons: null, lines: [], linewidthHz: 1, tree: null, fit,
    couplings: [{ jHz: 7.2, sdHz: 0.01, count: 1 }], multiplicity: 'd', flags: [], notes: [], cosy: [], ...over,
  };
}

describe('multipletView', () => {
  it('draws a doublet as two ticks J apart about the centre, and the model plus baseline over the region\'s 101 points', () => {
    // 4.01..3.99 ppm is points 450..550 (analyseMultiplet's own rounding): 101 values.
    const v = multipletView(analysis({}, 101), context);
    expect(v.linesPpm.map((p) => p * 600)).toEqual([2403.6, 2396.4].map((hz) => expect.closeTo(hz, 9)));
    expect(v.fitted?.data.length).toBe(101);
    expect(v.fitted?.data[0]).toBe(2.5);
    expect(v.fitted?.fromPpm).toBeCloseTo(4.01, 9);
    expect(v.reference).toMatch(/^no reference/);
  });

  it('the drawn curve of a real fit lies on the data (the baseline is counted once): a doublet on a 5 % offset', () => {
    const sys: SpinSystem = { observeMhz: 600, spins: [{ label: 'A', ppm: 4.0, linewidthHz: 0.8 }, { label: 'X', ppm: 2.0, linewidthHz: 1 }], couplings: [{ a: 'A', b: 'X', jHz: 7.2 }] };
    const p: DimensionProcessing = { acquiredPoints: 8192, spectralWidthHz: 2000, carrierHz: 1500, window: { kind: 'exponential', lbHz: 0.3 }, size: 16384 };
    const sim = simulate1D(sys, p, { noise: { seed: 5, snr: 2000 } }).spectrum;
    let top = 0;
    for (const v of sim.data) top = Math.max(top, v);
    const s = make1D('d on an offset', sim.data.map((v) => v + 0.05 * top), sim.axis, sim.processing);
    const a = analyseMultiplet(s, 4.0 + 12 / 600, 4.0 - 12 / 600);
    expect(a.multiplicity).toBe('d');
    const v = multipletView(a, { ...context, axis: s.axis });
    const i0 = Math.round(ppmToPoint(s.axis, v.fitted!.fromPpm));
    // Off by at most 1 % of the tallest line (noise and fit error); a baseline counted twice would be 5 % off.
    v.fitted!.data.forEach((y, k) => expect(Math.abs(y - (s.data[i0 + k] ?? 0))).toBeLessThan(0.01 * top));
  });

  it('draws no curve when the fit does not cover the expected points (it would sit shifted)', () => {
    expect(multipletView(analysis({}, 100), context).fitted).toBeNull();
  });

  it('gives no ticks and a plain note per flag when no J may be reported', () => {
    const v = multipletView(analysis({ couplings: [], flags: ['second-order', 'roofing'], notes: ['core note'] }, 101), context);
    expect(v.linesPpm).toEqual([]);
    expect(v.notes).toEqual([FLAG_NOTES['second-order'], FLAG_NOTES.roofing, 'core note']);
  });

  it('names the reference pick, or says this pick is it', () => {
    const reference = { pickId: 'p-1.1700', label: ['H-7'], protons: 3 };
    expect(multipletView(analysis({}, 101), { ...context, reference }).reference).toBe('reference p-1.1700 (H-7) = 3 H');
    expect(multipletView(analysis({}, 101), { ...context, reference, pickId: 'p-1.1700' }).reference).toBe('this pick is the integral reference (3 H)');
  });
});
