import type { SpinSystem } from '../../../src/core/simulate/spinSystem';

/** Invented four-spin system (a CH-CH-CH2 fragment with a geminal pair), first order at 600 MHz. */
export function fourSpinSystem(linewidthHz: number): SpinSystem {
  return {
    observeMhz: 600,
    spins: [
      { label: 'H-1', ppm: 4.2, linewidthHz },
      { label: 'H-2', ppm: 3.85, linewidthHz },
      { label: 'H-3a', ppm: 2.6, linewidthHz },
      { label: 'H-3b', ppm: 2.45, linewidthHz },
    ],
    couplings: [
      { a: 'H-1', b: 'H-2', jHz: 7.5 },
      { a: 'H-2', b: 'H-3a', jHz: 5 },
      { a: 'H-2', b: 'H-3b', jHz: 8.5 },
      { a: 'H-3a', b: 'H-3b', jHz: -16 },
    ],
  };
}
