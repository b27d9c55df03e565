import { describe, expect, it } from 'vitest';
import { makeAxis } from '../../src/core/spectrum/axis';
import { make1D } from '../../src/core/spectrum/spectrum';
import { sidecarState } from '../../src/extension/sidecarState';
import { gridSize, nearestPeakIndex, peakViews, spectrumMeta, type SpectrumModel } from '../../src/extension/spectrumModel';
import { testModel } from './fixture';

describe('nearestPeakIndex (what couplet.acceptAt uses)', () => {
  it('in 2D, finds the cross peak at a position, as the core snap does (fixture: H-1 4.20, H-2 3.85 ppm)', () => {
    expect(nearestPeakIndex(testModel(), 4.2, 3.85)).toBe(1);
    expect(nearestPeakIndex(testModel(), 3.85, 4.2)).toBe(2);
    expect(nearestPeakIndex(testModel(), 2.0, 2.0)).toBeNull();
    expect(nearestPeakIndex(testModel(), 4.2)).toBeNull();
  });

  const axis = makeAxis(1000, 3000, 600, 600);
  const one: SpectrumModel = {
    fileName: '1h.jdx', sha256: 'cd'.repeat(32), noise: 1, crossPeaks: [],
    spectrum: make1D('x', new Float64Array(1000), axis),
    multiplets: [
      { ppm: 4.5, hz: 2700, fromPpm: 4.52, toPpm: 4.48, point0: 0, point1: 1, height: 1, lines: [] },
      { ppm: 2.0, hz: 1200, fromPpm: 2.03, toPpm: 1.97, point0: 0, point1: 1, height: 1, lines: [] },
    ],
  };

  it('in 1D, takes the multiplet whose range holds or is nearest the position, within 0.1 ppm', () => {
    expect(nearestPeakIndex(one, 4.49)).toBe(0);
    expect(nearestPeakIndex(one, 2.1)).toBe(1);
    expect(nearestPeakIndex(one, 3.0)).toBeNull();
  });

  it('describes a 1D spectrum as one row with multiplet peaks', () => {
    expect(gridSize(one.spectrum)).toEqual({ rows: 1, cols: 1000 });
    expect(spectrumMeta(one)).toEqual({ fileName: '1h.jdx', title: 'x', noise: 1, min: 0, max: 0, dims: 1, f2: { points: 1000, firstHz: 3000, lastHz: 600, observeMhz: 600 } });
    expect(peakViews(one)[1]).toEqual({ index: 1, kind: 'multiplet', f2Ppm: 2, partner: null, extent: { f2FromPpm: 2.03, f2ToPpm: 1.97 } });
  });
});

describe('sidecarState', () => {
  const sha = 'ab'.repeat(32);
  const good = `schema: couplet-sidecar/1\ndata:\n  file: cosy.jdx\n  sha256: ${sha}\n\npicks: []\n\ncouplings: []\n`;

  it('reads no file, or a blank one, as an empty sidecar that may be created', () => {
    for (const t of [null, '', '  \n']) {
      expect(sidecarState(t, 'a.couplet.yaml', sha)).toEqual({ view: { picks: [], couplings: [], blocked: null }, diagnostics: [], sidecar: null, missing: true });
    }
  });

  it('blocks writing a file with conflict markers and reports each marker line', () => {
    const conflicted = good.replace('picks: []\n', '<<<<<<< ours\npicks: []\n=======\npicks: [] \n>>>>>>> theirs\n');
    const s = sidecarState(conflicted, 'a.couplet.yaml', sha);
    expect(s.diagnostics.map((d) => [d.line, d.code])).toEqual([[6, 'conflict-marker'], [8, 'conflict-marker'], [10, 'conflict-marker']]);
    expect(s.view.blocked).toMatch(/^a\.couplet\.yaml:6: .* — fix the file; Couplet will not write it until then\.$/);
  });

  it('blocks an unknown schema', () => {
    const s = sidecarState(good.replace('couplet-sidecar/1', 'other/1'), 'a.couplet.yaml', sha);
    expect(s.diagnostics[0]?.code).toBe('unknown-schema');
    expect(s.view.blocked).not.toBeNull();
  });

  it('lets a readable, matching sidecar be written', () => {
    expect(sidecarState(good, 'a.couplet.yaml', sha).view.blocked).toBeNull();
  });
});
