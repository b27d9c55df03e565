/**
 * The changes since another revision as the panel's overlay marks: each pick change at its pick,
 * each coupling change at the first pick it cites (now, or before when it was removed). Pure.
 */
import type { SidecarChanges } from '../../core/review/compare';
import { describeCouplingChange, describePickChange } from '../../core/review/describe';
import type { Pick, Sidecar } from '../../core/sidecar';
import type { ReviewMarkView } from '../../protocol';

const at = (p: { f2Ppm: number; f1Ppm?: number } | undefined): { f2Ppm?: number; f1Ppm?: number } =>
  p === undefined ? {} : p.f1Ppm === undefined ? { f2Ppm: p.f2Ppm } : { f2Ppm: p.f2Ppm, f1Ppm: p.f1Ppm };

export function compareMarks(changes: SidecarChanges, before: Sidecar | null, now: Sidecar): ReviewMarkView[] {
  const pickNow = new Map(now.picks.map((p) => [p.id, p]));
  const pickBefore = new Map((before?.picks ?? []).map((p) => [p.id, p]));
  const placeOf = (ids: readonly string[]): Pick | undefined =>
    ids.map((id) => pickNow.get(id) ?? pickBefore.get(id)).find((p) => p !== undefined);
  const marks: ReviewMarkView[] = [];
  for (const c of changes.picks) {
    const text = describePickChange(c);
    if (c.kind === 'moved') {
      marks.push({ kind: 'moved', text, ...at(c.to), ...(c.from.f1Ppm === undefined ? { fromF2Ppm: c.from.f2Ppm } : { fromF2Ppm: c.from.f2Ppm, fromF1Ppm: c.from.f1Ppm }) });
    } else {
      marks.push({ kind: c.kind === 'annotated' ? 'other' : c.kind, text, ...at(c.pick) });
    }
  }
  for (const c of changes.couplings) {
    const kind = c.kind === 're-measured' ? 're-measured' : c.kind === 'amended' ? 'other' : c.kind;
    marks.push({ kind, text: describeCouplingChange(c), ...at(placeOf(c.coupling.picks)) });
  }
  if (changes.dataChanged) marks.push({ kind: 'other', text: 'data file or its recorded hash changed' });
  return marks;
}
