/**
 * The invented demo scenario: a fictional group, project and three invented compounds. Names,
 * shifts and couplings are made up (plausible for the fragments, from handbook ranges: vicinal
 * ax-ax 8-13 Hz, ax-eq 2-5, geminal -10 to -15, olefinic trans 12-18, aromatic ortho 6-9, meta 1-3,
 * para 0-1, allylic and W-type 4J 1-3 Hz [mem]); the spectra are simulated by Couplet itself.
 */
import type { SpinSystem } from '../src/core/simulate/spinSystem';
import type { DimensionProcessing } from '../src/core/spectrum/processing';

export interface SampleCompound {
  readonly id: string;
  readonly name: string;
  readonly description: string;
  /** Label -> expected environment, in the order of the structure note. */
  readonly environments: readonly (readonly [string, string])[];
  readonly system: SpinSystem;
  readonly oneD: DimensionProcessing;
  readonly cosy: { readonly f1: DimensionProcessing; readonly f2: DimensionProcessing };
  readonly seed: number;
  readonly snr1D: number;
  readonly snr2D: number;
}

export const GROUP = 'the Fernhollow Ring Chemistry Group';
export const PROJECT = 'Project Lanternfish';
export const OWNER = 'Fernhollow Ring Chemistry Group (fictional; simulated data)';

const cos2 = { kind: 'sine', power: 2, shiftDeg: 90 } as const;

/** 1D: 12 ppm wide, 4.4-5.5 s acquisition, 2x zero-fill, 0.3 Hz exponential line broadening (common practice). */
function oneD(mhz: number, centrePpm: number): DimensionProcessing {
  const hz = (x: number): number => Number(x.toFixed(3));
  return { acquiredPoints: 32768, spectralWidthHz: hz(12 * mhz), carrierHz: hz(centrePpm * mhz), window: { kind: 'exponential', lbHz: 0.3 }, size: 65536 };
}

/**
 * DQF-COSY over [lo, hi] ppm in both dimensions, squared cosine bells, 2x zero-fill in both:
 * F1 256 increments -> 512 points, F2 `f2Acquired` points -> 2 x f2Acquired.
 */
function cosy(mhz: number, lo: number, hi: number, f2Acquired = 1024): SampleCompound['cosy'] {
  // Rounded to 1 mHz so the files carry tidy numbers.
  const sw = Number(((hi - lo) * mhz).toFixed(3));
  const carrierHz = Number((((hi + lo) / 2) * mhz).toFixed(3));
  return {
    f1: { acquiredPoints: 256, spectralWidthHz: sw, carrierHz, window: cos2, size: 512 },
    f2: { acquiredPoints: f2Acquired, spectralWidthHz: sw, carrierHz, window: cos2, size: 2 * f2Acquired },
  };
}

const quellopyranol: SampleCompound = {
  id: 'quellopyranol',
  name: 'Quellopyranol',
  description:
    'A 2,4,6-trisubstituted tetrahydropyran from the ring-closing step: a methyl at C-2, a hydroxyl at C-4 and a ' +
    'hydroxymethyl at C-6. The question is whether H-2, H-4 and H-6 are all axial (all-cis chair), which the ' +
    'vicinal couplings to the ring CH2 protons decide.',
  environments: [
    ['H-2', 'ring OCH next to the C-2 methyl; axial if the chair holds'],
    ['H-3a', 'ring CH2, the proton axial in the expected chair'],
    ['H-3b', 'ring CH2, equatorial'],
    ['H-4', 'CHOH in the ring; axial or equatorial is the open question'],
    ['H-5a', 'ring CH2, axial; close in shift to H-5b'],
    ['H-5b', 'ring CH2, equatorial'],
    ['H-6', 'ring OCH bearing the hydroxymethyl'],
    ['H-7', 'CH3 on C-2'],
    ['H-8a', 'exocyclic OCH2, first diastereotopic proton'],
    ['H-8b', 'exocyclic OCH2, second diastereotopic proton; close in shift to H-8a'],
  ],
  system: {
    observeMhz: 600.13,
    spins: [
      { label: 'H-2', ppm: 3.48, linewidthHz: 1.2 },
      { label: 'H-3a', ppm: 1.26, linewidthHz: 1.3 },
      { label: 'H-3b', ppm: 1.98, linewidthHz: 1.3 },
      { label: 'H-4', ppm: 3.82, linewidthHz: 1.4 },
      { label: 'H-5a', ppm: 1.3, linewidthHz: 1.3 },
      { label: 'H-5b', ppm: 1.48, linewidthHz: 1.3 },
      { label: 'H-6', ppm: 3.41, linewidthHz: 1.2 },
      { label: 'H-7', ppm: 1.17, linewidthHz: 0.9, count: 3 },
      { label: 'H-8a', ppm: 3.62, linewidthHz: 1.1 },
      { label: 'H-8b', ppm: 3.53, linewidthHz: 1.1 },
    ],
    couplings: [
      { a: 'H-2', b: 'H-3a', jHz: 11.2 },
      { a: 'H-2', b: 'H-3b', jHz: 2.1 },
      { a: 'H-2', b: 'H-7', jHz: 6.2 },
      { a: 'H-3a', b: 'H-3b', jHz: -12.4 },
      { a: 'H-3a', b: 'H-4', jHz: 11.0 },
      { a: 'H-3b', b: 'H-4', jHz: 4.6 },
      { a: 'H-3b', b: 'H-5b', jHz: 1.1 },
      { a: 'H-4', b: 'H-5a', jHz: 11.3 },
      { a: 'H-4', b: 'H-5b', jHz: 4.4 },
      { a: 'H-5a', b: 'H-5b', jHz: -12.6 },
      { a: 'H-5a', b: 'H-6', jHz: 11.5 },
      { a: 'H-5b', b: 'H-6', jHz: 2.0 },
      { a: 'H-6', b: 'H-8a', jHz: 3.2 },
      { a: 'H-6', b: 'H-8b', jHz: 6.4 },
      { a: 'H-8a', b: 'H-8b', jHz: -11.4 },
    ],
  },
  oneD: oneD(600.13, 5),
  cosy: cosy(600.13, 0.9, 4.1),
  seed: 1101,
  snr1D: 400,
  snr2D: 200,
};

const vantrelenol: SampleCompound = {
  id: 'vantrelenol',
  name: 'Vantrelenol',
  description:
    'An open-chain allylic alcohol from the olefination step: CH3-CH(OH)-CH=CH-CH2-CH3. The olefin geometry ' +
    '(E or Z) follows from the vinylic coupling; the two vinylic protons are close in shift.',
  environments: [
    ['H-1', 'CH3 next to the carbinol carbon'],
    ['H-2', 'carbinol CH (allylic)'],
    ['H-3', 'vinylic CH next to the carbinol carbon'],
    ['H-4', 'vinylic CH next to the CH2'],
    ['H-5', 'allylic CH2'],
    ['H-6', 'terminal CH3'],
  ],
  system: {
    observeMhz: 600.13,
    spins: [
      { label: 'H-1', ppm: 1.27, linewidthHz: 0.9, count: 3 },
      { label: 'H-2', ppm: 4.29, linewidthHz: 1.1 },
      { label: 'H-3', ppm: 5.48, linewidthHz: 1.0 },
      { label: 'H-4', ppm: 5.7, linewidthHz: 1.0 },
      { label: 'H-5', ppm: 2.05, linewidthHz: 1.0, count: 2 },
      { label: 'H-6', ppm: 0.99, linewidthHz: 0.9, count: 3 },
    ],
    couplings: [
      { a: 'H-1', b: 'H-2', jHz: 6.4 },
      { a: 'H-2', b: 'H-3', jHz: 6.6 },
      { a: 'H-2', b: 'H-4', jHz: -1.0 },
      { a: 'H-3', b: 'H-4', jHz: 15.4 },
      { a: 'H-3', b: 'H-5', jHz: -1.3 },
      { a: 'H-4', b: 'H-5', jHz: 6.5 },
      { a: 'H-5', b: 'H-6', jHz: 7.5 },
    ],
  },
  oneD: oneD(600.13, 5),
  cosy: cosy(600.13, 0.7, 6.0),
  seed: 2202,
  snr1D: 400,
  snr2D: 200,
};

const brisquarene: SampleCompound = {
  id: 'brisquarene',
  name: 'Brisquarene',
  description:
    'A 1,2,4-trisubstituted benzene carrying a methoxy group: three ring protons in an ortho/meta pattern. ' +
    'Which ring position carries which substituent follows from the ortho, meta and para couplings.',
  environments: [
    ['H-3', 'aromatic CH between two substituents; meta to H-5, para to H-6'],
    ['H-5', 'aromatic CH, ortho to H-6 and meta to H-3'],
    ['H-6', 'aromatic CH, ortho to H-5; shielded by the neighbouring methoxy'],
    ['H-7', 'OCH3 (a singlet: no DQF-COSY peaks)'],
  ],
  system: {
    observeMhz: 500.13,
    spins: [
      { label: 'H-3', ppm: 7.38, linewidthHz: 0.9 },
      { label: 'H-5', ppm: 7.21, linewidthHz: 0.9 },
      { label: 'H-6', ppm: 6.86, linewidthHz: 0.9 },
      { label: 'H-7', ppm: 3.89, linewidthHz: 0.8, count: 3 },
    ],
    couplings: [
      { a: 'H-5', b: 'H-6', jHz: 8.5 },
      { a: 'H-3', b: 'H-5', jHz: 2.2 },
      { a: 'H-3', b: 'H-6', jHz: 0.4 },
    ],
  },
  oneD: oneD(500.13, 5),
  // Narrow window: 512 F2 points already give 1.0 s and 0.54 Hz per point, and keep the file small.
  cosy: cosy(500.13, 6.6, 7.7, 512),
  seed: 3303,
  snr1D: 400,
  snr2D: 200,
};

export const COMPOUNDS: readonly SampleCompound[] = [quellopyranol, vantrelenol, brisquarene];
