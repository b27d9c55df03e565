/**
 * From decoded blocks to the spectrum model: units, the shift reference, 2D NTUPLES in PPM with
 * per-column FACTOR/FIRST/LAST (nD NMR form, Lampen et al., Appl. Spectrosc. 53 (1999) 1064 [from memory]).
 * ppm = Hz / observe MHz throughout (Davies & Lampen, Appl. Spectrosc. 47 (1993) 1093 [from memory]).
 */
import { describe, expect, it } from 'vitest';
import { parseJcamp } from '../../../src/core/jcamp';
import { jcampErrorOf, TINY_1D } from './helpers';

function withLine(after: number, text: string): string {
  const lines = TINY_1D.slice();
  lines.splice(after, 0, text);
  return lines.join('\n');
}

describe('##.SHIFT REFERENCE= (type, compound, point, ppm), point 1-based', () => {
  it('moves the axis so the named point has the stated shift', () => {
    // Point 10 (X = 1 Hz) is declared 0 ppm: every frequency moves down by 1 Hz.
    const s = parseJcamp(withLine(6, '##.SHIFT REFERENCE= INTERNAL, TMS, 10, 0.0'), 'tiny.jdx');
    expect(s.dims === 1 && [s.axis.firstHz, s.axis.lastHz]).toEqual([9, 0]);
    // Point 1 (X = 10 Hz) declared 0.05 ppm = 20 Hz at 400 MHz: up by 10 Hz.
    const t = parseJcamp(withLine(6, '##.SHIFT REFERENCE= (INTERNAL, TMS, 1, 0.05)'), 'tiny.jdx');
    expect(t.dims === 1 && [t.axis.firstHz, t.axis.lastHz]).toEqual([20, 11]);
  });

  it('ignores point 0, as written by the public test files (o01.jdx: INTERNAL, TMS, 0, 0)', () => {
    const s = parseJcamp(withLine(6, '##.SHIFT REFERENCE= INTERNAL, TMS, 0, 0'), 'tiny.jdx');
    expect(s.dims === 1 && [s.axis.firstHz, s.axis.lastHz]).toEqual([10, 1]);
  });

  it('rejects a malformed value with its line', () => {
    const e = jcampErrorOf(() => parseJcamp(withLine(6, '##.SHIFT REFERENCE= INTERNAL, TMS, ten, 0'), 'tiny.jdx'));
    expect(e).toMatchObject({ line: 7, field: '.SHIFTREFERENCE' });
  });
});

/** A hand-written 2D file: F1 6.0..4.0 ppm (3 rows), F2 5.0..3.5 ppm (4 points, X factor 0.5), Y factor 2. */
const PPM_2D = [
  '##TITLE= ppm 2D',
  '##JCAMP-DX= 6.00',
  '##DATA TYPE= nD NMR SPECTRUM',
  '##DATA CLASS= NTUPLES',
  '##ORIGIN= hand-written test fixture',
  '##OWNER= public domain',
  '##.OBSERVE FREQUENCY= 500.0',
  '##NUM DIM= 2',
  '##NTUPLES= nD NMR SPECTRUM',
  '##VAR_NAME= FREQUENCY1, FREQUENCY2, SPECTRUM',
  '##SYMBOL= F1, F2, Y',
  '##VAR_TYPE= INDEPENDENT, INDEPENDENT, DEPENDENT',
  '##VAR_FORM= AFFN, AFFN, ASDF',
  '##VAR_DIM= 3, 4, 4',
  '##UNITS= PPM, PPM, ARBITRARY UNITS',
  '##FACTOR= 1, 0.5, 2',
  '##FIRST= 6.0, 5.0, 2',
  '##LAST= 4.0, 3.5, ',
  '##PAGE= F1=6.0',
  '##DATA TABLE= (F2++(Y..Y)), PROFILE',
  '10 1 2 3 4',
  '##PAGE= F1=5.0',
  '##DATA TABLE= (F2++(Y..Y)), PROFILE',
  '10@A@a',
  '##PAGE= F1=4.0',
  '##DATA TABLE= (F2++(Y..Y)), PROFILE',
  '10EV',
  '##END NTUPLES= nD NMR SPECTRUM',
  '##END=',
];

describe('2D NTUPLES read by hand', () => {
  it('PPM columns become Hz (x 500 MHz), rows are pages, ordinates x FACTOR', () => {
    const s = parseJcamp(PPM_2D.join('\n'), 'ppm2d.jdx');
    if (s.dims !== 2) throw new Error('expected 2D');
    expect(s.f1).toEqual({ points: 3, firstHz: 3000, lastHz: 2000, observeMhz: 500 });
    expect(s.f2).toEqual({ points: 4, firstHz: 2500, lastHz: 1750, observeMhz: 500 });
    // By hand: 1 2 3 4 | @A@a = 0 1 0 -1 | E then DUP V(4) = 5 5 5 5, each x 2.
    expect(Array.from(s.data)).toEqual([2, 4, 6, 8, 0, 2, 0, -2, 10, 10, 10, 10]);
  });

  it('without ##NUM DIM=, two INDEPENDENT columns still make a 2D spectrum', () => {
    const s = parseJcamp(PPM_2D.filter((l) => !l.startsWith('##NUM DIM')).join('\n'), 'ppm2d.jdx');
    expect(s.dims).toBe(2);
  });

  it('a page value more than half a point off the F1 axis is an error at that page', () => {
    const text = PPM_2D.map((l) => (l === '##PAGE= F1=5.0' ? '##PAGE= F1=5.7' : l)).join('\n');
    const e = jcampErrorOf(() => parseJcamp(text, 'ppm2d.jdx'));
    expect(e).toMatchObject({ line: 22, field: 'PAGE' });
  });

  it('a page with a different F2 range is an error at that page', () => {
    const lines = PPM_2D.slice();
    lines.splice(22, 0, '##FIRST= 5.0, 5.5, 0');
    const e = jcampErrorOf(() => parseJcamp(lines.join('\n'), 'ppm2d.jdx'));
    expect(e.line).toBe(22);
    expect(e.message).toContain('the first page has 4');
  });
});
