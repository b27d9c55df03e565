import { describe, expect, it } from 'vitest';
import { renderPicture, wrap, type PictureInput } from '../../../src/core/review/svg';

const input: PictureInput = {
  title: 'a<b & "c"', width: 400, height: 300, view: { f2: [8, 6], f1: [8, 6] },
  contours: [{ level: 1, rings: [[7.5, 7.5, 7.4, 7.5, 7.4, 7.4]] }, { level: -1, rings: [[6.5, 6.5, 6.4, 6.5, 6.4, 6.4]] }],
  sidecar: { schema: 'couplet-sidecar/1', data: { file: 'x.jdx', sha256: 'a'.repeat(64) },
    picks: [{ id: 'p-7.0000-7.0000', f2Ppm: 7, f1Ppm: 7, label: ['H-1', 'H-2'] }], couplings: [] },
};

describe('renderPicture', () => {
  it('escapes text as XML 1.0 requires (§2.4: < and & in text)', () => {
    const svg = renderPicture(input);
    expect(svg).toContain('<title>a&lt;b &amp; &quot;c&quot;</title>');
    expect(svg).not.toContain('a<b');
  });

  it('draws negative levels dashed and positive ones solid, so print in grey still tells them apart', () => {
    const paths = renderPicture(input).split('\n').filter((l) => l.startsWith('<path d="M') && l.includes('stroke-width="0.6"'));
    expect(paths.filter((p) => p.includes('stroke-dasharray="2 1.5"') && p.includes('#d9822b'))).toHaveLength(1);
    expect(paths.filter((p) => !p.includes('stroke-dasharray') && p.includes('#2f6db5'))).toHaveLength(1);
  });

  it('maps the view: F2 8 ppm at the left edge of the plot, F1 8 ppm at its top', () => {
    // Plot frame starts at the left margin (56) and top margin (34); the pick at 7 ppm sits mid-way.
    const svg = renderPicture(input);
    expect(svg).toContain('<rect x="56.0" y="34.0" width="94.0" height="224.0" fill="none"');
    expect(svg).toContain('M98.5,146.0H107.5'); // 56 + 94/2 = 103 (+-4.5), 34 + 224/2 = 146
  });

  it('refuses a picture too small to read', () => {
    expect(() => renderPicture({ ...input, width: 100 })).toThrow(/below 200 x 150/);
  });
});

describe('wrap', () => {
  it('breaks at spaces within the width and keeps a long word whole', () => {
    expect(wrap('aa bb cc dd', 5)).toEqual(['aa bb', '  cc', '  dd']);
    expect(wrap('abcdefgh', 3)).toEqual(['abcdefgh']);
  });
});
