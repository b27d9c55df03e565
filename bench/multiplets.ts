/**
 * Speed of the 1D multiplet analysis on the simulated quellopyranol 1D spectrum (the sample's
 * processing and SNR): the lineshape fit with its tree search against the maxima-only analysis of
 * the same regions, per multiplet.
 */
import { pickMultiplets1D } from '../src/core/peaks/multiplets1D';
import { analyseMultiplet } from '../src/core/report/multiplet';
import { simulate1D } from '../src/core/simulate/simulate1D';
import type { Spectrum1D } from '../src/core/spectrum/spectrum';
import { COMPOUNDS } from '../scripts/sampleScenario';
import type { PipelineRow } from './pipeline';
import { best } from './timing';

/** Region of each picked multiplet with 6 Hz tails, as the SI derivation takes it. */
function regions(s: Spectrum1D): [number, number][] {
  const tail = 6 / s.axis.observeMhz;
  return pickMultiplets1D(s).multiplets.map((m) => [m.fromPpm + tail, m.toPpm - tail]);
}

export function runMultipletBench(repeats = 2): PipelineRow[] {
  const compound = COMPOUNDS[0];
  if (!compound) throw new Error('no sample compound to simulate');
  const s = simulate1D(compound.system, compound.oneD, { noise: { seed: 1, snr: compound.snr1D } }).spectrum;
  const rs = regions(s);
  // A fresh spectrum object per run: the lineshape results are memoised per spectrum.
  const each = (lineshape: boolean): number => best(repeats, () => {
    const copy: Spectrum1D = { ...s };
    for (const [from, to] of rs) analyseMultiplet(copy, from, to, { lineshape });
  }) / Math.max(1, rs.length);
  const maximaMs = each(false);
  const fitMs = each(true);
  return [{
    name: `1D multiplet, lineshape fit (${rs.length} regions)`, value: `${fitMs.toFixed(0)} ms`, ms: fitMs,
    baseline: 'line maxima only, per multiplet', baselineMs: maximaMs,
  }];
}
