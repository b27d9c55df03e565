/**
 * ASDF forms by hand (JCAMP-DX, McDonald & Wilks, Appl. Spectrosc. 42 (1988) 151 [from memory]):
 * SQZ @ A-I a-i = 0, 1..9, -1..-9 as the leading digit with sign; DIF % J-R j-r the same for
 * differences; DUP S-Z s = 1..9 as the leading digit of a repeat count that includes the repeated
 * token; a line ending in DIF form is followed by a line starting with the same ordinate (Y check).
 */
import { describe, expect, it } from 'vitest';
import { decodeAsdf } from '../../../src/core/jcamp/asdf';
import { dif, dup, encodeLines, sqz } from '../../../src/core/jcamp/asdfEncode';

function decode(lines: string[], n: number): number[] {
  const text = lines.join('\n');
  return Array.from(decodeAsdf(text, 0, text.length, 1, n, 'hand.jdx').values);
}

describe('ASDF characters (table of the standard)', () => {
  it('SQZ, DIF and DUP pseudo-digits', () => {
    expect([sqz(0), sqz(1), sqz(-1), sqz(123), sqz(-45), sqz(9)]).toEqual(['@', 'A', 'a', 'A23', 'd5', 'I']);
    expect([dif(0), dif(5), dif(-5), dif(-10), dif(92)]).toEqual(['%', 'N', 'n', 'j0', 'R2']);
    expect([dup(2), dup(3), dup(8), dup(9), dup(12)]).toEqual(['T', 'U', 'Z', 's', 'S2']);
  });
});

describe('decoding hand-encoded lines', () => {
  // 1 2 3 3 2 1 0 -1 -2 -3: SQZ 1 = A; differences +1 +1 0 -1 x6 = J T(DUP 2) % j X(DUP 6).
  const values = [1, 2, 3, 3, 2, 1, 0, -1, -2, -3];

  it('DIFDUP on one line', () => {
    expect(decode(['10AJT%jX'], 10)).toEqual(values);
  });

  it('AFFN with blanks, PAC with signs as separators, and SQZ', () => {
    expect(decode(['10 1 2 3 3 2', '5 1 0 -1 -2 -3'], 10)).toEqual(values);
    expect(decode(['10+1+2+3+3+2+1+0-1-2-3'], 10)).toEqual(values);
    expect(decode(['10ABCCBA@abc'], 10)).toEqual(values);
  });

  it('DIF across lines: the Y-check ordinate opening the next line is dropped', () => {
    expect(decode(['10AJT%j', '6BjW', '1c'], 10)).toEqual(values);
  });

  it('DUP of an absolute value and decimals in AFFN and SQZ', () => {
    expect(decode(['1 2.5 A0.5T @'], 4)).toEqual([2.5, 10.5, 10.5, 0]);
  });

  it('reads X in exponent form only with a signed exponent: "0E1" is X 0 then SQZ 51', () => {
    expect(decode(['0E1'], 1)).toEqual([51]);
    expect(decode(['1.0E+02 5 6'], 2)).toEqual([5, 6]);
  });

  it('stops at a $$ comment', () => {
    expect(decode(['10 1 2 $$ 3 4'], 2)).toEqual([1, 2]);
  });

  it('the encoder output decodes to the same integers (DIFDUP and AFFN)', () => {
    const q = [0, 0, 0, 5, -12, 300000, 299999, 299998, 299997, -1048576, 1048576, 7, 7, 7];
    for (const enc of ['DIFDUP', 'AFFN'] as const) {
      const lines = encodeLines(q, (i) => String(100 - i), enc);
      expect(decode(lines, q.length)).toEqual(q);
    }
  });
});
