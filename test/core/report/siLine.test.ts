import { describe, expect, it } from 'vitest';
import { formatSiLine, siLineJson, siNotes, type SiEntry } from '../../../src/core/report/siLine';

// Conventions: common practice as stated in ../shared/checks/references.md ("Reporting ¹H data in
// supporting information"): shifts to 0.01 ppm descending; J to 0.1 Hz, largest first, in the
// order of the multiplicity letters; s d t q p m br and combinations; proton counts from integrals.
const header = { observeMhz: 600.13, solvent: 'CDCl3' };
const h2: SiEntry = { labels: ['H-2'], ppm: 7.2612, couplings: [{ jHz: 8.43, partners: ['H-3'] }], protons: 2 };
const h3: SiEntry = { labels: ['H-3'], ppm: 4.1249, couplings: [{ jHz: 4.5 }, { jHz: -10.21 }], protons: 1 };

describe('formatSiLine (SI conventions, common practice)', () => {
  it('writes the example of references.md, entries in descending shift order', () => {
    expect(formatSiLine(header, [h3, h2])).toBe('¹H NMR (600 MHz, CDCl₃) δ 7.26 (d, J = 8.4 Hz, 2H, H-2), 4.12 (dd, J = 10.2, 4.5 Hz, 1H, H-3).');
  });

  it('rounds half away from zero on the decimal, not the binary value (4.125 -> 4.13; 0.05 -> 0.1)', () => {
    const e: SiEntry = { labels: ['H-1'], ppm: 4.125, couplings: [{ jHz: 0.05 }], protons: 1 };
    expect(formatSiLine(header, [e])).toContain('4.13 (d, J = 0.1 Hz');
  });

  it('orders letters and J largest first: a triplet of 10.0 Hz split by 3.0 Hz is "td, J = 10.0, 3.0 Hz"', () => {
    const e: SiEntry = { labels: ['H-5'], ppm: 2.0, couplings: [{ jHz: 3, count: 1 }, { jHz: 10, count: 2 }], protons: 1 };
    expect(formatSiLine(header, [e])).toContain('2.00 (td, J = 10.0, 3.0 Hz, 1H, H-5)');
    const f: SiEntry = { labels: ['H-6'], ppm: 2.0, couplings: [{ jHz: 10, count: 1 }, { jHz: 3, count: 2 }], protons: 1 };
    expect(formatSiLine(header, [f])).toContain('(dt, J = 10.0, 3.0 Hz');
  });

  it('writes s, q and p from the partner counts', () => {
    const s: SiEntry = { labels: ['H-9'], ppm: 3.3, couplings: [], protons: 3 };
    const q: SiEntry = { labels: ['H-10'], ppm: 2.4, couplings: [{ jHz: 7.1, count: 3 }], protons: 2 };
    const p: SiEntry = { labels: ['H-11'], ppm: 1.6, couplings: [{ jHz: 7.0, count: 4 }], protons: 2 };
    expect(formatSiLine(header, [s, q, p])).toBe('¹H NMR (600 MHz, CDCl₃) δ 3.30 (s, 3H, H-9), 2.40 (q, J = 7.1 Hz, 2H, H-10), 1.60 (p, J = 7.0 Hz, 2H, H-11).');
  });

  it('writes m with a range (high–low) for a multiplet, without J', () => {
    const e: SiEntry = { labels: ['H-8a', 'H-8b'], ppm: 3.57, rangePpm: [3.5, 3.6249], multiplet: true, couplings: [{ jHz: 11 }], protons: 2 };
    expect(formatSiLine(header, [e])).toContain('δ 3.62–3.50 (m, 2H, H-8a, H-8b)');
  });

  it('leaves an unresolved J out, marks the signal br and says so in a note', () => {
    const e: SiEntry = { labels: ['H-4'], ppm: 6.1, couplings: [{ jHz: 15.6, partners: ['H-3'] }, { jHz: 0.8, partners: ['H-1'], flags: ['unresolved'] }], protons: 1 };
    expect(formatSiLine(header, [e])).toContain('6.10 (br d, J = 15.6 Hz, 1H, H-4)');
    expect(siNotes([e])).toEqual(['H-4: J to H-1 is unresolved (0.8 Hz measured); left out of the multiplicity, signal marked br.']);
  });

  it('writes a second-order signal as m without J, with a note', () => {
    const e: SiEntry = { labels: ['H-5a'], ppm: 1.3, rangePpm: [1.36, 1.24], couplings: [{ jHz: 13 }], protons: 1, flags: ['second-order'] };
    expect(formatSiLine(header, [e])).toContain('1.36–1.24 (m, 1H, H-5a)');
    expect(siNotes([e])[0]).toMatch(/second-order/);
  });

  it('LaTeX: \\textit{J}, \\delta, $^{1}$H, thin-space units, subscript digits, -- in ranges', () => {
    const m: SiEntry = { labels: ['H-8'], ppm: 3.57, rangePpm: [3.62, 3.5], multiplet: true, couplings: [], protons: 2 };
    expect(formatSiLine(header, [h2, m], 'tex')).toBe(
      '$^{1}$H NMR (600\\,MHz, CDCl$_{3}$) $\\delta$ 7.26 (d, \\textit{J} = 8.4\\,Hz, 2H, H-2), 3.62--3.50 (m, 2H, H-8).',
    );
  });

  it('JSON keeps the numbers behind the line', () => {
    const j = siLineJson(header, [h3]) as { signals: { j_hz: number[]; multiplicity: string }[]; line: string };
    expect(j.signals[0]!.j_hz).toEqual([10.21, 4.5]);
    expect(j.signals[0]!.multiplicity).toBe('dd');
    expect(j.line).toContain('4.12 (dd');
  });

  it('refuses bad input naming the entry and field', () => {
    expect(() => formatSiLine(header, [{ ...h2, protons: 0 }])).toThrow(/SI entry 0 \(H-2\): protons/);
    expect(() => formatSiLine(header, [{ ...h2, couplings: [{ jHz: Number.NaN }] }])).toThrow(/couplings\[0\]\.jHz/);
  });
});
