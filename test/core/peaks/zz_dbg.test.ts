import { it } from 'vitest';
import { pickCrossPeaks } from '../../../src/core/peaks/crossPeaks';
import { simulateDqfCosy } from '../../../src/core/simulate/dqfCosy';
import type { DimensionProcessing } from '../../../src/core/spectrum/processing';
const system = { observeMhz: 600, spins: [ { label: 'H-1', ppm: 4.2, linewidthHz: 1.2 }, { label: 'H-2', ppm: 3.85, linewidthHz: 1.2 }, { label: 'H-3a', ppm: 2.6, linewidthHz: 1.2 }, { label: 'H-3b', ppm: 2.45, linewidthHz: 1.2 } ],
  couplings: [ { a: 'H-1', b: 'H-2', jHz: 7.5 }, { a: 'H-2', b: 'H-3a', jHz: 5 }, { a: 'H-2', b: 'H-3b', jHz: 8.5 }, { a: 'H-3a', b: 'H-3b', jHz: -16 } ] };
const cases = JSON.parse(process.env.CASES ?? '[]');
it('dbg', () => {
  for (const [win, snr] of cases) {
  const f2: DimensionProcessing = { acquiredPoints: 1024, spectralWidthHz: 3000, carrierHz: 1980, window: win, size: 2048 };
  const f1: DimensionProcessing = { acquiredPoints: 256, spectralWidthHz: 3000, carrierHz: 1980, window: win, size: 512 };
    const noise = snr ? { seed: 3, snr } : undefined;
    const sim = simulateDqfCosy(system, noise ? { f1, f2, noise } : { f1, f2 });
    const r = pickCrossPeaks(sim.spectrum);
    console.log(`RES ${JSON.stringify(win)} snr ${snr} level ${r.level.toFixed(1)}`);
    for (const p of r.peaks) console.log(`RES  ${p.kind} f2 ${p.f2Hz.toFixed(2)} f1 ${p.f1Hz.toFixed(2)} n ${p.extrema.length} h ${p.height.toFixed(1)} partner ${p.partner} ext ${p.extent.col0}-${p.extent.col1} ${p.extent.row0}-${p.extent.row1} ext1Hz ${(p.extent.f1FromPpm*600).toFixed(0)}..${(p.extent.f1ToPpm*600).toFixed(0)}`);
  }
});
