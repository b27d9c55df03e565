import { describe, expect, it } from 'vitest';
import { siRegions, staleSiRule } from '../../../src/core/review/check';

const md = 'intro\n<!-- couplet:si H1 begin -->\n¹H NMR δ 7.26 (d, J = 8.4 Hz, 1H, H-6).\n<!-- couplet:si H1 end -->\n';
const tex = 'x\n% couplet:si H1 begin\nline\n% couplet:si H1 end\n';

describe('SI regions in notes', () => {
  it('finds markdown and LaTeX regions with the begin marker line and the body', () => {
    expect(siRegions({ file: 'a.md', text: md })).toMatchObject([{ kind: 'H1', line: 2, body: '\n¹H NMR δ 7.26 (d, J = 8.4 Hz, 1H, H-6).\n' }]);
    expect(siRegions({ file: 'a.tex', text: tex })).toMatchObject([{ kind: 'H1', line: 2, body: '\nline\n' }]);
  });

  it('ignores an unpaired marker (the insert command names it)', () => {
    expect(siRegions({ file: 'a.md', text: '<!-- couplet:si H1 begin -->\ntext\n' })).toEqual([]);
  });

  it('stale: reports a region whose text differs from the expected line, ignoring wrapping', () => {
    const regions = siRegions({ file: 'a.md', text: md });
    expect(staleSiRule(regions, () => '¹H NMR δ 7.26\n(d, J = 8.4 Hz, 1H, H-6).')).toEqual([]);
    expect(staleSiRule(regions, () => '¹H NMR δ 7.26 (d, J = 8.5 Hz, 1H, H-6).')).toMatchObject([{ file: 'a.md', line: 2, rule: 'stale-si', severity: 'error' }]);
    expect(staleSiRule(regions, () => undefined)).toEqual([]);
  });
});
