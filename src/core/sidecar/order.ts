/** The sidecar's sort orders and item identities (what makes two items "the same"). */
import { naturalCompare } from './decimal';
import { COUPLING_METHODS, DIMENSIONS, type CouplingKey, type Pick } from './types';

/** The two atoms in natural order, so that [H-4a, H-3] and [H-3, H-4a] are one pair. */
export function normalizeAtoms(atoms: readonly [string, string]): [string, string] {
  const [a, b] = atoms;
  return naturalCompare(a, b) <= 0 ? [a, b] : [b, a];
}

/** Identity of a coupling: atom pair, method and dimension. */
export function couplingKeyString(c: CouplingKey): string {
  const [a, b] = normalizeAtoms(c.atoms);
  return `${a}\u0000${b}\u0000${c.method}\u0000${c.dimension}`;
}

export function comparePicks(a: Pick, b: Pick): number {
  return naturalCompare(a.id, b.id);
}

/** By atom pair (natural order), then method in schema order (fit, naive, manual, 1d), then F2 before F1. */
export function compareCouplings(x: CouplingKey, y: CouplingKey): number {
  const [xa, xb] = normalizeAtoms(x.atoms);
  const [ya, yb] = normalizeAtoms(y.atoms);
  return naturalCompare(xa, ya)
    || naturalCompare(xb, yb)
    || COUPLING_METHODS.indexOf(x.method) - COUPLING_METHODS.indexOf(y.method)
    || DIMENSIONS.indexOf(x.dimension) - DIMENSIONS.indexOf(y.dimension);
}
