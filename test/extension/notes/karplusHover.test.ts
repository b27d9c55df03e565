import { describe, expect, it } from 'vitest';
import { buildNetwork } from '../../../src/core/network';
import { readFrontMatter } from '../../../src/core/notes/frontMatter';
import { readKarplusRequests } from '../../../src/core/notes/karplusRequests';
import { karplusEstimates } from '../../../src/core/report/karplusReport';
import { formatSidecar, newSidecar } from '../../../src/core/sidecar';
import { hoverText } from '../../../src/extension/notes/hoverText';
import { karplusHoverLines } from '../../../src/extension/notes/karplusHover';
import { buildLabelIndex } from '../../../src/extension/notes/labelIndex';
import { noteProblems } from '../../../src/extension/notes/noteDiagnostics';

const HASH = 'cd'.repeat(32);
const sidecar = {
  ...newSidecar('cosy.jdx', HASH),
  couplings: [
    { atoms: ['H-3a', 'H-4'] as [string, string], jHz: 9.15, jSdHz: 0.29, method: 'fit' as const, dimension: 'F2' as const, picks: [], flags: ['unresolved'] },
    { atoms: ['H-2', 'H-3a'] as [string, string], jHz: 9.95, jSdHz: 0.44, method: 'fit' as const, dimension: 'F2' as const, picks: [], flags: [] },
  ],
};
const NOTE = [
  '---',
  'compound: q',
  'karplus:',
  '  - pair: [H-3a, H-4]',
  '    substituents: [C, C, O]',
  '    orientation: [-1, -1, +1]',
  '  - pair: [H-4, H-5a]',
  '    substituents: [C, O, C]',
  '    orientation: [+1, -1, +1]',
  '---',
  '',
  'H-2, H-3a, H-4 and H-5a.',
  '',
].join('\n');

function estimates() {
  const { requests } = readKarplusRequests(NOTE, 'q.md');
  return karplusEstimates(requests, buildNetwork([{ file: 'cosy.jdx.couplet.yaml', sidecar }]));
}

describe('hover: dihedral estimates of the requested pairs that contain the label', () => {
  const index = buildLabelIndex([{ fileName: 'cosy.jdx.couplet.yaml', text: formatSidecar(sidecar) }]);

  it('H-4 shows both of its pairs: the measured one with each relation, the unmeasured one as a note, and one line of caution', () => {
    const text = hoverText(index.get('H-4')!, { jDecimals: 2, karplus: estimates() });
    expect(text).toContain('**Dihedral estimates (Karplus)**, φ within J ± 2σ:');
    expect(text).toContain('*H-3a/H-4*: J = 9.15 ± 0.29 Hz (fit)');
    expect(text).toMatch(/- Haasnoot–de Leeuw–Altona \(3 substituents\) with C\(−1\), C\(−1\), O\(\+1\): φ = /);
    expect(text).toMatch(/- Karplus 1959: /);
    expect(text).toMatch(/- Karplus 1963: /);
    expect(text).toMatch(/unresolved.*inherit that doubt/);
    expect(text).toContain('*H-4/H-5a*: J not measured');
    expect(text.match(/an aid to the argument, not a proof/g)).toHaveLength(1);
  });

  it('a label in no requested pair gets the hover it had before', () => {
    const info = index.get('H-2')!;
    expect(hoverText(info, { jDecimals: 2, karplus: estimates() })).toBe(hoverText(info, { jDecimals: 2 }));
    expect(karplusHoverLines('H-2', estimates())).toEqual([]);
  });
});

describe('note diagnostics: a bad karplus request is an error at its value', () => {
  it('names the field and covers the offending text', () => {
    const bad = NOTE.replace('orientation: [+1, -1, +1]', 'orientation: [+1, -1, 5]');
    const { problems } = readKarplusRequests(bad, 'q.md');
    const out = noteProblems(bad, readFrontMatter(bad), buildLabelIndex([]), [], problems);
    const k = out.filter((p) => p.code === 'karplus-request');
    expect(k).toHaveLength(1);
    expect(k[0]?.severity).toBe('error');
    expect(k[0]?.message).toBe('karplus[1].orientation[2]: must be +1 or -1, got 5');
    expect(bad.slice(k[0]!.offset, k[0]!.offset + k[0]!.length)).toBe('5');
  });
});
