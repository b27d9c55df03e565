import { describe, expect, it } from 'vitest';
import { upsertRegion } from '../../../src/extension/notes/siRegion';

const apply = (text: string, e: { offset: number; length: number; text: string }): string => text.slice(0, e.offset) + e.text + text.slice(e.offset + e.length);

describe('upsertRegion', () => {
  it('inserts a marked region at the cursor, markers on lines of their own', () => {
    const text = '# Brisquarene\n\nData: \n';
    const at = text.indexOf(': ') + 2;
    const e = upsertRegion(text, at, 'markdown', 'H1', '¹H NMR δ 7.26 (d, J = 8.4 Hz, 1H, H-6).', 'b.md');
    expect(e.replaced).toBe(false);
    expect(apply(text, e)).toBe('# Brisquarene\n\nData: \n<!-- couplet:si H1 begin -->\n¹H NMR δ 7.26 (d, J = 8.4 Hz, 1H, H-6).\n<!-- couplet:si H1 end -->\n');
  });

  it('replaces only the body on a second run, so running twice equals running once with the newer line', () => {
    const once = apply('x\n', upsertRegion('x\n', 2, 'markdown', 'H1', 'old line', 'n.md'));
    const second = upsertRegion(once, 0, 'markdown', 'H1', 'new line', 'n.md');
    expect(second.replaced).toBe(true);
    expect(apply(once, second)).toBe('x\n<!-- couplet:si H1 begin -->\nnew line\n<!-- couplet:si H1 end -->');
    // Idempotent: the same body again changes nothing.
    const again = apply(apply(once, second), upsertRegion(apply(once, second), 0, 'markdown', 'H1', 'new line', 'n.md'));
    expect(again).toBe(apply(once, second));
  });

  it('keeps indented markers and the text around them byte for byte', () => {
    const text = 'before\n  <!-- couplet:si H1 begin -->  \nold\nlines\n  <!-- couplet:si H1 end -->\nafter';
    expect(apply(text, upsertRegion(text, 0, 'markdown', 'H1', 'new', 'n.md')))
      .toBe('before\n  <!-- couplet:si H1 begin -->  \nnew\n  <!-- couplet:si H1 end -->\nafter');
  });

  it('uses LaTeX comment markers in LaTeX and keeps CRLF line ends', () => {
    const text = 'a\r\n% couplet:si H1 begin\r\nold\r\n% couplet:si H1 end\r\n';
    expect(apply(text, upsertRegion(text, 0, 'latex', 'H1', 'new\nline', 'si.tex'))).toBe('a\r\n% couplet:si H1 begin\r\nnew\r\nline\r\n% couplet:si H1 end\r\n');
  });

  it('refuses unpaired, reversed or doubled markers, naming file and line', () => {
    expect(() => upsertRegion('a\n<!-- couplet:si H1 begin -->\nb\n', 0, 'markdown', 'H1', 'x', 'n.md')).toThrow('n.md:2: "couplet:si H1 begin" without its end marker');
    expect(() => upsertRegion('<!-- couplet:si H1 end -->\n', 0, 'markdown', 'H1', 'x', 'n.md')).toThrow('n.md:1: "couplet:si H1 end" without its begin marker');
    expect(() => upsertRegion('<!-- couplet:si H1 end -->\n<!-- couplet:si H1 begin -->\n', 0, 'markdown', 'H1', 'x', 'n.md')).toThrow('n.md:1: "couplet:si H1 end" comes before');
    const two = '<!-- couplet:si H1 begin -->\n<!-- couplet:si H1 end -->\n<!-- couplet:si H1 begin -->\n<!-- couplet:si H1 end -->\n';
    expect(() => upsertRegion(two, 0, 'markdown', 'H1', 'x', 'n.md')).toThrow('n.md:3: a second');
  });

  it('ignores a marker mentioned inside prose (only whole marker lines count)', () => {
    const text = 'Write `<!-- couplet:si H1 begin -->` to start a region.\n';
    expect(upsertRegion(text, text.length, 'markdown', 'H1', 'x', 'n.md').replaced).toBe(false);
  });

  it('does not touch a region of another kind', () => {
    const text = '<!-- couplet:si C13 begin -->\nc\n<!-- couplet:si C13 end -->\n';
    expect(upsertRegion(text, text.length, 'markdown', 'H1', 'h', 'n.md')).toMatchObject({ offset: text.length, length: 0, replaced: false });
  });
});
