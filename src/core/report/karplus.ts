/**
 * Karplus relations for vicinal ³J(H,H) against the H–C–C–H dihedral angle φ, and their inverse:
 * every φ consistent with a measured J ± kσ. Angles in degrees. All relations here are even in φ
 * (J(−φ) = J(φ)) except Haasnoot–de Leeuw–Altona with substituents, whose ξ signs break the symmetry.
 */

/** A relation J(φ), φ in degrees. */
export interface KarplusRelation {
  readonly name: string;
  /** The published source of the formula (and coefficients). */
  readonly source: string;
  readonly j: (phiDeg: number) => number;
}

const RAD = Math.PI / 180;

/** φ folded to 0..180 (the relation is even and 360° periodic). */
function fold(phiDeg: number): number {
  const p = Math.abs(((phiDeg % 360) + 540) % 360 - 180);
  return p;
}

/**
 * Karplus, J. Chem. Phys. 30 (1959) 11: J = 8.5 cos²φ − 0.28 for 0–90°, 9.5 cos²φ − 0.28 for
 * 90–180° (the two branches meet at 90°, where cos²φ = 0).
 */
export function karplus1959(phiDeg: number): number {
  const p = fold(phiDeg);
  const c2 = Math.cos(p * RAD) ** 2;
  return (p <= 90 ? 8.5 : 9.5) * c2 - 0.28;
}

export interface Karplus1963Coefficients {
  readonly a: number;
  readonly b: number;
  readonly c: number;
}

/** Karplus, J. Am. Chem. Soc. 85 (1963) 2870 [coefficients from memory]: A = 7, B = −1, C = 5 Hz. */
export const KARPLUS_1963: Karplus1963Coefficients = { a: 7, b: -1, c: 5 };

/** J = A + B cos φ + C cos 2φ (Karplus 1963). */
export function karplus1963(phiDeg: number, k: Karplus1963Coefficients = KARPLUS_1963): number {
  return k.a + k.b * Math.cos(phiDeg * RAD) + k.c * Math.cos(2 * phiDeg * RAD);
}

/** One substituent on the H–C–C–H fragment for Haasnoot–de Leeuw–Altona. */
export interface Substituent {
  /** Huggins electronegativity difference Δχ = χ(substituent) − χ(H) (HUGGINS_DELTA_CHI for common atoms). */
  readonly deltaChi: number;
  /**
   * Orientation sign ξ = +1 or −1, from the substituent's position relative to the coupled protons
   * (Haasnoot et al. 1980, their Fig. on substituent orientation); entered by the user.
   */
  readonly xi: 1 | -1;
}

export interface HlaParameters {
  readonly p1: number;
  readonly p2: number;
  readonly p3: number;
  readonly p4: number;
  readonly p5: number;
  /** Degrees. */
  readonly p6: number;
}

/**
 * Haasnoot, de Leeuw, Altona, Tetrahedron 36 (1980) 2783, general parameter set (as quoted in
 * references.md from two independent implementations; re-check before relying on them).
 */
export const HLA_GENERAL: HlaParameters = { p1: 13.86, p2: -0.81, p3: 0, p4: 0.56, p5: -2.32, p6: 17.9 };

/** Huggins electronegativity differences to H, Δχ [from memory, references.md]. */
export const HUGGINS_DELTA_CHI: Readonly<Record<string, number>> = { C: 0.4, N: 0.85, O: 1.3, Cl: 0.95, Br: 0.75 };

/** ³J = P1 cos²φ + P2 cos φ + P3 + Σ Δχi [P4 + P5 cos²(ξi φ + P6 |Δχi|)] (Haasnoot et al. 1980). */
export function haasnoot(phiDeg: number, substituents: readonly Substituent[], p: HlaParameters = HLA_GENERAL): number {
  const c = Math.cos(phiDeg * RAD);
  let j = p.p1 * c * c + p.p2 * c + p.p3;
  for (const s of substituents) {
    j += s.deltaChi * (p.p4 + p.p5 * Math.cos((s.xi * phiDeg + p.p6 * Math.abs(s.deltaChi)) * RAD) ** 2);
  }
  return j;
}

/** Validates substituents; the message names the one at fault. */
export function checkSubstituents(substituents: readonly Substituent[]): void {
  substituents.forEach((s, i) => {
    if (!Number.isFinite(s.deltaChi)) throw new RangeError(`substituents[${i}].deltaChi must be a finite number, got ${s.deltaChi}`);
    if (s.xi !== 1 && s.xi !== -1) throw new RangeError(`substituents[${i}].xi must be +1 or -1, got ${String(s.xi)}`);
  });
}

export const KARPLUS_1959_RELATION: KarplusRelation = {
  name: 'Karplus 1959', source: 'Karplus, J. Chem. Phys. 30 (1959) 11', j: karplus1959,
};
export const KARPLUS_1963_RELATION: KarplusRelation = {
  name: 'Karplus 1963', source: 'Karplus, J. Am. Chem. Soc. 85 (1963) 2870', j: (phi) => karplus1963(phi),
};

export function haasnootRelation(substituents: readonly Substituent[], p: HlaParameters = HLA_GENERAL): KarplusRelation {
  checkSubstituents(substituents);
  return {
    name: `Haasnoot–de Leeuw–Altona (${substituents.length} substituent${substituents.length === 1 ? '' : 's'})`,
    source: 'Haasnoot, de Leeuw, Altona, Tetrahedron 36 (1980) 2783',
    j: (phi) => haasnoot(phi, substituents, p),
  };
}

/** Shown with every inverse Karplus result. */
export const KARPLUS_CAUTION =
  'Several dihedral angles can fit one J; the relation depends on substituent electronegativity and orientation, ' +
  'bond angles, bond lengths and ring strain, so these angles are an aid to a stereochemical argument, not a proof.';
