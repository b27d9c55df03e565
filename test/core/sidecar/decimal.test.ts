import { describe, expect, it } from 'vitest';
import { naturalCompare, toFixedDecimal } from '../../../src/core/sidecar';

describe('toFixedDecimal: half away from zero on the decimal the number reads as', () => {
  it('rounds 1.005 to 1.01 where toFixed gives 1.00 (the double is 1.00499999999999989..., ECMA-262 Number.prototype.toFixed rounds that binary value)', () => {
    expect((1.005).toFixed(20).startsWith('1.00499999999999989')).toBe(true);
    expect((1.005).toFixed(2)).toBe('1.00');
    expect(toFixedDecimal(1.005, 2)).toBe('1.01');
  });

  it('rounds ties away from zero on both sides (roundTiesToAway, IEEE 754-2008 §4.3.1)', () => {
    expect(toFixedDecimal(2.675, 2)).toBe('2.68');
    expect(toFixedDecimal(-2.675, 2)).toBe('-2.68');
    expect(toFixedDecimal(0.125, 2)).toBe('0.13'); // exact binary tie: toFixed agrees (ECMA-262 picks the larger n)
    expect((0.125).toFixed(2)).toBe('0.13');
    expect(toFixedDecimal(-0.125, 2)).toBe('-0.13');
    expect(toFixedDecimal(4.12345, 4)).toBe('4.1235');
    expect(toFixedDecimal(-4.12345, 4)).toBe('-4.1235');
  });

  it('carries through nines and pads short fractions', () => {
    expect(toFixedDecimal(9.99995, 4)).toBe('10.0000');
    expect(toFixedDecimal(-0.995, 2)).toBe('-1.00');
    expect(toFixedDecimal(4.12, 4)).toBe('4.1200');
    expect(toFixedDecimal(7, 2)).toBe('7.00');
    expect(toFixedDecimal(123.456789, 4)).toBe('123.4568');
  });

  it('writes no sign on zero and on values that round to zero, and handles exponent forms', () => {
    expect(toFixedDecimal(-0, 2)).toBe('0.00');
    expect(toFixedDecimal(-0.004, 2)).toBe('0.00');
    expect(toFixedDecimal(1e-7, 4)).toBe('0.0000');
    expect(toFixedDecimal(5e-5, 4)).toBe('0.0001');
    expect(toFixedDecimal(-5e-5, 4)).toBe('-0.0001');
  });

  it('agrees with integer arithmetic for every k/1000, |k| <= 20000 (round half away: sign(k)*floor((|k|+5)/10))', () => {
    for (let k = -20000; k <= 20000; k++) {
      const q = Math.floor((Math.abs(k) + 5) / 10);
      const sign = k < 0 && q !== 0 ? '-' : '';
      const expected = `${sign}${Math.floor(q / 100)}.${String(q % 100).padStart(2, '0')}`;
      const got = toFixedDecimal(k / 1000, 2);
      if (got !== expected) expect(`${k}/1000 -> ${got}`).toBe(`${k}/1000 -> ${expected}`);
    }
  });

  it('refuses values it cannot write, saying which', () => {
    expect(() => toFixedDecimal(Number.NaN, 2)).toThrow(/NaN/);
    expect(() => toFixedDecimal(Number.POSITIVE_INFINITY, 2)).toThrow(/Infinity/);
    expect(() => toFixedDecimal(1e21, 2)).toThrow(/too large/);
  });
});

describe('naturalCompare (natural sort order, common practice)', () => {
  it('orders digit runs by value: H-2 < H-10, p-9.5000 < p-10.0000', () => {
    expect(['H-10', 'H-2', 'H-1', 'H-4b', 'H-4a'].sort(naturalCompare)).toEqual(['H-1', 'H-2', 'H-4a', 'H-4b', 'H-10']);
    expect(naturalCompare('p-9.5000', 'p-10.0000')).toBeLessThan(0);
  });

  it('is a total order: equal only for equal strings, leading zeros broken by code units', () => {
    expect(naturalCompare('H-3', 'H-3')).toBe(0);
    expect(naturalCompare('H-03', 'H-3')).not.toBe(0);
    expect(Math.sign(naturalCompare('H-03', 'H-3'))).toBe(-Math.sign(naturalCompare('H-3', 'H-03')));
  });
});
