import { describe, expect, it } from 'vitest';
import { compareSidecars } from '../../../src/core/review';
import type { Sidecar } from '../../../src/core/sidecar';
import { compareMarks } from '../../../src/extension/review/compareMarks';
import { parseToWebview } from '../../../src/protocol';

const base: Sidecar = {
  schema: 'couplet-sidecar/1', data: { file: 'cosy.jdx', sha256: 'a'.repeat(64) },
  picks: [
    { id: 'p-1', f2Ppm: 4.12, f1Ppm: 2.34, label: ['H-3', 'H-4a'] },
    { id: 'p-2', f2Ppm: 2.34, f1Ppm: 4.12, label: ['H-4a', 'H-3'] },
  ],
  couplings: [{ atoms: ['H-3', 'H-4a'], jHz: 10.2, jSdHz: 0.15, method: 'fit', dimension: 'F2', picks: ['p-2'], flags: [] }],
};
const now: Sidecar = {
  ...base,
  picks: [{ id: 'p-1', f2Ppm: 4.13, f1Ppm: 2.34, label: ['H-3', 'H-4a'] }, { id: 'p-3', f2Ppm: 5, f1Ppm: 3, label: [] }],
  couplings: [{ ...base.couplings[0]!, jHz: 10.4, picks: [] }],
};

describe('compareMarks', () => {
  it('places pick changes at the pick (a move with its old place) and coupling changes at their pick, then or now', () => {
    const marks = compareMarks(compareSidecars(base, now), base, now);
    expect(marks.map((m) => [m.kind, m.f2Ppm, m.f1Ppm])).toEqual([
      ['moved', 4.13, 2.34], ['removed', 2.34, 4.12], ['added', 5, 3], ['re-measured', undefined, undefined],
    ]);
    expect(marks[0]).toMatchObject({ fromF2Ppm: 4.12, fromF1Ppm: 2.34 });
  });

  it('places a re-measured coupling at the pick it was measured at', () => {
    const after: Sidecar = { ...base, couplings: [{ ...base.couplings[0]!, jHz: 10.4 }] };
    expect(compareMarks(compareSidecars(base, after), base, after)).toMatchObject([{ kind: 're-measured', f2Ppm: 2.34, f1Ppm: 4.12 }]);
  });

  it('gives marks the protocol accepts, and the protocol refuses a mark of an unknown kind', () => {
    const marks = compareMarks(compareSidecars(base, now), base, now);
    expect(parseToWebview({ type: 'compare', against: 'HEAD', marks }).ok).toBe(true);
    expect(parseToWebview({ type: 'compare', against: null, marks: [] }).ok).toBe(true);
    expect(parseToWebview({ type: 'compare', against: 'HEAD', marks: [{ kind: 'exploded', text: '' }] })).toEqual({ ok: false, error: 'message "compare": field "marks" is missing or invalid' });
  });
});
