import { describe, expect, it } from 'vitest';
import {
  addPick, applyEdits, formatSidecar, movePick, parseSidecar, relabelPick, removeCoupling, removePick, setCoupling,
  type Coupling, type Sidecar, type TextEdit,
} from '../../../src/core/sidecar';
import { golden } from './helpers';

const NAME = 'demo-cosy.jdx.couplet.yaml';

/** Park–Miller minimal standard generator (Park & Miller, Commun. ACM 31 (1988) 1192), seeded. */
function lcg(seed: number): () => number {
  let s = seed;
  return () => (s = (s * 16807) % 2147483647) / 2147483647;
}

const read = (text: string): Sidecar => {
  const { sidecar, diagnostics } = parseSidecar(text, NAME);
  const errors = diagnostics.filter((d) => d.severity === 'error');
  if (sidecar === null || errors.length > 0) throw new Error(errors.map((d) => d.message).join('\n'));
  return sidecar;
};
const comments = (text: string): string[] => text.split('\n').flatMap((l) => (l.includes('#') ? [l.slice(l.indexOf('#'))] : []));

/** One random user action: the edits, and what the data must look like afterwards (computed here, not by the module). */
function randomAction(text: string, rnd: () => number): { edits: TextEdit[]; expect: (s: Sidecar) => void } {
  const s = read(text);
  const pickAny = (): string | undefined => s.picks[Math.floor(rnd() * s.picks.length)]?.id;
  const round = (x: number, d: number): number => Math.round(x * 10 ** d) / 10 ** d;
  const f2 = round(0.5 + rnd() * 9, 4);
  const f1 = round(0.5 + rnd() * 9, 4);
  const atom = (): string => `H-${1 + Math.floor(rnd() * 12)}${rnd() < 0.3 ? 'a' : ''}`;
  const kind = Math.floor(rnd() * 6);
  const id = pickAny();
  if (kind === 0 || id === undefined) {
    const { edits, id: newId } = addPick(text, { f2Ppm: f2, f1Ppm: f1, label: [atom()] }, NAME);
    return { edits, expect: (t) => expect(t.picks.find((p) => p.id === newId)).toMatchObject({ f2Ppm: f2, f1Ppm: f1 }) };
  }
  if (kind === 1) {
    return { edits: movePick(text, id, { f2Ppm: f2, f1Ppm: f1 }, NAME), expect: (t) => expect(t.picks.find((p) => p.id === id)).toMatchObject({ f2Ppm: f2, f1Ppm: f1 }) };
  }
  if (kind === 2) {
    const label = [atom(), atom()];
    return { edits: relabelPick(text, id, label, NAME), expect: (t) => expect(t.picks.find((p) => p.id === id)?.label).toEqual(label) };
  }
  if (kind === 3) {
    return { edits: removePick(text, id, NAME), expect: (t) => {
      expect(t.picks.some((p) => p.id === id)).toBe(false);
      expect(t.couplings.some((c) => c.picks.includes(id))).toBe(false);
    } };
  }
  const existing = s.couplings[Math.floor(rnd() * s.couplings.length)];
  if (kind === 4 && existing !== undefined) {
    return { edits: removeCoupling(text, existing, NAME), expect: (t) => expect(t.couplings).toHaveLength(s.couplings.length - 1) };
  }
  const a = atom();
  const b0 = atom();
  const b = a === b0 ? `${b0}b` : b0;
  const c: Coupling = { atoms: [a, b], jHz: round(rnd() * 16 - 2, 2), jSdHz: round(rnd(), 2), method: 'fit', dimension: 'F2', picks: [id], flags: rnd() < 0.5 ? [] : ['unresolved'] };
  return { edits: setCoupling(text, c, NAME), expect: (t) => expect(t.couplings.find((x) => x.picks[0] === id && x.jHz === c.jHz && x.jSdHz === c.jSdHz)).toBeDefined() };
}

describe('random sequences of actions (seeded)', () => {
  it('from the canonical file: every action leaves canonical text with the expected data', () => {
    const rnd = lcg(20261201);
    let text = golden('canonical.couplet.yaml');
    for (let step = 0; step < 40; step++) {
      const action = randomAction(text, rnd);
      text = applyEdits(text, action.edits);
      const s = read(text);
      action.expect(s);
      expect(formatSidecar(s)).toBe(text);
    }
  });

  it('from the commented file: comments of surviving items stay, and the text reads back to the same data as a canonical rewrite', () => {
    const rnd = lcg(7);
    let text = golden('commented.couplet.yaml');
    const fileComments = ['# Demo compound, batch 7: picks by two of us, see notes/structure.md',
      '# exported from the 600 MHz run', '# end of picks', '# Reviewed in the group meeting; do not remove.'];
    for (let step = 0; step < 40; step++) {
      const action = randomAction(text, rnd);
      const next = applyEdits(text, action.edits);
      const s = read(next);
      action.expect(s);
      expect(read(formatSidecar(s))).toEqual(s);
      for (const c of fileComments) expect(comments(next)).toContain(c);
      text = next;
    }
  });
});
