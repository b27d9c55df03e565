import { existsSync, readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { parseJcamp } from '../../../src/core/jcamp';
import { pickCrossPeaks } from '../../../src/core/peaks/crossPeaks';
import { resolutionHz } from '../../../src/core/spectrum/axis';

const repo = resolve(__dirname, '..', '..', '..');
const file = resolve(repo, '..', 'shared', 'checks', 'jcamp2d', 'indep_dqfcosy_sqz.jdx');

interface Truth { observe_mhz: number; cross_peaks: { f1_ppm: number; f2_ppm: number; j_active_hz: number }[] }

// A DQF-COSY written by a simulator outside this project; its truth file lists the cross peaks
// (active J 0.7 Hz, far below the linewidth, so each is a weak, strongly cancelled multiplet).
describe.runIf(existsSync(file))('pickCrossPeaks on the independently written DQF-COSY (shared/checks/jcamp2d)', () => {
  const truth = JSON.parse(readFileSync(file.replace(/\.jdx$/, '.truth.json'), 'utf8')) as Truth;
  const s = parseJcamp(readFileSync(file, 'utf8'), 'indep_dqfcosy_sqz.jdx');
  if (s.dims !== 2) throw new Error('expected a 2D spectrum');
  const { peaks } = pickCrossPeaks(s);
  const mhz = truth.observe_mhz;
  const r1 = resolutionHz(s.f1);
  const r2 = resolutionHz(s.f2);
  const found = (f2Ppm: number, f1Ppm: number) =>
    peaks.findIndex((p) => Math.abs(p.f2Ppm - f2Ppm) * mhz <= r2 && Math.abs(p.f1Ppm - f1Ppm) * mhz <= 0.5 * r1);

  it('finds each listed cross peak within 1 F2 point and half an F1 point, and no other cross peak', () => {
    for (const t of truth.cross_peaks) {
      const i = found(t.f2_ppm, t.f1_ppm);
      expect(i, `F2 ${t.f2_ppm} / F1 ${t.f1_ppm}`).toBeGreaterThanOrEqual(0);
      expect(peaks[i]?.kind).toBe('cross');
    }
    expect(peaks.filter((p) => p.kind === 'cross')).toHaveLength(truth.cross_peaks.length);
  });

  it('pairs each cross peak with the one at the swapped shifts', () => {
    for (const t of truth.cross_peaks) {
      const i = found(t.f2_ppm, t.f1_ppm);
      expect(peaks[i]?.partner).toBe(found(t.f1_ppm, t.f2_ppm));
    }
  });

  it('finds a diagonal peak at every shift that takes part in a listed cross peak, and nothing else', () => {
    // In a DQF-COSY each coupled proton gives a diagonal multiplet at (shift, shift).
    const shifts = [...new Set(truth.cross_peaks.flatMap((t) => [t.f1_ppm, t.f2_ppm]))];
    for (const ppm of shifts) {
      const i = found(ppm, ppm);
      expect(i, `diagonal at ${ppm}`).toBeGreaterThanOrEqual(0);
      expect(peaks[i]?.kind).toBe('diagonal');
      expect(peaks[i]?.partner).toBeNull();
    }
    expect(peaks).toHaveLength(truth.cross_peaks.length + shifts.length);
  });
});
