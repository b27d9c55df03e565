import { describe, expect, it } from 'vitest';
import { buildNetwork } from '../../../src/core/network';
import type { KarplusRequest, KarplusSubstituent } from '../../../src/core/notes/karplusRequests';
import { newSidecar } from '../../../src/core/sidecar';
import type { Coupling } from '../../../src/core/sidecar/types';
import { HUGGINS_DELTA_CHI, KARPLUS_CAUTION, haasnoot, karplus1959, karplus1963 } from '../../../src/core/report/karplus';
import type { AngleInterval } from '../../../src/core/report/karplusInverse';
import { karplusEstimates, type KarplusEstimate, type RelationAngles } from '../../../src/core/report/karplusReport';
import { degText, intervalText, karplusJson, karplusMarkdown, karplusTex, texText } from '../../../src/core/report/karplusFormat';

const HASH = 'ab'.repeat(32);
const C = HUGGINS_DELTA_CHI.C ?? 0;
const O = HUGGINS_DELTA_CHI.O ?? 0;
const SUBS: KarplusSubstituent[] = [{ name: 'C', deltaChi: C, xi: -1 }, { name: 'C', deltaChi: C, xi: -1 }, { name: 'O', deltaChi: O, xi: 1 }];

function coupling(a: string, b: string, jHz: number, jSdHz: number, flags: string[] = []): Coupling {
  return { atoms: [a, b], jHz, jSdHz, method: 'fit', dimension: 'F2', picks: [], flags };
}

function estimate(jHz: number, sdHz: number, subs: KarplusSubstituent[] = SUBS, flags: string[] = []): KarplusEstimate {
  const net = buildNetwork([{ file: 'cosy.jdx.couplet.yaml', sidecar: { ...newSidecar('cosy.jdx', HASH), couplings: [coupling('H-3', 'H-4', jHz, sdHz, flags)] } }]);
  const req: KarplusRequest = { pair: ['H-4', 'H-3'], substituents: subs, line: 3 };
  const [e] = karplusEstimates([req], net);
  if (!e) throw new Error('no estimate');
  return e;
}

const byName = (e: KarplusEstimate, name: RegExp): RelationAngles => {
  const r = e.relations.find((x) => name.test(x.relation));
  if (!r) throw new Error(`no relation ${String(name)}`);
  return r;
};
const exacts = (r: RelationAngles): number[] => r.intervals.flatMap((i) => i.exactDeg).map((x) => (x > 180 ? x - 360 : x));
const contains = (r: RelationAngles, phi: number): boolean =>
  r.intervals.some((i) => (phi >= i.fromDeg && phi <= i.toDeg) || (phi + 360 >= i.fromDeg && phi + 360 <= i.toDeg));

describe('karplusEstimates: the adopted J of a requested pair, inverted through three relations', () => {
  it('finds the pair in either order and gives Haasnoot et al., Karplus 1959 and 1963, with the caution', () => {
    const e = estimate(9.15, 0.29);
    expect(e.jHz).toBe(9.15);
    expect(e.sdHz).toBe(0.29);
    expect(e.k).toBe(2);
    expect(e.relations.map((r) => r.relation)).toEqual(['Haasnoot–de Leeuw–Altona (3 substituents)', 'Karplus 1959', 'Karplus 1963']);
    expect(e.caution).toBe(KARPLUS_CAUTION);
    expect(e.notes.join(' ')).toMatch(/relations' own scatter is not included/);
  });

  it('round trip: each relation gives back J at every exact angle it reports', () => {
    const e = estimate(9.15, 0.29);
    const fns: [RegExp, (phi: number) => number][] = [[/Haasnoot/, (p) => haasnoot(p, SUBS)], [/1959/, karplus1959], [/1963/, (p) => karplus1963(p)]];
    for (const [name, f] of fns) {
      const xs = exacts(byName(e, name));
      expect(xs.length, String(name)).toBeGreaterThan(0);
      for (const x of xs) expect(f(x)).toBeCloseTo(9.15, 6);
    }
  });

  it('the 0°, 90° and 180° check values of references.md lie inside the band of their own J', () => {
    // Haasnoot et al. 1980, general set, no substituents: 13.050, 0.000, 14.670 Hz; two C: 11.671, 0.419, 13.291 Hz.
    const twoC: KarplusSubstituent[] = [{ name: 'C', deltaChi: C, xi: 1 }, { name: 'C', deltaChi: C, xi: -1 }];
    const cases: [KarplusSubstituent[], number, number][] = [[[], 0, 13.05], [[], 90, 0], [[], 180, 14.67], [twoC, 0, 11.671], [twoC, 90, 0.419], [twoC, 180, 13.291]];
    for (const [subs, phi, j] of cases) expect(contains(byName(estimate(j, 0.05, subs), /Haasnoot/), phi), `${subs.length} C at ${phi}°`).toBe(true);
    // Karplus 1959 (J. Chem. Phys. 30 (1959) 11): 8.22 Hz at 0°, 9.22 Hz at 180°; Karplus 1963 [mem]: 11.0, 2.0, 13.0 Hz.
    expect(contains(byName(estimate(8.22, 0.05), /1959/), 0)).toBe(true);
    expect(contains(byName(estimate(9.22, 0.05), /1959/), 180)).toBe(true);
    expect(contains(byName(estimate(2.0, 0.05), /1963/), 90)).toBe(true);
    expect(contains(byName(estimate(13.0, 0.05), /1963/), 180)).toBe(true);
  });

  it('a J above the maximum of Haasnoot et al. with substituents names the signed angle of that maximum (the relation is not even in φ)', () => {
    // Where the maximum lies, by scanning the relation itself (Haasnoot et al. 1980 with these ξ).
    let atMax = 0;
    for (let phi = -180; phi <= 180; phi += 0.5) if (haasnoot(phi, SUBS) > haasnoot(atMax, SUBS)) atMax = phi;
    const top = haasnoot(atMax, SUBS);
    expect(haasnoot(-atMax, SUBS)).toBeLessThan(top - 0.1); // the mirror angle is no maximum
    const note = byName(estimate(top + 0.3, 0.2), /Haasnoot/).notes.find((n) => n.includes('lies above the largest value'));
    const m = /at φ = (−?)(\d+)°/.exec(note ?? '');
    expect(m, note).not.toBeNull();
    const shown = (m![1] === '−' ? -1 : 1) * Number(m![2]);
    expect(Math.abs(shown - atMax)).toBeLessThanOrEqual(1);
  });

  it('a J between the 90° minimum and the maxima gives two ranges per half-turn, mirrored (±φ) by the even relations', () => {
    for (const name of [/1959/, /1963/]) {
      const r = byName(estimate(5, 0.2), name);
      expect(r.intervals).toHaveLength(4);
      expect(r.intervals.filter((i) => i.fromDeg >= 0)).toHaveLength(2);
      const sorted = [...r.intervals].sort((a, b) => a.fromDeg - b.fromDeg);
      for (let i = 0; i < 4; i++) {
        expect(sorted[i]!.fromDeg).toBeCloseTo(-sorted[3 - i]!.toDeg, 6);
        expect(sorted[i]!.toDeg).toBeCloseTo(-sorted[3 - i]!.fromDeg, 6);
      }
      expect(r.notes.join(' ')).toMatch(/4 separate ranges/);
    }
  });

  it('entering every ξ with the other sign mirrors every Haasnoot angle (φ → −φ): J(φ; ξ) = J(−φ; −ξ)', () => {
    const flipped = SUBS.map((s) => ({ ...s, xi: (s.xi === 1 ? -1 : 1) as 1 | -1 }));
    const a = byName(estimate(5, 0.2), /Haasnoot/).intervals;
    const b = byName(estimate(5, 0.2, flipped), /Haasnoot/).intervals;
    const mirror = (i: AngleInterval): [number, number] => [-i.toDeg, -i.fromDeg];
    const sortKey = (x: [number, number][]): [number, number][] => [...x].sort((p, q) => p[0] - q[0]);
    const got = sortKey(b.map((i) => [i.fromDeg, i.toDeg]));
    const want = sortKey(a.map(mirror));
    expect(got).toHaveLength(want.length);
    got.forEach(([f, t], i) => {
      expect(f).toBeCloseTo(want[i]![0], 4);
      expect(t).toBeCloseTo(want[i]![1], 4);
    });
  });

  it('passes flags on: an unresolved or second-order J makes the angles inherit that doubt', () => {
    const e = estimate(4.1, 0.6, SUBS, ['unresolved', 'second_order_suspected']);
    expect(e.flags).toEqual(['second_order_suspected', 'unresolved']);
    expect(e.notes.filter((n) => /inherit that doubt/.test(n))).toHaveLength(2);
  });

  it('says when J lies above a relation\'s largest value but the band still reaches it (Karplus 1959 peaks at 9.22 Hz)', () => {
    const r = byName(estimate(9.6, 0.3), /1959/);
    expect(r.intervals).toHaveLength(1);
    expect(r.notes.join(' ')).toMatch(/above the largest value of Karplus 1959 \(9\.22 Hz, at φ = 180°\)/);
    expect(byName(estimate(12, 0.3), /1959/).notes.join(' ')).toMatch(/outside the relation's range/);
  });

  it('a pair with no measured J is a note, not a crash', () => {
    const net = buildNetwork([{ file: 'x', sidecar: newSidecar('cosy.jdx', HASH) }]);
    const [e] = karplusEstimates([{ pair: ['H-4', 'H-5a'], substituents: [], line: 1 }], net);
    expect(e?.jHz).toBeNull();
    expect(e?.relations).toEqual([]);
    expect(e?.notes[0]).toMatch(/J\(H-4, H-5a\) is not measured/);
    expect(e?.notes[0]).toMatch(/H-4 and H-5a appear in no sidecar: check the label/);
  });

  it('a negative J (a geminal value?) is used as a magnitude and questioned', () => {
    const e = estimate(-12.4, 0.1);
    expect(e.jHz).toBe(12.4);
    expect(e.notes.join(' ')).toMatch(/is this pair really vicinal/);
  });
});

describe('karplus text and JSON', () => {
  it('degrees: whole, with a true minus sign and no −0°', () => {
    expect(degText(-155.4)).toBe('−155°');
    expect(degText(-0.3)).toBe('0°');
    expect(degText(-155.4, 'tex')).toBe('$-155^{\\circ}$');
  });

  it('an interval through 180° reads across the seam', () => {
    expect(intervalText({ fromDeg: 165, toDeg: 195, exactDeg: [175, 185] })).toBe('165° to −165° through 180° (exact 175°, −175°)');
    expect(intervalText({ fromDeg: 13.2, toDeg: 27.4, exactDeg: [] })).toBe('13° to 27°');
  });

  it('markdown and LaTeX sections; the LaTeX is plain ASCII (every symbol a command)', () => {
    const es = [estimate(9.15, 0.29, SUBS, ['fit_poor'])];
    const md = karplusMarkdown(es);
    expect(md).toMatch(/^### Dihedral estimates \(Karplus\)\n/);
    expect(md).toContain('**H-4/H-3**: J = 9.15 ± 0.29 Hz (fit)');
    expect(md).toContain('with C(−1), C(−1), O(+1): φ = ');
    const tex = karplusTex(es);
    expect(tex).toMatch(/^\\paragraph\{Dihedral estimates \(Karplus\)\.\}/);
    expect(tex).toContain('\\textit{J} = 9.15 $\\pm$ 0.29\\,Hz (fit)');
    expect(tex).toContain('fit\\_poor');
    expect(tex).not.toMatch(/[^\x20-\x7e\n]/);
    expect(karplusMarkdown([])).toBe('');
  });

  it('LaTeX text: special characters escaped, J in italics, quotes and symbols as commands', () => {
    expect(texText('fit_poor & 50% of {x} "exact" J ± 2σ at −60°')).toBe(
      "fit\\_poor \\& 50\\% of \\{x\\} ``exact'' \\textit{J} $\\pm$ 2$\\sigma$ at $-$60$^{\\circ}$");
    expect(texText('a\\b')).toBe('a\\textbackslash{}b');
  });

  it('json: one entry per pair and relation, stable snake_case keys, angles to 0.1°', () => {
    const j = karplusJson([estimate(9.15, 0.29)]);
    expect(j).toHaveLength(3);
    expect(Object.keys(j[0]!)).toEqual(['pair', 'j_hz', 'j_sd_hz', 'k', 'method', 'flags', 'relation', 'source', 'substituents', 'intervals', 'notes', 'caution']);
    const first = (j[0]!.intervals as { from_deg: number; to_deg: number; exact_deg: number[] }[])[0]!;
    expect(Object.keys(first)).toEqual(['from_deg', 'to_deg', 'exact_deg']);
    expect(first.from_deg * 10).toBe(Math.round(first.from_deg * 10));
    expect(j[0]!.substituents).toEqual([{ name: 'C', delta_chi: 0.4, xi: -1 }, { name: 'C', delta_chi: 0.4, xi: -1 }, { name: 'O', delta_chi: 1.3, xi: 1 }]);
  });
});

describe('karplusEstimates: a 1D splitting that disagrees with the adopted J is passed on', () => {
  it('notes the 1D reading of either atom for the pair, and nothing for other pairs', () => {
    const net = buildNetwork([{ file: 'cosy.jdx.couplet.yaml', sidecar: { ...newSidecar('cosy.jdx', HASH), couplings: [coupling('H-3', 'H-4', 9.15, 0.29), coupling('H-4', 'H-5', 4.4, 0.1)] } }]);
    const oneD = [{ atom: 'H-4', partner: 'H-3', oneDJHz: 11.16, oneDSdHz: 0.02 }];
    const [a, b] = karplusEstimates([{ pair: ['H-3', 'H-4'], substituents: SUBS, line: 1 }, { pair: ['H-4', 'H-5'], substituents: SUBS, line: 2 }], net, oneD);
    expect(a?.notes).toContain('the 1D multiplet of H-4 reads 11.16 ± 0.02 Hz for this pair, more than 3 combined sd and 0.2 Hz from this J: the angles inherit that doubt.');
    expect(b?.notes.some((n) => n.includes('1D multiplet'))).toBe(false);
  });
});
