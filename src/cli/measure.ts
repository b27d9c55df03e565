import { MeasureError, measureCrossPeak, measurePair, type Measurement, type PairMeasurement } from '../core/measure';
import { nearestCrossPeak, pickCrossPeaks, type CrossPeak } from '../core/peaks';
import type { Spectrum, Spectrum2D } from '../core/spectrum/spectrum';
import { InputError, MeasureFailed } from './errors';
import { fixed, formatTable, round } from './table';

export interface MeasureOptions {
  readonly method: 'fit' | 'naive';
  readonly dimension: 'F2' | 'F1';
  readonly threshold: number | undefined;
}

export interface MeasurementJson {
  file: string;
  peak: number;
  f2_ppm: number;
  f1_ppm: number;
  kind: 'cross' | 'diagonal';
  partner: number | null;
  j_hz: number;
  j_sd_hz: number;
  /** J and its sd measured at the symmetric cross peak (null when there is none or it failed). */
  partner_j_hz: number | null;
  partner_j_sd_hz: number | null;
  passive_hz: number[];
  passive_sd_hz: number[];
  linewidth_hz: number;
  linewidth_sd_hz: number;
  method: 'fit' | 'naive';
  dimension: 'F2' | 'F1';
  centre_ppm: number;
  chi2_reduced: number;
  lineshape: string;
  flags: string[];
  notes: string[];
}

export function require2D(file: string, s: Spectrum): Spectrum2D {
  if (s.dims !== 2) throw new InputError(`${file}: measure needs a 2D DQF-COSY spectrum; this file is 1D`);
  return s;
}

function toJson(file: string, index: number, peak: CrossPeak, m: Measurement | PairMeasurement): MeasurementJson {
  const partner = 'partner' in m ? m.partner : null;
  return {
    file,
    peak: index,
    f2_ppm: round(peak.f2Ppm, 5),
    f1_ppm: round(peak.f1Ppm, 5),
    kind: peak.kind,
    partner: peak.partner,
    j_hz: round(m.jHz, 3),
    j_sd_hz: round(m.jSdHz, 3),
    partner_j_hz: partner ? round(partner.jHz, 3) : null,
    partner_j_sd_hz: partner ? round(partner.jSdHz, 3) : null,
    passive_hz: m.passiveHz.map((j) => round(j, 3)),
    passive_sd_hz: m.passiveSdHz.map((j) => round(j, 3)),
    linewidth_hz: round(m.linewidthHz, 3),
    linewidth_sd_hz: round(m.linewidthSdHz, 3),
    method: m.method,
    dimension: m.dimension,
    centre_ppm: round(m.centrePpm, 5),
    chi2_reduced: round(m.chi2Reduced, 3),
    lineshape: m.lineshape,
    flags: [...m.flags],
    notes: [...m.notes],
  };
}

function measureOne(file: string, s: Spectrum2D, peaks: readonly CrossPeak[], index: number, noise: number, o: MeasureOptions): MeasurementJson {
  const peak = peaks[index];
  if (!peak) throw new MeasureFailed(`${file}: no peak ${index}`);
  try {
    const opts = { method: o.method, dimension: o.dimension, noise };
    // With a symmetric partner, both are measured and reconciled (CH2/CH3 partners read n J on one side).
    const partner = peak.partner === null ? undefined : peaks[peak.partner];
    return toJson(file, index, peak, partner ? measurePair(s, peak, partner, opts) : measureCrossPeak(s, peak, opts));
  } catch (e) {
    if (e instanceof MeasureError) throw new MeasureFailed(`${file}: cross peak at F2 ${peak.f2Ppm.toFixed(4)} / F1 ${peak.f1Ppm.toFixed(4)} ppm: ${e.message}`);
    throw e;
  }
}

/** J at the cross peak nearest (f2, f1); exit 1 when there is none near or the measurement fails. */
export function measureAt(file: string, s: Spectrum2D, f2Ppm: number, f1Ppm: number, o: MeasureOptions): MeasurementJson {
  const { peaks, noise } = pickCrossPeaks(s, o.threshold === undefined ? {} : { threshold: o.threshold });
  const index = nearestCrossPeak(peaks, f2Ppm, f1Ppm);
  if (index === null) {
    throw new MeasureFailed(`${file}: no cross peak above the threshold near F2 ${f2Ppm} / F1 ${f1Ppm} ppm (${peaks.length} peaks picked; try 'couplet peaks ${file}')`);
  }
  return measureOne(file, s, peaks, index, noise, o);
}

/** Every off-diagonal cross peak; failures are reported per peak, not fatal. */
export function measureAll(file: string, s: Spectrum2D, o: MeasureOptions): { results: MeasurementJson[]; failures: string[] } {
  const { peaks, noise } = pickCrossPeaks(s, o.threshold === undefined ? {} : { threshold: o.threshold });
  const results: MeasurementJson[] = [];
  const failures: string[] = [];
  peaks.forEach((p, i) => {
    if (p.kind !== 'cross') return;
    try {
      results.push(measureOne(file, s, peaks, i, noise, o));
    } catch (e) {
      if (!(e instanceof MeasureFailed)) throw e;
      failures.push(e.message);
    }
  });
  return { results, failures };
}

export function measurementsText(ms: readonly MeasurementJson[]): string {
  const rows = ms.map((m) => [
    m.file,
    String(m.peak),
    fixed(m.f2_ppm, 4),
    fixed(m.f1_ppm, 4),
    `${fixed(m.j_hz, 2)} ± ${fixed(m.j_sd_hz, 2)}`,
    m.passive_hz.map((j) => fixed(j, 1)).join(', ') || '-',
    fixed(m.linewidth_hz, 2),
    `${m.method} ${m.dimension}`,
    m.flags.join(', ') || '-',
  ]);
  return formatTable(['file', 'peak', 'F2 ppm', 'F1 ppm', 'J Hz (± sd)', 'passive Hz', 'width Hz', 'method', 'flags'], rows);
}

/** What each flag means for the chemist, printed once below a table for the flags that occur. */
const FLAG_MEANINGS: Readonly<Record<string, string>> = {
  unresolved: 'J is not clearly above half the linewidth: the antiphase lines cancel and the value leans on the lineshape model; confirm it another way.',
  resolution_limited: 'the digital resolution is too coarse for the stated precision.',
  second_order_suspected: 'the shift difference is under ten times J: line spacings may not be coupling constants; simulate the spin system.',
  fit_poor: 'the residual is well above the noise (overlap, more couplings, phase or baseline); sd was inflated; inspect the traces.',
  f1_coarse: 'measured in F1, whose resolution is several Hz per point.',
  equivalent_partner: 'one of the two symmetric cross peaks reads 2 or 3 times the other (a CH2/CH3 partner): the smaller value is J.',
  ambiguous_multiplet: 'a smaller J with a CH2/CH3 neighbour or one more coupling fits this multiplet as well as the larger reading; the smaller is reported; check the multiplicity.',
  partner_disagrees: 'the symmetric cross peak gives a different J (not a multiple of 2 or 3); check for overlap or second-order effects.',
};

/** A legend for the flags in a table, once each; `--json` carries each measurement's full notes. */
export function notesText(ms: readonly MeasurementJson[]): string {
  const flags = [...new Set(ms.flatMap((m) => m.flags))].sort();
  return flags.map((f) => `${f}: ${FLAG_MEANINGS[f] ?? 'see the notes in --json output.'}\n`).join('');
}
