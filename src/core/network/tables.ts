/**
 * J tables of a coupling network: atom × atom per spin system (markdown), and one row per
 * measurement (CSV, RFC 4180 quoting) so that every value keeps its method, dimension and source.
 */
import { toFixedDecimal } from '../sidecar/decimal';
import type { CouplingNetwork, PairEntry } from './network';

function pairOf(net: CouplingNetwork, a: string, b: string): PairEntry | undefined {
  return net.pairs.find((p) => (p.atoms[0] === a && p.atoms[1] === b) || (p.atoms[0] === b && p.atoms[1] === a));
}

function cell(p: PairEntry | undefined): string {
  if (!p) return '';
  const v = p.adopted;
  const marks = [...v.flags, ...(p.consistent ? [] : ['inconsistent'])];
  return `${toFixedDecimal(v.jHz, 2)} ± ${toFixedDecimal(v.sdHz, 2)} ${v.method}${marks.length > 0 ? ` (${marks.join(', ')})` : ''}`;
}

/** One markdown table per spin system with more than one atom: adopted J ± σ and method in each cell. */
export function jTableMarkdown(net: CouplingNetwork): string {
  const out: string[] = [];
  net.spinSystems.forEach((atoms, i) => {
    if (atoms.length < 2) return;
    out.push(`Spin system ${i + 1}: ${atoms.join(', ')}`, '');
    out.push(`| J / Hz | ${atoms.join(' | ')} |`, `|---|${atoms.map(() => '---').join('|')}|`);
    for (const a of atoms) {
      out.push(`| ${a} | ${atoms.map((b) => (a === b ? '—' : cell(pairOf(net, a, b)))).join(' | ')} |`);
    }
    out.push('');
  });
  const lone = net.spinSystems.filter((s) => s.length === 1).map((s) => s[0]);
  if (lone.length > 0) out.push(`Uncoupled (no J recorded): ${lone.join(', ')}`, '');
  return out.join('\n');
}

function csvField(s: string): string {
  return /[",\r\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}

/** Header plus one row per measurement, pairs in natural order; `adopted_*` repeat the pair's adopted value. */
export function jTableCsv(net: CouplingNetwork): string {
  const header = ['atom_a', 'atom_b', 'j_hz', 'j_sd_hz', 'method', 'dimension', 'flags', 'source', 'picks', 'adopted_j_hz', 'adopted_j_sd_hz', 'consistent'];
  const rows = net.pairs.flatMap((p) => p.measurements.map((m) => [
    m.atoms[0], m.atoms[1], toFixedDecimal(m.jHz, 2), toFixedDecimal(m.sdHz, 2), m.method, m.dimension, m.flags.join(' '), m.file,
    m.picks.join(' '), toFixedDecimal(p.adopted.jHz, 2), toFixedDecimal(p.adopted.sdHz, 2), p.consistent ? 'yes' : 'no',
  ]));
  return [header, ...rows].map((r) => r.map(csvField).join(',')).join('\r\n') + '\r\n';
}
