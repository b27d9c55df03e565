/**
 * Dihedral estimates for the vicinal pairs a structure note asks for (front matter `karplus:`):
 * the adopted J ± σ of the pair from the coupling network (the value the SI line uses), inverted
 * through Haasnoot–de Leeuw–Altona with the chemist's substituents and through both Karplus
 * relations for comparison. Every doubt the J carries is passed on to the angles in plain words.
 */
import type { CouplingNetwork, PairEntry } from '../network/network';
import type { KarplusRequest, KarplusSubstituent } from '../notes/karplusRequests';
import { KARPLUS_1959_RELATION, KARPLUS_1963_RELATION, KARPLUS_CAUTION, haasnootRelation, type KarplusRelation } from './karplus';
import { degText } from './karplusFormat';
import { anglesForJ, type AngleInterval } from './karplusInverse';
import type { OneDDisagreement } from './siEntries';

/** Width of the band, in standard deviations of the adopted J. */
export const KARPLUS_K = 2;

export interface RelationAngles {
  readonly relation: string;
  readonly source: string;
  /** The substituents used (Haasnoot et al. only; empty for the Karplus relations). */
  readonly substituents: readonly KarplusSubstituent[];
  readonly intervals: readonly AngleInterval[];
  readonly notes: readonly string[];
}

export interface KarplusEstimate {
  readonly pair: readonly [string, string];
  /** The adopted J (its magnitude: vicinal ³J(H,H) is positive), null when the pair is not measured. */
  readonly jHz: number | null;
  readonly sdHz: number | null;
  readonly method: string | null;
  readonly flags: readonly string[];
  readonly k: number;
  /** Haasnoot et al. first, then Karplus 1959 and 1963; empty when J is not measured. */
  readonly relations: readonly RelationAngles[];
  /** About the J itself (not measured, flagged, inconsistent); every one says what it means for the angles. */
  readonly notes: readonly string[];
  readonly caution: string;
}

/** What each quality flag means for an angle read from the J (README "Reading the numbers"). */
const FLAG_DOUBT: Readonly<Record<string, string>> = {
  unresolved: 'J is flagged unresolved (below about half the linewidth; the value leans on the lineshape model)',
  second_order_suspected: 'J is flagged second-order suspected (first-order analysis, and so this J, may be wrong)',
  fit_poor: 'the fit that gave J describes its cross peak poorly (fit_poor)',
  partner_disagrees: 'the symmetric cross peak gives a different J (partner_disagrees)',
  ambiguous_multiplet: 'the multiplet also fits a smaller or larger J (ambiguous_multiplet)',
  equivalent_partner: 'J was read from a trace split by an equivalent-proton partner (equivalent_partner)',
  resolution_limited: 'the digital resolution is coarse for the claimed precision (resolution_limited)',
  f1_coarse: 'J was measured in the coarse F1 dimension (f1_coarse)',
};

function findPair(net: CouplingNetwork, [a, b]: readonly [string, string]): PairEntry | undefined {
  return net.pairs.find((p) => (p.atoms[0] === a && p.atoms[1] === b) || (p.atoms[0] === b && p.atoms[1] === a));
}

function doubts(p: PairEntry): string[] {
  const out = p.adopted.flags.map((f) => FLAG_DOUBT[f] ?? `J carries the flag ${f}`);
  if (!p.consistent) out.push('its measurements disagree by more than 3 combined sd (see Consistency)');
  if (p.adopted.jHz < 0) out.push(`J was recorded as ${p.adopted.jHz.toFixed(2)} Hz; vicinal ³J(H,H) is positive, so its magnitude is used: is this pair really vicinal?`);
  return out.map((d) => `${d}: the angles inherit that doubt.`);
}

/** Smallest and largest J of the relation over a 0.5° grid (finer than any angle we report). */
function rangeOf(rel: KarplusRelation): { min: number; max: number; atMax: number } {
  let min = Infinity;
  let max = -Infinity;
  let atMax = 0;
  for (let phi = -180; phi <= 180; phi += 0.5) {
    const j = rel.j(phi);
    min = Math.min(min, j);
    if (j > max) [max, atMax] = [j, phi];
  }
  return { min, max, atMax };
}

function anglesWith(rel: KarplusRelation, subs: readonly KarplusSubstituent[], j: number, sd: number): RelationAngles {
  const inv = anglesForJ(rel, j, sd, { k: KARPLUS_K });
  const notes = [...inv.notes];
  const r = rangeOf(rel);
  // The band reaches the relation but J itself does not: the angles rest on the tail of the band only.
  if (inv.intervals.length > 0 && j > r.max) {
    // Signed: with substituents the relation is not even in φ (its maximum is at one sign only); −180° is 180°.
    notes.push(`J lies above the largest value of ${rel.name} (${r.max.toFixed(2)} Hz, at φ = ${degText(r.atMax <= -180 ? 180 : r.atMax)}); only the lower part of the band reaches it.`);
  }
  if (inv.intervals.length > 0 && j < r.min) notes.push(`J lies below the smallest value of ${rel.name} (${r.min.toFixed(2)} Hz); only the upper part of the band reaches it.`);
  return { relation: inv.relation, source: inv.source, substituents: subs, intervals: inv.intervals, notes };
}

function notMeasured(pair: readonly [string, string], net: CouplingNetwork): string {
  const unknown = pair.filter((l) => !net.atoms.includes(l));
  // A label no sidecar knows is most often a typo in the request.
  const why = unknown.length > 0 ? ` (${unknown.join(' and ')} appear${unknown.length === 1 ? 's' : ''} in no sidecar: check the label)` : '';
  return `J(${pair[0]}, ${pair[1]}) is not measured in this compound's sidecars${why}: no angle can be estimated.`;
}

/** The 1D multiplet of either atom reading another J for this pair (siEntries.oneDDisagreements). */
function oneDDoubts(pair: readonly [string, string], oneD: readonly OneDDisagreement[]): string[] {
  return oneD.filter((d) => (d.atom === pair[0] && d.partner === pair[1]) || (d.atom === pair[1] && d.partner === pair[0]))
    .map((d) => `the 1D multiplet of ${d.atom} reads ${d.oneDJHz.toFixed(2)} ± ${d.oneDSdHz.toFixed(2)} Hz for this pair, more than 3 combined sd and 0.2 Hz from this J: the angles inherit that doubt.`);
}

/** One estimate per request, in the note's order; `oneD`: pairs whose 1D splitting disagrees with the adopted J. */
export function karplusEstimates(requests: readonly KarplusRequest[], net: CouplingNetwork, oneD: readonly OneDDisagreement[] = []): KarplusEstimate[] {
  return requests.map((r) => {
    const p = findPair(net, r.pair);
    const base = { pair: r.pair, k: KARPLUS_K, caution: KARPLUS_CAUTION };
    if (!p) {
      return {
        ...base, jHz: null, sdHz: null, method: null, flags: [], relations: [],
        notes: [notMeasured(r.pair, net)],
      };
    }
    const j = Math.abs(p.adopted.jHz);
    const sd = p.adopted.sdHz;
    const relations = [
      anglesWith(haasnootRelation(r.substituents), r.substituents, j, sd),
      anglesWith(KARPLUS_1959_RELATION, [], j, sd),
      anglesWith(KARPLUS_1963_RELATION, [], j, sd),
    ];
    const notes = [
      ...doubts(p),
      ...oneDDoubts(r.pair, oneD),
      `The band is J ± ${KARPLUS_K}σ of the measurement only; the relations' own scatter is not included.`,
    ];
    return { ...base, jHz: j, sdHz: sd, method: p.adopted.method, flags: [...p.adopted.flags], relations, notes };
  });
}
