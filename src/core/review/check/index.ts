/** `couplet check` rules, pure: the caller reads the files and hashes the data. */
import { hiddenFlagRule, siRegions, staleSiRule } from './siRules';
import { repeatedJRule } from './jRules';
import { labelRule, schemaAndHashRule } from './sidecarRules';
import { frontMatterRule } from './noteRules';
import type { CompoundInput, Problem } from './types';

export * from './types';
export { hiddenFlagRule, siRegions, staleSiRule, type SiRegion } from './siRules';
export { repeatedJRule, AGREEMENT_SIGMAS } from './jRules';
export { labelRule, schemaAndHashRule, type CheckedSidecar } from './sidecarRules';
export { frontMatterRule } from './noteRules';

export interface CheckOptions {
  /** The SI text a region of this kind in this note should hold now (issue 5's formatter), when known. */
  readonly expectedSi?: (kind: string, noteFile: string) => string | undefined;
}

/** Every rule on one compound folder; problems sorted by file, line, column. */
export function checkCompound(input: CompoundInput, options: CheckOptions = {}): Problem[] {
  const checked = input.sidecars.map(schemaAndHashRule);
  const regions = input.notes.flatMap(siRegions);
  const notesNamed = input.notes.map((n) => n.file.split(/[\\/]/).pop() ?? n.file).join(', ');
  const problems = [
    ...checked.flatMap((c) => c.problems),
    ...(input.knownLabels === undefined ? [] : checked.flatMap((c) => labelRule(c, input.knownLabels ?? new Set(), notesNamed))),
    ...repeatedJRule(checked),
    ...hiddenFlagRule(regions, checked),
    ...(options.expectedSi === undefined ? [] : staleSiRule(regions, options.expectedSi)),
    ...input.notes.flatMap(frontMatterRule),
  ];
  return problems.sort((a, b) => (a.file < b.file ? -1 : a.file > b.file ? 1 : a.line - b.line || a.column - b.column));
}
