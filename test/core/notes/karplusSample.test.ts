import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { readKarplusRequests } from '../../../src/core/notes/karplusRequests';
import { haasnoot } from '../../../src/core/report/karplus';

/**
 * The ξ in samples/quellopyranol/quellopyranol.md, checked against a model of the expected all-cis
 * chair (H-2, H-4, H-6 axial): an ideal ring (atoms on a circle, alternately up and down), axial bonds
 * along the ring axis, equatorial bonds outwards. Rule (as the README states it): looking along the
 * C–C bond from the substituent's own carbon, ξ = +1 when the substituent sits clockwise of that
 * carbon's coupled proton. φ is the signed H–C–C–H torsion (IUPAC sign convention).
 */
type V = [number, number, number];
const sub = (a: V, b: V): V => [a[0] - b[0], a[1] - b[1], a[2] - b[2]];
const add = (a: V, b: V): V => [a[0] + b[0], a[1] + b[1], a[2] + b[2]];
const dot = (a: V, b: V): number => a[0] * b[0] + a[1] * b[1] + a[2] * b[2];
const cross = (a: V, b: V): V => [a[1] * b[2] - a[2] * b[1], a[2] * b[0] - a[0] * b[2], a[0] * b[1] - a[1] * b[0]];
const scale = (a: V, s: number): V => [a[0] * s, a[1] * s, a[2] * s];

// Ring positions 0..5 = O-1, C-2, C-3, C-4, C-5, C-6.
const ring: V[] = [0, 1, 2, 3, 4, 5].map((i) => [1.45 * Math.cos((i * Math.PI) / 3), 1.45 * Math.sin((i * Math.PI) / 3), i % 2 ? -0.25 : 0.25]);
const at = (i: number): V => ring[i] ?? [0, 0, 0];
const axial = (i: number): V => add(at(i), [0, 0, Math.sign(at(i)[2])]);
const equatorial = (i: number): V => add(at(i), [0.94 * Math.cos((i * Math.PI) / 3), 0.94 * Math.sin((i * Math.PI) / 3), -0.33 * Math.sign(at(i)[2])]);
const ATOMS: Record<string, V> = {
  'O-1': at(0), 'C-2': at(1), 'C-3': at(2), 'C-4': at(3), 'C-5': at(4), 'C-6': at(5),
  'H-2': axial(1), 'C-7': equatorial(1), 'H-3a': axial(2), 'H-4': axial(3), 'O-4': equatorial(3), 'H-5a': axial(4), 'H-6': axial(5), 'C-8': equatorial(5),
};
const P = (name: string): V => {
  const p = ATOMS[name];
  if (!p) throw new Error(name);
  return p;
};

function torsion(a: V, b: V, c: V, d: V): number {
  const b1 = sub(c, b);
  const n = scale(b1, 1 / Math.sqrt(dot(b1, b1)));
  const v = sub(sub(a, b), scale(n, dot(sub(a, b), n)));
  const w = sub(sub(d, c), scale(n, dot(sub(d, c), n)));
  return (Math.atan2(dot(cross(n, v), w), dot(v, w)) * 180) / Math.PI;
}

const xi = (carbon: V, proton: V, s: V, other: V): number => Math.sign(dot(cross(sub(proton, carbon), sub(s, carbon)), sub(other, carbon)));

/** Per requested pair: the two carbons and the substituent atoms in the note's order, each with its carbon. */
const FRAGMENTS: Record<string, { carbons: [string, string]; subs: [string, 0 | 1][] }> = {
  'H-2/H-3a': { carbons: ['C-2', 'C-3'], subs: [['O-1', 0], ['C-7', 0], ['C-4', 1]] },
  'H-3a/H-4': { carbons: ['C-3', 'C-4'], subs: [['C-2', 0], ['C-5', 1], ['O-4', 1]] },
  'H-4/H-5a': { carbons: ['C-4', 'C-5'], subs: [['C-3', 0], ['O-4', 0], ['C-6', 1]] },
  'H-5a/H-6': { carbons: ['C-5', 'C-6'], subs: [['C-4', 0], ['O-1', 1], ['C-8', 1]] },
};

describe('the quellopyranol note\'s karplus requests match the expected chair', () => {
  const note = readFileSync(join(__dirname, '..', '..', '..', 'samples', 'quellopyranol', 'quellopyranol.md'), 'utf8');
  const { requests, problems } = readKarplusRequests(note, 'quellopyranol.md');

  it('reads without problems', () => {
    expect(problems).toEqual([]);
    expect(requests.map((r) => r.pair.join('/'))).toEqual(Object.keys(FRAGMENTS));
  });

  it('every ξ and element agrees with the model; the axial–axial pairs are anti (|φ| ≈ 180°) with a large J', () => {
    for (const r of requests) {
      const key = r.pair.join('/');
      const f = FRAGMENTS[key];
      if (!f) throw new Error(key);
      const carbons = f.carbons.map(P);
      const protons = r.pair.map(P);
      f.subs.forEach(([name, side], i) => {
        const want = xi(carbons[side]!, protons[side]!, P(name), carbons[1 - side]!);
        expect(r.substituents[i]?.xi, `${key} ${name}`).toBe(want);
        expect(r.substituents[i]?.name, `${key} ${name}`).toBe(name[0]);
      });
      const phi = torsion(protons[0]!, carbons[0]!, carbons[1]!, protons[1]!);
      expect(Math.abs(phi), key).toBeGreaterThan(175);
      // Haasnoot et al. 1980 puts an anti H–C–C–H with these substituents near 11 Hz (cyclohexane ax-ax 8-13 Hz, handbook range [mem]).
      const j = haasnoot(phi, r.substituents);
      expect(j).toBeGreaterThan(8);
      expect(j).toBeLessThan(13);
    }
  });
});
