/**
 * The acceptance criteria judged against the information limit (bench/accuracyCrb.ts):
 * a tolerance is only demanded where the data hold that much information. Rules, per group of
 * cases (SNR x regime, the regime J >= 0.5 w with tolerance 0.15 Hz or J < 0.5 w with 0.5 Hz):
 * (a) over the cases whose own 1.645 x CRB sigma <= tolerance (the data allow it), the fit's P90 |error|
 *     meets the tolerance (per case, as a group mixes cases whose information differs tenfold);
 * (b) efficiency: P90 of |error| / CRB sigma <= 1.5 x 1.645 in every group (per case: a group mixes
 *     cases whose information differs tenfold, and a median sigma would judge the worst by the typical);
 * (c) coverage at 2 sigma >= 90 % overall and >= 85 % in every group with >= 30 cases;
 * (d) where 5 x 1.645 x median CRB sigma <= the naive P90 (unresolved, no passive coupling), the
 *     fit's P90 is at least 5x below the naive one.
 */
import { summarise, type CaseResult, type GroupSummary } from './accuracyStudy';

export const EFFICIENCY_LIMIT = 1.5;
export const GAIN = 5;

export interface CriteriaRow {
  group: GroupSummary;
  tolerance: number;
  /** The cases of the group whose information limit allows the tolerance. */
  allowed: GroupSummary;
  crbAllows: boolean;
  meetsTolerance: boolean;
  efficient: boolean;
}

const resolved = (r: CaseResult): boolean => r.jOverW >= 0.5;

export function criteriaRows(results: CaseResult[]): CriteriaRow[] {
  const rows: CriteriaRow[] = [];
  for (const snr of [...new Set(results.map((r) => r.snr))].sort((a, b) => a - b)) {
    for (const [name, test, tolerance] of [['J >= 0.5 w', resolved, 0.15], ['J < 0.5 w', (r: CaseResult) => !resolved(r), 0.5]] as const) {
      const inGroup = results.filter((r) => r.snr === snr && test(r));
      const g = summarise(`${name}, SNR ${snr}`, inGroup);
      if (g.n === 0) continue;
      const allowed = summarise(`${name}, SNR ${snr}, 1.645 CRB sigma <= ${tolerance} Hz`, inGroup.filter((r) => 1.645 * r.crbSd <= tolerance));
      rows.push({
        group: g, tolerance, allowed, crbAllows: allowed.n > 0, meetsTolerance: !(allowed.fitP90 > tolerance),
        efficient: g.efficiency <= EFFICIENCY_LIMIT,
      });
    }
  }
  return rows;
}

/** Unresolved cases without a passive coupling, per SNR: where the CRB allows a 5x gain over the naive reading. */
export function gainRows(results: CaseResult[]): { group: GroupSummary; crbAllows: boolean; gain: number }[] {
  return [...new Set(results.map((r) => r.snr))].sort((a, b) => a - b).map((snr) => {
    const g = summarise(`J < 0.5 w, no passive, SNR ${snr}`, results.filter((r) => r.snr === snr && !resolved(r) && r.passiveOverW === 0));
    return { group: g, crbAllows: GAIN * g.crbP90 <= g.naiveP90, gain: g.naiveP90 / g.fitP90 };
  });
}

export function crbCriteriaTable(results: CaseResult[]): string {
  const f = (x: number, d = 3): string => (Number.isFinite(x) ? x.toFixed(d) : 'n/a');
  const yes = (b: boolean): string => (b ? 'yes' : 'NO');
  const lines = [
    '| group | cases | tolerance (Hz) | 1.645 x median CRB sigma (Hz) | fit P90 (Hz) | cases the CRB allows | their fit P90 (Hz) | meets tolerance there | fit P90 / CRB P90 | efficiency (<= 1.5) | coverage |',
    '|---|---|---|---|---|---|---|---|---|---|---|',
  ];
  for (const r of criteriaRows(results)) {
    const g = r.group;
    lines.push(`| ${g.label} | ${g.n} | ${r.tolerance} | ${f(g.crbP90)} | ${f(g.fitP90)} | ${r.allowed.n} | ${f(r.allowed.fitP90)} | ` +
      `${r.crbAllows ? yes(r.meetsTolerance) : 'none'} | ${f(g.p90OverCrb, 2)} | ${f(g.efficiency, 2)} ${yes(r.efficient)} | ${f(g.coverage * 100, 1)} % |`);
  }
  lines.push('', '| group | cases | naive P90 (Hz) | 1.645 x CRB sigma (Hz) | CRB allows 5x | naive / fit P90 |', '|---|---|---|---|---|---|');
  for (const r of gainRows(results)) {
    lines.push(`| ${r.group.label} | ${r.group.n} | ${f(r.group.naiveP90)} | ${f(r.group.crbP90)} | ${r.crbAllows ? 'yes' : 'no'} | ` +
      `${f(r.gain, 1)} ${r.crbAllows ? yes(r.gain >= GAIN) : ''} |`);
  }
  return lines.join('\n');
}
