import { describe, expect, it } from 'vitest';
import {
  addPick, applyEdits, formatSidecar, isWritable, newSidecar, parseSidecar, setIntegralReference, setPickRegion, type Sidecar,
} from '../../../src/core/sidecar';
import { changedOldLines, gitDiffHunks } from './helpers';

const NAME = '1h.jdx.couplet.yaml';
const HASH = 'a'.repeat(64);

function oneD(): string {
  const s: Sidecar = newSidecar('1h.jdx', HASH);
  s.picks.push(
    { id: 'p-3.8200', f2Ppm: 3.82, label: ['H-4'], kind: 'multiplet' },
    { id: 'p-1.1700', f2Ppm: 1.17, label: ['H-7'], kind: 'multiplet' },
  );
  return formatSidecar(s);
}

const read = (text: string): Sidecar => {
  const { sidecar, diagnostics } = parseSidecar(text, NAME);
  if (sidecar === null || !isWritable(diagnostics)) throw new Error(diagnostics.map((d) => d.message).join('\n'));
  return sidecar;
};
const problems = (text: string): string[] => parseSidecar(text, NAME).diagnostics.filter((d) => d.severity !== 'info').map((d) => `${d.severity} ${d.line} ${d.field ?? ''}: ${d.message}`);

describe('1D multiplet regions and the integral reference (SCHEMA.md)', () => {
  it('setPickRegion stores the ends high to low and only inserts the two region lines', () => {
    const text = oneD();
    const out = applyEdits(text, setPickRegion(text, 'p-3.8200', { fromPpm: 3.79, toPpm: 3.85 }, NAME));
    expect(out).toContain('  - id: p-3.8200\n    f2_ppm: 3.8200\n    from_ppm: 3.8500\n    to_ppm: 3.7900\n    label: H-4\n');
    const hunks = gitDiffHunks(text, out);
    expect(hunks).toHaveLength(1);
    expect(hunks[0]?.oldCount).toBe(0);
    expect(read(out).picks.find((p) => p.id === 'p-3.8200')).toMatchObject({ fromPpm: 3.85, toPpm: 3.79 });
    // Clearing gives back the original text.
    expect(applyEdits(out, setPickRegion(out, 'p-3.8200', null, NAME))).toBe(text);
  });

  it('setIntegralReference moves the reference: one line removed, one inserted, never two references', () => {
    const text = oneD();
    const first = applyEdits(text, setIntegralReference(text, 'p-1.1700', 3, NAME));
    expect(first).toContain('    label: H-7\n    kind: multiplet\n    protons: 3\n');
    const moved = applyEdits(first, setIntegralReference(first, 'p-3.8200', 1, NAME));
    expect(read(moved).picks.map((p) => p.protons)).toEqual([undefined, 1]);
    expect(changedOldLines(gitDiffHunks(first, moved))).toEqual([first.split('\n').indexOf('    protons: 3') + 1]);
    expect(() => setIntegralReference(text, 'p-1.1700', 1.5, NAME)).toThrow(/whole number of protons/);
    expect(() => setIntegralReference(text, 'p-9', 1, NAME)).toThrow(/no pick with id "p-9"/);
  });

  it('refuses a region or reference on a 2D pick', () => {
    const s = newSidecar('cosy.jdx', HASH);
    const text = applyEdits(formatSidecar(s), addPick(formatSidecar(s), { f2Ppm: 3.8, f1Ppm: 1.2, label: [] }, 'c').edits);
    expect(() => setPickRegion(text, 'p-3.8000-1.2000', { fromPpm: 3.9, toPpm: 3.7 }, NAME)).toThrow(/2D peak/);
    expect(() => setIntegralReference(text, 'p-3.8000-1.2000', 1, NAME)).toThrow(/2D peak/);
  });

  it('reports a bad region or reference at its line and field', () => {
    const text = oneD();
    const lines = text.split('\n');
    const at = lines.indexOf('    label: H-4');
    const withLines = (...extra: string[]): string => [...lines.slice(0, at), ...extra, ...lines.slice(at)].join('\n');
    expect(problems(withLines('    from_ppm: 3.85'))).toEqual([`error ${at + 1} picks[1].to_ppm: ${NAME}:${at + 1}: picks[1].to_ppm: a multiplet region needs both from_ppm and to_ppm`]);
    expect(problems(withLines('    from_ppm: 3.79', '    to_ppm: 3.85'))[0]).toMatch(/picks\[1\]\.from_ppm: must be above to_ppm/);
    expect(problems(withLines('    from_ppm: 3.70', '    to_ppm: 3.60'))[0]).toMatch(/^warning .*f2_ppm 3.82 lies outside the region 3.7..3.6 ppm/);
    expect(problems(withLines('    protons: 0'))[0]).toMatch(/picks\[1\]\.protons: expected a whole number of protons from 1 to 99, found 0/);
    const two = [...lines];
    two.splice(lines.indexOf('    label: H-7'), 0, '    protons: 3');
    two.splice(two.indexOf('    label: H-4'), 0, '    protons: 1');
    expect(problems(two.join('\n'))).toEqual([expect.stringMatching(/picks\[1\]\.protons: .*only one pick per sidecar may set the integral reference; picks\[0\] already does/)]);
  });
});
