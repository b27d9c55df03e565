/**
 * Writes the invented demo scenario into a folder (default `samples`): per compound a structure
 * note, a simulated 1D ¹H spectrum and DQF-COSY (JCAMP-DX), and the simulation truth; plus a README.
 * Deterministic: fixed seeds and fixed formatting, so re-running reproduces every file byte for byte.
 * Usage: node dist/makeSamples.js [outDir]
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { writeJcamp1D, writeJcamp2D } from '../src/core/jcamp';
import { simulateDqfCosy } from '../src/core/simulate/dqfCosy';
import { simulate1D } from '../src/core/simulate/simulate1D';
import { strongCouplingRatio } from '../src/core/simulate/spinSystem';
import { COMPOUNDS, GROUP, OWNER, PROJECT, type SampleCompound } from './sampleScenario';
import { readmeText, structureNote } from './sampleText';

const ORIGIN = 'Simulated by the Couplet first-order simulator (invented data)';

function truthJson(c: SampleCompound, sigma1D: number, sigma2D: number, peaks: unknown): string {
  const couplings = c.system.couplings.map((k) => ({ ...k, shiftToJRatio: round(strongCouplingRatio(c.system, k.a, k.b), 3) }));
  const truth = {
    note: 'Simulation parameters (first-order, weak coupling). A real dataset has no such file; it is here for tests and honest comparison.',
    compound: c.id,
    system: { ...c.system, couplings },
    oneD: { file: '1h.jdx', processing: c.oneD, noise: { seed: c.seed, snr: c.snr1D, sigma: sigma1D } },
    cosy: { file: 'cosy.jdx', processing: c.cosy, noise: { seed: c.seed + 1, snr: c.snr2D, sigma: sigma2D }, peaks },
  };
  return `${JSON.stringify(truth, null, 2)}\n`;
}

function round(x: number, digits: number): number {
  return Number(x.toFixed(digits));
}

function writeCompound(out: string, c: SampleCompound): void {
  const dir = join(out, c.id);
  mkdirSync(dir, { recursive: true });
  const one = simulate1D(c.system, c.oneD, { title: `${c.name} 1H (simulated)`, noise: { seed: c.seed, snr: c.snr1D } });
  const two = simulateDqfCosy(c.system, { ...c.cosy, title: `${c.name} DQF-COSY (simulated)`, noise: { seed: c.seed + 1, snr: c.snr2D } });
  const opts = { origin: ORIGIN, owner: OWNER };
  writeFileSync(join(dir, `${c.id}.md`), structureNote(c));
  writeFileSync(join(dir, '1h.jdx'), writeJcamp1D(one.spectrum, opts));
  writeFileSync(join(dir, 'cosy.jdx'), writeJcamp2D(two.spectrum, opts));
  writeFileSync(join(dir, 'truth.json'), truthJson(c, one.noiseSigma, two.noiseSigma, two.peaks));
}

function main(): void {
  const out = process.argv[2] ?? 'samples';
  mkdirSync(out, { recursive: true });
  for (const c of COMPOUNDS) {
    writeCompound(out, c);
    console.log(`wrote ${join(out, c.id)}`);
  }
  writeFileSync(join(out, 'README.md'), readmeText(GROUP, PROJECT, COMPOUNDS));
}

main();
