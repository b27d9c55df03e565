import { describe, expect, it } from 'vitest';
import { compareSidecars, describeChanges, hasChanges } from '../../../src/core/review';
import type { Coupling, Pick, Sidecar } from '../../../src/core/sidecar';

const pick = (id: string, f2Ppm: number, f1Ppm: number, label: string[]): Pick => ({ id, f2Ppm, f1Ppm, label, kind: 'cross' });
const coupling = (jHz: number, jSdHz: number, extra: Partial<Coupling> = {}): Coupling =>
  ({ atoms: ['H-3', 'H-4a'], jHz, jSdHz, method: 'fit', dimension: 'F2', picks: ['p-1'], flags: [], ...extra });
const sidecar = (picks: Pick[], couplings: Coupling[] = []): Sidecar =>
  ({ schema: 'couplet-sidecar/1', data: { file: 'cosy.jdx', sha256: 'a'.repeat(64) }, picks, couplings });

const base = sidecar([pick('p-1', 4.12, 2.34, ['H-3', 'H-4a']), pick('p-2', 2.34, 4.12, ['H-4a', 'H-3'])], [coupling(10.2, 0.15)]);

describe('compareSidecars', () => {
  it('finds nothing between a sidecar and itself', () => {
    expect(hasChanges(compareSidecars(base, base))).toBe(false);
  });

  it('ignores differences below the stored precision (ppm 4 decimals, Hz 2)', () => {
    const after = sidecar([pick('p-1', 4.12000001, 2.34, ['H-3', 'H-4a']), base.picks[1] as Pick], [coupling(10.2000001, 0.15)]);
    expect(hasChanges(compareSidecars(base, after))).toBe(false);
  });

  it('reports an added and a removed pick by id', () => {
    const after = sidecar([base.picks[0] as Pick, pick('p-3', 5.0, 3.98, [])], base.couplings);
    const c = compareSidecars(base, after);
    expect(c.picks.map((p) => [p.kind, p.id])).toEqual([['removed', 'p-2'], ['added', 'p-3']]);
    expect(c.couplings).toEqual([]);
  });

  it('reports a move with both positions and a relabel with both labels, as two entries for one pick', () => {
    const after = sidecar([pick('p-1', 4.1234, 2.3456, ['H-3', 'H-4b']), base.picks[1] as Pick], base.couplings);
    const c = compareSidecars(base, after);
    expect(c.picks).toMatchObject([
      { kind: 'moved', id: 'p-1', from: { f2Ppm: 4.12, f1Ppm: 2.34 }, to: { f2Ppm: 4.1234, f1Ppm: 2.3456 } },
      { kind: 'relabelled', id: 'p-1', from: ['H-3', 'H-4a'], to: ['H-3', 'H-4b'] },
    ]);
  });

  it('reports a re-measured coupling with old and new J and sigma', () => {
    const c = compareSidecars(base, sidecar(base.picks, [coupling(10.35, 0.12)]));
    expect(c.couplings).toMatchObject([{ kind: 're-measured', from: { jHz: 10.2, jSdHz: 0.15 }, to: { jHz: 10.35, jSdHz: 0.12 } }]);
    expect(describeChanges(c)).toEqual(['J(H-3,H-4a) fit F2 re-measured: 10.20 ± 0.15 Hz -> 10.35 ± 0.12 Hz']);
  });

  it('tells couplings apart by method and dimension, and flags-only changes from re-measurement', () => {
    const after = sidecar(base.picks, [coupling(10.2, 0.15, { flags: ['second-order'] }), coupling(10.4, 0.3, { dimension: 'F1' })]);
    const c = compareSidecars(base, after);
    expect(c.couplings.map((x) => [x.kind, x.coupling.dimension])).toEqual([['amended', 'F2'], ['added', 'F1']]);
  });

  it('treats a new file as everything added, and notices a changed data hash', () => {
    expect(compareSidecars(null, base).picks.every((p) => p.kind === 'added')).toBe(true);
    expect(compareSidecars(base, { ...base, data: { file: 'cosy.jdx', sha256: 'b'.repeat(64) } }).dataChanged).toBe(true);
  });
});
