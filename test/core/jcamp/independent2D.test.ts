/**
 * ../shared/checks/jcamp2d/indep_dqfcosy_sqz.jdx was written by an independent simulator and
 * JCAMP-DX writer (README.md there): SQZ ordinates, `##PAGE= F1=<Hz>`, `(F2++(Y..Y)), PROFILE`.
 * Our reader must agree with its .truth.json on the axes and find the cross peaks where it says.
 */
import { describe, expect, it } from 'vitest';
import { parseJcamp } from '../../../src/core/jcamp';
import { firstPpm, lastPpm, nearestPoint } from '../../../src/core/spectrum/axis';
import { estimateNoise } from '../../../src/core/spectrum/noise';
import type { Spectrum2D } from '../../../src/core/spectrum/spectrum';
import { readCheck } from './helpers';

interface AxisTruth {
  n: number;
  first_hz: number;
  last_hz: number;
  first_ppm: number;
  last_ppm: number;
}
interface Truth {
  observe_mhz: number;
  axes: { f1: AxisTruth; f2: AxisTruth };
  cross_peaks: { f1_ppm: number; f2_ppm: number; j_active_hz: number }[];
}

const truth = JSON.parse(readCheck('jcamp2d', 'indep_dqfcosy_sqz.truth.json')) as Truth;

function load(): Spectrum2D {
  const s = parseJcamp(readCheck('jcamp2d', 'indep_dqfcosy_sqz.jdx'), 'indep_dqfcosy_sqz.jdx');
  if (s.dims !== 2) throw new Error('expected a 2D spectrum');
  return s;
}

/** Largest |value| in the box of +-dr rows and +-dc columns around (r, c), and where it is. */
function boxMaxAbs(s: Spectrum2D, r: number, c: number, dr: number, dc: number): { max: number; dRow: number; dCol: number } {
  let best = { max: 0, dRow: 0, dCol: 0 };
  for (let i = Math.max(0, r - dr); i <= Math.min(s.f1.points - 1, r + dr); i++) {
    for (let j = Math.max(0, c - dc); j <= Math.min(s.f2.points - 1, c + dc); j++) {
      const v = Math.abs(s.data[i * s.f2.points + j] ?? 0);
      if (v > best.max) best = { max: v, dRow: i - r, dCol: j - c };
    }
  }
  return best;
}

describe('independent 2D DQF-COSY file (jcamp2d/README.md, .truth.json)', () => {
  const s = load();

  it('has the observe frequency and axes of the truth file (the file writes Hz to 6 decimals)', () => {
    expect(s.f2.observeMhz).toBe(truth.observe_mhz);
    for (const [axis, t] of [
      [s.f1, truth.axes.f1],
      [s.f2, truth.axes.f2],
    ] as const) {
      expect(axis.points).toBe(t.n);
      expect(axis.firstHz).toBeCloseTo(t.first_hz, 5);
      expect(axis.lastHz).toBeCloseTo(t.last_hz, 5);
      expect(firstPpm(axis)).toBeCloseTo(t.first_ppm, 8);
      expect(lastPpm(axis)).toBeCloseTo(t.last_ppm, 8);
    }
  });

  it('has its strongest |values| near each listed cross-peak centre, far above the noise', () => {
    const noise = estimateNoise(s.data);
    expect(noise).toBeGreaterThan(0);
    for (const p of truth.cross_peaks) {
      const r = nearestPoint(s.f1, p.f1_ppm);
      const c = nearestPoint(s.f2, p.f2_ppm);
      // Search +-3 F1 and +-20 F2 points (F1 5.6 Hz/pt, F2 0.7 Hz/pt): the strongest value must sit
      // at the centre to within 1 F1 point and 2 F2 points (the 0.7 Hz antiphase lobes merge there).
      const near = boxMaxAbs(s, r, c, 3, 20);
      expect(Math.abs(near.dRow)).toBeLessThanOrEqual(1);
      expect(Math.abs(near.dCol)).toBeLessThanOrEqual(2);
      expect(near.max).toBeGreaterThan(100 * noise);
      // The same box 40 F2 points away (no peak listed there) holds values 50 times smaller.
      const away = boxMaxAbs(s, r, c + 40 < s.f2.points ? c + 40 : c - 40, 2, 8);
      expect(near.max).toBeGreaterThan(50 * away.max);
    }
  });
});
