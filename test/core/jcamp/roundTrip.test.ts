/**
 * Writer -> reader round trips. The writer's documented contract (src/core/jcamp/writer.ts): it
 * quantises to integers q with FACTOR = max|y| / 2^20, so |read - original| <= FACTOR / 2, and the
 * values read back are exactly q * FACTOR: writing them again gives the same text and the same numbers.
 * The written files must pass the reader's X check and DIF Y-value check (JCAMP-DX, McDonald & Wilks
 * 1988 [from memory]), keep lines within 80 characters (same source), and carry the labels the NMR
 * standards require (Davies & Lampen 1993; Lampen et al. 1999 [from memory]).
 */
import { describe, expect, it } from 'vitest';
import { parseJcamp, readJcampBlocks, writeJcamp1D, writeJcamp2D } from '../../../src/core/jcamp';
import { makeAxis } from '../../../src/core/spectrum/axis';
import type { DimensionProcessing } from '../../../src/core/spectrum/processing';
import { make1D, make2D, type Spectrum, type Spectrum1D, type Spectrum2D } from '../../../src/core/spectrum/spectrum';
import { headerValue, seeded } from './helpers';

const ENCODINGS = ['DIFDUP', 'AFFN'] as const;

function noisy(n: number, seed: number, scale: number): Float64Array {
  const rnd = seeded(seed);
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) out[i] = (rnd() - 0.5) * scale + (i % 97 === 0 ? 40 * scale : 0);
  return out;
}

function spectrum1D(n: number, seed: number): Spectrum1D {
  return make1D('test 1D', noisy(n, seed, 1234.5), makeAxis(n, 3012.345678, -587.25, 600.13));
}

function spectrum2D(n1: number, n2: number, seed: number, zeroRows: number[] = []): Spectrum2D {
  const data = noisy(n1 * n2, seed, 5e4);
  for (const r of zeroRows) data.fill(0, r * n2, (r + 1) * n2);
  return make2D('test 2D', data, makeAxis(n1, 2950.125, 2230.5, 500.13), makeAxis(n2, 2951.851102, 2234.060829, 500.13));
}

function maxAbs(a: Float64Array): number {
  return a.reduce((m, v) => Math.max(m, Math.abs(v)), 0);
}

function dataOf(s: Spectrum): Float64Array {
  return s.data;
}

describe('1D writer -> reader', () => {
  for (const encoding of ENCODINGS) {
    it(`${encoding}: odd size, negative values: axis exact, values within FACTOR/2, second round trip exact`, () => {
      const s = spectrum1D(1001, 7);
      const text = writeJcamp1D(s, { encoding });
      const back = parseJcamp(text, 'one.jdx');
      if (back.dims !== 1) throw new Error('expected 1D');
      expect(back.axis).toEqual(s.axis);
      expect(back.title).toBe(s.title);
      const factor = maxAbs(s.data) / 2 ** 20;
      expect(Number(headerValue(text, 'YFACTOR'))).toBe(factor);
      expect(maxAbs(back.data.map((v, i) => v - (s.data[i] ?? NaN)))).toBeLessThanOrEqual(factor / 2);
      expect(maxAbs(back.data.map((v) => v / factor - Math.round(v / factor)))).toBeLessThan(1e-9);
      const again = writeJcamp1D(back, { encoding });
      expect(again).toBe(text);
      expect(dataOf(parseJcamp(again, 'one.jdx'))).toEqual(back.data);
    });
  }

  it('an all-zero spectrum round-trips to zeros (FACTOR 1)', () => {
    const s = make1D('zeros', new Float64Array(17), makeAxis(17, 10, -6, 400));
    for (const encoding of ENCODINGS) expect(dataOf(parseJcamp(writeJcamp1D(s, { encoding }), 'z.jdx'))).toEqual(s.data);
  });

  it('writes the labels the standard asks for, and keeps every line within 80 characters', () => {
    const text = writeJcamp1D(spectrum1D(300, 3), { title: 'demo', origin: 'lab A', owner: 'nobody' });
    expect(text.split('\n').every((l) => l.length <= 80)).toBe(true);
    expect(headerValue(text, 'TITLE')).toBe('demo');
    expect(headerValue(text, 'JCAMP-DX')).toBe('5.01');
    expect(headerValue(text, 'DATA TYPE')).toBe('NMR SPECTRUM');
    expect(headerValue(text, 'ORIGIN')).toBe('lab A');
    expect(headerValue(text, 'OWNER')).toBe('nobody');
    expect(headerValue(text, '\\.OBSERVE FREQUENCY')).toBe('600.13');
    expect(headerValue(text, '\\.OBSERVE NUCLEUS')).toBe('^1H');
    expect(headerValue(text, 'NPOINTS')).toBe('300');
    expect(text.trimEnd().endsWith('##END=')).toBe(true);
  });
});

describe('2D writer -> reader', () => {
  for (const encoding of ENCODINGS) {
    it(`${encoding}: 7 x 333 points with all-zero rows: axes exact, values within FACTOR/2, second round trip exact`, () => {
      const s = spectrum2D(7, 333, 11, [0, 3, 6]);
      const text = writeJcamp2D(s, { encoding });
      const back = parseJcamp(text, 'two.jdx');
      if (back.dims !== 2) throw new Error('expected 2D');
      expect([back.f1, back.f2]).toEqual([s.f1, s.f2]);
      const factor = maxAbs(s.data) / 2 ** 20;
      expect(maxAbs(back.data.map((v, i) => v - (s.data[i] ?? NaN)))).toBeLessThanOrEqual(factor / 2);
      expect(Array.from(back.data.subarray(3 * 333, 4 * 333)).every((v) => v === 0)).toBe(true);
      const again = writeJcamp2D(back, { encoding });
      expect(again).toBe(text);
      expect(dataOf(parseJcamp(again, 'two.jdx'))).toEqual(back.data);
    });
  }

  it('one ##PAGE= F1=<Hz> per row, (F2++(Y..Y)), SPECTRUM tables, nD NMR labels, lines within 80 characters', () => {
    const s = spectrum2D(5, 64, 5);
    const text = writeJcamp2D(s);
    expect(text.split('\n').every((l) => l.length <= 80)).toBe(true);
    const pages = [...text.matchAll(/^##PAGE= F1=(.*)$/gm)].map((m) => Number(m[1]));
    const step = (s.f1.lastHz - s.f1.firstHz) / 4;
    pages.forEach((v, r) => expect(v).toBeCloseTo(s.f1.firstHz + r * step, 9));
    expect(pages.length).toBe(5);
    expect(text.match(/^##DATA TABLE= \(F2\+\+\(Y\.\.Y\)\), SPECTRUM$/gm)?.length).toBe(5);
    expect(headerValue(text, 'JCAMP-DX')).toBe('6.00');
    expect(headerValue(text, 'DATA TYPE')).toBe('nD NMR SPECTRUM');
    expect(headerValue(text, 'NUM DIM')).toBe('2');
    const file = readJcampBlocks(text, 'two.jdx');
    expect(file.blocks[0]?.pages.map((p) => [p.page, p.xSymbol, p.ySymbol, p.values.length])[4]).toEqual([`F1=${s.f1.lastHz}`, 'F2', 'Y', 64]);
  });

  it('DIFDUP lines: each line after the first on a page repeats the previous line\'s last ordinate (Y check)', () => {
    // Tamper with one Y-check value: the reader must notice, which shows the writer emits real checks.
    const s = spectrum2D(3, 200, 9);
    const text = writeJcamp2D(s);
    const lines = text.split('\n');
    const page1 = lines.indexOf(lines.find((l) => l.startsWith('##DATA TABLE=')) ?? '');
    const second = lines[page1 + 2] ?? '';
    const m = /^(-?[\d.]+)([@A-Ia-i])(\d*)/.exec(second);
    expect(m).not.toBeNull();
    const [, x = '', lead = '', rest = ''] = m ?? [];
    // Change the leading SQZ digit by one (A-I = 1..9, a-i = -1..-9, @ = 0), staying a SQZ character.
    const code = lead.charCodeAt(0);
    const bumped = lead === '@' ? 'A' : lead === 'I' || lead === 'i' ? String.fromCharCode(code - 1) : String.fromCharCode(code + 1);
    lines[page1 + 2] = x + bumped + rest + second.slice(x.length + 1 + rest.length);
    expect(() => parseJcamp(lines.join('\n'), 'two.jdx')).toThrow(/DIF Y-value check failed/);
  });
});

describe('processing labels round trip', () => {
  const f2: DimensionProcessing = { acquiredPoints: 1024, spectralWidthHz: 6009.615384615385, carrierHz: 2700.1234, size: 2048, window: { kind: 'sine', power: 2, shiftDeg: 90 } };
  const f1: DimensionProcessing = { acquiredPoints: 256, spectralWidthHz: 6009.615384615385, carrierHz: 2700.1234, size: 512, window: { kind: 'none' } };

  it('1D: exponential window', () => {
    const p: DimensionProcessing = { ...f2, window: { kind: 'exponential', lbHz: 0.3 } };
    const s = make1D('p', noisy(64, 1, 10), makeAxis(64, 100, -100, 600.13), p);
    const back = parseJcamp(writeJcamp1D(s), 'p.jdx');
    expect(back.dims === 1 && back.processing).toEqual(p);
  });

  it('2D: F1 and F2 labels, lines still within 80 characters', () => {
    const s = make2D('p', noisy(4 * 32, 2, 10), makeAxis(4, 100, -100, 600.13), makeAxis(32, 100, -100, 600.13), { f1, f2 });
    const text = writeJcamp2D(s);
    expect(text.split('\n').every((l) => l.length <= 80)).toBe(true);
    const back = parseJcamp(text, 'p.jdx');
    expect(back.dims === 2 && back.processing).toEqual({ f1, f2 });
  });
});
