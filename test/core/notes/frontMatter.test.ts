import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { readFrontMatter } from '../../../src/core/notes/frontMatter';

describe('readFrontMatter', () => {
  it('reads the compound id of a sample note (samples/brisquarene/brisquarene.md starts with `compound: brisquarene`)', () => {
    const note = readFileSync(join(__dirname, '..', '..', '..', 'samples', 'brisquarene', 'brisquarene.md'), 'utf8');
    const f = readFrontMatter(note);
    expect(f.compound).toBe('brisquarene');
    expect(note.slice(0, f.end)).toMatch(/^---\ncompound: brisquarene\n[^]*---\n$/);
    expect(note.slice(f.end)).toMatch(/^\n?# Brisquarene/);
  });

  it('is not a compound note without front matter, or with front matter lacking the key', () => {
    expect(readFrontMatter('# Title\ncompound: x\n')).toEqual({ compound: null, solvent: null, problem: null, end: 0 });
    expect(readFrontMatter('---\ntitle: x\n---\nbody').compound).toBeNull();
  });

  it('reports YAML errors and a compound that is not text', () => {
    expect(readFrontMatter('---\ncompound: [a\n---\n').problem).toMatch(/^front matter is not valid YAML/);
    expect(readFrontMatter('---\ncompound: {a: 1}\n---\n').problem).toBe('front matter field "compound" should be a compound id (text)');
  });

  it('reads the solvent for the SI header when given', () => {
    expect(readFrontMatter('---\ncompound: q\nsolvent: CD3OD\n---\n')).toMatchObject({ compound: 'q', solvent: 'CD3OD' });
    expect(readFrontMatter('---\ncompound: q\n---\n').solvent).toBeNull();
  });

  it('accepts CRLF line ends and a numeric id (YAML 1.2 reads `12` as an integer)', () => {
    expect(readFrontMatter('---\r\ncompound: 12\r\n---\r\nx').compound).toBe('12');
  });
});
