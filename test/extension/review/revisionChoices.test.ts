import { describe, expect, it } from 'vitest';
import { revisionChoices } from '../../../src/extension/review/revisionChoices';

describe('revisionChoices', () => {
  it('offers HEAD, the merge base with the main line, the other branches and a typed revision', () => {
    const c = revisionChoices('feature', ['feature', 'main', 'alice'], false);
    expect(c.map((x) => x.rev)).toEqual(['HEAD', 'merge-base:main', 'main', 'alice', 'ask']);
    expect(c[1]?.name).toBe('merge base with main');
  });

  it('has no merge base on the main line itself, and offers to clear an overlay only when one is shown', () => {
    expect(revisionChoices('main', ['main'], false).map((x) => x.rev)).toEqual(['HEAD', 'ask']);
    expect(revisionChoices(null, ['master'], true).map((x) => x.rev)).toEqual(['HEAD', 'merge-base:master', 'master', 'ask', null]);
  });
});
