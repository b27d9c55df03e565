import { describe, expect, it } from 'vitest';
import { processedLine, pseudoVoigtLine } from '../../../src/core/measure/lineshape';
import { processFid, processedAxis } from '../../../src/core/simulate/process';
import { pointToHz } from '../../../src/core/spectrum/axis';
import type { DimensionProcessing, WindowFunction } from '../../../src/core/spectrum/processing';

/** A decaying complex exponential sampled at k / SW: the FID of one line (R2 = pi w). */
function fidOf(nuHz: number, wHz: number, p: DimensionProcessing): { re: Float64Array; im: Float64Array } {
  const re = new Float64Array(p.acquiredPoints);
  const im = new Float64Array(p.acquiredPoints);
  for (let k = 0; k < p.acquiredPoints; k++) {
    const t = k / p.spectralWidthHz;
    const a = Math.exp(-Math.PI * wHz * t);
    re[k] = a * Math.cos(2 * Math.PI * nuHz * t);
    im[k] = a * Math.sin(2 * Math.PI * nuHz * t);
  }
  return { re, im };
}

const windows: WindowFunction[] = [
  { kind: 'none' },
  { kind: 'exponential', lbHz: 1.5 },
  { kind: 'sine', power: 1, shiftDeg: 0 },
  { kind: 'sine', power: 2, shiftDeg: 90 },
  { kind: 'sine', power: 2, shiftDeg: 60 },
];

describe('processedLine (closed form of the processed line)', () => {
  for (const window of windows) {
    it(`equals processFid point by point for window ${JSON.stringify(window)} (DFT of a truncated, windowed exponential)`, () => {
      const p: DimensionProcessing = { acquiredPoints: 150, spectralWidthHz: 600, carrierHz: 40, size: 1024, window };
      const nu = 57.3; // Hz, absolute (carrier 40 Hz)
      const w = 1.2;
      const fid = fidOf(nu - p.carrierHz, w, p);
      const ref = processFid(fid.re, fid.im, p);
      const axis = processedAxis(p, 600);
      const line = processedLine(p);
      const out = new Float64Array(2);
      let peak = 0;
      for (const v of ref.re) peak = Math.max(peak, Math.abs(v));
      let worst = 0;
      for (let i = 0; i < p.size; i++) {
        line.evaluate(nu - pointToHz(axis, i), w, 0, out);
        worst = Math.max(worst, Math.abs((out[0] ?? 0) - (ref.re[i] ?? 0)), Math.abs((out[1] ?? 0) - (ref.im[i] ?? 0)));
      }
      expect(worst / peak).toBeLessThan(1e-9);
    });
  }

  it('evaluateGrid equals evaluate at each offset of a uniform axis (angle-addition recurrence)', () => {
    const p: DimensionProcessing = { acquiredPoints: 200, spectralWidthHz: 800, carrierHz: 0, size: 2048, window: { kind: 'sine', power: 2, shiftDeg: 90 } };
    const line = processedLine(p);
    const re = new Float64Array(400);
    const im = new Float64Array(400);
    line.evaluateGrid(-30, 0.15, 0.7, 0, re, im);
    const out = new Float64Array(2);
    for (let i = 0; i < 400; i += 37) {
      line.evaluate(-30 + 0.15 * i, 0.7, 0, out);
      expect(re[i]).toBeCloseTo(out[0] ?? NaN, 9);
      expect(im[i]).toBeCloseTo(out[1] ?? NaN, 9);
    }
  });

  it('without window or truncation its FWHM is the natural Lorentzian width (analytic Lorentzian)', () => {
    // AQ = 4096 / 512 = 8 s >> 1 / (pi w): the FID has decayed; the line is Lorentzian of FWHM w.
    const p: DimensionProcessing = { acquiredPoints: 4096, spectralWidthHz: 512, carrierHz: 0, size: 8192, window: { kind: 'none' } };
    expect(processedLine(p).fwhm(2, 0)).toBeCloseTo(2, 2);
  });

  it('fwhm agrees with the half-height width read off a heavily zero-filled processFid spectrum (cos^2 bell, short AQ)', () => {
    const p: DimensionProcessing = { acquiredPoints: 100, spectralWidthHz: 500, carrierHz: 0, size: 65536, window: { kind: 'sine', power: 2, shiftDeg: 90 } };
    const fid = fidOf(0, 0.8, p);
    const spec = processFid(fid.re, fid.im, p).re;
    let iMax = 0;
    for (let i = 0; i < spec.length; i++) if ((spec[i] ?? 0) > (spec[iMax] ?? 0)) iMax = i;
    const half = (spec[iMax] ?? 0) / 2;
    let j = iMax;
    while ((spec[j] ?? 0) > half) j++;
    // linear interpolation between the two points around half height
    const frac = ((spec[j - 1] ?? 0) - half) / ((spec[j - 1] ?? 0) - (spec[j] ?? 0));
    const hzPerPt = p.spectralWidthHz / p.size;
    const measured = 2 * (j - 1 - iMax + frac) * hzPerPt;
    expect(processedLine(p).fwhm(0.8, 0)).toBeCloseTo(measured, 3);
  });
});

describe('pseudoVoigtLine', () => {
  it('has FWHM equal to its width for any mix (both parts are 1/2 at x = width/2 by construction)', () => {
    const line = pseudoVoigtLine();
    const out = new Float64Array(2);
    for (const mix of [0, 0.3, 1]) {
      line.evaluate(0, 4, mix, out);
      expect(out[0]).toBeCloseTo(1, 12);
      line.evaluate(2, 4, mix, out);
      expect(out[0]).toBeCloseTo(0.5, 12);
    }
  });
});
