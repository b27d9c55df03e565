/**
 * What "Compare Picks With…" offers: the last commit, the merge base with the main line, the
 * other branches, any revision typed in, or no comparison. Pure: the glue passes git's answers.
 */
export interface RevisionChoice {
  readonly label: string;
  readonly description: string;
  /** What to hand to `git show REV:path`; 'ask' prompts for one; null clears the overlay. */
  readonly rev: string | 'ask' | null;
  /** How the overlay names it (the branch, not the merge-base hash). */
  readonly name: string;
}

/** `current` is the checked-out branch (null when detached); `branches` from `git for-each-ref refs/heads`. */
export function revisionChoices(current: string | null, branches: readonly string[], showingOverlay: boolean): RevisionChoice[] {
  const others = branches.filter((b) => b !== current);
  const main = ['main', 'master', 'trunk'].find((b) => others.includes(b));
  return [
    { label: 'HEAD', description: 'the last commit (your uncommitted changes)', rev: 'HEAD', name: 'HEAD' },
    ...(main === undefined ? [] : [{ label: `Merge base with ${main}`, description: 'what this branch changed', rev: `merge-base:${main}`, name: `merge base with ${main}` }]),
    ...others.map((b) => ({ label: b, description: 'branch', rev: b, name: b })),
    { label: 'Commit or other revision…', description: 'a hash, a tag, HEAD~2, …', rev: 'ask' as const, name: '' },
    ...(showingOverlay ? [{ label: 'Clear comparison', description: 'remove the overlay', rev: null, name: '' }] : []),
  ];
}
