/**
 * The text conventions of an NMReDATA record, each from the NMReDATA tag format 1.1 as described by
 * the NMReDATA Initiative wiki (nmredata.org) and Pupier et al., Magn. Reson. Chem. 56 (2018) 703.
 * Section names below are the wiki's page and heading.
 */
import { toFixedDecimal } from '../sidecar/decimal';

/** "Separator": `, ` (comma and space); readers must also accept `,`. */
export const SEP = ', ';

/** "End-of-line": for version > 1.0 every line of a tag value ends with `\` before the line feed. */
export const EOL = '\\\n';

/** "Sdf files", SDF tags: `>  <NAME>` header, the value lines, and one empty line ending the tag. */
export function sdTag(name: string, lines: readonly string[]): string {
  return `>  <${name}>\n${lines.map((l) => `${l}${EOL}`).join('')}\n`;
}

/** "Important note on comments": everything after `;` in a tag line is a comment. */
export function withComment(line: string, comment: string | null): string {
  return comment === null || comment === '' ? line : `${line} ;${comment.replace(/[\\\n\r]/g, ' ')}`;
}

/**
 * NMREDATA_ASSIGNMENT, "Labels including comma or other special characters": a label holding
 * `,` `/` `\` `|` `(` `)` or `&` is written inside `<"…">`.
 */
export function labelText(label: string): string {
  return /[,/\\|()&]/.test(label) ? `<"${label}">` : label;
}

/** Chemical shifts "with four digits after the period" (NMREDATA_1D_1H; 1D attributes). */
export const ppmText = (x: number): string => toFixedDecimal(x, 4);

/** Couplings "in Hz with two digits after the period" (1D attributes, J=; 2D attributes, Ja=). */
export const hzText = (x: number): string => toFixedDecimal(x, 2);

/** sd and flags of a J value as a comment: the format has no field for either. */
export function jComment(sdHz: number | null, method: string, flags: readonly string[]): string {
  const parts = [sdHz === null ? method : `sd ${hzText(sdHz)} Hz, ${method}`];
  if (flags.length > 0) parts.push(`CAUTION ${flags.join(' ')}: check before using this value`);
  return parts.join(', ');
}

/**
 * The molfile block of a record without a structure: an empty V2000 molecule (counts line with 0 atoms
 * and 0 bonds, `M  END`). Header line 2 follows the CTfile layout (initials, program, date, dimension).
 */
export function emptyMolfile(title: string): string {
  return `${title}\n  Couplet           2D\nno structure: add one to the structure note (structure:, atoms:)\n` +
    '  0  0  0  0  0  0  0  0  0  0999 V2000\nM  END\n';
}
