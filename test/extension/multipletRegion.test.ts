/** What the chemist types for a region or a reference, the pick of a multiplet, and the partners read from the COSY sidecar. */
import { describe, expect, it } from 'vitest';
import type { Multiplet1D } from '../../src/core/peaks';
import { addPick, applyEdits, formatSidecar, newSidecar, setCoupling, type Coupling, type Pick } from '../../src/core/sidecar';
import { partnersFor, shiftOf } from '../../src/extension/multipletPartners';
import { parseProtonsInput, parseRegionInput, pickOfMultiplet } from '../../src/extension/multipletRegion';

const LIMITS = [12, -1] as const;

describe('parseRegionInput', () => {
  it.each([
    ['3.86 3.78', 3.86, 3.78],
    ['3.78 3.86', 3.86, 3.78],
    ['3.86-3.78', 3.86, 3.78],
    ['3.86 – 3.78 ppm', 3.86, 3.78],
    ['  3.86..3.78 ', 3.86, 3.78],
    ['0.10 -0.20', 0.1, -0.2],
    ['.5 to 0.4', 0.5, 0.4],
  ])('reads "%s" as %d to %d ppm (high first)', (text, from, to) => {
    expect(parseRegionInput(text, LIMITS)).toEqual({ fromPpm: from, toPpm: to });
  });

  it.each([
    ['', /two shifts/],
    ['3.86', /two shifts/],
    ['3,86 3,78', /two shifts/],
    ['3.8 3.8', /equal \(3\.8 ppm\)/],
    ['13 3.8', /13 ppm is outside the spectrum \(12\.00 to -1\.00 ppm\)/],
    ['abc def', /two shifts/],
  ])('refuses "%s" with a message saying what to type', (text, message) => {
    const r = parseRegionInput(text, LIMITS);
    expect(typeof r).toBe('string');
    expect(r).toMatch(message);
  });
});

describe('parseProtonsInput', () => {
  it('reads a whole number from 1 to 99', () => {
    expect(parseProtonsInput(' 3 ')).toBe(3);
    expect(parseProtonsInput('99')).toBe(99);
  });
  it.each(['0', '100', '2.5', '-1', 'three', ''])('refuses "%s"', (t) => {
    expect(typeof parseProtonsInput(t)).toBe('string');
  });
});

describe('pickOfMultiplet', () => {
  const m: Multiplet1D = { ppm: 3.82, hz: 2292, fromPpm: 3.848, toPpm: 3.793, point0: 0, point1: 1, height: 1 } as Multiplet1D;
  const pick = (id: string, f2Ppm: number, extra: Partial<Pick> = {}): Pick => ({ id, f2Ppm, label: [], kind: 'multiplet', ...extra });

  it('takes the 1D pick inside the extent nearest the centre, never a 2D pick', () => {
    const picks = [pick('a', 3.84), pick('b', 3.821), { ...pick('c', 3.82), f1Ppm: 1.2, kind: 'cross' as const }, pick('d', 3.6)];
    expect(pickOfMultiplet(picks, m)?.id).toBe('b');
  });

  it('takes a pick outside the extent whose own region holds the centre', () => {
    expect(pickOfMultiplet([pick('e', 3.9, { fromPpm: 3.95, toPpm: 3.75 })], m)?.id).toBe('e');
    expect(pickOfMultiplet([pick('f', 3.9)], m)).toBeUndefined();
  });
});

describe('partnersFor (the COSY sidecar of the same folder)', () => {
  const coupling = (atoms: [string, string], jHz: number, method: Coupling['method'], dimension: Coupling['dimension'] = 'F2'): Coupling =>
    ({ atoms, jHz, jSdHz: 0.1, method, dimension, picks: [], flags: [] });

  function cosy(couplings: Coupling[]): string {
    let t = formatSidecar(newSidecar('cosy.jdx', 'cd'.repeat(32)));
    t = applyEdits(t, addPick(t, { f2Ppm: 3.82, f1Ppm: 1.98, label: ['H-4', 'H-3b'], kind: 'cross' }).edits);
    t = applyEdits(t, addPick(t, { f2Ppm: 3.62, f1Ppm: 3.82, label: ['H-8a', 'H-4'], kind: 'cross' }).edits);
    for (const c of couplings) t = applyEdits(t, setCoupling(t, c));
    return t;
  }

  it('gives each partner once, with the fit F2 value before naive or F1, and its shift from the cross picks', () => {
    const text = cosy([coupling(['H-3b', 'H-4'], 4.6, 'naive'), coupling(['H-3b', 'H-4'], 4.55, 'fit', 'F1'), coupling(['H-3b', 'H-4'], 4.5, 'fit'),
      coupling(['H-4', 'H-8a'], 11.2, 'fit')]);
    expect(partnersFor('H-4', [{ fileName: 'cosy.jdx.couplet.yaml', text }])).toEqual([
      { label: 'H-3b', ppm: 1.98, jHz: 4.5, sdHz: 0.1 },
      { label: 'H-8a', ppm: 3.62, jHz: 11.2, sdHz: 0.1 },
    ]);
  });

  it('never checks the 1D against a value from the 1D (method 1d), skips unreadable sidecars and partners without a shift', () => {
    const text = cosy([coupling(['H-3b', 'H-4'], 4.5, '1d'), coupling(['H-4', 'H-12'], 3, 'manual')]);
    expect(partnersFor('H-4', [{ fileName: 'a.couplet.yaml', text }, { fileName: 'b.couplet.yaml', text: '<<<<<<< HEAD\n' }])).toEqual([]);
  });

  it('prefers the shift of a 1D pick labelled with the atom', () => {
    const picks: Pick[] = [{ id: 'x', f2Ppm: 3.62, f1Ppm: 3.82, label: ['H-8a', 'H-4'] }, { id: 'y', f2Ppm: 3.8201, label: ['H-4'], kind: 'multiplet' }];
    expect(shiftOf('H-4', picks)).toBe(3.8201);
    expect(shiftOf('H-8a', picks)).toBe(3.62);
    expect(shiftOf('H-9', picks)).toBeUndefined();
  });
});
