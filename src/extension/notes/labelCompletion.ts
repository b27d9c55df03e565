/**
 * Completion of atom labels in a structure note: the labels the compound's sidecars assign and the
 * ones the notes already use, offered where a label is being typed (`H`, `H-`, `H-1`...). Pure.
 */
import { mergeLabels } from '../../core/notes/labels';
import { shiftOf, type LabelIndex } from './labelIndex';
import { toFixedDecimal } from '../../core/sidecar';

export interface LabelCompletion {
  readonly label: string;
  /** e.g. `δ 4.12 · 2 couplings · cosy.jdx.couplet.yaml`, or `in the notes only`. */
  readonly detail: string;
  /** Natural order position, so the list keeps H-2 before H-10 whatever the editor's sort. */
  readonly sortText: string;
}

/** The partial label ending at the cursor: start offset within `linePrefix`, or null when none is being typed. */
export function labelPrefixStart(linePrefix: string): number | null {
  const m = /(?<![\w-])H(?:-\d{0,3}[a-z]?'{0,2})?$/.exec(linePrefix);
  return m ? m.index : null;
}

export function labelCompletions(index: LabelIndex, noteLabels: readonly string[]): LabelCompletion[] {
  return mergeLabels(index.labels, noteLabels).map((label, i) => {
    const info = index.get(label);
    const shift = info ? shiftOf(info) : null;
    const files = info ? [...new Set([...info.shifts.map((s) => s.fileName), ...info.couplings.map((c) => c.fileName)])] : [];
    const detail = info
      ? [shift ? `δ ${toFixedDecimal(shift.ppm, 2)}` : null, `${info.couplings.length} coupling${info.couplings.length === 1 ? '' : 's'}`, files.join(', ')].filter((x) => x !== null).join(' · ')
      : 'in the notes only';
    return { label, detail, sortText: String(i).padStart(4, '0') };
  });
}
