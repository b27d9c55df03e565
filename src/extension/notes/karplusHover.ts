/**
 * The dihedral estimates shown in the hover on an atom label: the requested pairs that contain it,
 * one line per relation, and one line of caution. Pure; the estimates come from the same core
 * function as the report (core/report/karplusReport.ts), so hover and report cannot differ.
 */
import { jText, relationLine } from '../../core/report/karplusFormat';
import type { KarplusEstimate } from '../../core/report/karplusReport';

/** Markdown lines (empty when no requested pair contains the label). */
export function karplusHoverLines(label: string, estimates: readonly KarplusEstimate[]): string[] {
  const mine = estimates.filter((e) => e.pair.includes(label));
  if (mine.length === 0) return [];
  const lines = ['', `**Dihedral estimates (Karplus)**, φ within J ± ${mine[0]?.k ?? 2}σ:`];
  for (const e of mine) {
    lines.push('', `*${e.pair[0]}/${e.pair[1]}*: ${jText(e)}`);
    lines.push(...e.relations.map((r) => `- ${relationLine(r)}`));
    // Only what is particular to this J; the general notes are in the report.
    lines.push(...e.notes.filter((n) => /not measured|doubt|vicinal/.test(n)).map((n) => `- ${n}`));
  }
  lines.push('', '*Several angles can fit one J; substituents and ring strain shift the curve: an aid to the argument, not a proof.*');
  return lines;
}
