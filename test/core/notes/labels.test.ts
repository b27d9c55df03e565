import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { labelsInMarkdown, labelsInSidecar, mergeLabels } from '../../../src/core/notes/labels';

describe('labelsInMarkdown', () => {
  it('finds the proton labels of a structure note (samples/quellopyranol, its label table)', () => {
    const note = readFileSync(join(__dirname, '..', '..', '..', 'samples', 'quellopyranol', 'quellopyranol.md'), 'utf8');
    // The note's table lists these ten labels; the prose also names carbons (C-2, C-4, C-6), which are not protons.
    expect(mergeLabels(labelsInMarkdown(note))).toEqual(['H-2', 'H-3a', 'H-3b', 'H-4', 'H-5a', 'H-5b', 'H-6', 'H-7', 'H-8a', 'H-8b']);
  });

  it('takes primed and multi-digit labels and leaves labels inside longer words alone', () => {
    expect(labelsInMarkdown("H-2' couples to H-10b; not CH-3, H-3-ol, H-4x1 or XH-5")).toEqual(["H-2'", 'H-10b']);
  });

  it('reports each label once', () => {
    expect(labelsInMarkdown('H-3 and H-3, then (H-3)')).toEqual(['H-3']);
  });
});

describe('labelsInSidecar', () => {
  const sidecar = `schema: couplet-sidecar/1
data:
  file: cosy.jdx
  sha256: ${'a'.repeat(64)}

picks:
  - id: p-4.2000-3.8500
    f2_ppm: 4.2000
    f1_ppm: 3.8500
    label: [H-1, H-2]

couplings:
  - atoms: [H-2, H-9]
    j_hz: 7.50
    j_sd_hz: 0.05
    method: fit
    dimension: F2
    picks: []
    flags: []
`;

  it('collects pick labels and coupling atoms', () => {
    expect(mergeLabels(labelsInSidecar(sidecar, 'cosy.jdx.couplet.yaml'))).toEqual(['H-1', 'H-2', 'H-9']);
  });

  it('gives nothing for a sidecar it cannot read (conflict markers)', () => {
    expect(labelsInSidecar(`<<<<<<< ours\n${sidecar}=======\n>>>>>>> theirs\n`, 'x.couplet.yaml')).toEqual([]);
  });
});

describe('mergeLabels', () => {
  it('sorts in natural order (H-2 before H-10) and drops blanks and repeats', () => {
    expect(mergeLabels(['H-10', 'H-2', ' '], ['H-2', 'H-3a'])).toEqual(['H-2', 'H-3a', 'H-10']);
  });
});
