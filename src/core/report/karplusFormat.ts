/**
 * The dihedral estimates as text: a markdown section, a LaTeX block (pure ASCII: every symbol as a
 * LaTeX command) and a JSON array with stable snake_case keys. Angles are written in whole degrees
 * in text (a Karplus relation supports no more) and to 0.1° in JSON.
 */
import type { AngleInterval } from './karplusInverse';
import type { KarplusEstimate, RelationAngles } from './karplusReport';
import { KARPLUS_CAUTION } from './karplus';
import { toFixedDecimal } from '../sidecar/decimal';
import type { KarplusSubstituent } from '../notes/karplusRequests';

export type KarplusFormat = 'md' | 'tex';

export const KARPLUS_TITLE = 'Dihedral estimates (Karplus)';

/** Shown under the section: where each relation comes from (the 1963 coefficients are recalled). */
export const KARPLUS_SOURCES = [
  'Haasnoot, de Leeuw, Altona, Tetrahedron 36 (1980) 2783 (general parameter set; Huggins Δχ of the substituents)',
  'Karplus, J. Chem. Phys. 30 (1959) 11',
  'Karplus, J. Am. Chem. Soc. 85 (1963) 2870 (A = 7, B = −1, C = 5 Hz, from memory)',
];

/** LaTeX special characters first, then the symbols our text uses, so the result is plain ASCII. */
const TEX_SYMBOLS: Readonly<Record<string, string>> = {
  '±': '$\\pm$', '°': '$^{\\circ}$', '−': '$-$', '–': '--', '—': '---', 'φ': '$\\phi$', 'σ': '$\\sigma$', 'ξ': '$\\xi$',
  '³': '$^{3}$', 'Δ': '$\\Delta$', 'χ': '$\\chi$', '≈': '$\\approx$', '’': "'",
};

export function texText(s: string): string {
  return s
    .replace(/[\\{}$&#^_%~]/g, (c) => (c === '\\' ? '\\textbackslash{}' : c === '^' ? '\\textasciicircum{}' : c === '~' ? '\\textasciitilde{}' : `\\${c}`))
    .replace(/\bJ\b/g, '\\textit{J}') // the coupling constant is set in italics, as in the SI line
    .replace(/"([^"]*)"/g, "``$1''")
    .replace(/[±°−–—φσξ³Δχ≈’]/g, (c) => TEX_SYMBOLS[c] ?? c);
}

/** Whole degrees with a true minus sign: `−155°` (md), `$-155^{\circ}$` (tex). */
export function degText(x: number, f: KarplusFormat = 'md'): string {
  const r = Math.round(x);
  const v = r === 0 ? 0 : r; // no "−0°"
  return f === 'tex' ? `$${v}^{\\circ}$` : `${v < 0 ? '−' : ''}${Math.abs(v)}°`;
}

/** `139° to 171° (exact 155°)`; an interval running through 180° reads `160° to −160° through 180°`. */
export function intervalText(i: AngleInterval, f: KarplusFormat = 'md'): string {
  const exact = i.exactDeg.map((x) => degText(x > 180 ? x - 360 : x, f));
  const tail = exact.length > 0 ? ` (exact ${exact.join(', ')})` : '';
  if (i.toDeg > 180) return `${degText(i.fromDeg, f)} to ${degText(i.toDeg - 360, f)} through ${degText(180, f)}${tail}`;
  if (Math.round(i.fromDeg) === Math.round(i.toDeg)) return exact.length > 0 ? `${exact.join(', ')}` : degText(i.fromDeg, f);
  return `${degText(i.fromDeg, f)} to ${degText(i.toDeg, f)}${tail}`;
}

/** `C(+1), O(−1)`: the substituents as entered, with their ξ. */
export function substituentText(subs: readonly KarplusSubstituent[]): string {
  return subs.map((s) => `${s.name}(${s.xi > 0 ? '+1' : '−1'})`).join(', ');
}

/** `Karplus 1959: φ = 139° to 171° (exact 155°); …`, or why no angle fits, plus the relation's notes. */
export function relationLine(r: RelationAngles, f: KarplusFormat = 'md'): string {
  const t = (s: string): string => (f === 'tex' ? texText(s) : s);
  const subs = r.substituents.length > 0 ? ` with ${substituentText(r.substituents)}` : '';
  const ranges = r.intervals.length > 0 ? `${t('φ')} = ${r.intervals.map((i) => intervalText(i, f)).join('; ')}` : 'no angle fits';
  const notes = r.notes.length > 0 ? ` ${t('—')} ${r.notes.map(t).join(' ')}` : '';
  return `${t(r.relation + subs)}: ${ranges}${notes}`;
}

/** `J = 9.15 ± 0.29 Hz (fit)` or that it is not measured. */
export function jText(e: KarplusEstimate, f: KarplusFormat = 'md'): string {
  if (e.jHz === null || e.sdHz === null) return f === 'tex' ? '\\textit{J} not measured' : 'J not measured';
  const j = `${toFixedDecimal(e.jHz, 2)}`;
  const sd = toFixedDecimal(e.sdHz, 2);
  return f === 'tex' ? `\\textit{J} = ${j} $\\pm$ ${sd}\\,Hz (${e.method ?? ''})` : `J = ${j} ± ${sd} Hz (${e.method ?? ''})`;
}

const pairText = (e: KarplusEstimate): string => `${e.pair[0]}/${e.pair[1]}`;

const INTRO = (k: number): string =>
  `H–C–C–H dihedral angles φ whose J lies within the adopted J ± ${k}σ, from −180° to 180° (whole degrees); ` +
  `"exact" marks where the relation gives the measured J itself, a range without it only comes within ${k}σ. `;

export function karplusMarkdown(es: readonly KarplusEstimate[]): string {
  if (es.length === 0) return '';
  const lines = [`### ${KARPLUS_TITLE}`, '', `${INTRO(es[0]?.k ?? 2)}Caution: ${KARPLUS_CAUTION}`, ''];
  for (const e of es) {
    lines.push(`**${pairText(e)}**: ${jText(e)}`, '');
    lines.push(...e.relations.map((r) => `- ${relationLine(r)}`), ...e.notes.map((n) => `- Note: ${n}`), '');
  }
  lines.push(`Sources: ${KARPLUS_SOURCES.join('; ')}.`, '');
  return lines.join('\n');
}

export function karplusTex(es: readonly KarplusEstimate[]): string {
  if (es.length === 0) return '';
  const lines = [`\\paragraph{${KARPLUS_TITLE}.} ${texText(INTRO(es[0]?.k ?? 2))}${texText(`Caution: ${KARPLUS_CAUTION}`)}`, '\\begin{itemize}'];
  for (const e of es) {
    const parts = [...e.relations.map((r) => relationLine(r, 'tex')), ...e.notes.map((n) => `Note: ${texText(n)}`)];
    const sentences = parts.map((p) => (p.endsWith('.') ? p : `${p}.`)).join(' ');
    lines.push(`\\item ${texText(pairText(e))}, ${jText(e, 'tex')}${parts.length > 0 ? `. ${sentences}` : '.'}`);
  }
  lines.push('\\end{itemize}', `% Sources: ${texText(KARPLUS_SOURCES.join('; '))}.`, '');
  return lines.join('\n');
}

const tenth = (x: number): number => Math.round(x * 10) / 10;

/** One entry per pair and relation (relation null when J is not measured); stable snake_case keys. */
export function karplusJson(es: readonly KarplusEstimate[]): Record<string, unknown>[] {
  return es.flatMap((e): Record<string, unknown>[] => {
    const common = { pair: e.pair, j_hz: e.jHz, j_sd_hz: e.sdHz, k: e.k, method: e.method, flags: e.flags };
    if (e.relations.length === 0) return [{ ...common, relation: null, source: null, substituents: [], intervals: [], notes: e.notes, caution: e.caution }];
    return e.relations.map((r) => ({
      ...common, relation: r.relation, source: r.source,
      substituents: r.substituents.map((s) => ({ name: s.name, delta_chi: s.deltaChi, xi: s.xi })),
      intervals: r.intervals.map((i) => ({ from_deg: tenth(i.fromDeg), to_deg: tenth(i.toDeg), exact_deg: i.exactDeg.map(tenth) })),
      notes: [...r.notes, ...e.notes], caution: e.caution,
    }));
  });
}
