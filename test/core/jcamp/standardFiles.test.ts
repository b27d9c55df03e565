/**
 * The public JCAMP-DX test files in ../shared/checks/jcamp (see SOURCES.md there): every one must
 * decode under the rules of the standard (JCAMP-DX, McDonald & Wilks, Appl. Spectrosc. 42 (1988) 151
 * [from memory]): the X check and the DIF Y-value check (enforced by the reader, which throws on a
 * failure), the point count of NPOINTS / VAR_DIM, and FIRSTY = first ordinate x YFACTOR.
 * MIN/MAX header values are unreliable in these files and are not checked (SOURCES.md).
 */
import { readdirSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { parseJcamp, readJcampBlocks, type JcampFile } from '../../../src/core/jcamp';
import { checkPath, headerValue, jcampErrorOf, readCheck } from './helpers';

const DATA_FILES = readdirSync(checkPath('jcamp'))
  .filter((f) => /\.(dx|jdx)$/i.test(f))
  .sort();

function read(name: string): JcampFile {
  return readJcampBlocks(readCheck('jcamp', name), name);
}

/** Split a file's text into blocks the simple way (test-side), to get each block's header labels. */
function blockTexts(text: string): string[] {
  return text.split(/^\s*##TITLE\s*=/m).slice(1).filter((b) => /##(XYDATA|DATA\s*TABLE)\s*=/.test(b));
}

describe('every public JCAMP-DX test file decodes (SOURCES.md)', () => {
  it('finds the data files listed in SOURCES.md', () => {
    expect(DATA_FILES.length).toBe(24); // 24 .DX/.jdx files; DX-DIR.TXT is an index, not data
  });

  for (const name of DATA_FILES) {
    it(`${name}: each data table has NPOINTS/VAR_DIM points and FIRSTY = first ordinate x YFACTOR`, () => {
      const text = readCheck('jcamp', name);
      const file = read(name);
      const withData = file.blocks.filter((b) => b.pages.length > 0);
      const texts = blockTexts(text);
      expect(withData.length).toBe(texts.length);
      withData.forEach((block, k) => {
        const header = texts[k] ?? '';
        const npoints = headerValue(header, 'NPOINTS');
        const varDim = headerValue(header, 'VAR_DIM');
        const expectedPoints = npoints ? Number(npoints) : Number(varDim?.split(',')[1]);
        for (const page of block.pages) expect(page.values.length).toBe(expectedPoints);
        const firstY = headerValue(header, 'FIRSTY');
        const yFactor = Number(headerValue(header, 'YFACTOR') ?? 1);
        const page = block.pages[0];
        if (firstY !== undefined && page) {
          // FIRSTY is the unquantised value, written to some precision: it may differ from the stored
          // integer times YFACTOR by one quantum plus one unit of its last written digit.
          const decimals = /\.(\d*)/.exec(firstY)?.[1]?.length ?? 0;
          const tol = Math.abs(yFactor) + 10 ** -decimals;
          expect(Math.abs((page.values[0] ?? NaN) - Number(firstY))).toBeLessThanOrEqual(tol);
        }
        // NTUPLES: the FIRST entry of each Y column is the first ordinate of that column's page.
        const first = headerValue(header, 'FIRST')?.split(',');
        const factor = headerValue(header, 'FACTOR')?.split(',');
        const symbols = headerValue(header, 'SYMBOL')?.split(',').map((x) => x.trim());
        if (first && factor && symbols && block.pages.length === 2) {
          for (const p of block.pages) {
            const i = symbols.indexOf(p.ySymbol);
            const text = first[i]?.trim() ?? '';
            const decimals = /\.(\d*)/.exec(text)?.[1]?.length ?? 0;
            const tol = Math.abs(Number(factor[i])) + 10 ** -decimals;
            expect(Math.abs((p.values[0] ?? NaN) - Number(text))).toBeLessThanOrEqual(tol);
          }
        }
      });
    });
  }
});

describe('the same spectrum written in different encodings decodes to the same numbers (SOURCES.md)', () => {
  it('o01-o05 (AFFN, DIF, PAC, SQZ, DIFDUP) give identical ordinates', () => {
    const ref = read('o01.jdx').blocks[0]?.pages[0]?.values;
    expect(ref?.length).toBe(8192);
    for (const n of ['o02.jdx', 'o03.jdx', 'o04.jdx', 'o05.jdx']) {
      expect(read(n).blocks[0]?.pages[0]?.values).toEqual(ref);
    }
  });

  it('o06-o10 give identical real and imaginary pages, and the real page equals o01', () => {
    const ref = read('o06.jdx').blocks[0]?.pages;
    expect(ref?.map((p) => p.ySymbol)).toEqual(['R', 'I']);
    for (const n of ['o07.jdx', 'o08.jdx', 'o09.jdx', 'o10.jdx']) {
      const pages = read(n).blocks[0]?.pages;
      expect(pages?.[0]?.values).toEqual(ref?.[0]?.values);
      expect(pages?.[1]?.values).toEqual(ref?.[1]?.values);
    }
    // Same FACTOR (1.267406) and integers as o01 (SOURCES.md: the same spectrum).
    expect(ref?.[0]?.values).toEqual(read('o01.jdx').blocks[0]?.pages[0]?.values);
  });

  it('TESTSPEC (XYDATA) equals the real page of TESTNTUP', () => {
    // DX-DIR.TXT: the same ISAS ethylbenzene spectrum; the files carry the same factor and first value.
    expect(read('TESTNTUP.DX').blocks[0]?.pages[0]?.values).toEqual(read('TESTSPEC.DX').blocks[0]?.pages[0]?.values);
  });

  it('TEST32 (DIFDUP) equals sqzdec1 (SQZ) except at point 1, where the two files themselves disagree', () => {
    // By hand from the texts: TEST32 line 1 "16383B259260p502228" is 2259260, 2259260 - 7502228 = -5242968;
    // sqzdec1 line 257 "16383 B259260E242968" is 2259260, +5242968. Point 2 is -7176216 in both.
    const a = read('TEST32.DX').blocks[0]?.pages[0]?.values ?? new Float64Array();
    const b = read('sqzdec1.jdx').blocks[0]?.pages[0]?.values ?? new Float64Array();
    expect([a[1], b[1], a[2], b[2]]).toEqual([-5242968, 5242968, -7176216, -7176216]);
    const differing = a.reduce((n, v, i) => n + (v === b[i] ? 0 : 1), 0);
    expect([a.length, b.length, differing]).toEqual([16384, 16384, 1]);
  });

  it('decodes the first ordinates of o01 by hand: 37 -2 -2 2 times YFACTOR 1.267406 (file text, AFFN)', () => {
    const v = read('o03.jdx').blocks[0]?.pages[0]?.values;
    expect(Array.from(v?.subarray(0, 4) ?? [])).toEqual([37, -2, -2, 2].map((q) => q * 1.267406));
  });
});

describe('LINK files, FIDs and non-NMR data', () => {
  it('compound.jdx: five IR blocks with BLOCK_ID 1..5, each NPOINTS long; the high level says "not an NMR spectrum"', () => {
    const file = read('compound.jdx');
    expect(file.blocks.map((b) => b.blockId)).toEqual(['1', '2', '3', '4', '5']);
    expect(file.blocks.map((b) => b.pages[0]?.values.length)).toEqual([1976, 1976, 3951, 1976, 3951]);
    const text = readCheck('jcamp', 'compound.jdx');
    const e = jcampErrorOf(() => parseJcamp(text, 'compound.jdx', { blockId: '4' }));
    expect(e.message).toBe('compound.jdx:296: ##DATATYPE=: "INFRARED SPECTRUM" is not an NMR spectrum');
    expect(jcampErrorOf(() => parseJcamp(text, 'compound.jdx')).line).toBe(9);
  });

  it('ISAS_CDX.DX: a structure block and a peak-assignment block, neither a spectrum', () => {
    const file = read('ISAS_CDX.DX');
    expect(file.blocks.map((b) => b.dataType)).toEqual(['', 'NMR PEAK ASSIGNMENTS']);
    const e = jcampErrorOf(() => parseJcamp(readCheck('jcamp', 'ISAS_CDX.DX'), 'ISAS_CDX.DX'));
    expect(e).toMatchObject({ file: 'ISAS_CDX.DX', line: 82, field: 'DATATYPE' });
    expect(e.message).toContain('not an NMR spectrum');
  });

  it('TESTFID.DX: both FID pages decode at the low level; the high level rejects a time-domain FID', () => {
    const pages = read('TESTFID.DX').blocks[0]?.pages;
    expect(pages?.map((p) => [p.ySymbol, p.values.length, p.xUnits])).toEqual([
      ['R', 16384, 'SECONDS'],
      ['I', 16384, 'SECONDS'],
    ]);
    const e = jcampErrorOf(() => parseJcamp(readCheck('jcamp', 'TESTFID.DX'), 'TESTFID.DX'));
    expect(e.message).toContain('FID');
    expect(e.line).toBe(3);
  });

  it('every IR file decodes at the low level and is rejected as "not an NMR spectrum"', () => {
    for (const name of ['dupdec1.jdx', 'dupdec2.jdx', 'fixdec1.jdx', 'fixinc1.jdx', 'pacdec1.jdx', 'sqzdupd1.jdx']) {
      expect(read(name).blocks[0]?.pages[0]?.values.length).toBeGreaterThan(1000);
      expect(jcampErrorOf(() => parseJcamp(readCheck('jcamp', name), name)).message).toContain('is not an NMR spectrum');
    }
  });
});

describe('1D NMR spectra through parseJcamp', () => {
  it('o01: 8192 points from FIRSTX to LASTX in Hz at 200.136 MHz (file header)', () => {
    const s = parseJcamp(readCheck('jcamp', 'o01.jdx'), 'o01.jdx');
    expect(s.dims).toBe(1);
    if (s.dims !== 1) return;
    expect(s.axis).toEqual({ points: 8192, firstHz: 2391.297363, lastHz: -402.202637, observeMhz: 200.136 });
    expect(s.title).toBe('o-dichlorobenzene');
  });

  it('o06 (complex NTUPLES): takes the real page', () => {
    const s = parseJcamp(readCheck('jcamp', 'o06.jdx'), 'o06.jdx');
    expect(s.dims === 1 && s.data).toEqual(read('o01.jdx').blocks[0]?.pages[0]?.values);
  });

  it('TESTNTUP: 16384 points, 24038.5 Hz to 0 Hz at 100.4 MHz (FIRST/LAST of the X column)', () => {
    const s = parseJcamp(readCheck('jcamp', 'TESTNTUP.DX'), 'TESTNTUP.DX');
    expect(s.dims === 1 && s.axis).toEqual({ points: 16384, firstHz: 24038.5, lastHz: 0, observeMhz: 100.4 });
  });
});
