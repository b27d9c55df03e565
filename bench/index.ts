/**
 * `npm run bench`: speed against same-run baselines (ratios are the numbers to compare).
 * `npm run bench -- --accuracy`: also the full accuracy study, written to bench/accuracy.md.
 */
import { resolve } from 'node:path';
import { writeAccuracyReport } from './accuracy';
import { printContourBench, runContourBench } from './contours';
import { runJcampBench } from './jcampParse';
import { runMultipletBench } from './multiplets';
import { runPipelineBench } from './pipeline';

function main(): void {
  console.log('Couplet benchmarks (best of repeats; ratio = time / baseline time in this run)\n');
  for (const r of [...runPipelineBench(), ...runMultipletBench()]) {
    console.log(`${r.name.padEnd(42)} ${r.value.padStart(12)}   ${(r.ms / r.baselineMs).toFixed(1).padStart(7)} x ${r.baseline} (${r.baselineMs.toFixed(2)} ms)`);
  }
  console.log('');
  for (const r of runJcampBench()) {
    console.log(`${r.name.padEnd(42)} ${`${(r.megabytes / (r.ms / 1000)).toFixed(1)} MB/s`.padStart(12)}   ${r.ratio.toFixed(1).padStart(7)} x scan of the same text`);
  }
  console.log('');
  printContourBench(runContourBench());
  if (process.argv.includes('--accuracy')) {
    const t0 = performance.now();
    const out = resolve(process.cwd(), 'bench', 'accuracy.md');
    writeAccuracyReport(out);
    console.log(`\naccuracy study (${((performance.now() - t0) / 1000).toFixed(0)} s) written to ${out}`);
  }
}

main();
