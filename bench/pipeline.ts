/**
 * Speed of the main job on a simulated 2048 (F2) x 1024 (F1) DQF-COSY written as DIFDUP JCAMP-DX:
 * parse, pick, measure. Each number comes with a baseline measured in the same run on the same
 * data, and the ratio is what to compare between runs (the machines are shared and noisy).
 */
import { parseJcamp, writeJcamp2D } from '../src/core/jcamp';
import { measureCrossPeak } from '../src/core/measure';
import { pickCrossPeaks } from '../src/core/peaks';
import { simulateDqfCosy } from '../src/core/simulate/dqfCosy';
import type { DimensionProcessing } from '../src/core/spectrum/processing';
import { COMPOUNDS } from '../scripts/sampleScenario';
import { best, scanText, scanValues } from './timing';

export interface PipelineRow {
  readonly name: string;
  readonly value: string;
  readonly ms: number;
  readonly baseline: string;
  readonly baselineMs: number;
}

function processing(base: DimensionProcessing, acquired: number, size: number): DimensionProcessing {
  return { ...base, acquiredPoints: acquired, size };
}

export function runPipelineBench(repeats = 3): PipelineRow[] {
  const compound = COMPOUNDS[0];
  if (!compound) throw new Error('no sample compound to simulate');
  const sim = simulateDqfCosy(compound.system, {
    f1: processing(compound.cosy.f1, 512, 1024),
    f2: processing(compound.cosy.f2, 1024, 2048),
    noise: { seed: 1, snr: compound.snr2D },
  });
  const text = writeJcamp2D(sim.spectrum, { encoding: 'DIFDUP' });
  const mb = text.length / 1e6;
  const scanMs = best(repeats, () => scanText(text));
  const parseMs = best(repeats, () => parseJcamp(text, 'bench.jdx'));
  const s = parseJcamp(text, 'bench.jdx');
  if (s.dims !== 2) throw new Error('bench file did not read back as 2D');

  const valuesMs = best(repeats, () => scanValues(s.data));
  let picked = pickCrossPeaks(s);
  const pickMs = best(repeats, () => (picked = pickCrossPeaks(s)));
  const cross = picked.peaks.filter((p) => p.kind === 'cross');
  const each = (method: 'fit' | 'naive'): number =>
    best(1, () => {
      for (const p of cross) {
        try {
          measureCrossPeak(s, p, { method, noise: picked.noise });
        } catch {
          // a failed measurement still costs its time; the bench measures speed only
        }
      }
    }) / Math.max(1, cross.length);
  const naiveMs = each('naive');
  const fitMs = each('fit');

  return [
    { name: `parse ${s.f2.points}x${s.f1.points} DIFDUP (${mb.toFixed(1)} MB)`, value: `${(mb / (parseMs / 1000)).toFixed(1)} MB/s`, ms: parseMs, baseline: 'scan of the same text', baselineMs: scanMs },
    { name: `pick peaks (${picked.peaks.length} found)`, value: `${pickMs.toFixed(0)} ms`, ms: pickMs, baseline: 'one pass over the values', baselineMs: valuesMs },
    { name: `fit, per cross peak (${cross.length})`, value: `${fitMs.toFixed(1)} ms`, ms: fitMs, baseline: 'naive measurement, per cross peak', baselineMs: naiveMs },
  ];
}
