/**
 * Export of a compound's assignments and J values as an NMReDATA record (SD file with NMREDATA_*
 * tags): Pupier et al., Magn. Reson. Chem. 56 (2018) 703. The tag names, the `\` line terminator
 * inside tag values, `Larmor=`, `CorType=`, the `S=`, `N=`, `L=`, `E=`, `J=` fields of a 1D signal and
 * `label/label` correlation lines are reproduced FROM MEMORY of that publication (version 1.1
 * format), not from a re-read; check against the specification before relying on them.
 *
 * What is omitted, and why: Couplet holds no structure. The molfile block is an empty molecule
 * (V2000 counts line with 0 atoms, 0 bonds; syntactically a valid molfile), so NMREDATA_ASSIGNMENT
 * lines carry the label and shift but no atom numbers, which the format expects for each label.
 * A reader that requires atom numbers will reject the record until a structure is added (e.g. by
 * pasting the molfile and appending the H atom numbers to each assignment line).
 */
import { toFixedDecimal } from '../sidecar/decimal';
import type { CompoundReport } from './compound';

const END = '\\';

function tag(name: string, lines: readonly string[]): string {
  return `> <${name}>\n${lines.map((l) => `${l}${END}`).join('\n')}\n\n`;
}

/** An empty V2000 molfile: header (3 lines), counts line, M  END. */
function emptyMolfile(title: string): string {
  return `${title}\n  Couplet\n  no structure: assignments by label only (see NMREDATA_ASSIGNMENT)\n` +
    '  0  0  0  0  0  0  0  0  0  0999 V2000\nM  END\n';
}

/** One SD record (ends with `$$$$`); several compounds concatenate into one SD file. */
export function nmredataRecord(r: CompoundReport, opts: { cosy?: boolean } = {}): string {
  const entries = [...r.derived.entries].sort((a, b) => b.ppm - a.ppm);
  const assignment = entries.flatMap((e) => e.labels.map((l) => `${l}, ${toFixedDecimal(e.ppm, 4)}`));
  const js = r.network.pairs.map((p) => `${p.atoms[0]}, ${p.atoms[1]}, ${toFixedDecimal(p.adopted.jHz, 2)}`);
  const signals = entries.map((e) => {
    const fields = [toFixedDecimal(e.ppm, 4)];
    const m = e.multiplet || (e.flags ?? []).length > 0 ? 'm' : e.couplings.map((c) => ['', 'd', 't', 'q', 'p'][c.count ?? 1] ?? 'm').join('') || 's';
    fields.push(`S=${m}`, `N=${e.protons}`, `L=${e.labels.join(',')}`, `E=${e.protons}`);
    if (m !== 'm' && e.couplings.length > 0) {
      fields.push(`J=${e.couplings.map((c) => `${toFixedDecimal(Math.abs(c.jHz), 2)}(${(c.partners ?? []).join(',')})`).join(',')}`);
    }
    return fields.join(', ');
  });
  let out = emptyMolfile(r.compound);
  out += tag('NMREDATA_VERSION', ['1.1']);
  out += tag('NMREDATA_LEVEL', ['0']);
  if (!r.header.solvent.endsWith('?')) out += tag('NMREDATA_SOLVENT', [r.header.solvent]);
  out += tag('NMREDATA_ASSIGNMENT', assignment);
  out += tag('NMREDATA_J', js);
  out += tag('NMREDATA_1D_1H', [`Larmor=${toFixedDecimal(r.header.observeMhz, 2)}`, ...signals]);
  if (opts.cosy !== false && r.network.pairs.length > 0) {
    out += tag('NMREDATA_2D_1H_NJ_1H', [
      `Larmor=${toFixedDecimal(r.header.observeMhz, 2)}`, 'CorType=DQF-COSY',
      ...r.network.pairs.map((p) => `${p.atoms[0]}/${p.atoms[1]}`),
    ]);
  }
  return `${out}$$$$\n`;
}
