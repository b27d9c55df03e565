import { fitFrom, lrStat, uncertainty, type FitContext, type FitResult, type Selection } from './fit';
import { apparentFwhm, atBound, boundedCoupling, groupSize, J_MAX_HZ, paramCount, passiveIndex, type ModelSpec } from './model';

/**
 * χ²(1) at p = 0.05 (tables): two models whose residuals differ by less than this many noise variances
 * (along the change of the fitted values) fit "equally well" here.
 */
const CHI2_1_P05 = 3.84;

/** The selection after the multiplet check; ambiguous when two readings of J fit within the noise. */
export interface MultipletChoice extends Selection {
  ambiguous: boolean;
}

/** Parameters of `to` started from `from` with the active coupling set to j; passives copied, new ones set to jp. */
function startFrom(from: FitResult, to: ModelSpec, j: number, jp: number): Float64Array {
  const th = new Float64Array(paramCount(to));
  th.set(from.theta.subarray(0, passiveIndex(from.spec, 0)));
  th[1] = j;
  for (let i = 0; i < to.passives; i++) th[passiveIndex(to, i)] = i < from.spec.passives ? from.theta[passiveIndex(from.spec, i)] ?? 0 : jp;
  return th;
}

/**
 * True when a passive coupling lies within a quarter linewidth of J/2 (the resolvability margin of
 * fit.ts): with it, a 2J reading is the pattern of a CH3 partner (sin 2x cos x = 2 sin x cos² x).
 */
function halfPassive(fit: FitResult, j: number): boolean {
  const w = apparentFwhm(fit.spec, fit.theta);
  return Array.from({ length: fit.spec.passives }, (_, i) => Math.abs(boundedCoupling(fit.theta[passiveIndex(fit.spec, i)] ?? 0)))
    .some((p) => Math.abs(p - j / 2) < 0.25 * w);
}

function groupsOf(spec: ModelSpec): number[] {
  return Array.from({ length: spec.passives }, (_, i) => groupSize(spec, i));
}

/**
 * Models with the active coupling J/n (n = 2, 3) that can give the pattern read as J: (a) one more
 * passive group of n - 1 protons at J/n (a CH2 or CH3 partner: sin(x) cos^(n-1)(x) has its inner
 * lines cancel; sin 2x = 2 sin x cos x exactly, so the CH2 form is tried only when J hits the bound
 * or a passive coupling is J/2, because every antiphase pair has it); (b) an existing passive coupling to 2 or 3 equivalent protons.
 */
function alternatives(fit: FitResult, maxPassive: number, identity: boolean): { spec: ModelSpec; th: Float64Array }[] {
  const j = Math.abs(boundedCoupling(fit.theta[1] ?? 0));
  const groups = groupsOf(fit.spec);
  const out: { spec: ModelSpec; th: Float64Array }[] = [];
  if (identity && fit.spec.passives < maxPassive) {
    const spec: ModelSpec = { line: fit.spec.line, passives: fit.spec.passives + 1, groups: [...groups, 1] };
    out.push({ spec, th: startFrom(fit, spec, j / 2, j / 2) });
  }
  for (const n of [2, 3]) {
    const jn = j / n;
    if (fit.spec.passives < maxPassive && n === 3) {
      const spec: ModelSpec = { line: fit.spec.line, passives: fit.spec.passives + 1, groups: [...groups, n - 1] };
      out.push({ spec, th: startFrom(fit, spec, jn, jn) });
    }
    groups.forEach((g, i) => {
      for (const bigger of [2, 3].filter((b) => b > g)) {
        const spec: ModelSpec = { line: fit.spec.line, passives: fit.spec.passives, groups: groups.map((x, q) => (q === i ? bigger : x)) };
        out.push({ spec, th: startFrom(fit, spec, jn, 0) });
      }
    });
  }
  return out;
}

/**
 * The rule for crowded multiplets. A model with a smaller active coupling J/2 or J/3 (an equivalent-proton
 * group or an extra passive coupling, see `alternatives`) is preferred (1) when the chosen fit puts J at the
 * 20 Hz bound or has a passive coupling at J/2, and the alternative fits as well: its RSS is lower, or higher
 * by less than χ²(1, p = 0.05) = 3.84 noise variances (likelihood-ratio scale of fit.ts); (2) otherwise only
 * when it fits significantly better (statistic above 3.84). When both fit within that margin the data cannot
 * tell them apart: ambiguous (the caller flags it).
 */
export function preferSmallerActive(ctx: FitContext, sel: Selection, maxPassive: number): MultipletChoice {
  const fit = sel.fit;
  const j = Math.abs(boundedCoupling(fit.theta[1] ?? 0));
  const w = apparentFwhm(fit.spec, fit.theta);
  const bound = atBound(fit.theta[1] ?? 0);
  // J/2 below half a linewidth would itself be unresolved: no smaller reading to prefer.
  if (!bound && j / 2 < 0.5 * w) return { ...sel, ambiguous: false };
  const scale = Math.max(1, uncertainty(ctx, fit).chi2Reduced);
  let best: { alt: FitResult; stat: number } | undefined;
  // The CH2 form J/2 + one passive at J/2 is the same pattern as the 2J reading (sin 2x = 2 sin x cos x), so
  // it is tried only where a 2J reading is suspect: J at the bound, or a passive coupling at J/2 (CH3 signature).
  const identity = bound || halfPassive(fit, j);
  // Short runs from every alternative, then the best (lowest RSS among the smaller readings) to convergence.
  let lead: FitResult | undefined;
  for (const a of alternatives(fit, maxPassive, identity)) {
    const alt = fitFrom(ctx, a.spec, a.th, 15);
    if (Math.abs(boundedCoupling(alt.theta[1] ?? 0)) < j - 0.5 * w && (!lead || alt.rss < lead.rss)) lead = alt;
  }
  for (const alt of lead ? [fitFrom(ctx, lead.spec, lead.theta)] : []) {
    const altJ = Math.abs(boundedCoupling(alt.theta[1] ?? 0));
    if (!(altJ < j - 0.5 * w)) continue; // it went back to the large reading
    // Positive: the alternative fits better; above -CHI2_1_P05: as well within the noise.
    const stat = lrStat(ctx, fit, alt, scale);
    // Equal within the noise is enough for the identity form; any other model must fit significantly better.
    if (stat > (identity ? -CHI2_1_P05 : CHI2_1_P05) && (!best || stat > best.stat)) best = { alt, stat };
  }
  if (!best) {
    const notes = bound ? [...sel.notes, `The fit puts J at the ${J_MAX_HZ} Hz bound of H,H couplings and no model with a ` +
      'smaller active coupling fits as well; the value is doubtful.'] : sel.notes;
    return { ...sel, notes, ambiguous: bound };
  }
  const altJ = Math.abs(boundedCoupling(best.alt.theta[1] ?? 0));
  const groups = groupsOf(best.alt.spec).join(', ');
  const ambiguous = best.stat < CHI2_1_P05;
  const why = bound ? `the fit put J at the ${J_MAX_HZ} Hz bound of H,H couplings (${j.toFixed(2)} Hz)` : `J read ${j.toFixed(2)} Hz`;
  const note = `Multiplet check: ${why}; a model with active J = ${altJ.toFixed(2)} Hz and passive couplings to ` +
    `${groups} equivalent protons fits ${ambiguous ? 'as well within the noise' : 'better'} (likelihood-ratio statistic ` +
    `${best.stat.toFixed(1)}; chi-squared 1 degree of freedom, 3.84 at p = 0.05), so the smaller active J is reported` +
    (ambiguous ? '. The two readings cannot be told apart from this trace: check the multiplicity of the partner or the symmetric cross peak.' : '.');
  return { fit: best.alt, notes: [...sel.notes, note], ambiguous };
}
