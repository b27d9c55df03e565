import { describe, expect, it } from 'vitest';
import {
  HUGGINS_DELTA_CHI, KARPLUS_1959_RELATION, KARPLUS_1963_RELATION, KARPLUS_CAUTION,
  haasnoot, haasnootRelation, karplus1959, karplus1963, type Substituent,
} from '../../../src/core/report/karplus';
import { anglesForJ } from '../../../src/core/report/karplusInverse';

// Check values from ../shared/checks/references.md; each line names its publication.
describe('Karplus relations reproduce the published check values', () => {
  it('Karplus 1959 (J. Chem. Phys. 30 (1959) 11): both branches', () => {
    expect(karplus1959(0)).toBeCloseTo(8.22, 3);
    expect(karplus1959(60)).toBeCloseTo(1.845, 3);
    expect(karplus1959(90)).toBeCloseTo(-0.28, 3);
    expect(karplus1959(120)).toBeCloseTo(2.095, 3);
    expect(karplus1959(180)).toBeCloseTo(9.22, 3);
  });

  it('Karplus 1959 is even and 360° periodic (cos² of the dihedral)', () => {
    for (const phi of [12, 75, 133, 171]) {
      expect(karplus1959(-phi)).toBeCloseTo(karplus1959(phi), 12);
      expect(karplus1959(phi + 360)).toBeCloseTo(karplus1959(phi), 12);
    }
  });

  it('Karplus 1963 (J. Am. Chem. Soc. 85 (1963) 2870; A, B, C from memory): 11.0, 2.0, 13.0 Hz', () => {
    expect(karplus1963(0)).toBeCloseTo(11.0, 10);
    expect(karplus1963(90)).toBeCloseTo(2.0, 10);
    expect(karplus1963(180)).toBeCloseTo(13.0, 10);
  });

  it('Haasnoot–de Leeuw–Altona (Tetrahedron 36 (1980) 2783), general set, no substituents', () => {
    expect(haasnoot(0, [])).toBeCloseTo(13.05, 3);
    expect(haasnoot(90, [])).toBeCloseTo(0, 3);
    expect(haasnoot(180, [])).toBeCloseTo(14.67, 3);
  });

  it('Haasnoot et al. 1980 with two carbon substituents (Huggins Δχ = 0.40, from memory)', () => {
    const c: Substituent[] = [{ deltaChi: HUGGINS_DELTA_CHI.C ?? 0, xi: 1 }, { deltaChi: HUGGINS_DELTA_CHI.C ?? 0, xi: -1 }];
    expect(haasnoot(0, c)).toBeCloseTo(11.671, 3);
    expect(haasnoot(90, c)).toBeCloseTo(0.419, 3);
    expect(haasnoot(180, c)).toBeCloseTo(13.291, 3);
  });

  it('Haasnoot et al. 1980: one electronegative substituent makes J(φ) ≠ J(−φ), the ξ sign mirrors it', () => {
    const plus: Substituent[] = [{ deltaChi: 1.3, xi: 1 }];
    const minus: Substituent[] = [{ deltaChi: 1.3, xi: -1 }];
    expect(Math.abs(haasnoot(60, plus) - haasnoot(-60, plus))).toBeGreaterThan(0.3);
    expect(haasnoot(60, plus)).toBeCloseTo(haasnoot(-60, minus), 12);
  });

  it('refuses a substituent with a bad ξ, naming it', () => {
    expect(() => haasnootRelation([{ deltaChi: 0.4, xi: 1 }, { deltaChi: 0.4, xi: 0 as unknown as 1 }])).toThrow(/substituents\[1\]\.xi/);
  });
});

describe('anglesForJ inverts the relation', () => {
  const relations = [KARPLUS_1959_RELATION, KARPLUS_1963_RELATION, haasnootRelation([{ deltaChi: 1.3, xi: 1 }, { deltaChi: 0.4, xi: -1 }])];

  it('inverse ∘ forward: every exact solution gives J back, and the true angle is among them', () => {
    for (const rel of relations) {
      for (const phi of [-150, -100, -35, 0, 25, 60, 110, 165]) {
        const j = rel.j(phi);
        const inv = anglesForJ(rel, j, 0.3);
        const exact = inv.intervals.flatMap((i) => i.exactDeg);
        for (const x of exact) expect(rel.j(x)).toBeCloseTo(j, 6);
        const wrapped = exact.map((x) => (x > 180 ? x - 360 : x));
        const nearest = Math.min(...wrapped.map((x) => Math.abs(x - phi)));
        // the extremum at 0° (and 180°) is a double root the sign scan can miss; the interval still holds it
        if (phi !== 0) expect(nearest, `${rel.name} at ${phi}°`).toBeLessThan(1e-5);
        const inside = inv.intervals.some((i) => (phi >= i.fromDeg && phi <= i.toDeg) || (phi + 360 >= i.fromDeg && phi + 360 <= i.toDeg));
        expect(inside, `${rel.name} at ${phi}°`).toBe(true);
      }
    }
  });

  it('interval edges give exactly J ± kσ', () => {
    const inv = anglesForJ(KARPLUS_1963_RELATION, 6, 0.5, { k: 2 });
    for (const i of inv.intervals) {
      for (const edge of [i.fromDeg, i.toDeg]) expect(Math.abs(KARPLUS_1963_RELATION.j(edge) - 6)).toBeCloseTo(1, 6);
    }
  });

  it('J near the minimum of Karplus 1963 fits two mirror ranges around ±90° (edges solved by hand)', () => {
    // 7 − cos φ + 5 cos 2φ = 2 − c + 10c² (c = cos φ); within 2.1 ± 2·0.1 only the upper edge 2.3 bounds it:
    // 10c² − c − 0.3 = 0, c = (1 ± √13) / 20 -> φ = 76.68° and 97.47° (and their mirrors).
    const inv = anglesForJ(KARPLUS_1963_RELATION, 2.1, 0.1);
    expect(inv.intervals).toHaveLength(2);
    const [a, b] = inv.intervals;
    const deg = (c: number): number => (Math.acos(c) * 180) / Math.PI;
    expect(b!.fromDeg).toBeCloseTo(deg((1 + Math.sqrt(13)) / 20), 6);
    expect(b!.toDeg).toBeCloseTo(deg((1 - Math.sqrt(13)) / 20), 6);
    expect(a!.fromDeg).toBeCloseTo(-b!.toDeg, 6);
    expect(a!.toDeg).toBeCloseTo(-b!.fromDeg, 6);
    expect(inv.notes.join(' ')).toMatch(/cannot choose/);
    expect(inv.caution).toBe(KARPLUS_CAUTION);
  });

  it('a large J near the trans maximum is one interval running through 180°', () => {
    const inv = anglesForJ(KARPLUS_1959_RELATION, 9.0, 0.2);
    const through = inv.intervals.find((i) => i.toDeg > 180);
    expect(through).toBeDefined();
    expect(through!.fromDeg).toBeLessThan(180);
    expect(inv.intervals.every((i) => i.fromDeg < i.toDeg)).toBe(true);
  });

  it('says so when no angle fits', () => {
    const inv = anglesForJ(KARPLUS_1959_RELATION, 15, 0.2);
    expect(inv.intervals).toEqual([]);
    expect(inv.notes[0]).toMatch(/outside the relation's range/);
  });

  it('refuses a negative sd with a clear message', () => {
    expect(() => anglesForJ(KARPLUS_1959_RELATION, 5, -1)).toThrow(/sd must be/);
  });
});
