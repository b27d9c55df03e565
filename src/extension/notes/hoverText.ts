/**
 * The hover on an atom label in a structure note, as markdown: the shift, the multiplicity, every
 * J with its sigma, method and flags, and the sidecar and pick each value came from. Pure.
 */
import { toFixedDecimal } from '../../core/sidecar';
import { shiftOf, type LabelInfo } from './labelIndex';
import type { KarplusEstimate } from '../../core/report/karplusReport';
import { karplusHoverLines } from './karplusHover';

export interface HoverOptions {
  /** Decimals for J and sigma (the `couplet.display.jDecimals` setting). */
  readonly jDecimals: number;
  /** The multiplicity as the SI line reports it (e.g. `dd`, `m`), when it can be derived. */
  readonly multiplicity?: string;
  /** Dihedral estimates of the pairs the note requests (front matter `karplus:`); those with this label are shown. */
  readonly karplus?: readonly KarplusEstimate[];
}

/** Markdown table cells must not contain a bare `|`; labels and ids never should, but stay safe. */
const cell = (s: string): string => s.replace(/\|/g, '\\|');

export function hoverText(info: LabelInfo, o: HoverOptions): string {
  const lines: string[] = [];
  const shift = shiftOf(info);
  const head = shift === null ? 'no shift picked' : `δ ${toFixedDecimal(shift.ppm, 2)} ppm`;
  lines.push(`**${info.label}** — ${head}${o.multiplicity ? `, ${o.multiplicity}` : ''}`);
  if (shift !== null) {
    const from = shift.from.map((s) => `${toFixedDecimal(s.ppm, 4)} (${s.axis}, ${s.fileName} \`${s.pickId}\`)`);
    lines.push('', `Picked at ${from.join('; ')}`);
  }
  if (info.couplings.length === 0) {
    lines.push('', 'No coupling measured yet.', ...karplusHoverLines(info.label, o.karplus ?? []));
    return lines.join('\n');
  }
  lines.push('', '| partner | J (Hz) | σ (Hz) | method | flags | from |', '|---|---:|---:|---|---|---|');
  // Largest J first, as the SI line lists them.
  const sorted = [...info.couplings].sort((a, b) => b.jHz - a.jHz || a.partner.localeCompare(b.partner));
  for (const c of sorted) {
    const from = `${c.fileName}${c.picks.length > 0 ? ` ${c.picks.map((p) => `\`${p}\``).join(', ')}` : ' (no pick)'}`;
    lines.push(`| ${cell(c.partner)} | ${toFixedDecimal(c.jHz, o.jDecimals)} | ${toFixedDecimal(c.jSdHz, o.jDecimals)} | ${c.method} ${c.dimension} | ${cell(c.flags.join(', ') || '—')} | ${cell(from)} |`);
  }
  lines.push(...karplusHoverLines(info.label, o.karplus ?? []));
  return lines.join('\n');
}
