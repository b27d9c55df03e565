import { describe, expect, it } from 'vitest';
import { buildNetwork, jTableCsv, jTableMarkdown } from '../../../src/core/network';
import type { Coupling, Sidecar } from '../../../src/core/sidecar/types';

const HASH = 'a'.repeat(64);
function sidecar(file: string, couplings: Partial<Coupling>[], labels: string[][] = []): { file: string; sidecar: Sidecar } {
  return {
    file: `${file}.couplet.yaml`,
    sidecar: {
      schema: 'couplet-sidecar/1', data: { file, sha256: HASH },
      picks: labels.map((label, i) => ({ id: `p-${i}`, f2Ppm: 1, label })),
      couplings: couplings.map((c) => ({ atoms: ['H-1', 'H-2'], jHz: 0, jSdHz: 0.1, method: 'fit', dimension: 'F2', picks: [], flags: [], ...c }) as Coupling),
    },
  };
}

describe('buildNetwork', () => {
  const cosy = sidecar('cosy.jdx', [
    { atoms: ['H-1', 'H-2'], jHz: 7.5, jSdHz: 0.1 },
    { atoms: ['H-2', 'H-3'], jHz: 10.2, jSdHz: 0.2 },
    { atoms: ['H-2', 'H-3'], jHz: 11.4, jSdHz: 0.3, method: 'naive' },
    { atoms: ['H-5', 'H-6'], jHz: 15.8, jSdHz: 0.1 },
  ], [['H-9']]);
  const oneD = sidecar('1h.jdx', [
    { atoms: ['H-1', 'H-2'], jHz: 7.7, jSdHz: 0.1, method: '1d' },
    { atoms: ['H-2', 'H-3'], jHz: 9.0, jSdHz: 0.1, method: '1d' },
  ]);
  const net = buildNetwork([cosy, oneD]);

  it('spin systems are the connected components; an atom without couplings is its own (hand-checked graph)', () => {
    expect(net.spinSystems).toEqual([['H-1', 'H-2', 'H-3'], ['H-5', 'H-6'], ['H-9']]);
  });

  it('agreeing values (|ΔJ| = 0.2 ≤ 3·√(0.1² + 0.1²) = 0.42) give the inverse-variance mean 7.6 ± 0.071', () => {
    const p = net.pairs.find((x) => x.atoms.join() === 'H-1,H-2')!;
    expect(p.consistent).toBe(true);
    expect(p.adopted.jHz).toBeCloseTo(7.6, 10);
    expect(p.adopted.sdHz).toBeCloseTo(0.1 / Math.SQRT2, 10);
    expect(p.adopted.method).toBe('fit+1d');
  });

  it('disagreeing values (|ΔJ| = 1.2 > 3·√(0.2² + 0.1²) = 0.67) give a diagnostic naming both sources; naive takes no part', () => {
    const p = net.pairs.find((x) => x.atoms.join() === 'H-2,H-3')!;
    expect(p.consistent).toBe(false);
    expect(p.adopted.method).toBe('1d');
    expect(net.diagnostics).toHaveLength(1);
    expect(net.diagnostics[0]!.message).toBe(
      'J(H-2, H-3): cosy.jdx.couplet.yaml (fit F2): 10.20 ± 0.20 Hz and 1h.jdx.couplet.yaml (1d F2): 9.00 ± 0.10 Hz differ by more than 3 combined sd (|ΔJ| = 1.20 Hz > 0.67 Hz).',
    );
  });

  it('writes a markdown J table per spin system and a CSV row per measurement', () => {
    const md = jTableMarkdown(net);
    expect(md).toContain('| J / Hz | H-1 | H-2 | H-3 |');
    expect(md).toContain('| H-1 | — | 7.60 ± 0.07 fit+1d |  |');
    expect(md).toContain('Uncoupled (no J recorded): H-9');
    const csv = jTableCsv(net).split('\r\n');
    expect(csv[0]).toBe('atom_a,atom_b,j_hz,j_sd_hz,method,dimension,flags,source,picks,adopted_j_hz,adopted_j_sd_hz,consistent');
    expect(csv).toHaveLength(1 + 6 + 1);
    expect(csv).toContain('H-2,H-3,11.40,0.30,naive,F2,,cosy.jdx.couplet.yaml,,9.00,0.10,no');
  });
});
