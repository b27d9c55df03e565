/**
 * Canonical text of each part of a sidecar, as lines. Block style, one field per line, flow style
 * only for short lists of scalars (`[H-3, H-4a]`), fixed decimals (ppm 4, Hz 2).
 */
import { parse } from 'yaml';
import { naturalCompare, toFixedDecimal } from './decimal';
import { normalizeAtoms } from './order';
import { SCHEMA_ID, type Coupling, type DataRef, type Pick } from './types';

/** Indent of the `- ` of list items, and of the fields inside them. */
export const DASH_INDENT = 2;

export interface FieldLine {
  key: string;
  /** The full line without the list dash/indent prefix, e.g. `f2_ppm: 4.1200`. */
  text: string;
}

/**
 * A scalar as YAML text: plain when the plain form reads back as the same string, otherwise
 * double-quoted with JSON escapes (every JSON string is a valid YAML 1.2 double-quoted scalar,
 * YAML 1.2.2 §7.3.1). Reading back through the parser catches the plain forms that would change
 * type (`true`, `1.5`, `null`, `~`) or meaning (`a: b`, `# x`, `[x]`). The check is made under
 * YAML 1.1 rules too, so that older readers do not turn `yes`, `on` or `1:20` into other types.
 */
export function scalar(value: string, inFlow: boolean): string {
  if (SIMPLE.test(value) && !KEYWORD.test(value)) return value;
  const safeChars = inFlow ? /^[^\s,[\]{}#&*!|>'"%@`][^,[\]{}\n\r\t]*$/ : /^[^\s[\]{}#&*!|>'"%@`,][^\n\r\t]*$/;
  if (value === value.trim() && safeChars.test(value) && readsBack(value, inFlow, '1.2') && readsBack(value, inFlow, '1.1')) {
    return value;
  }
  return JSON.stringify(value);
}

/** Fast path: a letter then letters, digits, `.`, `_`, `-`, `+`, `(`, `)` is plain text in YAML 1.2 and 1.1 ... */
const SIMPLE = /^[A-Za-z][A-Za-z0-9._+()-]*$/;
/** ... unless it is a keyword of the YAML 1.2 core schema (§10.3.2) or a YAML 1.1 boolean/null. */
const KEYWORD = /^(null|true|false|y|n|yes|no|on|off)$/i;

function readsBack(value: string, inFlow: boolean, version: '1.1' | '1.2'): boolean {
  try {
    const back: unknown = inFlow ? parse(`[${value}]`, { version }) : parse(`k: ${value}`, { version });
    if (inFlow) return Array.isArray(back) && back.length === 1 && back[0] === value;
    return typeof back === 'object' && back !== null && (back as Record<string, unknown>)['k'] === value;
  } catch {
    return false;
  }
}

const flowList = (items: readonly string[]): string => `[${items.join(', ')}]`;
const ppm = (x: number): string => toFixedDecimal(x, 4);
const hz = (x: number): string => toFixedDecimal(x, 2);

export function headLines(data: DataRef): string[] {
  return [`schema: ${SCHEMA_ID}`, 'data:', `  file: ${scalar(data.file, false)}`, `  sha256: ${scalar(data.sha256, false)}`];
}

export function pickFields(p: Pick): FieldLine[] {
  const label = p.label.length === 1 ? scalar(p.label[0] ?? '', false) : flowList(p.label.map((l) => scalar(l, true)));
  const out: FieldLine[] = [
    { key: 'id', text: `id: ${scalar(p.id, false)}` },
    { key: 'f2_ppm', text: `f2_ppm: ${ppm(p.f2Ppm)}` },
  ];
  if (p.f1Ppm !== undefined) out.push({ key: 'f1_ppm', text: `f1_ppm: ${ppm(p.f1Ppm)}` });
  if (p.fromPpm !== undefined) out.push({ key: 'from_ppm', text: `from_ppm: ${ppm(p.fromPpm)}` });
  if (p.toPpm !== undefined) out.push({ key: 'to_ppm', text: `to_ppm: ${ppm(p.toPpm)}` });
  out.push({ key: 'label', text: `label: ${label}` });
  if (p.kind !== undefined) out.push({ key: 'kind', text: `kind: ${p.kind}` });
  if (p.protons !== undefined) out.push({ key: 'protons', text: `protons: ${p.protons}` });
  if (p.note !== undefined) out.push({ key: 'note', text: `note: ${scalar(p.note, false)}` });
  return out;
}

export function couplingFields(c: Coupling): FieldLine[] {
  const flags = [...new Set(c.flags)].sort(naturalCompare);
  const out: FieldLine[] = [
    { key: 'atoms', text: `atoms: ${flowList(normalizeAtoms(c.atoms).map((a) => scalar(a, true)))}` },
    { key: 'j_hz', text: `j_hz: ${hz(c.jHz)}` },
    { key: 'j_sd_hz', text: `j_sd_hz: ${hz(c.jSdHz)}` },
    { key: 'method', text: `method: ${c.method}` },
    { key: 'dimension', text: `dimension: ${c.dimension}` },
    { key: 'picks', text: `picks: ${flowList(c.picks.map((p) => scalar(p, true)))}` },
    { key: 'flags', text: `flags: ${flowList(flags.map((f) => scalar(f, true)))}` },
  ];
  if (c.passiveHz !== undefined) out.push({ key: 'passive_hz', text: `passive_hz: ${flowList(c.passiveHz.map(hz))}` });
  if (c.linewidthHz !== undefined) out.push({ key: 'linewidth_hz', text: `linewidth_hz: ${hz(c.linewidthHz)}` });
  if (c.note !== undefined) out.push({ key: 'note', text: `note: ${scalar(c.note, false)}` });
  return out;
}

/** Field lines as list-item lines: the first behind `- `, the rest indented under it. */
export function itemLines(fields: readonly FieldLine[], dashIndent: number = DASH_INDENT): string[] {
  const pad = ' '.repeat(dashIndent);
  return fields.map((f, i) => (i === 0 ? `${pad}- ${f.text}` : `${pad}  ${f.text}`));
}

/** The canonical key line of a list section. */
export function listKeyLine(key: string, empty: boolean): string {
  return empty ? `${key}: []` : `${key}:`;
}
