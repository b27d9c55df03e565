/**
 * Accuracy study of the J measurement on simulated DQF-COSY cross peaks (the simulator in
 * src/core/simulate: time-domain noise, States processing, squared-sine windows, truncation).
 *
 * Definitions used throughout:
 * - linewidth w: the apparent full width at half height of ONE line in the processed F2 spectrum
 *   (natural Lorentzian width, truncated at AQ, windowed, zero-filled), computed from the processing;
 * - J/w: the true active J over that apparent width;
 * - SNR: the largest |value| of the noise-free simulated cross-peak region over the standard
 *   deviation of the noise in the processed spectrum (the simulator's `snr`);
 * - error: measured J minus true J, Hz; covered: |error| <= 2 sigma (the reported jSdHz).
 */
import { measureCrossPeak, type CrossPeakInput } from '../src/core/measure';
import { informationLimitSd } from './accuracyCrb';
import { processedLine } from '../src/core/measure/lineshape';
import { simulateCrossPeakRegion } from '../src/core/simulate/dqfCosy';
import type { SpinSystem } from '../src/core/simulate/spinSystem';
import { ppmToPoint } from '../src/core/spectrum/axis';
import type { DimensionProcessing } from '../src/core/spectrum/processing';

export interface StudyCase {
  jOverW: number;
  hzPerPoint: number;
  snr: number;
  aqS: number;
  naturalHz: number;
  /** Passive coupling of A over the linewidth (0: none). */
  passiveOverW: number;
  shiftDeg: number;
  seed: number;
}

export interface CaseResult extends StudyCase {
  jHz: number;
  widthHz: number;
  fitJ: number;
  fitSd: number;
  naiveJ: number;
  fitErr: number;
  naiveErr: number;
  /** σ(J) of a least-squares fit at the true parameters (bench/accuracyCrb.ts): the information limit. */
  crbSd: number;
  covered: boolean;
  flags: string[];
  passivesFound: number;
  failed?: string;
}

const OBSERVE_MHZ = 600;
/** Shifts relative to the carriers, Hz: A (F2 of the cross peak), X (its F1), M (A's passive partner). */
const NU_A = 100;
const NU_X = -200;
const NU_M = 250;

function f2Processing(c: StudyCase): DimensionProcessing {
  const size = c.hzPerPoint >= 1.5 ? 512 : Math.round(614.4 / c.hzPerPoint / 256) * 256;
  const sw = c.hzPerPoint * size;
  return {
    acquiredPoints: Math.round(c.aqS * sw), spectralWidthHz: sw, carrierHz: 0, size,
    window: { kind: 'sine', power: 2, shiftDeg: c.shiftDeg },
  };
}

const F1: DimensionProcessing = { acquiredPoints: 64, spectralWidthHz: 640, carrierHz: 0, size: 128, window: { kind: 'sine', power: 2, shiftDeg: 90 } };

/** Apparent FWHM of one processed F2 line (the study's linewidth). */
export function apparentWidth(c: StudyCase): number {
  return processedLine(f2Processing(c)).fwhm(c.naturalHz, 0);
}

/** The simulated cross peak of a case; noisy = false gives the same region without noise. */
export function simulateCase(c: StudyCase, noisy = true) {
  const p2 = f2Processing(c);
  const w = apparentWidth(c);
  const j = c.jOverW * w;
  const jp = c.passiveOverW * w;
  const ppm = (hz: number): number => hz / OBSERVE_MHZ;
  const spins = [
    { label: 'A', ppm: ppm(NU_A), linewidthHz: c.naturalHz },
    { label: 'X', ppm: ppm(NU_X), linewidthHz: 2 },
  ];
  const couplings = [{ a: 'A', b: 'X', jHz: j }];
  if (jp > 0) {
    spins.push({ label: 'M', ppm: ppm(NU_M), linewidthHz: 2 });
    couplings.push({ a: 'A', b: 'M', jHz: jp });
  }
  const system: SpinSystem = { observeMhz: OBSERVE_MHZ, spins, couplings };
  const cols = Math.max(64, Math.ceil(140 / c.hzPerPoint));
  const sim = simulateCrossPeakRegion(system, 'X', 'A', { f1: F1, f2: p2, rows: 24, cols, ...(noisy ? { noise: { seed: c.seed, snr: c.snr } } : {}) });
  const s = sim.spectrum;
  // The extent a picker would give: the multiplet span plus one linewidth each side.
  const half2 = (j + jp) / 2 + w;
  const half1 = j / 2 + 12;
  const col = (hz: number): number => Math.round(ppmToPoint(s.f2, ppm(hz)));
  const row = (hz: number): number => Math.round(ppmToPoint(s.f1, ppm(hz)));
  const peak: CrossPeakInput = {
    f1Ppm: ppm(NU_X), f2Ppm: ppm(NU_A),
    extent: {
      f1FromPpm: ppm(NU_X + half1), f1ToPpm: ppm(NU_X - half1), f2FromPpm: ppm(NU_A + half2), f2ToPpm: ppm(NU_A - half2),
      row0: row(NU_X + half1), row1: row(NU_X - half1), col0: col(NU_A + half2), col1: col(NU_A - half2),
    },
  };
  return { spectrum: s, peak, jHz: j, widthHz: w, passiveHz: jp, noiseSigma: sim.noiseSigma };
}

export function runCase(c: StudyCase): CaseResult {
  const { spectrum, peak, jHz, widthHz, passiveHz, noiseSigma } = simulateCase(c);
  const truth = { centreHz: NU_A, jHz, naturalHz: c.naturalHz, passiveHz: passiveHz > 0 ? [passiveHz] : [] };
  const base = { ...c, jHz, widthHz, crbSd: informationLimitSd(simulateCase(c, false).spectrum, peak, noiseSigma, truth) };
  try {
    const fit = measureCrossPeak(spectrum, peak, { maxPassive: 2 });
    const naive = measureCrossPeak(spectrum, peak, { method: 'naive' });
    const fitErr = fit.jHz - jHz;
    return {
      ...base, fitJ: fit.jHz, fitSd: fit.jSdHz, naiveJ: naive.jHz, fitErr, naiveErr: naive.jHz - jHz,
      covered: Math.abs(fitErr) <= 2 * fit.jSdHz, flags: fit.flags, passivesFound: fit.passiveHz.length,
    };
  } catch (e) {
    const msg = e instanceof Error ? e.message : String(e);
    return { ...base, fitJ: NaN, fitSd: NaN, naiveJ: NaN, fitErr: NaN, naiveErr: NaN, covered: false, flags: [], passivesFound: 0, failed: msg };
  }
}

/** All combinations of the given levels, one seed each (seeds differ per case). */
export function studyGrid(levels: {
  jOverW: number[]; hzPerPoint: number[]; snr: number[]; aqS: number[]; naturalHz: number[]; passiveOverW: number[]; shiftDeg: number[];
}, seed0 = 1): StudyCase[] {
  const out: StudyCase[] = [];
  let seed = seed0;
  for (const jOverW of levels.jOverW) for (const hzPerPoint of levels.hzPerPoint) for (const snr of levels.snr)
    for (const aqS of levels.aqS) for (const naturalHz of levels.naturalHz) for (const passiveOverW of levels.passiveOverW)
      for (const shiftDeg of levels.shiftDeg) out.push({ jOverW, hzPerPoint, snr, aqS, naturalHz, passiveOverW, shiftDeg, seed: seed++ });
  return out.filter(realistic);
}

/**
 * The ranges (J/w 0.4-5, F2 0.3-2 Hz/point, SNR 20-500) at widths typical of a DQF-COSY:
 * F2 AQ 0.25 or 0.5 s with a squared cosine bell and natural widths 0.5 or 1.5 Hz give apparent
 * widths of 2.2-4.7 Hz; cases whose J falls outside 0.8-18 Hz (typical 1H-1H couplings,
 * references.md handbook ranges) or that are not zero-filled are dropped by `realistic`.
 */
export const FULL_GRID = {
  jOverW: [0.4, 0.5, 0.7, 1, 2, 5], hzPerPoint: [0.3, 0.6, 1.2, 2], snr: [20, 50, 150, 500],
  aqS: [0.25, 0.5], naturalHz: [0.5, 1.5], passiveOverW: [0, 1.5], shiftDeg: [90],
};

/** J limits of the study, Hz: typical 1H-1H couplings (references.md, handbook ranges [mem]). */
export const J_RANGE_HZ = [0.8, 18] as const;

/**
 * Realistic cases: J within J_RANGE_HZ, and the F2 FID zero-filled at least 1.5 times
 * (AQ x Hz/point <= 2/3; zero-filling at least once is common practice).
 */
export function realistic(c: StudyCase): boolean {
  const j = c.jOverW * apparentWidth(c);
  return j >= J_RANGE_HZ[0] && j <= J_RANGE_HZ[1] && c.aqS * c.hzPerPoint <= 2 / 3 + 1e-9;
}

export function percentile(values: number[], q: number): number {
  const v = values.filter(Number.isFinite).sort((a, b) => a - b);
  if (v.length === 0) return NaN;
  const idx = Math.min(v.length - 1, Math.max(0, Math.ceil(q * v.length) - 1));
  return v[idx] ?? NaN;
}

export interface GroupSummary {
  label: string;
  n: number;
  failed: number;
  fitP90: number;
  naiveP90: number;
  /** Median reported sigma of the fit, and 1.645 times it: the P90 |error| an unbiased estimator with that sigma would show. */
  medianSd: number;
  efficientP90: number;
  /** 1.645 x the median information-limit sigma (bench/accuracyCrb.ts), and fit P90 over it. */
  crbP90: number;
  p90OverCrb: number;
  /**
   * Efficiency ratio per case: P90 of |error| / CRB sigma, over 1.645 (1 for an efficient unbiased fit).
   * Unlike fit P90 / (1.645 x median CRB sigma) it is not dominated by the least informative cases of a mixed group.
   */
  efficiency: number;
  coverage: number;
}

export function summarise(label: string, rs: CaseResult[]): GroupSummary {
  const ok = rs.filter((r) => !r.failed);
  return {
    label, n: rs.length, failed: rs.length - ok.length,
    fitP90: percentile(ok.map((r) => Math.abs(r.fitErr)), 0.9),
    naiveP90: percentile(ok.map((r) => Math.abs(r.naiveErr)), 0.9),
    medianSd: percentile(ok.map((r) => r.fitSd), 0.5),
    efficientP90: 1.645 * percentile(ok.map((r) => r.fitSd), 0.5),
    crbP90: 1.645 * percentile(ok.map((r) => r.crbSd), 0.5),
    p90OverCrb: percentile(ok.map((r) => Math.abs(r.fitErr)), 0.9) / (1.645 * percentile(ok.map((r) => r.crbSd), 0.5)),
    efficiency: percentile(ok.map((r) => Math.abs(r.fitErr) / r.crbSd), 0.9) / 1.645,
    coverage: ok.length ? ok.filter((r) => r.covered).length / ok.length : NaN,
  };
}

export function runAccuracyStudy(cases: StudyCase[] = studyGrid(FULL_GRID)): { results: CaseResult[]; groups: GroupSummary[] } {
  const results = cases.map(runCase);
  const resolved = results.filter((r) => r.jOverW >= 0.5);
  const unresolved = results.filter((r) => r.jOverW < 0.5);
  const groups: GroupSummary[] = [summarise('all, J >= 0.5 w', resolved), summarise('all, J < 0.5 w', unresolved)];
  for (const snr of [...new Set(results.map((r) => r.snr))]) {
    groups.push(summarise(`J >= 0.5 w, SNR ${snr}`, resolved.filter((r) => r.snr === snr)));
    groups.push(summarise(`J < 0.5 w, SNR ${snr}`, unresolved.filter((r) => r.snr === snr)));
  }
  groups.push(summarise('J < 0.5 w, no passive coupling', unresolved.filter((r) => r.passiveOverW === 0)));
  for (const snr of [...new Set(results.map((r) => r.snr))]) {
    groups.push(summarise(`J < 0.5 w, no passive coupling, SNR ${snr}`, unresolved.filter((r) => r.passiveOverW === 0 && r.snr === snr)));
  }
  const by = <K extends keyof StudyCase>(key: K, name: string): void => {
    for (const v of [...new Set(results.map((r) => r[key]))]) groups.push(summarise(`${name} = ${v}`, results.filter((r) => r[key] === v)));
  };
  by('jOverW', 'J/w');
  by('snr', 'SNR');
  by('hzPerPoint', 'Hz/point');
  by('aqS', 'AQ (s)');
  by('passiveOverW', 'passive J / w');
  return { results, groups };
}

export function markdownTable(groups: GroupSummary[]): string {
  const f = (x: number, d = 3): string => (Number.isFinite(x) ? x.toFixed(d) : 'n/a');
  const lines = [
    '| group | cases | failed | fit P90 abs error (Hz) | naive P90 abs error (Hz) | median fit sigma (Hz) | 1.645 x median sigma (Hz) | 1.645 x median CRB sigma (Hz) | fit P90 / CRB P90 | efficiency (P90 of error / CRB sigma, / 1.645) | coverage at 2 sigma |',
    '|---|---|---|---|---|---|---|---|---|---|---|',
  ];
  for (const g of groups) {
    lines.push(`| ${g.label} | ${g.n} | ${g.failed} | ${f(g.fitP90)} | ${f(g.naiveP90)} | ${f(g.medianSd)} | ${f(g.efficientP90)} | ${f(g.crbP90)} | ${f(g.p90OverCrb, 2)} | ${f(g.efficiency, 2)} | ${f(g.coverage * 100, 1)} % |`);
  }
  return lines.join('\n');
}

/** The acceptance criteria, checked separately at each SNR of the results. */
export function criteriaTable(results: CaseResult[]): string {
  const yes = (ok: boolean): string => (ok ? 'yes' : 'NO');
  const f = (x: number): string => (Number.isFinite(x) ? x.toFixed(3) : 'n/a');
  const lines = [
    '| SNR | P90 J >= 0.5 w (<= 0.15 Hz) | P90 J < 0.5 w (<= 0.5 Hz) | naive / fit P90, J < 0.5 w, no passive (>= 5) | coverage at 2 sigma (>= 90 %) |',
    '|---|---|---|---|---|',
  ];
  for (const snr of [...new Set(results.map((r) => r.snr))].sort((a, b) => a - b)) {
    const at = results.filter((r) => r.snr === snr);
    const res = summarise('', at.filter((r) => r.jOverW >= 0.5));
    const unr = summarise('', at.filter((r) => r.jOverW < 0.5));
    const plain = summarise('', at.filter((r) => r.jOverW < 0.5 && r.passiveOverW === 0));
    const ratio = plain.naiveP90 / plain.fitP90;
    const cov = summarise('', at).coverage;
    lines.push(`| ${snr} | ${f(res.fitP90)} ${yes(res.fitP90 <= 0.15)} | ${f(unr.fitP90)} ${yes(unr.fitP90 <= 0.5)} | ` +
      `${f(ratio)} ${yes(ratio >= 5)} | ${(cov * 100).toFixed(1)} % ${yes(cov >= 0.9)} |`);
  }
  return lines.join('\n');
}
