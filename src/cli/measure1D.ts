/** `couplet measure` on a 1D ¹H spectrum: the first-order analysis of a multiplet region. */
import { pickMultiplets1D } from '../core/peaks';
import { analyseMultiplet, type MultipletAnalysis } from '../core/report/multiplet';
import { MAX_DISTANCE_PPM, autoRegion, multipletAt } from '../core/report/multipletRegion';
import type { Spectrum1D } from '../core/spectrum/spectrum';
import { InputError, MeasureFailed } from './errors';
import { fixed, formatTable, round } from './table';

export interface MultipletAnalysisJson {
  file: string;
  from_ppm: number;
  to_ppm: number;
  centre_ppm: number;
  integral: number;
  multiplicity: string;
  /** What may be reported: [] when a flag says a first-order J would be wrong. */
  couplings: { j_hz: number; j_sd_hz: number; count: number }[];
  linewidth_hz: number;
  /** chi-squared over its expectation for noise alone (null when no lineshape was fitted). */
  chi2_reduced: number | null;
  lines: { ppm: number; height: number }[];
  flags: string[];
  notes: string[];
}

export interface Region1D {
  /** Both given: this region; else `f2` picks the automatic multiplet there; else every multiplet. */
  from?: number;
  to?: number;
  f2?: number;
}

function toJson(file: string, a: MultipletAnalysis): MultipletAnalysisJson {
  return {
    file,
    from_ppm: round(a.fromPpm, 5),
    to_ppm: round(a.toPpm, 5),
    centre_ppm: round(a.centrePpm, 5),
    integral: round(a.integral, 6),
    multiplicity: a.multiplicity,
    couplings: a.couplings.map((c) => ({ j_hz: round(c.jHz, 3), j_sd_hz: round(c.sdHz, 3), count: c.count })),
    linewidth_hz: round(a.linewidthHz, 3),
    chi2_reduced: a.fit ? round(a.fit.chi2Reduced, 3) : null,
    lines: a.lines.map((l) => ({ ppm: round(l.ppm, 5), height: round(l.height, 6) })),
    flags: [...a.flags],
    notes: [...a.notes],
  };
}

function analyse(file: string, s: Spectrum1D, from: number, to: number): MultipletAnalysisJson {
  try {
    return toJson(file, analyseMultiplet(s, from, to));
  } catch (e) {
    if (e instanceof RangeError) throw new InputError(`${file}: ${e.message}`);
    throw e;
  }
}

/** The analysis of one region (given, or the multiplet at --f2) or of every picked multiplet. */
export function measure1D(file: string, s: Spectrum1D, r: Region1D, threshold: number | undefined): MultipletAnalysisJson[] {
  if ((r.from === undefined) !== (r.to === undefined)) throw new InputError('a 1D region needs both --from PPM and --to PPM');
  if (r.from !== undefined && r.to !== undefined) return [analyse(file, s, r.from, r.to)];
  const { multiplets } = pickMultiplets1D(s, threshold === undefined ? {} : { threshold });
  const mhz = s.axis.observeMhz;
  if (r.f2 !== undefined) {
    const i = multipletAt(multiplets, r.f2, mhz);
    if (i === null) throw new MeasureFailed(`${file}: no multiplet above the threshold within ${MAX_DISTANCE_PPM} ppm of ${r.f2} ppm (try --from PPM --to PPM)`);
    const [from, to] = autoRegion(multiplets, i, mhz);
    return [analyse(file, s, from, to)];
  }
  return multiplets.map((_, i) => {
    const [from, to] = autoRegion(multiplets, i, mhz);
    return analyse(file, s, from, to);
  });
}

/** The table, the notes of each multiplet, and the second-order caveat. */
export function multipletsText(ms: readonly MultipletAnalysisJson[]): string {
  const rows = ms.map((m) => [
    m.file,
    `${fixed(m.from_ppm, 3)}..${fixed(m.to_ppm, 3)}`,
    fixed(m.centre_ppm, 4),
    m.multiplicity,
    m.couplings.map((c) => `${fixed(c.j_hz, 2)} ± ${fixed(c.j_sd_hz, 2)}`).join(', ') || '-',
    fixed(m.linewidth_hz, 2),
    m.integral.toPrecision(4),
    m.flags.join(', ') || '-',
  ]);
  const table = formatTable(['file', 'region ppm', 'centre ppm', 'mult.', 'J Hz (± sd)', 'width Hz', 'integral', 'flags'], rows);
  // Notes say why a multiplet is m or a J rests on the lineshape: the chemist must see them.
  const notes = ms.flatMap((m) => m.notes.map((n) => `${fixed(m.centre_ppm, 2)} ppm: ${n}\n`));
  return table + notes.join('') + SECOND_ORDER_CAVEAT;
}

/** A region alone carries no partner shifts, so the Δν/J test of the report cannot run here. */
export const SECOND_ORDER_CAVEAT =
  'Second order is judged here from roofing alone; `couplet report` also tests shift difference / J against the assigned partners, ' +
  'and a multiplet it writes as m should not be read from this table.\n';
