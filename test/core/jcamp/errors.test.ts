/**
 * One fixture per kind of bad input: each must give a JcampError naming the file, the line and
 * what is wrong, never a TypeError or a silently wrong array. The fixture is TINY_1D (helpers.ts).
 */
import { describe, expect, it } from 'vitest';
import { parseJcamp, writeJcamp2D } from '../../../src/core/jcamp';
import { makeAxis } from '../../../src/core/spectrum/axis';
import { make2D } from '../../../src/core/spectrum/spectrum';
import { JcampError } from '../../../src/core/jcamp';
import { jcampErrorOf, seeded, TINY_1D } from './helpers';

const GOOD = TINY_1D;

/** The fixture with line `n` (1-based) replaced, or removed when `text` is undefined. */
function variant(n: number, text?: string): string {
  const lines = GOOD.slice();
  if (text === undefined) lines.splice(n - 1, 1);
  else lines[n - 1] = text;
  return lines.join('\n');
}

function errorOf(text: string, file = 'tiny.jdx') {
  return jcampErrorOf(() => parseJcamp(text, file));
}

describe('the good fixture', () => {
  it('decodes to the hand-decoded values, with CRLF line ends as well', () => {
    const expected = [1, 2, 3, 3, 2, 1, 0, -1, -2, -3];
    for (const text of [GOOD.join('\n'), GOOD.join('\r\n')]) {
      const s = parseJcamp(text, 'tiny.jdx');
      expect(s.dims === 1 && Array.from(s.data)).toEqual(expected);
      expect(s.dims === 1 && s.axis).toEqual({ points: 10, firstHz: 10, lastHz: 1, observeMhz: 400 });
    }
  });

  it('reads PPM abscissae as Hz = ppm x MHz (ppm = Hz / MHz, Davies & Lampen 1993 [from memory])', () => {
    const text = variant(7, '##XUNITS= PPM');
    const s = parseJcamp(text, 'tiny.jdx');
    expect(s.dims === 1 && [s.axis.firstHz, s.axis.lastHz]).toEqual([4000, 400]);
  });
});

describe('errors name file, line and what is wrong', () => {
  it('failed DIF Y-value check', () => {
    const e = errorOf(variant(17, '6.0CjW'));
    expect(e).toMatchObject({ file: 'tiny.jdx', line: 17 });
    expect(e.message).toBe('tiny.jdx:17: DIF Y-value check failed: line starts with 3, previous line ended with 2');
  });

  it('failed X check (a line starting one point off)', () => {
    const e = errorOf(variant(17, '7.0BjW'));
    expect(e.line).toBe(17);
    expect(e.message).toMatch(/^tiny\.jdx:17: X check failed: line starts at X = 7 .* point 4 should be at 6$/);
  });

  it('wrong point count: too few and too many ordinates for NPOINTS', () => {
    const few = errorOf(variant(13, '##NPOINTS= 11'));
    expect(few.message).toBe('tiny.jdx:18: found 10 ordinates, NPOINTS/VAR_DIM declares 11 (wrong point count or truncated page)');
    const many = errorOf(variant(13, '##NPOINTS= 9'));
    expect(many.message).toBe('tiny.jdx:17: more ordinates than the 9 points declared (NPOINTS/VAR_DIM)');
  });

  it('truncated file (no ##END=)', () => {
    const e = errorOf(GOOD.slice(0, 17).join('\n'));
    expect(e.message).toBe('tiny.jdx:17: file ends inside the block "tiny" opened at line 1 (no ##END=): truncated?');
  });

  it('truncated 2D page and missing pages', () => {
    const s = make2D('cut', Float64Array.from({ length: 4 * 40 }, (_, i) => ((i * 37) % 23) - 11), makeAxis(4, 40, -20, 500), makeAxis(40, 30, -30, 500));
    const lines = writeJcamp2D(s).split('\n');
    const pageStarts = lines.flatMap((l, i) => (l.startsWith('##PAGE=') ? [i + 1] : []));
    const third = pageStarts[2] ?? 0;
    // Cut inside the third page's data: the page has fewer points than VAR_DIM.
    const cut = [...lines.slice(0, third + 2), ...lines.slice(-3)].join('\n');
    const e1 = errorOf(cut, 'cut.jdx');
    expect(e1.line).toBe(third + 2);
    expect(e1.message).toContain('NPOINTS/VAR_DIM declares 40');
    // Drop the last page entirely: VAR_DIM says 4 F1 points, the file has 3 pages.
    const last = pageStarts[3] ?? 0;
    const dropped = [...lines.slice(0, last - 1), ...lines.slice(-3)].join('\n');
    const e2 = errorOf(dropped, 'cut.jdx');
    expect(e2.message).toMatch(/VAR_DIM gives 4 F1 points but the file has 3 pages/);
  });

  it('not an NMR spectrum', () => {
    const e = errorOf(variant(3, '##DATA TYPE= INFRARED SPECTRUM'));
    expect(e).toMatchObject({ line: 3, field: 'DATATYPE' });
    expect(e.message).toBe('tiny.jdx:3: ##DATATYPE=: "INFRARED SPECTRUM" is not an NMR spectrum');
  });

  it('missing required labels: observe frequency, FIRSTX', () => {
    expect(errorOf(variant(6)).message).toBe('tiny.jdx:1: missing required ##.OBSERVE FREQUENCY= (MHz; needed for ppm)');
    expect(errorOf(variant(11)).message).toBe('tiny.jdx:1: missing required ##FIRSTX= (needed to decode ##XYDATA=)');
    // YFACTOR is required too: assuming 1 would silently rescale the spectrum.
    expect(errorOf(variant(10)).message).toBe('tiny.jdx:1: missing required ##YFACTOR= (needed to decode ##XYDATA=)');
  });

  it('non-numeric fields', () => {
    const e = errorOf(variant(6, '##.OBSERVE FREQUENCY= four hundred'));
    expect(e).toMatchObject({ line: 6, field: '.OBSERVEFREQUENCY' });
    expect(e.message).toContain('expected a number, found "four hundred"');
    expect(errorOf(variant(12, '##LASTX= 1,0')).message).toBe('tiny.jdx:12: ##LASTX=: expected a number, found "1,0"');
  });

  it('unsupported label value: a table form other than (X++(Y..Y))', () => {
    const e = errorOf(variant(15, '##XYDATA= (XY..XY)'));
    expect(e).toMatchObject({ line: 15, field: 'XYDATA' });
  });

  it('missing "?" ordinates are rejected, not turned into numbers', () => {
    expect(errorOf(variant(17, '6.0Bj?')).message).toBe('tiny.jdx:17: missing ordinate "?" is not supported: every point needs a value');
  });

  it('empty file', () => {
    expect(errorOf('').message).toBe('tiny.jdx:1: empty file: no ##TITLE= record');
    expect(errorOf(' \r\n\n').line).toBe(1);
  });

  it('binary garbage: NUL bytes, a binary header, stray bytes in a data line', () => {
    expect(errorOf('##TITLE= x\n\u0000\u0001\u0002').message).toBe('tiny.jdx:2: binary data (a NUL byte): not a JCAMP-DX text file');
    expect(errorOf('\u0089PNG\r\n\u001a\n').message).toMatch(/^tiny\.jdx:1: text outside any ##LABEL= record/);
    expect(errorOf(variant(17, '6.0Bj\u00ffW')).message).toBe('tiny.jdx:17: unexpected character byte 0xff in a data line');
  });

  it('picks blocks by index and reports a missing one', () => {
    const e = jcampErrorOf(() => parseJcamp(GOOD.join('\n'), 'tiny.jdx', { block: 3 }));
    expect(e.message).toBe('tiny.jdx:1: no block 3: the file has 1 data block(s), numbered from 0');
  });
});

describe('LINK (compound) files', () => {
  // A LINK block holding an IR block and our NMR fixture (JCAMP-DX 4.24 ##BLOCKS= [from memory]).
  const ir = variant(3, '##DATA TYPE= INFRARED SPECTRUM').replace('##TITLE= tiny', '##TITLE= ir part\n##BLOCK_ID= 1');
  const nmr = GOOD.join('\n').replace('##TITLE= tiny', '##TITLE= nmr part\n##BLOCK_ID= 2');
  const link = ['##TITLE= link', '##JCAMP-DX= 5.01', '##DATA TYPE= LINK', '##BLOCKS= 2', ir, nmr, '##END='].join('\n');

  it('takes the first block holding an NMR spectrum, or the one asked for by index or BLOCK_ID', () => {
    expect(parseJcamp(link, 'link.jdx').title).toBe('nmr part');
    expect(parseJcamp(link, 'link.jdx', { block: 1 }).title).toBe('nmr part');
    expect(parseJcamp(link, 'link.jdx', { blockId: '2' }).title).toBe('nmr part');
    const e = jcampErrorOf(() => parseJcamp(link, 'link.jdx', { block: 0 }));
    expect(e.message).toBe('link.jdx:8: ##DATATYPE=: "INFRARED SPECTRUM" is not an NMR spectrum');
  });

  it('a ##TITLE= inside an unfinished data block is an error naming both lines', () => {
    const e = errorOf(GOOD.slice(0, 18).concat(GOOD).join('\n'));
    expect(e.message).toBe('tiny.jdx:19: ##TITLE= inside the block "tiny" opened at line 1, which has no ##END=');
  });
});

describe('damaged files (house rule: a JcampError naming file and line, never another exception)', () => {
  it('500 seeded random edits of written and hand-written files either parse or throw a JcampError', () => {
    const s = make2D('fuzz', Float64Array.from({ length: 6 * 50 }, (_, i) => Math.round(Math.sin(i) * 1000)), makeAxis(6, 40, -20, 500), makeAxis(50, 30, -30, 500));
    const bases = [writeJcamp2D(s), writeJcamp2D(s, { encoding: 'AFFN' }), GOOD.join('\r\n')];
    const rnd = seeded(2024);
    const alphabet = '0123456789.+-, @A%JjSsZ?$#=\n\r\u0000\u00ffE(XY)';
    let rejected = 0;
    for (let k = 0; k < 500; k++) {
      let t = bases[k % bases.length] ?? '';
      const at = Math.floor(rnd() * t.length);
      const ch = alphabet[Math.floor(rnd() * alphabet.length)] ?? '';
      t = rnd() < 0.5 ? t.slice(0, at) + ch + t.slice(at + 1) : t.slice(0, at) + t.slice(at + 1 + Math.floor(rnd() * 40));
      try {
        parseJcamp(t, 'fuzz.jdx');
      } catch (e) {
        expect(e).toBeInstanceOf(JcampError);
        expect((e as Error).message).toMatch(/^fuzz\.jdx:\d+: /);
        rejected++;
      }
    }
    expect(rejected).toBeGreaterThan(250); // most edits of data lines break a check
  });
});
