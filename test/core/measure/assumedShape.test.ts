import { existsSync, readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { parseJcamp } from '../../../src/core/jcamp';
import { measureCrossPeak } from '../../../src/core/measure';
import { nearestCrossPeak, pickCrossPeaks } from '../../../src/core/peaks';

// The independently written file of ../shared/checks/jcamp2d (README there): a DQF-COSY whose
// processing is not recorded, all four cross peaks with an active J of 0.7 Hz (its truth.json).
const repo = resolve(__dirname, '..', '..', '..');
const file = resolve(repo, '..', 'shared', 'checks', 'jcamp2d', 'indep_dqfcosy_sqz.jdx');

interface Truth { cross_peaks: { f1_ppm: number; f2_ppm: number; j_active_hz: number }[] }

describe.runIf(existsSync(file))('measure with an assumed line shape (independent file, processing not recorded)', () => {
  const s = parseJcamp(readFileSync(file, 'utf8'), 'indep_dqfcosy_sqz.jdx');
  const truth = JSON.parse(readFileSync(file.replace(/\.jdx$/, '.truth.json'), 'utf8')) as Truth;
  if (s.dims !== 2) throw new Error('expected a 2D file');
  const { peaks, noise } = pickCrossPeaks(s);

  it.each(truth.cross_peaks)('cross peak at F2 $f2_ppm / F1 $f1_ppm: unresolved, and J ± 2 sigma contains the true J', (t) => {
    const i = nearestCrossPeak(peaks, t.f2_ppm, t.f1_ppm);
    const peak = i === null ? undefined : peaks[i];
    if (!peak) throw new Error(`no cross peak near ${t.f2_ppm} / ${t.f1_ppm}`);
    const m = measureCrossPeak(s, peak, { noise });
    expect(m.flags).toContain('unresolved');
    expect(Math.abs(m.jHz - t.j_active_hz)).toBeLessThanOrEqual(2 * m.jSdHz);
    expect(m.notes.join(' ')).toMatch(/line shapes were fitted/);
  });
});
