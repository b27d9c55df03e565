import { describe, expect, it } from 'vitest';
import { readKarplusRequests } from '../../../src/core/notes/karplusRequests';
import { readFrontMatter } from '../../../src/core/notes/frontMatter';

/** A note whose front matter lines are numbered as in an editor (line 1 is the opening `---`). */
function note(...frontMatter: string[]): string {
  return ['---', 'compound: quellopyranol', ...frontMatter, '---', '', '# Quellopyranol', ''].join('\n');
}

const GOOD = [
  'karplus:',
  '  - pair: [H-3a, H-4]',
  '    substituents: [C, C, O]',
  '    orientation: [-1, -1, +1]',
  '  - pair: [H-2, H-3a]',
  '    substituents: [0.62]',
  '    orientation: [1]',
];

describe('readKarplusRequests', () => {
  it('reads pairs, Huggins Δχ of element symbols (C 0.40, O 1.30, from memory, references.md) and ξ', () => {
    const r = readKarplusRequests(note(...GOOD), 'q.md');
    expect(r.problems).toEqual([]);
    expect(r.requests).toHaveLength(2);
    const [a, b] = r.requests;
    expect(a?.pair).toEqual(['H-3a', 'H-4']);
    expect(a?.substituents.map((s) => [s.name, s.deltaChi, s.xi])).toEqual([['C', 0.4, -1], ['C', 0.4, -1], ['O', 1.3, 1]]);
    expect(a?.line).toBe(4); // `  - pair: [H-3a, H-4]` is the note's 4th line
    expect(b?.substituents).toEqual([{ name: '0.62', deltaChi: 0.62, xi: 1 }]);
  });

  it('names the note, the line and the field of a bad ξ, and leaves that request out', () => {
    const text = note('karplus:', '  - pair: [H-3a, H-4]', '    substituents: [C, C]', '    orientation: [+1, 2]');
    const r = readKarplusRequests(text, 'quellopyranol.md');
    expect(r.requests).toEqual([]);
    expect(r.problems.map((p) => p.text)).toEqual(['quellopyranol.md:6: karplus[0].orientation[1]: must be +1 or -1, got 2']);
    const p = r.problems[0]!;
    expect(text.slice(p.offset, p.offset + p.length)).toBe('2');
  });

  it('an unknown element lists the known ones', () => {
    const r = readKarplusRequests(note('karplus:', '  - pair: [H-3a, H-4]', '    substituents: [Xe]', '    orientation: [1]'), 'q.md');
    expect(r.problems[0]?.text).toBe('q.md:5: karplus[0].substituents[0]: unknown substituent "Xe": use one of C, N, O, Cl, Br or a Huggins Δχ number');
  });

  it('refuses prototype names as elements (no Δχ from Object.prototype)', () => {
    const r = readKarplusRequests(note('karplus:', '  - pair: [H-3a, H-4]', '    substituents: [constructor]', '    orientation: [1]'), 'q.md');
    expect(r.problems[0]?.field).toBe('karplus[0].substituents[0]');
  });

  it('checks counts, pairs, ranges and unknown fields, each at its own line', () => {
    const text = note(
      'karplus:',
      '  - pair: [H-3a]', //                      line 4
      '  - pair: [H-4, H-4]', //                  line 5
      '  - pair: [H-3a, H-4]', //                 line 6
      '    substituents: [C, O]',
      '    orientation: [1]', //                  line 8: one ξ for two substituents
      '  - pair: [H-3a, H-4]', //                 line 9
      '    substituents: [5]', //                 line 10: Δχ out of range
      '    orientation: [1]',
      '    sigma: 2', //                          line 12: unknown field
      '  - pair: [H-3a, H-4]',
      '    substituents: [C, C, C, C, C]', //     line 14: too many
      '    orientation: [1, 1, 1, 1, 1]',
    );
    const r = readKarplusRequests(text, 'q.md');
    expect(r.requests).toEqual([]);
    expect(r.problems.map((p) => `${p.line} ${p.field}`)).toEqual([
      '4 karplus[0].pair', '5 karplus[1].pair', '8 karplus[2].orientation',
      '12 karplus[3].sigma', '10 karplus[3].substituents[0]', '14 karplus[4].substituents',
    ]);
  });

  it('karplus that is not a list is one problem; absent or empty karplus is nothing', () => {
    expect(readKarplusRequests(note('karplus: H-3a/H-4'), 'q.md').problems[0]?.text).toMatch(/^q\.md:3: karplus: must be a list/);
    expect(readKarplusRequests(note(), 'q.md')).toEqual({ requests: [], problems: [] });
    expect(readKarplusRequests(note('karplus:'), 'q.md')).toEqual({ requests: [], problems: [] });
    expect(readKarplusRequests('# no front matter\n', 'q.md')).toEqual({ requests: [], problems: [] });
  });

  it('leaves a YAML syntax error to the front matter check (one report, not two)', () => {
    const text = note('karplus: [unclosed');
    expect(readFrontMatter(text).problem).toMatch(/not valid YAML/);
    expect(readKarplusRequests(text, 'q.md')).toEqual({ requests: [], problems: [] });
  });

  it('counts lines the same way with CRLF line ends', () => {
    const r = readKarplusRequests(note('karplus:', '  - pair: [H-3a, H-4]', '    substituents: [C]', '    orientation: [0]').replace(/\n/g, '\r\n'), 'q.md');
    expect(r.problems[0]?.text).toBe('q.md:6: karplus[0].orientation[0]: must be +1 or -1, got 0');
  });
});
